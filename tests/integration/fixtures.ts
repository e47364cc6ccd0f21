// People and brands for integration tests, created through the public API like a real studio would.
import { Client, signUpFresh } from '../support/client';
import { sql } from '../support/db';
import type { BrandRole } from '@/lib/auth/roles';
import { makeClientWork } from './client-fixture';

/** A small logo of our own: a circle mark with a margin, for fixtures. */
export const FIXTURE_SVG = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 120 60"><circle cx="30" cy="30" r="20" fill="#1d2a44"/><rect x="60" y="20" width="40" height="20" fill="#c8553d"/></svg>';

export const CALLERS = ['anonymous', 'owner', 'editor', 'reviewer', 'partner', 'viewer', 'outsider'] as const;
export type CallerName = (typeof CALLERS)[number];

export interface Cast {
  clients: Record<CallerName, Client>;
  emails: Record<Exclude<CallerName, 'anonymous'>, string>;
  /** An extra person whose membership the member routes may change or remove. */
  target: { email: string; client: Client };
}

/** One signed-in person per role, an outsider with a studio of their own, and an anonymous client. */
export async function makeCast(): Promise<Cast> {
  const names = ['owner', 'editor', 'reviewer', 'partner', 'viewer', 'outsider'] as const;
  const people = await Promise.all(names.map((n) => signUpFresh(n)));
  const target = await signUpFresh('target');
  const clients = { anonymous: new Client() } as Record<CallerName, Client>;
  const emails = {} as Cast['emails'];
  names.forEach((n, i) => {
    clients[n] = people[i].client;
    emails[n] = people[i].email;
  });
  // The outsider runs a studio of their own, so they are signed in and busy, just not on our brand.
  await clients.outsider.post('/api/brands', { name: 'Outsider Works' });
  return { clients, emails, target: { email: target.email, client: target.client } };
}

/** What a matrix row may refer to: a fresh brand with every role filled, and things inside it. */
export interface Fixture {
  brandId: string;
  targetMemberId: string;
  colorId: string;
  logoId: string;
  typefaceId: string;
  /** An approved SVG asset on the brand's shelf. */
  assetId: string;
  /** A share link of the brand (version 1 is published from a one-section draft). */
  shareLinkId: string;
  /** Client work (tests/integration/client-fixture.ts): a pending invitation, a sent brief, a sent board, a review, a comment. */
  invitationId: string;
  invitationToken: string;
  briefId: string;
  briefToken: string;
  boardId: string;
  boardItemId: string;
  boardImageId: string;
  boardToken: string;
  /** A set of two palette routes, sent (tests/integration/client-fixture.ts). */
  routeSetId: string;
  routeId: string;
  routeSetToken: string;
  reviewId: string;
  commentId: string;
}

/** Client work left out: empty ids, so a row that wrongly refers to it fails on an address that names nothing. */
const NO_CLIENT_WORK: Awaited<ReturnType<typeof makeClientWork>> = {
  invitationId: '',
  invitationToken: '',
  briefId: '',
  briefToken: '',
  boardId: '',
  boardItemId: '',
  boardImageId: '',
  boardToken: '',
  routeSetId: '',
  routeId: '',
  routeSetToken: '',
  reviewId: '',
  commentId: '',
};

/**
 * A brand owned by the cast's owner with every other role filled, one colour, one logo and one typeface, an approved
 * asset, a published version and a share link, and client work. `clientWork: false` leaves the client work out
 * (about half the cost) and its fields empty, for matrix rows that never refer to it.
 */
export async function makeBrand(cast: Cast, name = 'Fixture Brand', opts: { clientWork?: boolean } = {}): Promise<Fixture> {
  const owner = cast.clients.owner;
  const created = await owner.post('/api/brands', { name });
  if (created.status !== 201) throw new Error(`brand create answered ${created.status}`);
  const brandId: string = created.body.brand.id;
  // Memberships are written directly: this fixture is rebuilt for every one of several hundred matrix cases, and
  // joining through an invitation (tests/hostile/accounts.test.ts, invitations.test.ts) has tests of its own.
  const members: [string, BrandRole][] = [
    [cast.emails.editor, 'editor'],
    [cast.emails.reviewer, 'reviewer'],
    [cast.emails.partner, 'partner'],
    [cast.emails.viewer, 'viewer'],
    [cast.target.email, 'viewer'],
  ];
  const rows = await sql(
    `INSERT INTO brand_members (id, brand_id, user_id, role, created_at, updated_at)
     SELECT gen_random_uuid(), $1, u.id, m.role::"enum_brand_members_role", now(), now()
       FROM unnest($2::text[], $3::text[]) AS m(email, role) JOIN "user" u ON u.email = m.email
     RETURNING id, user_id`,
    [brandId, members.map((m) => m[0]), members.map((m) => m[1])],
  );
  if (rows.length !== members.length) throw new Error(`fixture members: ${rows.length} of ${members.length} written`);
  const [targetUser] = await sql('SELECT id FROM "user" WHERE email = $1', [cast.target.email]);
  const targetMemberId: string = rows.find((r) => r.user_id === targetUser.id).id;
  // The identity, the shelf and the draft are independent of each other, and so are the share link and the client
  // work once a version is out: each group is asked for at once.
  const approvedAsset = async () => {
    const asset = await owner.upload(`/api/brands/${brandId}/assets`, 'shelf-mark.svg', FIXTURE_SVG, 'image/svg+xml');
    if (asset.status !== 201) return asset;
    return owner.patch(`/api/brands/${brandId}/assets/${asset.body.assets[0].id}`, { state: 'approved' });
  };
  const draft = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'intro', title: 'Introduction', eyebrow: '', intro: '' } }] };
  const [color, typeface, logo, approved, saved] = await Promise.all([
    owner.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#1d2a44' }),
    owner.post(`/api/brands/${brandId}/typefaces`, { shipped: 'dm-sans', role: 'body' }),
    owner.upload(`/api/brands/${brandId}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml'),
    approvedAsset(),
    owner.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: 0, doc: draft }),
  ]);
  for (const r of [color, typeface, logo]) if (r.status !== 201) throw new Error(`fixture answered ${r.status}: ${JSON.stringify(r.body)}`);
  for (const r of [approved, saved]) if (r.status !== 200) throw new Error(`fixture answered ${r.status}: ${JSON.stringify(r.body)}`);
  const assetId: string = approved.body.asset.id;
  const publishAndShare = async () => {
    const published = await owner.post(`/api/brands/${brandId}/versions`, { note: 'First version' });
    if (published.status !== 201) return published;
    return owner.post(`/api/brands/${brandId}/share-links`, {});
  };
  const [link, client] = await Promise.all([publishAndShare(), opts.clientWork === false ? NO_CLIENT_WORK : makeClientWork(owner, brandId, 'intro')]);
  if (link.status !== 201) throw new Error(`fixture answered ${link.status}: ${JSON.stringify(link.body)}`);
  return { brandId, targetMemberId, colorId: color.body.color.id, logoId: logo.body.logo.id, typefaceId: typeface.body.typeface.id, assetId, shareLinkId: link.body.shareLink.id, ...client };
}
