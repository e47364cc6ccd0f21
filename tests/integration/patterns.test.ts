// Patterns cut from the mark over HTTP: the tile export (SVG and PNG, read back with sharp), clear errors for bad
// settings, and "add to shelf" keeping the settings. Pixel checks as in tests/unit/pattern.test.ts (sharp/libvips).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl } from '../support/client';
import { closeDb } from '../support/db';
import { makeBrand, makeCast, type Cast, type Fixture } from './fixtures';

const DISC = readFileSync(join(process.cwd(), 'tests/fixtures/pattern/disc-with-hole.svg'), 'utf8');

let cast: Cast;
let brand: Fixture;
let markId: string;
let groundId: string;
let inkId: string;
beforeAll(async () => {
  cast = await makeCast();
  brand = await makeBrand(cast, 'Pattern Brand', { clientWork: false });
  const owner = cast.clients.owner;
  const [logo, ground, ink] = await Promise.all([
    owner.upload(`/api/brands/${brand.brandId}/logos`, 'disc.svg', DISC, 'image/svg+xml', { variant: 'mark' }),
    owner.post(`/api/brands/${brand.brandId}/colors`, { name: 'Paper', value: '#f3ead8', role: 'background' }),
    owner.post(`/api/brands/${brand.brandId}/colors`, { name: 'Teal', value: '#0f4c5c', role: 'primary' }),
  ]);
  for (const r of [logo, ground, ink]) expect(r.status, JSON.stringify(r.body)).toBe(201);
  markId = logo.body.logo.id;
  groundId = ground.body.color.id;
  inkId = ink.body.color.id;
});
afterAll(closeDb);

const tileUrl = (query: string) => `/api/brands/${brand.brandId}/patterns?logoId=${markId}&${query}`;

/** The raw bytes of an answer (the test client reads text). */
async function fetchBytes(path: string): Promise<{ status: number; type: string | null; tile: string | null; bytes: Buffer }> {
  const res = await fetch(baseUrl() + path, { headers: { cookie: cast.clients.owner.cookieHeader() } });
  return { status: res.status, type: res.headers.get('content-type'), tile: res.headers.get('x-pattern-tile'), bytes: Buffer.from(await res.arrayBuffer()) };
}

describe('the tile export', () => {
  test('SVG: one tile, no <pattern>, in the palette ground and ink', async () => {
    const r = await cast.clients.owner.get(tileUrl(`layout=grid&scale=100&spacing=0.5&groundColorId=${groundId}&inkColorId=${inkId}&format=svg`));
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/svg+xml');
    expect(r.headers.get('x-pattern-tile')).toBe('150x150');
    expect(r.body).not.toContain('<pattern');
    expect(r.body).toContain('fill="#f3ead8"');
    expect(r.body).toContain('#0f4c5c');
  });

  test('PNG at 2×: the hole of the disc shows the ground, the ring the ink', async () => {
    const r = await fetchBytes(tileUrl('layout=grid&scale=100&spacing=0.5&format=png&ratio=2'));
    expect(r.status).toBe(200);
    expect(r.type).toBe('image/png');
    const { data, info } = await sharp(r.bytes).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([300, 300]);
    const at = (x: number, y: number) => Array.from(data.subarray((y * info.width + x) * 3, (y * info.width + x) * 3 + 3));
    expect(at(150, 150)).toEqual([0xf3, 0xea, 0xd8]);
    expect(at(150 + 62, 150)).toEqual([0x0f, 0x4c, 0x5c]);
  });

  test.each([
    ['scale=9999', 400, 'invalid_input'],
    ['layout=zigzag', 400, 'invalid_input'],
    ['format=gif', 400, 'invalid_input'],
    ['inkColorId=not-in-palette', 422, 'pattern_colour_missing'],
  ])('%s → %i %s', async (query, status, code) => {
    const r = await cast.clients.owner.get(tileUrl(query));
    expect(r.status).toBe(status);
    expect(r.body.error.code).toBe(code);
    expect(r.body.error.message.length).toBeGreaterThan(10);
  });

  test('a logo that is not the brand’s is refused', async () => {
    const r = await cast.clients.owner.get(`/api/brands/${brand.brandId}/patterns?logoId=${brand.brandId}`);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('pattern_logo_missing');
  });
});

describe('add to shelf', () => {
  test('the tile becomes a draft pattern asset with its settings; the same tile twice is one asset', async () => {
    const settings = { logoId: markId, layout: 'half-drop', scale: 48, spacing: 0.75, rotation: 12, groundColorId: groundId, inkColorId: inkId };
    const first = await cast.clients.owner.post(`/api/brands/${brand.brandId}/patterns`, { settings });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const asset = first.body.asset;
    expect(asset).toMatchObject({ kind: 'pattern', format: 'svg', state: 'draft', patternSettings: { ...settings, seed: 1, opacity: 1 } });
    const again = await cast.clients.owner.post(`/api/brands/${brand.brandId}/patterns`, { settings });
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ duplicate: true, asset: { id: asset.id } });
    // The shelf draws its renditions like any other file.
    const png = await fetchBytes(`/api/assets/${asset.id}/file?format=png&width=128`);
    expect(png.status).toBe(200);
    expect(png.type).toBe('image/png');
    const listed = await cast.clients.owner.get(`/api/brands/${brand.brandId}/assets?kind=pattern`);
    expect(listed.body.assets.map((a: { id: string }) => a.id)).toContain(asset.id);
  });

  test('unknown fields in the body are refused and nothing is stored', async () => {
    const before = (await cast.clients.owner.get(`/api/brands/${brand.brandId}/assets`)).body.assets.length;
    const r = await cast.clients.owner.post(`/api/brands/${brand.brandId}/patterns`, { settings: { logoId: markId, colour: 'red' } });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect((await cast.clients.owner.get(`/api/brands/${brand.brandId}/assets`)).body.assets.length).toBe(before);
  });
});
