// Client work: invitations, briefs, mood boards, palette routes, reviews, comments, follows and the sent-mail list.
import { FIXTURE_ROUTES } from '../client-fixture';
import { all, only, type Route } from './route';

const readers = only(200, ['owner', 'editor', 'reviewer']);
const makers = (ok: number) => only(ok, ['owner', 'editor']);
/** Token routes answer the link holder, signed in or not. */
const linkHolders = (ok: number) => all(ok, { anonymous: ok });
const b = (f: { brandId: string }) => `/api/brands/${f.brandId}`;

export default [
  { method: 'GET', file: 'brands/[id]/invitations/index.ts', path: (f) => `${b(f)}/invitations`, expect: makers(200) },
  { method: 'POST', file: 'brands/[id]/invitations/[invitationId]/resend.ts', path: (f) => `${b(f)}/invitations/${f.invitationId}/resend`, body: () => ({}), expect: only(200, ['owner']) },
  { method: 'DELETE', file: 'brands/[id]/invitations/[invitationId]/index.ts', path: (f) => `${b(f)}/invitations/${f.invitationId}`, expect: only(204, ['owner']) },
  { method: 'GET', file: 'invitations/[token]/index.ts', path: (f) => `/api/invitations/${f.invitationToken}`, expect: linkHolders(200) },
  // Nobody in the cast holds the invited address: signed-in callers are told it is someone else's invitation.
  { method: 'POST', file: 'invitations/[token]/accept.ts', path: (f) => `/api/invitations/${f.invitationToken}/accept`, body: () => ({}), expect: all(403) },

  { method: 'GET', file: 'brands/[id]/briefs/index.ts', path: (f) => `${b(f)}/briefs`, expect: readers },
  { method: 'POST', file: 'brands/[id]/briefs/index.ts', path: (f) => `${b(f)}/briefs`, body: () => ({ template: 'refresh', contactName: 'Matrix Contact', contactEmail: 'matrix-contact@test.example' }), expect: makers(201) },
  { method: 'GET', file: 'brands/[id]/briefs/[briefId]/index.ts', path: (f) => `${b(f)}/briefs/${f.briefId}`, expect: readers },
  { method: 'DELETE', file: 'brands/[id]/briefs/[briefId]/index.ts', path: (f) => `${b(f)}/briefs/${f.briefId}`, expect: makers(200) },
  { method: 'GET', file: 'brands/[id]/briefs/[briefId]/export.ts', path: (f) => `${b(f)}/briefs/${f.briefId}/export?format=csv`, expect: readers },
  { method: 'GET', file: 'briefs/[token]/index.ts', path: (f) => `/api/briefs/${f.briefToken}`, expect: linkHolders(200) },
  { method: 'PUT', file: 'briefs/[token]/index.ts', path: (f) => `/api/briefs/${f.briefToken}`, body: () => ({ answers: { audience: 'Early commuters' } }), expect: linkHolders(200) },
  // The fixture brief has no answers yet, so submitting names the required questions (400) for every link holder.
  { method: 'POST', file: 'briefs/[token]/submit.ts', path: (f) => `/api/briefs/${f.briefToken}/submit`, body: () => ({}), expect: linkHolders(400) },

  { method: 'GET', file: 'brands/[id]/moodboards/index.ts', path: (f) => `${b(f)}/moodboards`, expect: readers },
  { method: 'POST', file: 'brands/[id]/moodboards/index.ts', path: (f) => `${b(f)}/moodboards`, body: () => ({ title: 'Matrix board' }), expect: makers(201) },
  { method: 'GET', file: 'brands/[id]/moodboards/[boardId]/index.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}`, expect: readers },
  { method: 'PATCH', file: 'brands/[id]/moodboards/[boardId]/index.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}`, body: () => ({ title: 'Renamed board' }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/moodboards/[boardId]/index.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}`, expect: makers(204) },
  { method: 'POST', file: 'brands/[id]/moodboards/[boardId]/items/index.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}/items`, body: () => ({ kind: 'note', caption: 'Warm, not sweet' }), expect: makers(201) },
  { method: 'DELETE', file: 'brands/[id]/moodboards/[boardId]/items/[itemId]/index.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}/items/${f.boardItemId}`, expect: makers(204) },
  { method: 'GET', file: 'brands/[id]/moodboards/[boardId]/items/[itemId]/image.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}/items/${f.boardImageId}/image`, expect: readers },
  { method: 'POST', file: 'brands/[id]/moodboards/[boardId]/send.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}/send`, body: () => ({ contactName: 'Matrix Contact', contactEmail: 'matrix-contact@test.example' }), expect: makers(200) },
  // The fixture board is sent, not approved: makers are told so (409).
  { method: 'POST', file: 'brands/[id]/moodboards/[boardId]/adopt-swatches.ts', path: (f) => `${b(f)}/moodboards/${f.boardId}/adopt-swatches`, body: () => ({}), expect: makers(409) },
  { method: 'GET', file: 'moodboards/[token]/index.ts', path: (f) => `/api/moodboards/${f.boardToken}`, expect: linkHolders(200) },
  {
    method: 'POST',
    file: 'moodboards/[token]/decision.ts',
    path: (f) => `/api/moodboards/${f.boardToken}/decision`,
    body: (f) => ({ name: 'Matrix Client', outcome: 'approved', items: [{ id: f.boardItemId, verdict: 'keep' }, { id: f.boardImageId, verdict: 'drop' }] }),
    expect: linkHolders(200),
  },
  { method: 'GET', file: 'moodboards/[token]/items/[itemId].ts', path: (f) => `/api/moodboards/${f.boardToken}/items/${f.boardImageId}`, expect: linkHolders(200) },

  { method: 'GET', file: 'brands/[id]/palette-routes/index.ts', path: (f) => `${b(f)}/palette-routes`, expect: readers },
  { method: 'POST', file: 'brands/[id]/palette-routes/index.ts', path: (f) => `${b(f)}/palette-routes`, body: () => ({ title: 'Matrix routes', routes: FIXTURE_ROUTES }), expect: makers(201) },
  { method: 'GET', file: 'brands/[id]/palette-routes/[setId]/index.ts', path: (f) => `${b(f)}/palette-routes/${f.routeSetId}`, expect: readers },
  { method: 'PATCH', file: 'brands/[id]/palette-routes/[setId]/index.ts', path: (f) => `${b(f)}/palette-routes/${f.routeSetId}`, body: () => ({ title: 'Renamed routes' }), expect: makers(200) },
  { method: 'DELETE', file: 'brands/[id]/palette-routes/[setId]/index.ts', path: (f) => `${b(f)}/palette-routes/${f.routeSetId}`, expect: makers(204) },
  { method: 'POST', file: 'brands/[id]/palette-routes/[setId]/send.ts', path: (f) => `${b(f)}/palette-routes/${f.routeSetId}/send`, body: () => ({ contactName: 'Matrix Contact', contactEmail: 'matrix-contact@test.example' }), expect: makers(200) },
  // The fixture set is with the client, nothing chosen yet: makers are told so (409).
  { method: 'POST', file: 'brands/[id]/palette-routes/[setId]/adopt.ts', path: (f) => `${b(f)}/palette-routes/${f.routeSetId}/adopt`, body: () => ({}), expect: makers(409) },
  { method: 'GET', file: 'palette-routes/[token]/index.ts', path: (f) => `/api/palette-routes/${f.routeSetToken}`, expect: linkHolders(200) },
  { method: 'POST', file: 'palette-routes/[token]/decision.ts', path: (f) => `/api/palette-routes/${f.routeSetToken}/decision`, body: (f) => ({ name: 'Matrix Client', choice: f.routeId }), expect: linkHolders(200) },

  { method: 'GET', file: 'brands/[id]/reviews/index.ts', path: (f) => `${b(f)}/reviews`, expect: readers },
  { method: 'POST', file: 'brands/[id]/reviews/index.ts', path: (f) => `${b(f)}/reviews`, body: () => ({ message: 'Matrix review' }), expect: makers(201) },
  { method: 'POST', file: 'brands/[id]/reviews/[reviewId]/decision.ts', path: (f) => `${b(f)}/reviews/${f.reviewId}/decision`, body: () => ({ outcome: 'approved' }), expect: only(200, ['owner', 'reviewer']) },
  { method: 'GET', file: 'brands/[id]/comments/index.ts', path: (f) => `${b(f)}/comments?open=1`, expect: readers },
  { method: 'POST', file: 'brands/[id]/comments/index.ts', path: (f) => `${b(f)}/comments`, body: () => ({ blockId: 'intro', body: 'Matrix comment' }), expect: only(201, ['owner', 'editor', 'reviewer']) },
  { method: 'PATCH', file: 'brands/[id]/comments/[commentId].ts', path: (f) => `${b(f)}/comments/${f.commentId}`, body: () => ({ resolved: true }), expect: only(200, ['owner', 'editor', 'reviewer']) },

  { method: 'GET', file: 'brands/[id]/follow.ts', path: (f) => `${b(f)}/follow`, expect: all(200, { outsider: 404 }) },
  { method: 'PUT', file: 'brands/[id]/follow.ts', path: (f) => `${b(f)}/follow`, expect: all(200, { outsider: 404 }) },
  { method: 'DELETE', file: 'brands/[id]/follow.ts', path: (f) => `${b(f)}/follow`, expect: all(200, { outsider: 404 }) },
  { method: 'GET', file: 'mail/index.ts', path: () => '/api/mail', expect: all(200) },
  // Every signed-in caller here has proven their address, so asking for another link is a conflict.
  { method: 'GET', file: 'account/verification.ts', path: () => '/api/account/verification', expect: all(200) },
  { method: 'POST', file: 'account/verification.ts', path: () => '/api/account/verification', body: () => ({}), expect: all(409) },
] satisfies Route[];
