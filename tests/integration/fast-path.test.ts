// Published reads answered ahead of Astro (src/lib/publishing/fast-path.server.ts), over HTTP against the built
// server, with raw bytes (node:http, which does not decode bodies) so the encodings themselves are checked.
// Outside references, named beside each check:
// - RFC 9110 §8.4 Content-Encoding, §12.5.3 Accept-Encoding (q=0 refuses a coding), §12.5.5 Vary, §8.6
//   Content-Length (for HEAD: the length GET would send), §9.3.2 HEAD (no content), §8.8.3 strong ETags ("a
//   strong validator changes whenever the representation data changes": so each encoding has its own), §13.1.2
//   If-None-Match with weak comparison, §15.4.5 304 Not Modified, §15.4.2 301 Moved Permanently, §10.2.3 Retry-After;
// - RFC 7932 (brotli) and RFC 1952 (gzip), decoded by node:zlib as the reference implementation of both.
import { request } from 'node:http';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { pagePath, staticPath, type Manifest } from '@/lib/publishing/build/contract';
import { baseUrl, Client, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { waitForBuild } from '../support/publish';

const SECOND = 1000;
/** What a current browser sends (common practice: Chromium and Firefox both list gzip, deflate, br, zstd). */
const BROWSER_ENCODINGS = 'gzip, deflate, br, zstd';
let owner: Client;
let brandId: string;
let slug: string;
let manifest: Manifest;
const api = (p = '') => `/api/brands/${brandId}${p}`;

interface Raw {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: Buffer;
}

/** One request with the bytes as sent on the wire (no decoding). */
function raw(path: string, headers: Record<string, string>, method = 'GET'): Promise<Raw> {
  const url = new URL(path, baseUrl());
  return new Promise((resolve, reject) => {
    const req = request({ host: url.hostname, port: url.port, path: url.pathname + url.search, method, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

const stored = (path: string) => readFile(join(inject('filesDir'), manifest.entries[path].key));
const varyOf = (r: Raw) => String(r.headers.vary ?? '').split(/\s*,\s*/).map((v) => v.toLowerCase());

/** Open a share link: the visitor holding its cookie. */
async function visitor(url: string): Promise<Client> {
  const client = new Client();
  expect((await client.get(new URL(url).pathname)).status).toBe(303);
  return client;
}

/** Polls until `check` holds; fails after `deadline` ms. Answers how long it took from the first request sent. */
async function msUntil(check: () => Promise<boolean>, deadline: number): Promise<number> {
  const start = performance.now();
  for (;;) {
    const sent = performance.now();
    if (await check()) return sent - start;
    if (performance.now() - start > deadline) throw new Error(`still not so after ${deadline} ms`);
    await new Promise((r) => setTimeout(r, 10));
  }
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('fast-owner'));
  const created = (await owner.post('/api/brands', { name: 'Quick Reads Co' })).body.brand;
  brandId = created.id;
  slug = created.slug;
  const { revision } = (await owner.get(api('/guideline'))).body;
  const content = [
    { type: 'sectionHeading', attrs: { id: 'intro', title: 'Welcome', eyebrow: '', intro: 'How the brand reads.' } },
    { type: 'paragraph', attrs: { id: 'p1' }, content: [{ type: 'text', text: 'Guidance for everyone who applies the brand. '.repeat(40) }] },
  ];
  expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content } })).status).toBe(200);
  expect((await owner.post(api('/versions'), { note: 'First' })).status).toBe(201);
  expect((await waitForBuild(owner, brandId, 1)).state).toBe('ready');
  [{ manifest }] = await sql('SELECT manifest FROM guideline_versions WHERE brand_id = $1 AND number = 1', [brandId]);
}, 240_000);
afterAll(closeDb);

describe('encodings of a share-link visitor’s page', () => {
  let cookie: string;
  let identity: Raw;
  beforeAll(async () => {
    const { url } = (await owner.post(api('/share-links'), { label: 'Encodings' })).body.shareLink;
    cookie = (await visitor(url)).cookieHeader();
    identity = await raw(`/b/${slug}`, { cookie });
  });

  test('without Accept-Encoding: the stored bytes as they are, no Content-Encoding (RFC 9110 §8.4)', async () => {
    expect(identity.status).toBe(200);
    expect(identity.headers['content-encoding']).toBeUndefined();
    expect(identity.body.equals(await stored(pagePath({ latest: true, who: 'link', downloads: false })))).toBe(true);
    expect(Number(identity.headers['content-length'])).toBe(identity.body.length);
  });

  test.each([
    // RFC 7932: brotli; node:zlib decodes it.
    ['br', BROWSER_ENCODINGS, (b: Buffer) => brotliDecompressSync(b)],
    // RFC 1952: gzip; node:zlib decodes it. q=0 refuses br (RFC 9110 §12.5.3).
    ['gzip', 'gzip, br;q=0', (b: Buffer) => gunzipSync(b)],
  ] as const)('%s: decodes to the identity bytes, smaller, with its own strong ETag and Vary (RFC 9110 §8.8.3, §12.5.5)', async (coding, accept, decode) => {
    const r = await raw(`/b/${slug}`, { cookie, 'accept-encoding': accept });
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBe(coding);
    expect(decode(r.body).equals(identity.body)).toBe(true);
    expect(r.body.length).toBeLessThan(identity.body.length);
    expect(Number(r.headers['content-length'])).toBe(r.body.length);
    // A strong validator differs for each representation (RFC 9110 §8.8.3): never W/, never the identity's.
    expect(r.headers.etag).toMatch(/^"[^"]+"$/);
    expect(r.headers.etag).not.toBe(identity.headers.etag);
    // The answer depended on Accept-Encoding and, for a page, on who is asking (RFC 9110 §12.5.5).
    expect(varyOf(r)).toEqual(expect.arrayContaining(['accept-encoding', 'cookie']));
  });

  test('If-None-Match: 304 for each encoding’s own ETag, 200 for another encoding’s (RFC 9110 §13.1.2, §15.4.5)', async () => {
    const br = await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' });
    const gz = await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'gzip' });
    const tags = new Set([identity.headers.etag, br.headers.etag, gz.headers.etag]);
    expect(tags.size).toBe(3);
    for (const [accept, etag] of [['', identity.headers.etag], ['br', br.headers.etag], ['gzip', gz.headers.etag]] as const) {
      const again = await raw(`/b/${slug}`, { cookie, 'accept-encoding': accept, 'if-none-match': String(etag) });
      expect(again.status).toBe(304);
      expect(again.body.length).toBe(0);
      expect(again.headers.etag).toBe(etag);
      // Weak comparison (§13.1.2): W/"x" matches "x" for If-None-Match.
      expect((await raw(`/b/${slug}`, { cookie, 'accept-encoding': accept, 'if-none-match': `W/${etag}` })).status).toBe(304);
    }
    // The gzip ETag does not validate the brotli body.
    expect((await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br', 'if-none-match': String(gz.headers.etag) })).status).toBe(200);
  });

  test('HEAD: the headers GET would send, Content-Length included, and no content (RFC 9110 §9.3.2, §8.6)', async () => {
    const get = await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' });
    const head = await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' }, 'HEAD');
    expect(head.status).toBe(200);
    expect(head.body.length).toBe(0);
    expect(head.headers['content-length']).toBe(get.headers['content-length']);
    expect(head.headers.etag).toBe(get.headers.etag);
    expect(head.headers['content-encoding']).toBe('br');
  });

  test('a version’s stylesheet copy is compressed too and varies by Accept-Encoding only (RFC 9110 §12.5.5)', async () => {
    const path = `/b/${slug}/v/1/static/site.css`;
    expect(manifest.entries[staticPath('site.css')]).toBeDefined();
    const r = await raw(path, { cookie, 'accept-encoding': BROWSER_ENCODINGS });
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBe('br');
    expect(brotliDecompressSync(r.body).equals(await stored(staticPath('site.css')))).toBe(true);
    expect(varyOf(r)).toEqual(['accept-encoding']);
    expect(r.headers['cache-control']).toBe('private, max-age=31536000, immutable');
  });
});

describe('refusals reach the fast path within a second', () => {
  test('a revoked share link', async () => {
    const { url, id } = (await owner.post(api('/share-links'), { label: 'Revoked' })).body.shareLink;
    const cookie = (await visitor(url)).cookieHeader();
    // Answered by the fast path: only it sends a compressed page (RFC 9110 §8.4).
    for (let i = 0; i < 2; i++) expect((await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' })).headers['content-encoding']).toBe('br');
    expect((await owner.delete(api(`/share-links/${id}`))).status).toBe(204);
    const took = await msUntil(async () => (await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' })).status !== 200, 5 * SECOND);
    expect(took).toBeLessThan(SECOND);
    // Today's answer for anyone without access: sent to sign in; files say nothing (404).
    expect((await raw(`/b/${slug}`, { cookie })).status).toBe(302);
    expect((await raw(`/b/${slug}/v/1/static/site.css`, { cookie })).status).toBe(404);
  });

  test('a removed member', async () => {
    const member = await signUpFresh('fast-member');
    const memberId = await joinBrand(owner, brandId, member, 'viewer');
    const cookie = member.client.cookieHeader();
    for (let i = 0; i < 2; i++) expect((await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'br' })).headers['content-encoding']).toBe('br');
    expect((await owner.delete(api(`/members/${memberId}`))).status).toBe(204);
    const took = await msUntil(async () => (await raw(`/b/${slug}`, { cookie })).status !== 200, 5 * SECOND);
    expect(took).toBeLessThan(SECOND);
    expect((await raw(`/b/${slug}`, { cookie })).status).toBe(404);
  });

  test('a signed-out session', async () => {
    const member = await signUpFresh('fast-session');
    await joinBrand(owner, brandId, member, 'viewer');
    const cookie = member.client.cookieHeader();
    for (let i = 0; i < 2; i++) expect((await raw(`/b/${slug}`, { cookie, 'accept-encoding': 'gzip' })).headers['content-encoding']).toBe('gzip');
    expect((await member.client.post('/api/auth/sign-out', {})).status).toBe(200);
    const took = await msUntil(async () => (await raw(`/b/${slug}`, { cookie })).status !== 200, 5 * SECOND);
    expect(took).toBeLessThan(SECOND);
    expect((await raw(`/b/${slug}`, { cookie })).status).toBe(302);
  });
});

describe('what the fast path leaves to the full routes', () => {
  test('a former slug still answers 301 to the new address, path kept (RFC 9110 §15.4.2)', async () => {
    const renamed = (await owner.post('/api/brands', { name: 'Renamed Reads Co' })).body.brand;
    const { revision } = (await owner.get(`/api/brands/${renamed.id}/guideline`)).body;
    const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'intro', title: 'Hello', eyebrow: '', intro: '' } }] };
    expect((await owner.request('PUT', `/api/brands/${renamed.id}/guideline`, { baseRevision: revision, doc })).status).toBe(200);
    expect((await owner.post(`/api/brands/${renamed.id}/versions`, { note: 'One' })).status).toBe(201);
    expect((await waitForBuild(owner, renamed.id, 1)).state).toBe('ready');
    const fresh = `${renamed.slug}-new`;
    expect((await owner.patch(`/api/brands/${renamed.id}`, { slug: fresh })).status).toBe(200);
    const cookie = owner.cookieHeader();
    for (const rest of ['', '/v/1', '/v/1/static/site.css']) {
      const r = await raw(`/b/${renamed.slug}${rest}`, { cookie, 'accept-encoding': 'br' });
      expect(r.status).toBe(301);
      expect(r.headers.location).toBe(`/b/${fresh}${rest}`);
    }
    expect((await raw(`/b/${fresh}`, { cookie, 'accept-encoding': 'br' })).headers['content-encoding']).toBe('br');
  });

  test('a version not ready yet answers 503 with Retry-After and a page, as before (RFC 9110 §10.2.3)', async () => {
    const cookie = owner.cookieHeader();
    expect((await raw(`/b/${slug}/v/1`, { cookie, 'accept-encoding': 'br' })).status).toBe(200);
    // The row as a build in progress leaves it (the change notice tells every process).
    await sql(`UPDATE guideline_versions SET state = 'building' WHERE brand_id = $1 AND number = 1`, [brandId]);
    try {
      await msUntil(async () => (await raw(`/b/${slug}/v/1`, { cookie })).status === 503, 5 * SECOND);
      const r = await raw(`/b/${slug}/v/1`, { cookie, 'accept-encoding': 'br' });
      expect(r.status).toBe(503);
      expect(r.headers['retry-after']).toBe('5');
      expect(r.headers['content-encoding']).toBeUndefined();
      expect(r.body.toString()).toContain('being prepared');
    } finally {
      await sql(`UPDATE guideline_versions SET state = 'ready' WHERE brand_id = $1 AND number = 1`, [brandId]);
    }
  });

  test('a path the version does not hold, and other methods, get the full route’s answers', async () => {
    const cookie = owner.cookieHeader();
    const missing = await raw(`/b/${slug}/v/1/static/nothing.css`, { cookie, 'accept-encoding': 'br' });
    expect(missing.status).toBe(404);
    expect(missing.body.toString()).toBe('Not found');
    expect((await raw(`/b/${slug}/v/0`, { cookie })).status).toBe(404);
  });
});
