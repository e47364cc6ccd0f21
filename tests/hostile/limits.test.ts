// Limits a hostile visitor must not be able to reset, dodge or overrun, against the built server (scripts/serve.mjs).
// Requirement texts: OWASP ASVS 5.0.0 (github.com/OWASP/ASVS, 5.0/en) and the OWASP Cheat Sheet Series.
import type { ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { freePort } from '../../scripts/lib/postgres';
import { startServer } from '../../scripts/lib/prepare';
import { clientAddress, trustedProxies } from '@/lib/http/client-address';
import { Client, baseUrl, signIn } from '../support/client';
import { closeDb, sql } from '../support/db';
import { waitForBuild } from '../support/publish';
import { makeBrand, makeCast, type Cast, type Fixture } from '../integration/fixtures';

const SECRET = 'test-secret-that-is-long-enough-for-better-auth';
const LOW_LIMIT = 3;
// Each check sends from a loopback address of its own, so no other test shares its limiter bucket.
const ATTACKER = '127.0.0.9';
const PROXY = '127.0.0.11';

let limited: { child: ChildProcess; port: number } | undefined;
let cast: Cast;
let brand: Fixture;
let slug: string;

beforeAll(async () => {
  // A second server on the same cluster with a low sign-in limit and one trusted proxy (the suite's own uses 10 000).
  const port = await freePort();
  const child = await startServer(
    { host: '127.0.0.1', port, databaseUrl: inject('databaseUrl'), siteUrl: baseUrl(), secret: SECRET, signInLimit: LOW_LIMIT, trustedProxies: PROXY, filesDir: join(mkdtempSync(join(tmpdir(), 'plumbline-limits-')), 'files') },
    { quiet: true },
  );
  limited = { child, port };
  cast = await makeCast();
  brand = await makeBrand(cast, 'Limits Brand');
  slug = (await cast.clients.owner.get(`/api/brands/${brand.brandId}`)).body.brand.slug;
  // The fixture's version is built by the job after publishing answers; its site exists once it is ready.
  await waitForBuild(cast.clients.owner, brand.brandId, 1);
});

afterAll(async () => {
  limited?.child.kill('SIGTERM');
  await closeDb();
});

interface Sent {
  status: number;
  body: any;
  /** Bytes written before the answer arrived, and the size of the whole body we meant to send. */
  sentBeforeAnswer: number;
  total: number;
}

/** Send `total` bytes chunked (no Content-Length), from `localAddress`, stopping as soon as an answer arrives. */
function sendChunked(opts: { port?: number; path: string; headers: Record<string, string>; head?: Buffer; total: number; localAddress?: string }): Promise<Sent> {
  const port = opts.port ?? Number(new URL(baseUrl()).port);
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = -1;
    const req = httpRequest({ host: '127.0.0.1', port, path: opts.path, method: 'POST', localAddress: opts.localAddress, headers: { origin: baseUrl(), ...opts.headers } }, (res) => {
      answered = sent;
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        req.destroy();
        const text = Buffer.concat(chunks).toString('utf8');
        let body: unknown = text;
        try {
          body = JSON.parse(text);
        } catch {
          // not JSON
        }
        resolve({ status: res.statusCode ?? 0, body, sentBeforeAnswer: answered, total: opts.total });
      });
    });
    req.on('error', (err) => (answered >= 0 ? undefined : reject(err)));
    const chunk = Buffer.alloc(1024 * 1024, 0x20);
    const pump = () => {
      if (sent === 0 && opts.head) {
        req.write(opts.head);
        sent += opts.head.length;
      }
      while (answered < 0 && sent < opts.total) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
      if (answered < 0) req.end();
    };
    pump();
  });
}

/** POST JSON (or a form) from a chosen local address with a chosen X-Forwarded-For; the status and body. */
function postFrom(opts: { port?: number; localAddress: string; path: string; body: string; type?: string; xff?: string; cookie?: string }): Promise<{ status: number; body: string }> {
  const port = opts.port ?? Number(new URL(baseUrl()).port);
  return new Promise((ok, fail) => {
    const headers: Record<string, string | number> = { 'content-type': opts.type ?? 'application/json', origin: baseUrl(), 'content-length': Buffer.byteLength(opts.body) };
    if (opts.xff) headers['x-forwarded-for'] = opts.xff;
    if (opts.cookie) headers.cookie = opts.cookie;
    const req = httpRequest({ host: '127.0.0.1', port, path: opts.path, method: 'POST', localAddress: opts.localAddress, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => ok({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }));
    });
    req.on('error', fail);
    req.end(opts.body);
  });
}

const randomIp = () => `198.51.100.${Math.floor(Math.random() * 254) + 1}`;

describe('limits keyed on the connection, not on what the client says', () => {
  it('V6.3.1 + V4.1.3 (ASVS 5.0): a new X-Forwarded-For on each try does not reset the sign-in limit', async () => {
    const email = DEMO_PEOPLE[0].email;
    const attempt = (password: string) =>
      postFrom({ port: limited!.port, localAddress: ATTACKER, path: '/api/auth/sign-in/email', body: JSON.stringify({ email, password }), xff: randomIp() });
    const statuses: number[] = [];
    for (let i = 0; i < LOW_LIMIT + 3; i++) statuses.push((await attempt(`wrong-guess-${i}`)).status);
    expect(statuses).toEqual([...Array(LOW_LIMIT).fill(401), 429, 429, 429]);
    // The right password is refused too while the limit holds.
    expect((await attempt(DEMO_PASSWORD)).status).toBe(429);
  });

  it('V6.3.1 + V4.1.3 (ASVS 5.0): a new X-Forwarded-For on each try does not reset the share-link password limit', async () => {
    const { url } = (await cast.clients.owner.post(`/api/brands/${brand.brandId}/share-links`, { password: 'harbour-lights-at-dusk' })).body.shareLink;
    const path = new URL(url).pathname;
    const attempt = (password: string) =>
      postFrom({ localAddress: '127.0.0.12', path, body: `password=${encodeURIComponent(password)}`, type: 'application/x-www-form-urlencoded', xff: randomIp() });
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) statuses.push((await attempt(`wrong-${i}`)).status);
    // Five tries per link and address per quarter hour (src/lib/publishing/share-links.server.ts).
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429]);
    expect((await attempt('harbour-lights-at-dusk')).status).toBe(429);
  });

  it('V4.1.3 (ASVS 5.0): X-Forwarded-For is believed from a proxy named in TRUSTED_PROXIES, one bucket per client behind it', async () => {
    const email = DEMO_PEOPLE[1].email;
    const attempt = (xff: string) =>
      postFrom({ port: limited!.port, localAddress: PROXY, path: '/api/auth/sign-in/email', body: JSON.stringify({ email, password: 'wrong-guess' }), xff });
    // Different clients behind the trusted proxy are counted apart…
    for (let i = 1; i <= LOW_LIMIT + 2; i++) expect((await attempt(`203.0.113.${i}`)).status).toBe(401);
    // …and one client behind it is still limited, whatever it writes left of the proxy's own entry.
    const statuses: number[] = [];
    for (let i = 0; i < LOW_LIMIT + 1; i++) statuses.push((await attempt(`${randomIp()}, 203.0.113.200`)).status);
    expect(statuses).toEqual([...Array(LOW_LIMIT).fill(401), 429]);
  });

  it('V4.1.3 (ASVS 5.0): clientAddress walks X-Forwarded-For from the right and skips only TRUSTED_PROXIES hops', () => {
    const req = (xff: string) => new Request('http://127.0.0.1/', { headers: { 'x-forwarded-for': xff } });
    expect(clientAddress(req('1.2.3.4'), '203.0.113.9')).toBe('203.0.113.9');
    expect(clientAddress(req('1.2.3.4, 198.51.100.7'), '10.0.0.1', trustedProxies('10.0.0.0/8'))).toBe('198.51.100.7');
    expect(clientAddress(req('1.2.3.4, 198.51.100.7, 10.1.1.1'), '10.0.0.1', trustedProxies('10.0.0.0/8'))).toBe('198.51.100.7');
    expect(clientAddress(req('1.2.3.4'), '203.0.113.9', trustedProxies('10.0.0.0/8'))).toBe('203.0.113.9');
  });
});

describe('no redirect off the site after sign-in', () => {
  // Payloads: OWASP Unvalidated Redirects and Forwards Cheat Sheet; tab/newline stripping and `\` as `/`: WHATWG URL.
  it.each([
    '/%09/evil.example',
    '//evil.example',
    '/%5Cevil.example',
    '/%2F/evil.example',
    '%2f%2fevil.example',
    '/%252F%252Fevil.example',
    'javascript:alert(1)',
    'https://evil.example/',
    '/.//evil.example',
  ])('V3.7.2 (ASVS 5.0), OWASP Unvalidated Redirects Cheat Sheet: next=%s lands on the dashboard', async (payload) => {
    const member = await signIn(DEMO_PEOPLE[0].email);
    const r = await member.get(`/sign-in?next=${payload}`);
    expect(r.status).toBe(302);
    expect(r.headers.get('location')).toBe('/app');
    // Signed out, the form is handed the dashboard, never the payload.
    const page = await new Client().get(`/sign-in?next=${payload}`);
    expect(page.status).toBe(200);
    expect(page.body).not.toMatch(/evil\.example|javascript:/);
  });

  it('V3.7.2 (ASVS 5.0): a same-site next survives', async () => {
    const member = await signIn(DEMO_PEOPLE[0].email);
    const r = await member.get(`/sign-in?next=${encodeURIComponent(`/b/${slug}`)}`);
    expect(r.headers.get('location')).toBe(`/b/${slug}`);
  });
});

describe('body limits hold on the stream (chunked, no Content-Length)', () => {
  it('V2.4.1 (ASVS 5.0), OWASP Denial of Service Cheat Sheet: 50 MB chunked to sign-in → 413 before the body is sent', async () => {
    const r = await sendChunked({ path: '/api/auth/sign-in/email', headers: { 'content-type': 'application/json' }, head: Buffer.from('{"email":"'), total: 50 * 1024 * 1024, localAddress: '127.0.0.13' });
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too_large');
    expect(r.sentBeforeAnswer).toBeLessThan(r.total / 2);
  });

  it('V2.4.1 (ASVS 5.0), OWASP Denial of Service Cheat Sheet: 50 MB chunked JSON to the API → 413, nothing created', async () => {
    const owner = cast.clients.owner;
    const before = (await owner.get('/api/brands')).body.brands.length;
    const r = await sendChunked({ path: '/api/brands', headers: { 'content-type': 'application/json', cookie: owner.cookieHeader() }, head: Buffer.from('{"name":"'), total: 50 * 1024 * 1024 });
    expect(r.status).toBe(413);
    expect(r.body.error).toMatchObject({ code: 'too_large' });
    expect(r.sentBeforeAnswer).toBeLessThan(r.total / 2);
    expect((await owner.get('/api/brands')).body.brands.length).toBe(before);
  });

  it('V5.2.1 (ASVS 5.0): 50 MB chunked logo upload → 413 as it streams, the brand keeps its logos', async () => {
    const owner = cast.clients.owner;
    const before = await sql('SELECT id FROM brand_logos WHERE brand_id = $1 ORDER BY id', [brand.brandId]);
    const boundary = `----limits${randomUUID()}`;
    const head = Buffer.from(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="huge.svg"\r\ncontent-type: image/svg+xml\r\n\r\n<svg `);
    const r = await sendChunked({ path: `/api/brands/${brand.brandId}/logos`, headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie: owner.cookieHeader() }, head, total: 50 * 1024 * 1024 });
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too_large');
    expect(r.sentBeforeAnswer).toBeLessThan(r.total / 2);
    expect(await sql('SELECT id FROM brand_logos WHERE brand_id = $1 ORDER BY id', [brand.brandId])).toEqual(before);
  });

  it('V5.2.1 (ASVS 5.0): a 640 MB chunked asset upload is refused once the file passes 25 MB, nothing stored', async () => {
    const owner = cast.clients.owner;
    const count = async () => (await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1', [brand.brandId]))[0].n;
    const before = await count();
    const boundary = `----limits${randomUUID()}`;
    const head = Buffer.from(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="huge.png"\r\ncontent-type: image/png\r\n\r\n`);
    const r = await sendChunked({ path: `/api/brands/${brand.brandId}/assets`, headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie: owner.cookieHeader() }, head, total: 640 * 1024 * 1024 });
    // The shelf's documented answer for a file over its limit (tests/integration/assets.test.ts): 400 too_large.
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('too_large');
    expect(r.body.rejected).toEqual([expect.objectContaining({ filename: 'huge.png', code: 'too_large' })]);
    expect(r.sentBeforeAnswer).toBeLessThan(100 * 1024 * 1024);
    expect(await count()).toBe(before);
  });
});

describe('lookups that name nothing', () => {
  it.each(['__proto__', 'constructor', 'toString', 'hasOwnProperty'])('V15.3.6 (ASVS 5.0): a published file id %s is a 404, not a 500', async (id) => {
    const r = await cast.clients.owner.get(`/b/${slug}/v/1/files/${id}`);
    expect(r.status).toBe(404);
  });

  it('V8.2.2 (ASVS 5.0), OWASP Authorization Cheat Sheet: an outsider gets one answer for an existing, a random and a malformed asset id', async () => {
    const outsider = cast.clients.outsider;
    const answers = await Promise.all([brand.assetId, randomUUID(), 'not-an-id', '__proto__'].map((id) => outsider.get(`/api/assets/${id}/file`)));
    for (const a of answers) {
      expect(a.status).toBe(404);
      expect(a.body).toEqual(answers[0].body);
    }
  });

  it('V8.2.2 (ASVS 5.0), OWASP Authorization Cheat Sheet: a share link of another brand gets one answer for an existing and a random asset id', async () => {
    // The outsider's own brand, with its own asset and a download link.
    const outsider = cast.clients.outsider;
    const theirs = (await outsider.get('/api/brands')).body.brands[0].id as string;
    const link = (await outsider.post(`/api/brands/${theirs}/share-links`, { allowDownloads: true })).body.shareLink;
    const holder = new Client();
    await holder.get(new URL(link.url).pathname);
    const answers = await Promise.all([brand.assetId, randomUUID(), 'not-an-id'].map((id) => holder.get(`/api/assets/${id}/file`)));
    for (const a of answers) {
      expect(a.status).toBe(404);
      expect(a.body).toEqual(answers[0].body);
    }
  });
});

describe('signing out', () => {
  it('V7.4.1 (ASVS 5.0): a signed-out session cookie is refused on the very next request, in every process', async () => {
    const member = await signIn(DEMO_PEOPLE[2].email);
    const cookie = member.cookieHeader();
    const other = `http://127.0.0.1:${limited!.port}`;
    // Both processes have just seen the session (any cache would now hold it).
    expect((await fetch(`${baseUrl()}/api/brands`, { headers: { cookie } })).status).toBe(200);
    expect((await fetch(`${other}/api/brands`, { headers: { cookie } })).status).toBe(200);
    expect((await member.post('/api/auth/sign-out', {})).status).toBe(200);
    expect((await fetch(`${baseUrl()}/api/brands`, { headers: { cookie } })).status).toBe(401);
    expect((await fetch(`${other}/api/brands`, { headers: { cookie } })).status).toBe(401);
    const page = await fetch(`${baseUrl()}/app`, { headers: { cookie }, redirect: 'manual' });
    expect(page.status).toBe(302);
    expect(page.headers.get('location')).toContain('/sign-in');
  });
});
