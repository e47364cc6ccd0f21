// Search on the published site over HTTP: the build writes one index per audience, and GET /b/:slug/v/:n/search.json
// answers each visitor the index their page was drawn for (an editor, a member, a share link with or without
// downloads), with the manifest's strong ETag. Outside references: RFC 9110 §8.8.3 (a strong ETag names one exact
// representation) and §15.4.5 (304 Not Modified on a matching If-None-Match); the colour's values are what the
// palette block prints (checked against colorjs.io in tests/unit/search-index.test.ts). The brand is invented.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { searchPath, type Manifest } from '@/lib/publishing/build/contract';
import { loadSearchIndex } from '@/lib/publishing/search';
import { baseUrl, Client, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { publishAndWait } from '../support/publish';
import { FIXTURE_SVG } from './fixtures';

let owner: Client;
let viewer: Client;
let brandId: string;
let slug: string;
let manifest: Manifest;
const api = (p = '') => `/api/brands/${brandId}${p}`;
const FILE_NAME = 'Crossing timetable poster';

async function visit(url: string): Promise<Client> {
  const client = new Client();
  expect((await client.get(new URL(url).pathname)).status).toBe(303);
  return client;
}

async function fetchIndex(client: Client, number: number, headers: Record<string, string> = {}) {
  const r = await fetch(`${baseUrl()}/b/${slug}/v/${number}/search.json`, { headers: { cookie: client.cookieHeader(), ...headers }, redirect: 'manual' });
  return { status: r.status, headers: r.headers, text: await r.text() };
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('search-owner'));
  const brand = (await owner.post('/api/brands', { name: 'Quillfield Ferries' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const [color, logo, file] = await Promise.all([
    owner.post(api('/colors'), { name: 'Harbour navy', value: '#1d2a44' }),
    owner.upload(api('/logos'), 'rope-knot.svg', FIXTURE_SVG, 'image/svg+xml'),
    owner.upload(api('/assets'), 'poster.svg', FIXTURE_SVG.replace('#c8553d', '#1d2a44'), 'image/svg+xml'),
  ]);
  const logoId = logo.body.logo.id;
  expect((await owner.patch(api(`/logos/${logoId}`), { name: 'Rope knot mark' })).status).toBe(200);
  const fileId = file.body.assets[0].id;
  expect((await owner.patch(api(`/assets/${fileId}`), { state: 'approved', name: FILE_NAME })).status).toBe(200);
  const content = [
    { type: 'sectionHeading', attrs: { id: 'colour', title: 'Colour', eyebrow: 'Palette', intro: '' } },
    { type: 'colorPalette', attrs: { id: 'pal', colorIds: [color.body.color.id], showPrint: true, note: '' } },
    { type: 'sectionHeading', attrs: { id: 'logo', title: 'Logo', eyebrow: '', intro: '' } },
    { type: 'logoShowcase', attrs: { id: 'show', logoIds: [logoId], brandColorId: null, onDark: 'white', caption: '' } },
    { type: 'downloads', attrs: { id: 'files', title: 'Files to download', assetIds: [], note: '' } },
  ];
  const { revision } = (await owner.get(api('/guideline'))).body;
  expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content } })).status).toBe(200);
  await publishAndWait(owner, brandId, 'With search');
  [{ manifest }] = await sql('SELECT manifest FROM guideline_versions WHERE brand_id = $1 AND number = 1', [brandId]);
  const person = await signUpFresh('search-viewer');
  await joinBrand(owner, brandId, person, 'viewer');
  viewer = person.client;
}, 240_000);
afterAll(closeDb);

describe('the index each visitor gets', () => {
  test('the build wrote one index per audience that sees a different page', () => {
    for (const who of ['editor', 'member', 'link'] as const) for (const downloads of [true, false]) expect(Object.keys(manifest.entries)).toContain(searchPath({ who, downloads }));
  });

  test('an owner gets the editor index with files, a viewer the member index without; each finds the colour by hex and the logo by name', async () => {
    const asOwner = await fetchIndex(owner, 1);
    expect(asOwner.status).toBe(200);
    expect(asOwner.headers.get('content-type')).toMatch(/^application\/json/);
    expect(asOwner.headers.get('etag')).toBe(`"${manifest.entries[searchPath({ who: 'editor', downloads: true })].hash.slice(0, 32)}"`);
    expect(loadSearchIndex(asOwner.text).search(FILE_NAME)[0]).toMatchObject({ kind: 'file', blockId: 'files' });

    const asViewer = await fetchIndex(viewer, 1);
    expect(asViewer.headers.get('etag')).toBe(`"${manifest.entries[searchPath({ who: 'member', downloads: false })].hash.slice(0, 32)}"`);
    const index = loadSearchIndex(asViewer.text);
    expect(index.search('#1d2a44')[0]).toMatchObject({ kind: 'colour', title: 'Harbour navy', swatch: '#1d2a44', blockId: 'pal' });
    expect(index.search('rope knot')[0]).toMatchObject({ kind: 'logo', title: 'Rope knot mark', blockId: 'show' });
    expect(index.search(FILE_NAME)).toEqual([]);
    expect(asViewer.text).not.toContain(FILE_NAME);
  });

  test('a share link gets the link index, with files only when it allows downloads', async () => {
    const without = await visit((await owner.post(api('/share-links'), { allowDownloads: false })).body.shareLink.url);
    const withFiles = await visit((await owner.post(api('/share-links'), { allowDownloads: true })).body.shareLink.url);
    const a = await fetchIndex(without, 1);
    const b = await fetchIndex(withFiles, 1);
    expect(a.headers.get('etag')).toBe(`"${manifest.entries[searchPath({ who: 'link', downloads: false })].hash.slice(0, 32)}"`);
    expect(b.headers.get('etag')).toBe(`"${manifest.entries[searchPath({ who: 'link', downloads: true })].hash.slice(0, 32)}"`);
    expect(a.text).not.toContain(FILE_NAME);
    expect(loadSearchIndex(b.text).search('timetable')[0]).toMatchObject({ kind: 'file' });
    expect(loadSearchIndex(a.text).search('1d2a44')[0]).toMatchObject({ kind: 'colour' });
  });

  test('304 when the visitor already holds that index (RFC 9110 §15.4.5), and not for another audience’s', async () => {
    const first = await fetchIndex(viewer, 1);
    const again = await fetchIndex(viewer, 1, { 'if-none-match': first.headers.get('etag')! });
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    const owners = await fetchIndex(owner, 1, { 'if-none-match': first.headers.get('etag')! });
    expect(owners.status).toBe(200);
  });

  test('nobody without access gets an index, and a number that is no version is 404', async () => {
    expect((await fetchIndex(new Client(), 1)).status).toBe(404);
    expect((await fetchIndex(owner, 99)).status).toBe(404);
    const r = await fetch(`${baseUrl()}/b/${slug}/v/0/search.json`, { headers: { cookie: owner.cookieHeader() } });
    expect(r.status).toBe(404);
  });

  test('a share link pinned to version 1 reads that version’s index only', async () => {
    const pinned = await visit((await owner.post(api('/share-links'), { allowDownloads: false, version: 1 })).body.shareLink.url);
    await publishAndWait(owner, brandId, 'Second');
    expect((await fetchIndex(pinned, 1)).status).toBe(200);
    expect((await fetchIndex(pinned, 2)).status).toBe(404);
    expect((await fetchIndex(owner, 2)).status).toBe(200);
  }, 240_000);
});

describe('the page offers search', () => {
  test('the guideline page carries the box and the version’s own script, engine and index addresses', async () => {
    const page = await owner.get(`/b/${slug}/v/1`);
    const html = String(page.body);
    expect(html).toContain('data-site-search');
    expect(html).toContain(`/b/${slug}/v/1/static/search.js`);
    expect(html).toContain(`data-index="/b/${slug}/v/1/search.json"`);
    for (const name of ['search.js', 'minisearch.js']) {
      const r = await fetch(`${baseUrl()}/b/${slug}/v/1/static/${name}`, { headers: { cookie: owner.cookieHeader() } });
      expect(r.status, name).toBe(200);
      expect(r.headers.get('content-type')).toMatch(/^text\/javascript/);
    }
    // The print edition offers it on screen; its policy lets the version's own script and index load.
    const print = await fetch(`${baseUrl()}/b/${slug}/v/1/print?size=a4`, { headers: { cookie: owner.cookieHeader() } });
    expect(await print.text()).toContain('data-site-search');
    expect(print.headers.get('content-security-policy')).toMatch(/script-src 'self'; connect-src 'self'/);
  });
});
