// Renditions, bundles and the download log, read back with libraries that are not ours: sharp/libvips for
// raster metadata, decode-ico for the favicon, yauzl for the zip.
import decodeIco from 'decode-ico';
import sharp from 'sharp';
import yauzl from 'yauzl';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';
import { makeBrand, makeCast, type Cast, type Fixture } from './fixtures';

let cast: Cast;
let brand: Fixture;
beforeAll(async () => {
  cast = await makeCast();
  brand = await makeBrand(cast, 'Rendition Brand');
});
afterAll(closeDb);

/** The raw bytes of a GET with the client's session. */
async function bytes(client: Client, path: string, init: { method?: string; body?: unknown } = {}): Promise<{ status: number; body: Buffer; headers: Headers }> {
  const jar = (client as unknown as { cookies: Map<string, string> }).cookies;
  const headers: Record<string, string> = { origin: baseUrl(), cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; ') };
  if (init.body !== undefined) headers['content-type'] = 'application/json';
  const res = await fetch(baseUrl() + path, { method: init.method ?? 'GET', headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) });
  return { status: res.status, body: Buffer.from(await res.arrayBuffer()), headers: res.headers };
}
const file = (query: string) => `/api/assets/${brand.assetId}/file?${query}`;

/** Entry names of a zip, read with yauzl (a general-purpose zip reader, APPNOTE 6.3 central directory). */
function zipEntries(zip: Buffer): Promise<{ name: string; size: number; text?: string }[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(zip, { lazyEntries: true }, (err, archive) => {
      if (err || !archive) return reject(err);
      const out: { name: string; size: number; text?: string }[] = [];
      archive.on('entry', (entry: yauzl.Entry) => {
        if (entry.fileName !== 'USAGE.txt') {
          out.push({ name: entry.fileName, size: entry.uncompressedSize });
          return archive.readEntry();
        }
        archive.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            out.push({ name: entry.fileName, size: entry.uncompressedSize, text: Buffer.concat(chunks).toString('utf8') });
            archive.readEntry();
          });
        });
      });
      archive.on('end', () => resolve(out));
      archive.on('error', reject);
      archive.readEntry();
    });
  });
}

describe('renditions have the exact sizes asked for (read back with sharp metadata)', () => {
  // The fixture logo's viewBox is 120 × 60, so a width of N gives N × N/2.
  test.each([
    ['format=png&width=16', 'png', 16, 8],
    ['format=png&width=1000', 'png', 1000, 500],
    ['format=png&width=8000', 'png', 8000, 4000],
    ['format=webp&width=334', 'webp', 334, 167],
    ['format=jpg&width=640&background=%23f4efe6', 'jpeg', 640, 320],
    ['preset=apple-touch', 'png', 180, 180], // Apple's home-screen icon size for current iPhones (from memory)
    ['preset=app-icon-192', 'png', 192, 192], // web app manifest icon sizes most browsers ask for (common practice)
    ['preset=app-icon-512', 'png', 512, 512],
    ['preset=social-avatar&width=400', 'png', 400, 400],
  ])('%s → %s %i × %i', async (query, format, width, height) => {
    const r = await bytes(cast.clients.partner, file(query));
    expect(r.status, r.body.toString().slice(0, 200)).toBe(200);
    const meta = await sharp(r.body).metadata();
    expect({ format: meta.format, width: meta.width, height: meta.height }).toEqual({ format, width, height });
  });

  test('PNG keeps transparency; JPEG is flattened on the chosen background', async () => {
    const png = await sharp((await bytes(cast.clients.owner, file('format=png&width=120'))).body).raw().toBuffer({ resolveWithObject: true });
    expect(png.info.channels).toBe(4);
    expect(png.data[3]).toBe(0); // top-left corner of the fixture is empty
    const jpg = await sharp((await bytes(cast.clients.owner, file('format=jpg&width=120&background=%23ff0000'))).body).raw().toBuffer({ resolveWithObject: true });
    expect(jpg.info.channels).toBe(3);
    // ≈ (255, 0, 0): JPEG is lossy, so within a few levels.
    expect(jpg.data[0]).toBeGreaterThan(240);
    expect(Math.max(jpg.data[1], jpg.data[2])).toBeLessThan(16);
  });

  test('one-colour variants: every drawn pixel is the ink (black, white)', async () => {
    for (const [variant, ink] of [['black', 0], ['white', 255]] as const) {
      const { data } = await sharp((await bytes(cast.clients.owner, file(`format=png&width=120&variant=${variant}`))).body).raw().toBuffer({ resolveWithObject: true });
      for (let i = 0; i < data.length; i += 4) if (data[i + 3] === 255) expect([data[i], data[i + 1], data[i + 2]]).toEqual([ink, ink, ink]);
    }
  });

  test('the social avatar keeps the clear space: a quarter of the drawn height on the short side (the identity default, common practice)', async () => {
    const { data, info } = await sharp((await bytes(cast.clients.owner, file('preset=social-avatar&width=400&background=%23ffffff'))).body).raw().toBuffer({ resolveWithObject: true });
    // Find the drawn (non-white) box.
    let top = info.height, left = info.width, right = 0, bottom = 0;
    for (let y = 0; y < info.height; y++) for (let x = 0; x < info.width; x++) {
      const i = (y * info.width + x) * info.channels;
      if (data[i] < 240 || data[i + 1] < 240 || data[i + 2] < 240) { top = Math.min(top, y); bottom = Math.max(bottom, y); left = Math.min(left, x); right = Math.max(right, x); }
    }
    const w = right - left + 1;
    const h = bottom - top + 1;
    // Fixture drawn box is 90 × 40 units: wide, so width + 2 × (h/4) fills the 400 px square.
    expect(w + h / 2).toBeGreaterThan(396);
    expect(w + h / 2).toBeLessThan(404);
    expect(left).toBeGreaterThanOrEqual(Math.floor(h / 4) - 2);
  });

  test('the favicon ICO holds 16, 32 and 48 px images (parsed back with decode-ico)', async () => {
    const r = await bytes(cast.clients.partner, file('preset=favicon'));
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/x-icon');
    const images = decodeIco(r.body);
    expect(images.map((i) => [i.width, i.height]).sort((a, b) => a[0] - b[0])).toEqual([[16, 16], [32, 32], [48, 48]]);
  });

  test('print TIFF is CMYK with an embedded ICC profile, and the print caution travels with it (libvips metadata)', async () => {
    const r = await bytes(cast.clients.partner, file('preset=print&width=600'));
    expect(r.status).toBe(200);
    const meta = await sharp(r.body).metadata();
    expect(meta.format).toBe('tiff');
    expect(meta.space).toBe('cmyk');
    expect(meta.channels).toBe(4);
    expect(meta.hasProfile).toBe(true);
    expect(meta.icc!.length).toBeGreaterThan(128); // ICC.1:2022 §7.2: a profile header alone is 128 bytes
    expect(meta.icc!.subarray(16, 20).toString('latin1')).toBe('CMYK'); // ICC header data colour space signature
    expect(meta.width).toBe(600);
    expect(r.headers.get('x-print-caution')).toMatch(/proof/);
    const jpg = await sharp((await bytes(cast.clients.partner, file('format=jpg&width=300&colorSpace=cmyk'))).body).metadata();
    expect([jpg.format, jpg.space, jpg.hasProfile]).toEqual(['jpeg', 'cmyk', true]);
  });

  test('SVG variants stay vector and carry the ink', async () => {
    const r = await bytes(cast.clients.partner, file('format=svg&variant=one-colour&color=%23335c4a'));
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/svg+xml');
    const text = r.body.toString();
    expect(text).toMatch(/^<svg/);
    // Drawn back, every fully drawn pixel is the ink (the mask's own black and white never show).
    const { data } = await sharp(r.body).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    let drawn = 0;
    for (let i = 0; i < data.length; i += 4) {
      if (data[i + 3] === 255) {
        drawn++;
        expect([data[i], data[i + 1], data[i + 2]]).toEqual([0x33, 0x5c, 0x4a]);
      }
    }
    expect(drawn).toBeGreaterThan(0);
  });

  test.each([
    ['width=15&format=png', 'invalid_input'],
    ['width=8001&format=png', 'invalid_input'],
    ['width=12.5&format=png', 'invalid_input'],
    ['format=gif', 'invalid_input'],
    ['format=png&variant=one-colour', 'invalid_input'],
    ['format=jpg&background=transparent', 'invalid_input'],
    ['format=png&colorSpace=cmyk', 'invalid_input'],
    ['format=png&background=not-a-colour', 'invalid_color'],
    ['format=png&width=100&surprise=1', 'invalid_input'],
  ])('refused: %s → 400 %s', async (query, code) => {
    const r = await cast.clients.owner.get(file(query));
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe(code);
  });

  test('a second identical request is served from the cache (one index row per asset and parameters)', async () => {
    await bytes(cast.clients.owner, file('format=png&width=777'));
    await bytes(cast.clients.owner, file('format=png&width=777'));
    const rows = await sql('SELECT count(*)::int AS n FROM asset_renditions WHERE asset_id = $1', [brand.assetId]);
    const before = rows[0].n;
    await bytes(cast.clients.owner, file('format=png&width=777'));
    expect((await sql('SELECT count(*)::int AS n FROM asset_renditions WHERE asset_id = $1', [brand.assetId]))[0].n).toBe(before);
  });
});

describe('bundles', () => {
  test('all logos: a zip with originals, renditions and a USAGE.txt built from the identity (listed with yauzl)', async () => {
    const r = await bytes(cast.clients.partner, `/api/brands/${brand.brandId}/bundles`, { method: 'POST', body: { allLogos: true } });
    expect(r.status, r.body.toString().slice(0, 300)).toBe(200);
    expect(r.headers.get('content-type')).toBe('application/zip');
    const entries = await zipEntries(r.body);
    const names = entries.map((e) => e.name);
    expect(names[0]).toBe('USAGE.txt');
    expect(names).toEqual(expect.arrayContaining([
      'shelf-mark/original/shelf-mark.svg',
      expect.stringMatching(/^shelf-mark\/web-icons\/.*favicon\.ico$/),
      expect.stringMatching(/^shelf-mark\/print\/.*-cmyk\.tif$/),
      expect.stringMatching(/^shelf-mark\/print\/.*-print-cmyk\.pdf$/),
      expect.stringMatching(/^shelf-mark\/print\/.*-print-cmyk\.eps$/),
      expect.stringMatching(/^shelf-mark\/print\/.*-print\.pdf$/),
      expect.stringMatching(/^shelf-mark\/screen\/.*-2048w\.png$/),
    ]));
    expect(Number(r.headers.get('x-bundle-entries'))).toBe(entries.length);
    const usage = entries[0].text!;
    expect(usage).toContain('#1D2A44'); // the fixture colour "Ink"
    expect(usage).toMatch(/Never smaller than \d+ px wide on screen or [\d.]+ mm wide in print/);
    expect(usage).toMatch(/Keep clear/);
    expect(usage).toMatch(/proof/);
  });

  test('a partner asking for a draft gets 404; an owner asking for one gets 400 not_approved', async () => {
    const up = await cast.clients.owner.upload(`/api/brands/${brand.brandId}/assets`, 'draft.svg', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><rect width="5" height="5" fill="#224466"/></svg>', 'image/svg+xml');
    const draftId = up.body.assets[0].id;
    const asPartner = await cast.clients.partner.post(`/api/brands/${brand.brandId}/bundles`, { assetIds: [draftId] });
    expect(asPartner.status).toBe(404);
    const asOwner = await cast.clients.owner.post(`/api/brands/${brand.brandId}/bundles`, { assetIds: [draftId] });
    expect(asOwner.status).toBe(400);
    expect(asOwner.body.error.code).toBe('not_approved');
    expect((await cast.clients.owner.post(`/api/brands/${brand.brandId}/bundles`, {})).status).toBe(400);
  });
});

describe('the download log', () => {
  test('file downloads and bundles are recorded with who and what; owners read it as JSON and CSV (RFC 4180)', async () => {
    const fresh = await makeBrand(cast, 'Logged Brand');
    await bytes(cast.clients.partner, `/api/assets/${fresh.assetId}/file?format=png&width=256`);
    await bytes(cast.clients.reviewer, `/api/assets/${fresh.assetId}/file?preset=favicon`);
    await bytes(cast.clients.partner, `/api/brands/${fresh.brandId}/bundles`, { method: 'POST', body: { assetIds: [fresh.assetId] } });
    // The shelf's thumbnails are not downloads, and a "preview" cannot be used to take a full-size file unlogged.
    expect((await bytes(cast.clients.partner, `/api/assets/${fresh.assetId}/file?format=png&width=480&preview=1`)).status).toBe(200);
    expect((await bytes(cast.clients.partner, `/api/assets/${fresh.assetId}/file?format=png&width=2000&preview=1`)).status).toBe(400);

    const rows = await sql('SELECT kind, user_id, share_link_id, asset_id, details FROM asset_downloads WHERE brand_id = $1 ORDER BY created_at', [fresh.brandId]);
    expect(rows.map((r) => r.kind)).toEqual(['file', 'file', 'bundle']);
    expect(rows.every((r) => r.user_id && r.share_link_id === null)).toBe(true);
    expect(rows[0].details).toMatchObject({ format: 'png', width: 256 });
    expect(rows[2].details).toMatchObject({ assetIds: [fresh.assetId] });

    const log = await cast.clients.owner.get(`/api/brands/${fresh.brandId}/downloads`);
    expect(log.status).toBe(200);
    expect(log.body.downloads).toHaveLength(3);
    expect(log.body.downloads[0]).toMatchObject({ kind: 'bundle', who: { type: 'member', email: cast.emails.partner } });
    const onlyFiles = await cast.clients.owner.get(`/api/brands/${fresh.brandId}/downloads?kind=file`);
    expect(onlyFiles.body.downloads).toHaveLength(2);
    const future = await cast.clients.owner.get(`/api/brands/${fresh.brandId}/downloads?from=2099-01-01`);
    expect(future.body.downloads).toEqual([]);

    const csv = await cast.clients.owner.get(`/api/brands/${fresh.brandId}/downloads?format=csv`);
    expect(csv.headers.get('content-type')).toMatch(/^text\/csv/);
    const lines = (csv.body as string).split('\r\n');
    expect(lines[0]).toBe('when,kind,asset,who,email,share_link,file,format,width,variant,entries');
    expect(lines).toHaveLength(5); // header, three rows, and the final CRLF
    expect((await cast.clients.editor.get(`/api/brands/${fresh.brandId}/downloads`)).status).toBe(403);
  });
});
