// One-colour logos through the API and the published site: knockouts read back by pixel sampling with sharp,
// the designer's own version files winning everywhere, and vector print files of shelf logos read back with pdf-lib.
// Luminance sorting follows WCAG 2.2 relative luminance; PDF structure follows ISO 32000-1 (see the unit tests).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { closeDb } from '../support/db';
import { publishAndWait } from '../support/publish';

const TREE = readFileSync(join(__dirname, '../fixtures/knockout/disc-tree.svg'), 'utf8');
const LETTERS = readFileSync(join(__dirname, '../fixtures/knockout/letters.svg'), 'utf8').replace('fill="#111"', 'fill="#000"');

let owner: Client;
let brandId: string;
let slug: string;
let treeId: string;
let lettersId: string;

/** Raw bytes of a GET with the client's cookies. */
async function bytes(client: Client, path: string): Promise<{ status: number; body: Buffer; type: string | null }> {
  const res = await fetch(baseUrl() + path, { headers: { origin: baseUrl(), cookie: client.cookieHeader() } });
  return { status: res.status, body: Buffer.from(await res.arrayBuffer()), type: res.headers.get('content-type') };
}

/** RGBA at logo units (x, y) of an image drawn so that one unit is `scale` px. */
async function sampler(image: Buffer, scale = 1) {
  const { data, info } = await sharp(image, { density: 72 * scale }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return (x: number, y: number) => {
    const at = (Math.round(y * scale) * info.width + Math.round(x * scale)) * 4;
    return Array.from(data.subarray(at, at + 4));
  };
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('knockout'));
  const brand = (await owner.post('/api/brands', { name: 'Knockout Test Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  treeId = (await owner.upload(`/api/brands/${brandId}/logos`, 'tree.svg', TREE, 'image/svg+xml', { variant: 'mark' })).body.logo.id;
  const png = await sharp(Buffer.from(LETTERS)).png().toBuffer();
  lettersId = (await owner.upload(`/api/brands/${brandId}/logos`, 'letters.png', png, 'image/png', { variant: 'wordmark' })).body.logo.id;
});
afterAll(closeDb);

const logoFile = (id: string, q: string) => `/api/brands/${brandId}/logos/${id}/file?${q}`;

describe('one-colour logos keep their drawing', () => {
  test('the white SVG of a light tree on a navy disc is a white disc with the tree cut out', async () => {
    const r = await bytes(owner, logoFile(treeId, 'variant=white'));
    expect(r.type).toBe('image/svg+xml');
    const px = await sampler(r.body, 2);
    expect(px(50, 40)[3]).toBe(0);
    expect(px(15, 50)).toEqual([255, 255, 255, 255]);
  });

  test('a PNG of black lettering gives white lettering on transparent, never the original bytes', async () => {
    const original = await bytes(owner, logoFile(lettersId, 'variant=original'));
    const white = await bytes(owner, logoFile(lettersId, 'variant=white'));
    expect(white.type).toBe('image/png');
    expect(white.body.equals(original.body)).toBe(false);
    const px = await sampler(white.body);
    expect(px(50, 20)).toEqual([255, 255, 255, 255]);
    expect(px(50, 50)[3]).toBe(0);
  });

  test('reversed is on a transparent ground, not a black rectangle', async () => {
    const px = await sampler((await bytes(owner, logoFile(treeId, 'variant=reversed'))).body, 2);
    expect(px(2, 2)[3]).toBe(0);
    expect(px(50, 40)[3]).toBe(0);
  });
});

describe("the designer's own version file wins", () => {
  const OWN = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect x="10" y="10" width="80" height="80" fill="#ffffff"/></svg>';

  test('upload, serve, publish and remove', async () => {
    const up = await owner.upload(`/api/brands/${brandId}/logos/${treeId}/variants/white`, 'white.svg', OWN, 'image/svg+xml');
    expect(up.status).toBe(200);
    expect(up.body.logo.ownVariants).toEqual(['white']);
    expect((await bytes(owner, logoFile(treeId, 'variant=white'))).body.toString()).toContain('<rect');
    // Published versions carry the file with them.
    const doc = { type: 'doc', content: [{ type: 'paragraph', attrs: { id: 'p1' }, content: [{ type: 'text', text: 'Our mark.' }] }] };
    expect((await owner.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: 0, doc })).status).toBe(200);
    await publishAndWait(owner, brandId, 'With own white');
    const published = await bytes(owner, `/b/${slug}/v/1/files/${treeId}?variant=white`);
    expect(published.status).toBe(200);
    expect(published.body.toString()).toContain('<rect');
    // The computed black is still a knockout on the site.
    const black = await sampler((await bytes(owner, `/b/${slug}/v/1/files/${treeId}?variant=black`)).body, 2);
    expect(black(50, 40)[3]).toBe(0);
    expect(black(15, 50)).toEqual([0, 0, 0, 255]);
    // Removed: the computed version is back, the published one keeps its copy.
    expect((await owner.delete(`/api/brands/${brandId}/logos/${treeId}/variants/white`)).status).toBe(200);
    expect((await bytes(owner, logoFile(treeId, 'variant=white'))).body.toString()).toContain('<mask');
    expect((await bytes(owner, `/b/${slug}/v/1/files/${treeId}?variant=white`)).body.toString()).toContain('<rect');
  });

  test('a bad slot or file is refused in words', async () => {
    const slot = await owner.upload(`/api/brands/${brandId}/logos/${treeId}/variants/sepia`, 'x.svg', OWN, 'image/svg+xml');
    expect(slot.status).toBe(400);
    expect(slot.body.error.message).toMatch(/version must be one of/);
    const junk = await owner.upload(`/api/brands/${brandId}/logos/${treeId}/variants/black`, 'x.svg', 'hello', 'image/svg+xml');
    expect(junk.status).toBe(400);
    expect(junk.body.error.code).toBe('unsupported_file');
    expect((await owner.get(`/api/brands/${brandId}/identity`)).body.identity.logos.find((l: { id: string }) => l.id === treeId).ownVariants).toEqual([]);
  });
});

describe('print-ready vector files on the shelf', () => {
  let svgAsset: string;
  let pngAsset: string;
  beforeAll(async () => {
    svgAsset = (await owner.upload(`/api/brands/${brandId}/assets`, 'tree.svg', TREE, 'image/svg+xml')).body.assets[0].id;
    pngAsset = (await owner.upload(`/api/brands/${brandId}/assets`, 'letters.png', await sharp(Buffer.from(LETTERS)).png().toBuffer(), 'image/png')).body.assets[0].id;
  });

  test('a CMYK PDF of an SVG logo: one page the size of its drawn bounds (75 × 75 pt less the margin)', async () => {
    const r = await bytes(owner, `/api/assets/${svgAsset}/file?format=pdf&colorSpace=cmyk`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('application/pdf');
    const page = (await PDFDocument.load(r.body)).getPage(0);
    // The disc has radius 45 in a 100-unit (100 px = 75 pt) square: 90 units = 67.5 pt, within a raster pixel of the bounds scan.
    expect(Math.abs(page.getMediaBox().width - 67.5)).toBeLessThan(0.2);
    expect(Math.abs(page.getMediaBox().height - 67.5)).toBeLessThan(0.2);
  });

  test('an EPS comes with its bounding box', async () => {
    const r = await bytes(owner, `/api/assets/${svgAsset}/file?format=eps&colorSpace=rgb`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('application/postscript');
    expect(r.body.toString('latin1')).toMatch(/%%BoundingBox: \d+ \d+ \d+ \d+/);
  });

  test('a raster logo gets no fake vector file', async () => {
    const r = await owner.get(`/api/assets/${pngAsset}/file?format=pdf`);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('vector_from_raster');
  });
});
