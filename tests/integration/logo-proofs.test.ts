// One-colour proofs through the API: the tone analysis of a logo, the proof images read back by pixel with sharp, the
// designer's own one-colour file winning, and clear errors. Greys and the 3:1 of WCAG 2.2 SC 1.4.11 are checked
// against colorjs.io and culori in tests/unit/logo-proofs.test.ts.
import Color from 'colorjs.io';
import { wcagContrast } from 'culori';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { closeDb } from '../support/db';

// A green of pure red's relative luminance, found with colorjs.io (general-purpose reference library).
const RED_LUMINANCE = new Color('#ff0000').luminance;
const GREEN_LEVEL = [...Array(256).keys()].reduce((best, g) =>
  Math.abs(new Color('srgb', [0, g / 255, 0]).luminance - RED_LUMINANCE) < Math.abs(new Color('srgb', [0, best / 255, 0]).luminance - RED_LUMINANCE) ? g : best, 0);
const GREEN = `#00${GREEN_LEVEL.toString(16).padStart(2, '0')}00`;
const RED_GREEN = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="${GREEN}"/></svg>`;
const DISC = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="48" fill="#1a4d8f"/><circle cx="50" cy="50" r="20" fill="#ffffff"/></svg>';
const SQUARE = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><rect width="100" height="100" fill="#000"/></svg>';

let owner: Client;
let brandId: string;
let redGreenId: string;
let redGreenPngId: string;
let discId: string;

async function bytes(client: Client, path: string) {
  const res = await fetch(baseUrl() + path, { headers: { origin: baseUrl(), cookie: client.cookieHeader() } });
  return { status: res.status, body: Buffer.from(await res.arrayBuffer()), type: res.headers.get('content-type'), disposition: res.headers.get('content-disposition') };
}

/** The RGBA pixel at fractions (fx, fy) of a PNG. */
async function at(png: Buffer, fx: number, fy: number) {
  const { data, info } = await sharp(png).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (Math.round(fy * (info.height - 1)) * info.width + Math.round(fx * (info.width - 1))) * 4;
  return [...data.subarray(i, i + 4)];
}

const proofs = (id: string) => `/api/brands/${brandId}/logos/${id}/proofs`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('proofs'));
  brandId = (await owner.post('/api/brands', { name: 'Proof Test Co' })).body.brand.id;
  redGreenId = (await owner.upload(`/api/brands/${brandId}/logos`, 'red-green.svg', RED_GREEN, 'image/svg+xml', { variant: 'mark' })).body.logo.id;
  const png = await sharp(Buffer.from(RED_GREEN)).png().toBuffer();
  redGreenPngId = (await owner.upload(`/api/brands/${brandId}/logos`, 'red-green.png', png, 'image/png', { variant: 'mark' })).body.logo.id;
  discId = (await owner.upload(`/api/brands/${brandId}/logos`, 'disc.svg', DISC, 'image/svg+xml', { variant: 'primary' })).body.logo.id;
});
afterAll(closeDb);

describe('the proofs of a logo', () => {
  test.each([['SVG', () => redGreenId], ['PNG', () => redGreenPngId]])('a %s of red beside an equally light green is flagged, naming both', async (_kind, id) => {
    const r = await owner.get(proofs(id()));
    expect(r.status).toBe(200);
    const { tones, files } = r.body.proofs;
    expect(tones.dependsOnColour).toBe(true);
    expect([tones.collapses[0].a.hex, tones.collapses[0].b.hex].sort()).toEqual([GREEN, '#ff0000'].sort());
    expect(tones.collapses[0].contrast).toBeCloseTo(wcagContrast('#ff0000', GREEN), 6);
    expect(tones.threshold.contrast).toBe(3);
    expect(files.greyscale).toBe(`${proofs(id())}/greyscale`);
  });

  test('a disc with a hole is not flagged, and its proofs keep the hole (sampled with sharp)', async () => {
    const r = await owner.get(proofs(discId));
    expect(r.body.proofs.tones.dependsOnColour).toBe(false);
    const black = await bytes(owner, `${proofs(discId)}/black-on-white`);
    expect(black.type).toBe('image/png');
    expect(await at(black.body, 0.5, 0.5)).toEqual([255, 255, 255, 255]);
    const white = await bytes(owner, `${proofs(discId)}/white-on-black`);
    expect(await at(white.body, 0.5, 0.5)).toEqual([0, 0, 0, 255]);
    expect(await at(white.body, 0.5 + 0.34 * (1 / 1.2), 0.5)).toEqual([255, 255, 255, 255]);
  });

  test('the designer’s own black file is what the black proof shows', async () => {
    const up = await owner.upload(`/api/brands/${brandId}/logos/${discId}/variants/black`, 'black.svg', SQUARE, 'image/svg+xml', {});
    expect(up.status).toBe(200);
    const black = await bytes(owner, `${proofs(discId)}/black-on-white`);
    expect(await at(black.body, 0.5, 0.5)).toEqual([0, 0, 0, 255]);
    await owner.delete(`/api/brands/${brandId}/logos/${discId}/variants/black`);
  });

  test('the proof sheet downloads as a PNG attachment', async () => {
    const sheet = await bytes(owner, `${proofs(redGreenId)}/sheet?download=1`);
    expect(sheet.status).toBe(200);
    expect(sheet.type).toBe('image/png');
    expect(sheet.disposition).toMatch(/^attachment; filename=".*proof-sheet\.png"$/);
  });

  test('an unknown proof, an unknown query and an unknown logo answer clear errors', async () => {
    const unknown = await owner.get(`${proofs(discId)}/sepia`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('not_found');
    const query = await owner.get(`${proofs(discId)}/greyscale?size=9000`);
    expect(query.status).toBe(400);
    const missing = await owner.get(proofs('00000000-0000-4000-8000-000000000000'));
    expect(missing.status).toBe(404);
  });
});
