// The client-work part of a matrix fixture: one of each thing the client routes act on, made through the API.
import type { Client } from '../support/client';
import { lastMailTo, linkIn } from '../support/mailbox';
import { unique } from './matrix/route';

/** A 4 × 3 PNG made with sharp (solid #c8553d), small enough to inline. */
export const TINY_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAQAAAADCAIAAAA7ljmRAAAACXBIWXMAAAPoAAAD6AG1e1JrAAAAEElEQVR4nGM4EWoLRww4OQBC/hA5V5FSqAAAAABJRU5ErkJggg==', 'base64');

const ok = (r: { status: number; body: unknown }, what: string) => {
  if (r.status >= 300) throw new Error(`${what} answered ${r.status}: ${JSON.stringify(r.body)}`);
  return r.body as any;
};

/** Two palette routes of three colours each, for a set of routes offered to the client. */
export const FIXTURE_ROUTES = [
  { name: 'Harbour', rationale: 'Cool and calm.', colors: [{ name: 'Deep water', value: '#1d3557', role: 'primary' }, { name: 'Sail', value: '#f1faee', role: 'background' }, { name: 'Buoy', value: '#e63946', role: 'accent' }] },
  { name: 'Orchard', rationale: 'Warm and ripe.', colors: [{ name: 'Bark', value: '#4a2c21', role: 'primary' }, { name: 'Blossom', value: '#fdf0e6', role: 'background' }, { name: 'Leaf', value: '#2f5d50', role: 'accent' }] },
];

/** An invitation, a brief, a board and a set of palette routes sent to fresh contacts (tokens read from the captured mail), a review and a comment on `blockId`. */
export async function makeClientWork(owner: Client, brandId: string, blockId: string) {
  const b = `/api/brands/${brandId}`;
  const invitee = unique();
  const briefContact = unique();
  const boardContact = unique();
  const routesContact = unique();
  const [inv, brief, board, routes] = await Promise.all([
    owner.post(`${b}/members`, { email: invitee, role: 'viewer' }),
    owner.post(`${b}/briefs`, { template: 'new-identity', contactName: 'Fixture Contact', contactEmail: briefContact }),
    owner.post(`${b}/moodboards`, { title: 'Fixture board', items: [{ kind: 'swatch', name: 'Roast', value: '#4a2c21' }] }),
    owner.post(`${b}/palette-routes`, { title: 'Fixture routes', routes: FIXTURE_ROUTES }),
  ]);
  const routeSetId: string = ok(routes, 'routes create').set.id;
  const boardId: string = ok(board, 'board create').board.id;
  const [image, sent, routesSent, review, comment] = await Promise.all([
    owner.upload(`${b}/moodboards/${boardId}/items`, 'tiny.png', TINY_PNG, 'image/png'),
    owner.post(`${b}/moodboards/${boardId}/send`, { contactName: 'Fixture Contact', contactEmail: boardContact }),
    owner.post(`${b}/palette-routes/${routeSetId}/send`, { contactName: 'Fixture Contact', contactEmail: routesContact }),
    owner.post(`${b}/reviews`, { message: 'Fixture review' }),
    owner.post(`${b}/comments`, { blockId, body: 'Fixture comment' }),
  ]);
  return {
    invitationId: ok(inv, 'invitation').invitation.id as string,
    invitationToken: linkIn(lastMailTo(invitee), '/invite/').token,
    briefId: ok(brief, 'brief').brief.id as string,
    briefToken: linkIn(lastMailTo(briefContact), '/brief/').token,
    boardId,
    boardItemId: ok(board, 'board').board.items[0].id as string,
    boardImageId: ok(image, 'board image').item.id as string,
    boardToken: (ok(sent, 'board send'), linkIn(lastMailTo(boardContact), '/board/').token),
    routeSetId,
    routeId: ok(routes, 'routes').set.routes[0].id as string,
    routeSetToken: (ok(routesSent, 'routes send'), linkIn(lastMailTo(routesContact), '/palette/').token),
    reviewId: ok(review, 'review').review.id as string,
    commentId: ok(comment, 'comment').comment.id as string,
  };
}
