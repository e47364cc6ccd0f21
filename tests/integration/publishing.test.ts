// Publishing over HTTP: immutable versions, what changed, the read-only site by role, and share links.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, baseUrl, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { waitForBuild } from '../support/publish';

let owner: Client;
let brandId: string;
let slug: string;
let colorId: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;
const section = (id: string, title: string) => ({ type: 'sectionHeading', attrs: { id, title, eyebrow: '', intro: '' } });
const palette = (id: string, ids: string[]) => ({ type: 'colorPalette', attrs: { id, colorIds: ids, showPrint: true, note: '' } });

async function saveDraft(content: unknown[]) {
  const { revision } = (await owner.get(api('/guideline'))).body;
  const r = await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content } });
  expect(r.status).toBe(200);
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('publisher'));
  const created = (await owner.post('/api/brands', { name: 'Publishing Test Co' })).body.brand;
  brandId = created.id;
  slug = created.slug;
  colorId = (await owner.post(api('/colors'), { name: 'Harbour', value: '#1f6f8b' })).body.color.id;
});
afterAll(closeDb);

describe('versions', () => {
  test('an empty draft cannot be published', async () => {
    const r = await owner.post(api('/versions'), { note: 'Too soon' });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('empty_draft');
  });

  test('publish v1, edit, publish v2: v1 is unchanged, v2 differs, and what-changed lists the colour', async () => {
    await saveDraft([section('colour', 'Colour'), palette('pal', [colorId])]);
    const v1 = await owner.post(api('/versions'), { note: 'First edition' });
    expect(v1.status).toBe(201);
    expect(v1.body.version).toMatchObject({ number: 1, note: 'First edition' });
    expect(Date.parse(v1.body.version.publishedAt)).not.toBeNaN();
    expect((await waitForBuild(owner, brandId, 1)).state).toBe('ready');

    const v1Page = await owner.get(`/b/${slug}/v/1`);
    expect(v1Page.status).toBe(200);
    expect(v1Page.body).toContain('#1f6f8b');

    await owner.patch(api(`/colors/${colorId}`), { value: '#155e75' });
    await saveDraft([section('colour', 'Colour'), palette('pal', [colorId]), section('type', 'Typography')]);
    const v2 = await owner.post(api('/versions'), { note: 'Deeper harbour blue' });
    expect(v2.body.version.number).toBe(2);
    expect((await waitForBuild(owner, brandId, 2)).state).toBe('ready');

    const v1Again = await owner.get(`/b/${slug}/v/1`);
    expect(v1Again.body).toContain('#1f6f8b');
    expect(v1Again.body).not.toContain('#155e75');
    expect(v1Again.body).not.toContain('Typography');
    const v2Page = await owner.get(`/b/${slug}/v/2`);
    expect(v2Page.body).toContain('#155e75');
    expect(v2Page.body).toContain('Typography');
    const latest = await owner.get(`/b/${slug}`);
    expect(latest.body).toContain('Version 2');

    const diff = await owner.get(api('/versions/compare?from=1&to=2'));
    expect(diff.status).toBe(200);
    expect(diff.body.changes.colors).toContainEqual({ what: 'Colour Harbour', from: '#1f6f8b', to: '#155e75' });
    expect(diff.body.changes.blocks.added.map((b: any) => b.id)).toEqual(['type']);
    expect(diff.body.summary).toContain('Colour Harbour: #1f6f8b → #155e75');

    const list = await owner.get(api('/versions'));
    expect(list.body.versions.map((v: any) => [v.number, v.note])).toEqual([[2, 'Deeper harbour blue'], [1, 'First edition']]);
    expect(list.body.versions[0].author.name).toBe('Test publisher');
    const trail = await sql(`SELECT count(*)::int AS n FROM audit_events WHERE brand_id = $1 AND action = 'version.publish'`, [brandId]);
    expect(trail[0].n).toBe(2);
  });

  test('the published page revalidates with its ETag and is private to its viewer', async () => {
    const first = await owner.get(`/b/${slug}/v/1`);
    const etag = first.headers.get('etag')!;
    expect(etag).toBeTruthy();
    expect(first.headers.get('cache-control')).toContain('private');
    const again = await owner.request('GET', `/b/${slug}/v/1`, undefined, { 'if-none-match': etag });
    expect(again.status).toBe(304);
    // The validator never stands in for access: a stranger with the ETag still gets nothing.
    const { client: stranger } = await signUpFresh('stranger');
    const theirs = await stranger.request('GET', `/b/${slug}/v/1`, undefined, { 'if-none-match': etag });
    expect(theirs.status).toBe(404);
    const anonymous = await new Client().request('GET', `/b/${slug}/v/1`, undefined, { 'if-none-match': etag });
    expect(anonymous.status).toBe(302);
    expect(anonymous.headers.get('location')).toContain('/sign-in');
  });

  test('a viewer reads the published site but not the draft', async () => {
    const viewerPerson = await signUpFresh('viewer');
    const viewer = viewerPerson.client;
    await joinBrand(owner, brandId, viewerPerson, 'viewer');
    expect((await viewer.get(`/b/${slug}`)).status).toBe(200);
    expect((await viewer.get(api('/guideline'))).status).toBe(403);
  });
});

describe('share links', () => {
  const open = async (url: string, init: { password?: string; client?: Client } = {}) => {
    const client = init.client ?? new Client();
    const path = new URL(url).pathname;
    const r = init.password === undefined ? await client.get(path) : await client.request('POST', path, `password=${encodeURIComponent(init.password)}`, { 'content-type': 'application/x-www-form-urlencoded' });
    return { client, r };
  };

  test('a valid link opens the latest version to an anonymous visitor, and nothing else', async () => {
    const made = await owner.post(api('/share-links'), { label: 'Agency' });
    expect(made.status).toBe(201);
    const { url, id } = made.body.shareLink;
    expect(url).toMatch(new RegExp(`^${baseUrl()}/s/[A-Za-z0-9_-]{32}$`)); // 24 random bytes = 192 bits
    const [row] = await sql('SELECT token_hash FROM share_links WHERE id = $1', [id]);
    expect(url).not.toContain(row.token_hash);
    const { client, r } = await open(url);
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe(`/b/${slug}`);
    const site = await client.get(`/b/${slug}`);
    expect(site.status).toBe(200);
    expect(site.body).toContain('shared with you by link');
    // Its reach is the published site: no draft, no API.
    expect((await client.get(api('/guideline'))).status).toBe(401);
    expect((await client.post(api('/colors'), { name: 'x', value: '#000' })).status).toBe(401);
    const list = (await owner.get(api('/share-links'))).body.shareLinks.find((l: any) => l.id === id);
    expect(list.useCount).toBe(1);
    expect(list.lastUsedAt).not.toBeNull();
  });

  test('a revoked link shows 410, and the cookie it gave stops working', async () => {
    const { url, id } = (await owner.post(api('/share-links'), {})).body.shareLink;
    const { client } = await open(url);
    expect((await client.get(`/b/${slug}`)).status).toBe(200);
    expect((await owner.delete(api(`/share-links/${id}`))).status).toBe(204);
    expect((await open(url)).r.status).toBe(410);
    expect((await client.get(`/b/${slug}`)).status).toBe(302);
  });

  test('an expired link shows 410', async () => {
    const { url, id } = (await owner.post(api('/share-links'), { expiresAt: new Date(Date.now() + 60_000).toISOString() })).body.shareLink;
    await sql(`UPDATE share_links SET expires_at = now() - interval '1 minute' WHERE id = $1`, [id]);
    const { r } = await open(url);
    expect(r.status).toBe(410);
    expect(r.body).toContain('expired');
  });

  test('a password link: wrong → 401, right → in; then the attempt limit is hit', async () => {
    const { url } = (await owner.post(api('/share-links'), { password: 'harbour-lights' })).body.shareLink;
    const ask = await open(url);
    expect(ask.r.status).toBe(200);
    expect(ask.r.body).toContain('Password');
    expect((await open(url, { password: 'wrong-guess' })).r.status).toBe(401);
    const right = await open(url, { password: 'harbour-lights' });
    expect(right.r.status).toBe(303);
    expect((await right.client.get(`/b/${slug}`)).status).toBe(200);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await open(url, { password: `guess-${i}` })).r.status);
    expect(statuses).toContain(429); // 5 attempts per quarter hour per link and address
  });

  test('a link pinned to version 1 opens version 1 only', async () => {
    const { url } = (await owner.post(api('/share-links'), { version: 1 })).body.shareLink;
    const { client, r } = await open(url);
    expect(r.headers.get('location')).toBe(`/b/${slug}/v/1`);
    expect((await client.get(`/b/${slug}/v/1`)).status).toBe(200);
    expect((await client.get(`/b/${slug}/v/2`)).status).toBe(404);
  });

  test('a made-up token is 404 and bad link settings are refused', async () => {
    expect((await new Client().get('/s/not-a-real-token-at-all-000000')).status).toBe(404);
    expect((await owner.post(api('/share-links'), { expiresAt: '2001-01-01T00:00:00Z' })).status).toBe(400);
    expect((await owner.post(api('/share-links'), { version: 99 })).status).toBe(400);
    expect((await owner.post(api('/share-links'), { password: '123' })).status).toBe(400);
  });
});
