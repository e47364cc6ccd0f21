// A published version is built once: every page and file it serves is stored under the version with a manifest, and
// requests only decide access and stream the stored bytes. Checked over HTTP against the built server and a second
// server process on the same database and storage. Outside references: RFC 9110 §8.8.3 (a strong ETag names one
// exact representation, so two servers sending the same bytes send the same ETag) and §15.4.5 (304 Not Modified on
// a matching If-None-Match); RFC 9110 §10.2.3 (Retry-After on a 503); the HTML Living Standard for which attributes
// load or link a resource (src, href, srcset) — every such address under the version must answer 200.
import { readFile, rm } from 'node:fs/promises';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { startServer } from '../../scripts/lib/prepare';
import { freePort } from '../../scripts/lib/postgres';
import { AUDIENCES, pagePath, presentationPath, printPath, type Manifest } from '@/lib/publishing/build/contract';
import { htmlUrls } from '@/lib/publishing/build/references';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { waitForBuild } from '../support/publish';
import { FIXTURE_SVG } from './fixtures';

let owner: Client;
let brandId: string;
let slug: string;
let logoId: string;
let manifest: Manifest;
const api = (p = '') => `/api/brands/${brandId}${p}`;

/** GET with a client's cookies, keeping the bytes. */
async function fetchBytes(client: Client, path: string, headers: Record<string, string> = {}, root = baseUrl()) {
  const r = await fetch(root + path, { headers: { cookie: client.cookieHeader(), ...headers }, redirect: 'manual' });
  return { status: r.status, headers: r.headers, body: Buffer.from(await r.arrayBuffer()) };
}

/** The stored bytes of one manifest entry, read from the server's storage folder (the local-disk driver). */
const stored = (path: string) => readFile(join(inject('filesDir'), manifest.entries[path].key));

async function readManifest(number: number): Promise<{ state: string; manifest: Manifest; build_error: string | null }> {
  const [row] = await sql('SELECT state, manifest, build_error FROM guideline_versions WHERE brand_id = $1 AND number = $2', [brandId, number]);
  return row;
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('builder'));
  const created = (await owner.post('/api/brands', { name: 'Built Pages Co' })).body.brand;
  brandId = created.id;
  slug = created.slug;
  const photo = await sharp({ create: { width: 1800, height: 1200, channels: 3, background: '#6b4a33' } }).jpeg().toBuffer();
  const [color, , logo, uploaded] = await Promise.all([
    owner.post(api('/colors'), { name: 'Harbour', value: '#1f6f8b' }),
    owner.post(api('/typefaces'), { shipped: 'dm-sans', role: 'body' }),
    owner.upload(api('/logos'), 'mark.svg', FIXTURE_SVG, 'image/svg+xml'),
    owner.upload(api('/assets'), 'quay.jpg', photo, 'image/jpeg', { kind: 'photo' }),
  ]);
  logoId = logo.body.logo.id;
  const photoId = uploaded.body.assets[0].id;
  expect((await owner.patch(api(`/assets/${photoId}`), { state: 'approved', altText: 'A brown quay.' })).status).toBe(200);
  const content = [
    { type: 'sectionHeading', attrs: { id: 'logo', title: 'Logo', eyebrow: '', intro: '' } },
    { type: 'logoShowcase', attrs: { id: 'show', logoIds: [logoId], brandColorId: color.body.color.id, onDark: 'white', caption: '' } },
    { type: 'sectionHeading', attrs: { id: 'colour', title: 'Colour', eyebrow: '', intro: '' } },
    { type: 'colorPalette', attrs: { id: 'pal', colorIds: [color.body.color.id], showPrint: true, note: '' } },
    { type: 'sectionHeading', attrs: { id: 'imagery', title: 'Imagery', eyebrow: '', intro: '' } },
    { type: 'imagery', attrs: { id: 'img', items: [{ src: photoId, alt: '', verdict: 'do', caption: '' }], columns: 2, aspect: '3:2' } },
    { type: 'applications', attrs: { id: 'apps', templates: ['business-card'], logoId, photoIds: [], note: '' } },
  ];
  const { revision } = (await owner.get(api('/guideline'))).body;
  expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content } })).status).toBe(200);
  expect((await owner.post(api('/versions'), { note: 'Built once' })).status).toBe(201);
  await waitForBuild(owner, brandId, 1);
  const row = await readManifest(1);
  expect(row.build_error).toBeNull();
  expect(row.state).toBe('ready');
  manifest = row.manifest;
}, 120_000);
afterAll(closeDb);

describe('what a built version holds', () => {
  test('a page for each of the 12 audiences, the print edition on A4 and Letter, and the presentation in its three forms', () => {
    const paths = Object.keys(manifest.entries);
    for (const audience of AUDIENCES) expect(paths).toContain(pagePath(audience));
    expect(paths).toEqual(expect.arrayContaining([printPath('a4'), printPath('letter'), presentationPath('version'), presentationPath('current'), presentationPath('print')]));
    // Keys are object keys inside the brand's build folder, never machine paths.
    for (const entry of Object.values(manifest.entries)) expect(entry.key).toMatch(new RegExp(`^${brandId}/build/[0-9a-f-]{36}/[0-9a-f]{64}(\\.[a-z0-9]+)?$`));
  });

  test('every address under the version that any built page refers to answers 200 (src, href, srcset, CSS url())', async () => {
    const pages = Object.keys(manifest.entries).filter((p) => manifest.entries[p].type.startsWith('text/html') || manifest.entries[p].type.startsWith('text/css'));
    const base = `/b/${slug}/v/1/`;
    const wanted = new Set<string>();
    for (const path of pages) {
      const text = (await stored(path)).toString();
      const urls = manifest.entries[path].type.startsWith('text/css') ? [...text.matchAll(/url\(\s*["']?([^"')]+)["']?\s*\)/g)].map((m) => m[1]) : htmlUrls(text);
      for (const url of urls) {
        const address = new URL(url, `http://x${base}`);
        expect(address.pathname.startsWith('/_astro/'), `${path} refers to the app build: ${url}`).toBe(false);
        if (address.origin === 'http://x' && address.pathname.startsWith(base) && !/\.pdf$/.test(address.pathname)) wanted.add(address.pathname + address.search);
      }
    }
    // Logos in several versions, the font, the photo's renditions, the mock-up, the stylesheets and their fonts.
    expect([...wanted].some((u) => u.includes('?variant='))).toBe(true);
    expect([...wanted].some((u) => u.includes('aspect='))).toBe(true);
    expect([...wanted].some((u) => u.includes('/mockups/'))).toBe(true);
    expect([...wanted].some((u) => u.endsWith('/static/site.css'))).toBe(true);
    for (const url of wanted) expect((await fetchBytes(owner, url)).status, url).toBe(200);
  });

  test("the page links the version's own copy of the site stylesheet, not the running app's build", async () => {
    const page = (await fetchBytes(owner, `/b/${slug}/v/1`)).body.toString();
    expect(page).toContain(`href="/b/${slug}/v/1/static/site.css"`);
    expect(page).not.toContain('/_astro/');
    const css = await fetchBytes(owner, `/b/${slug}/v/1/static/site.css`);
    expect(css.headers.get('content-type')).toMatch(/^text\/css/);
    expect(css.body.length).toBeGreaterThan(5000);
  });

  test('a path the version does not hold is a 404, even for a real file with a query the pages never asked for', async () => {
    for (const path of [`files/${logoId}?variant=purple`, `files/${logoId}?w=123&aspect=3:2`, 'static/other.css', 'nothing-here']) {
      expect((await fetchBytes(owner, `/b/${slug}/v/1/${path}`)).status, path).toBe(404);
    }
  });
});

describe('serving the stored bytes', () => {
  test('each audience gets its own built page, byte for byte, with the manifest ETag; 304 on If-None-Match', async () => {
    // The stored bytes themselves (identity coding): a compressed answer has an ETag of its own (RFC 9110 §8.8.3).
    const page = await fetchBytes(owner, `/b/${slug}`, { 'accept-encoding': 'identity' });
    expect(page.status).toBe(200);
    const entry = manifest.entries[pagePath({ latest: true, who: 'editor', downloads: true })];
    expect(page.body.equals(await stored(pagePath({ latest: true, who: 'editor', downloads: true })))).toBe(true);
    expect(page.headers.get('etag')).toBe(`"${entry.hash.slice(0, 32)}"`);
    const again = await fetchBytes(owner, `/b/${slug}`, { 'accept-encoding': 'identity', 'if-none-match': page.headers.get('etag')! });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
  });

  test('a share link without downloads never gets the downloads page or a mock-up file; one with downloads does', async () => {
    const open = async (allowDownloads: boolean) => {
      const link = (await owner.post(api('/share-links'), { allowDownloads })).body.shareLink;
      const visitor = new Client();
      expect((await visitor.get(new URL(link.url).pathname)).status).toBe(303);
      return visitor;
    };
    const plain = await open(false);
    const plainPage = await fetchBytes(plain, `/b/${slug}`);
    expect(plainPage.body.equals(await stored(pagePath({ latest: true, who: 'link', downloads: false })))).toBe(true);
    expect(plainPage.body.toString()).not.toContain(`/b/${slug}/downloads`);
    const mockup = htmlUrls(plainPage.body.toString()).find((u) => u.includes('/mockups/'))!;
    expect(mockup).toBeTruthy();
    expect((await fetchBytes(plain, mockup)).status).toBe(403);
    const allowed = await open(true);
    const allowedPage = await fetchBytes(allowed, `/b/${slug}`);
    expect(allowedPage.body.equals(await stored(pagePath({ latest: true, who: 'link', downloads: true })))).toBe(true);
    expect(allowedPage.body.toString()).toContain(`/b/${slug}/downloads`);
    const file = await fetchBytes(allowed, mockup);
    expect(file.status).toBe(200);
    expect(file.headers.get('content-disposition')).toMatch(/^attachment; filename="[a-z0-9-]+-v1-business-card\.png"$/);
    // A stranger holding the ETag still gets nothing.
    const stranger = (await signUpFresh('stranger')).client;
    expect((await fetchBytes(stranger, `/b/${slug}/v/1`, { 'if-none-match': plainPage.headers.get('etag')! })).status).toBe(404);
  });

  test('a second server process on the same database and storage serves the same bytes with the same ETags', async () => {
    const port = await freePort();
    const second = await startServer(
      { host: '127.0.0.1', port, databaseUrl: inject('databaseUrl'), siteUrl: baseUrl(), secret: 'test-secret-that-is-long-enough-for-better-auth', filesDir: inject('filesDir') },
      { quiet: true },
    );
    try {
      const other = `http://127.0.0.1:${port}`;
      for (const path of [`/b/${slug}`, `/b/${slug}/v/1`, `/b/${slug}/v/1/print?size=letter`, `/b/${slug}/v/1/presentation`, `/b/${slug}/v/1/files/${logoId}?variant=black`, `/b/${slug}/v/1/static/site.css`]) {
        const here = await fetchBytes(owner, path);
        const there = await fetchBytes(owner, path, {}, other);
        expect(here.status, path).toBe(200);
        expect(there.status, path).toBe(200);
        expect(there.body.equals(here.body), path).toBe(true);
        expect(there.headers.get('etag'), path).toBe(here.headers.get('etag'));
        expect((await fetchBytes(owner, path, { 'if-none-match': here.headers.get('etag')! }, other)).status, path).toBe(304);
      }
    } finally {
      const exited = new Promise((r) => second.once('exit', r));
      second.kill('SIGTERM');
      await exited;
    }
  });
});

describe('versions over time', () => {
  test('an older version gets its "older" page; a version still building answers 503 with Retry-After and a readable page', async () => {
    const { revision } = (await owner.get(api('/guideline'))).body;
    const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'next', title: 'Next', eyebrow: '', intro: '' } }] };
    expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc })).status).toBe(200);
    expect((await owner.post(api('/versions'), { note: 'Second' })).status).toBe(201);
    expect((await waitForBuild(owner, brandId, 2)).state).toBe('ready');
    const older = await fetchBytes(owner, `/b/${slug}/v/1`);
    expect(older.body.equals(await stored(pagePath({ latest: false, who: 'editor', downloads: true })))).toBe(true);
    expect(older.body.toString()).toContain('You are reading an earlier version');

    await sql(`UPDATE guideline_versions SET state = 'building' WHERE brand_id = $1 AND number = 2`, [brandId]);
    try {
      await new Promise((r) => setTimeout(r, 2100)); // the site's two-second lookup memory
      const waiting = await fetchBytes(owner, `/b/${slug}/v/2`);
      expect(waiting.status).toBe(503);
      expect(Number(waiting.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(waiting.body.toString()).toContain('This version is being prepared');
    } finally {
      await sql(`UPDATE guideline_versions SET state = 'ready' WHERE brand_id = $1 AND number = 2`, [brandId]);
    }
  });

  test('a renamed slug still serves old versions: the old address redirects, the built page and its files still load', async () => {
    const before = await fetchBytes(owner, `/b/${slug}/v/1`);
    const renamed = `${slug}-renamed`;
    expect((await owner.patch(api(), { slug: renamed })).status).toBe(200);
    const moved = await fetchBytes(owner, `/b/${slug}/v/1`);
    expect(moved.status).toBe(301);
    expect(moved.headers.get('location')).toBe(`/b/${renamed}/v/1`);
    const after = await fetchBytes(owner, `/b/${renamed}/v/1`);
    expect(after.status).toBe(200);
    expect(after.body.equals(before.body)).toBe(true);
    // The page still names the old address for its files: each redirects once and then loads.
    const logo = htmlUrls(after.body.toString()).find((u) => u.startsWith(`/b/${slug}/v/1/files/`))!;
    const hop = await fetchBytes(owner, logo);
    expect(hop.status).toBe(301);
    expect((await fetchBytes(owner, hop.headers.get('location')!)).status).toBe(200);
  });
});

describe('a build that cannot make a file', () => {
  test('fails with the file named, never turns ready, and the version answers a readable 503 instead of a page with a broken logo', async () => {
    const created = (await owner.post('/api/brands', { name: 'Missing File Co' })).body.brand;
    const own = (p: string) => `/api/brands/${created.id}${p}`;
    const logo = (await owner.upload(own('/logos'), 'mark.svg', FIXTURE_SVG, 'image/svg+xml')).body.logo;
    const { revision } = (await owner.get(own('/guideline'))).body;
    const doc = { type: 'doc', content: [{ type: 'logoShowcase', attrs: { id: 'show', logoIds: [logo.id], brandColorId: null, onDark: 'white', caption: '' } }] };
    expect((await owner.request('PUT', own('/guideline'), { baseRevision: revision, doc })).status).toBe(200);
    // The logo's stored file goes missing between upload and publish (a disk fault, a half-finished restore).
    const [row] = await sql('SELECT storage_key FROM brand_logos WHERE id = $1', [logo.id]);
    await rm(join(inject('filesDir'), row.storage_key));
    await owner.post(own('/versions'), { note: 'Broken' });
    // The job tries again (pg-boss retries) before it gives the version up as failed.
    await waitForBuild(owner, created.id, 1);
    type Row = { state: string; build_error: string | null; manifest: unknown };
    const [version] = await sql<Row>('SELECT state, build_error, manifest FROM guideline_versions WHERE brand_id = $1 AND number = 1', [created.id]);
    expect(version!.state).toBe('failed');
    expect(version!.manifest).toBeNull();
    expect(version!.build_error).toMatch(/logo "mark"/);
    const page = await fetchBytes(owner, `/b/${created.slug}/v/1`);
    expect(page.status).toBe(503);
    expect(page.body.toString()).toContain('could not be prepared');
  });
});

