// Work a visitor can make us do is bounded: pixel caps on every rendition and on images inside SVGs, a cap on
// custom renditions per asset, and a per-caller rate for drawing new ones; cached files stay free.
// This file starts its own server (same database, same build) with small limits: RENDITION_CUSTOM_LIMIT=3,
// RENDITION_RATE_LIMIT=5 per minute, so the rest of the suite keeps the defaults.
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { freePort } from '../../scripts/lib/postgres';
import { startServer } from '../../scripts/lib/prepare';
import { FIXTURE_SVG } from '../integration/fixtures';
import { Client } from '../support/client';
import { closeDb, sql } from '../support/db';
import { publishAndWait } from '../support/publish';

const CUSTOM_LIMIT = 3;
const RATE_LIMIT = 5;

let server: ChildProcess;
let base: string;
let filesDir: string;
let owner: Client;
let brandId: string;
let slug: string;
/** The share-link holder of the rate rows, and two of the assets they asked for. */
let holder: Client;
let assetB: string;
let assetC: string;

/** A PNG chunk: length, type, data, CRC-32 over type and data (ISO/IEC 15948 §5.3). */
function chunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(4);
  head.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([head, body, crc]);
}

/** A real, all-black 1-bit greyscale PNG of width × height (ISO/IEC 15948): tiny on disk, width × height pixels when decoded. */
function blackPng(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([1, 0, 0, 0, 0], 8); // bit depth 1, colour type 0 (greyscale), deflate, adaptive filtering, no interlace
  const raw = Buffer.alloc((1 + Math.ceil(width / 8)) * height); // filter byte 0 and zero bits on every row
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0))]);
}

const svgWithImages = (...pngs: Buffer[]) =>
  `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect width="40" height="40" fill="#1d2a44"/>${pngs
    .map((p, i) => `<image x="${50 + i}" y="50" width="40" height="40" href="data:image/png;base64,${p.toString('base64')}"/>`)
    .join('')}</svg>`;

/** Upload one file to the brand's shelf as the owner. */
const upload = (name: string, content: string | Buffer, type: string, fields: Record<string, string> = {}) =>
  owner.upload(`/api/brands/${brandId}/assets`, name, content, type, fields);

/** An approved SVG logo of our own, with a colour to keep each upload's content distinct. */
async function approvedLogo(colour: string): Promise<string> {
  const up = await upload(`mark-${colour.slice(1)}.svg`, FIXTURE_SVG.replace('#c8553d', colour), 'image/svg+xml');
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const id = up.body.assets[0].id as string;
  expect((await owner.patch(`/api/brands/${brandId}/assets/${id}`, { state: 'approved' })).status).toBe(200);
  return id;
}

const renditionRows = async (assetId: string) => (await sql('SELECT count(*)::int AS n FROM asset_renditions WHERE asset_id = $1', [assetId]))[0].n as number;
const renditionFiles = () => {
  const dir = join(filesDir, brandId, 'rendition');
  return existsSync(dir) ? readdirSync(dir).length : 0;
};

/** A share-link holder: open the link once, keep its cookie. */
async function visitor(allowDownloads = true): Promise<Client> {
  const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads })).body.shareLink;
  const client = new Client(base);
  expect((await client.get(new URL(url).pathname)).status).toBe(303);
  return client;
}

beforeAll(async () => {
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  filesDir = mkdtempSync(join(tmpdir(), 'plumbline-hostile-files-'));
  server = await startServer(
    {
      host: '127.0.0.1',
      port,
      databaseUrl: inject('databaseUrl'),
      siteUrl: base,
      secret: 'hostile-renditions-secret-long-enough-for-better-auth',
      signInLimit: 10_000,
      filesDir,
      settings: { RENDITION_CUSTOM_LIMIT: String(CUSTOM_LIMIT), RENDITION_RATE_LIMIT: String(RATE_LIMIT) },
    },
    { quiet: true },
  );
  owner = new Client(base);
  const email = `render-owner-${Date.now()}@test.example`;
  const signUp = await owner.post('/api/auth/sign-up/email', { email, password: 'correct-horse-battery', name: 'Render Owner' });
  expect(signUp.status).toBe(200);
  // This server has no mail catcher: the address is proven directly in the database (the proof itself has its own tests).
  await sql('UPDATE "user" SET "emailVerified" = true WHERE email = $1', [email]);
  const brand = (await owner.post('/api/brands', { name: 'Bounded Work Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
});

afterAll(async () => {
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    if (server.exitCode === null) server.kill('SIGKILL');
  }
  rmSync(filesDir, { recursive: true, force: true });
  await closeDb();
});

describe('pixel caps on what is drawn', () => {
  it('V5.2.6 (ASVS 5.0, pixel flood) a 4 × 2000 px PNG asked 2000 px wide is refused with 422 naming the 8192 px side cap, not drawn at 2000 × 1,000,000 (refused, never clamped)', async () => {
    const tall = await sharp({ create: { width: 4, height: 2000, channels: 4, background: '#1d2a44' } }).png().toBuffer();
    const up = await upload('sliver.png', tall, 'image/png', { kind: 'image' });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const id = up.body.assets[0].id;
    const before = renditionFiles();
    const r = await owner.get(`/api/assets/${id}/file?format=png&width=2000`);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('rendition_too_large');
    expect(r.body.error.message).toContain('2,000 × 1,000,000 px');
    expect(r.body.error.message).toContain('8192 px');
    expect(await renditionRows(id)).toBe(0);
    expect(renditionFiles()).toBe(before);
    // The cap is on the output: the same file 16 px wide (16 × 8000 px) is drawn.
    const small = await owner.get(`/api/assets/${id}/file?format=png&width=16`);
    expect(small.status).toBe(200);
  });

  it('V5.2.6 (ASVS 5.0) an SVG whose aspect ratio makes a 100 px wide rendition 20,000 px tall is refused (422) before librsvg draws it', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 20000"><rect width="100" height="20000" fill="#1d2a44"/></svg>';
    const up = await upload('needle.svg', svg, 'image/svg+xml');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const r = await owner.get(`/api/assets/${up.body.assets[0].id}/file?format=png&width=100`);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('rendition_too_large');
    expect(r.body.error.message).toContain('100 × 20,000 px');
    expect(await renditionRows(up.body.assets[0].id)).toBe(0);
  });

  it('V5.2.6 (ASVS 5.0) a square rendition 8000 px a side (64 million pixels) is refused with 422 naming the 40-million-pixel cap', async () => {
    const id = await approvedLogo('#2f6f4e');
    const r = await owner.get(`/api/assets/${id}/file?preset=social-avatar&width=8000`);
    expect(r.status).toBe(422);
    expect(r.body.error.message).toContain('40 million pixels');
  });
});

describe('images embedded in an SVG count against the pixel cap (checked at upload, from headers only)', () => {
  it('V5.2.6 (ASVS 5.0) and OWASP File Upload Cheat Sheet: an SVG embedding a real 20000 × 20000 px PNG is refused at upload and nothing is stored', async () => {
    const bomb = blackPng(20_000, 20_000);
    expect(bomb.length).toBeLessThan(200_000); // a decompression bomb: small on the wire, 400 million pixels decoded
    const meta = await sharp(bomb, { limitInputPixels: false }).metadata(); // libvips reads the same header
    expect([meta.width, meta.height]).toEqual([20_000, 20_000]);
    const before = (await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1', [brandId]))[0].n;
    const r = await upload('embedded.svg', svgWithImages(bomb), 'image/svg+xml');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('svg_embedded_image_too_large');
    expect(r.body.error.message).toContain('20,000 × 20,000 px');
    expect(r.body.error.message).toContain('40 million');
    expect((await sql('SELECT count(*)::int AS n FROM assets WHERE brand_id = $1', [brandId]))[0].n).toBe(before);
  });

  it('V5.2.6 (ASVS 5.0) embedded images are summed: two 5000 × 5000 px PNGs (50 million pixels together) are refused', async () => {
    const r = await upload('pair.svg', svgWithImages(blackPng(5000, 5000), blackPng(5000, 5001)), 'image/svg+xml');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('svg_embedded_image_too_large');
    expect(r.body.error.message).toContain('together');
  });

  it('OWASP File Upload Cheat Sheet: an SVG image pointing outside the file is refused (svg_external_reference)', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><image width="10" height="10" href="https://example.invalid/huge.png"/></svg>';
    const r = await upload('remote.svg', svg, 'image/svg+xml');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('svg_external_reference');
  });

  it('OWASP File Upload Cheat Sheet: a small embedded PNG is still accepted and drawn', async () => {
    const r = await upload('badge.svg', svgWithImages(blackPng(64, 64)), 'image/svg+xml');
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const png = await owner.get(`/api/assets/${r.body.assets[0].id}/file?format=png&width=64`);
    expect(png.status).toBe(200);
  });
});

describe('how many renditions a caller can make us draw and keep', () => {
  it(`V5.2.4 (ASVS 5.0, quota on files) beyond ${CUSTOM_LIMIT} custom renditions of one asset: 422 rendition_limit and nothing new is stored; standard files and earlier sizes still served`, async () => {
    const id = await approvedLogo('#5b3a8c');
    for (const width of [100, 101, 102]) expect((await owner.get(`/api/assets/${id}/file?format=png&width=${width}`)).status).toBe(200);
    const rows = await renditionRows(id);
    const files = renditionFiles();
    const over = await owner.get(`/api/assets/${id}/file?format=png&width=103`);
    expect(over.status).toBe(422);
    expect(over.body.error.code).toBe('rendition_limit');
    expect(over.body.error.message).toMatch(/3 custom renditions/);
    expect(await renditionRows(id)).toBe(rows);
    expect(renditionFiles()).toBe(files);
    // The standard set is not counted (a fixed number per asset), and sizes made before come from the cache.
    expect((await owner.get(`/api/assets/${id}/file?format=png&width=512`)).status).toBe(200);
    expect((await owner.get(`/api/assets/${id}/file?format=png&width=101`)).status).toBe(200);
  });

  it(`V2.4.1 (ASVS 5.0, anti-automation) an anonymous share-link holder may have at most ${RATE_LIMIT} new renditions drawn a minute; the next is 429 and nothing is stored`, async () => {
    assetB = await approvedLogo('#8c3a3a');
    assetC = await approvedLogo('#3a6f8c');
    await owner.request('PUT', `/api/brands/${brandId}/guideline`, {
      baseRevision: 0,
      doc: { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'dl', title: 'Files', eyebrow: '', intro: '' } }] },
    });
    await publishAndWait(owner, brandId, 'For visitors');
    holder = await visitor();
    const asks = [
      [assetB, 100],
      [assetB, 101],
      [assetB, 102],
      [assetC, 100],
      [assetC, 101],
    ] as const;
    for (const [id, width] of asks) expect((await holder.get(`/api/assets/${id}/file?format=png&width=${width}`)).status).toBe(200);
    const rows = await renditionRows(assetC);
    const files = renditionFiles();
    const over = await holder.get(`/api/assets/${assetC}/file?format=png&width=102`);
    expect(over.status).toBe(429);
    expect(over.body.error.code).toBe('rate_limited');
    expect(over.body.error.message).toContain(`${RATE_LIMIT} new renditions`);
    expect(await renditionRows(assetC)).toBe(rows);
    expect(renditionFiles()).toBe(files);
  });

  it('V2.4.1 (ASVS 5.0) forged X-Forwarded-For values do not buy the share-link holder a fresh budget each', async () => {
    const fresh = [await approvedLogo('#6f6f2f'), await approvedLogo('#2f2f6f')];
    const statuses: number[] = [];
    for (const [i, id] of [fresh[0], fresh[0], fresh[0], fresh[1], fresh[1], fresh[1]].entries()) {
      const r = await holder.request('GET', `/api/assets/${id}/file?format=png&width=${100 + i}`, undefined, { 'x-forwarded-for': `203.0.113.${i + 1}` });
      statuses.push(r.status);
    }
    // Six different forged addresses: at most one budget's worth is drawn, the rest is 429.
    expect(statuses.filter((s) => s === 200).length).toBeLessThanOrEqual(RATE_LIMIT);
    expect(statuses).toContain(429);
    expect(statuses.every((s) => s === 200 || s === 429)).toBe(true);
  });

  it('OWASP Denial of Service Cheat Sheet (serve from cache): over the rate, renditions made before and the standard set are still served, and the download is logged', async () => {
    const cached = await holder.get(`/api/assets/${assetB}/file?format=png&width=100`);
    expect(cached.status).toBe(200);
    expect(cached.headers.get('content-type')).toBe('image/png');
    expect((await sharp(Buffer.from(await (await fetch(`${base}/api/assets/${assetB}/file?format=png&width=100`, { headers: { cookie: holder.cookieHeader() } })).arrayBuffer())).metadata()).width).toBe(100);
    expect((await holder.get(`/api/assets/${assetC}/file?format=png&width=1024`)).status).toBe(200); // offered on the downloads page
    const logged = await sql("SELECT count(*)::int AS n FROM asset_downloads WHERE asset_id = $1 AND details->>'width' = '100'", [assetB]);
    expect(logged[0].n).toBeGreaterThanOrEqual(2);
  });

  it('V2.4.1 (ASVS 5.0) the budget is per link and address: another share link has its own', async () => {
    const other = await visitor();
    expect((await other.get(`/api/assets/${assetC}/file?format=png&width=102`)).status).toBe(200);
  });
});

// The published downloads page stays usable for the same visitor: its files are the standard set.
describe('the downloads page for a holder over the rate', () => {
  it('OWASP Denial of Service Cheat Sheet: the page and its previews still load', async () => {
    const page = await holder.get(`/b/${slug}/downloads`);
    expect(page.status).toBe(200);
    expect((await holder.get(`/api/assets/${assetC}/file?format=png&width=480&variant=white`)).status).toBe(200);
  });
});
