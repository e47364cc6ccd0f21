// The identity through the API: values checked against outside references, bad input refused, nothing kept.
import { readFileSync } from 'node:fs';
import Color from 'colorjs.io';
import * as fontkit from 'fontkit';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';

let designer: Client;
let brandId: string;
const api = (path = '') => `/api/brands/${brandId}${path}`;

beforeAll(async () => {
  ({ client: designer } = await signUpFresh('identity'));
  brandId = (await designer.post('/api/brands', { name: 'Identity Test Co' })).body.brand.id;
});
afterAll(closeDb);

describe('colours', () => {
  test('a colour typed in OKLCH comes back in every space, agreeing with colorjs.io (reference library)', async () => {
    const r = await designer.post(api('/colors'), { name: 'Harbour teal', value: 'oklch(55% 0.08 190)', role: 'primary' });
    expect(r.status).toBe(201);
    const c = r.body.color;
    const ref = new Color('oklch(55% 0.08 190)').to('srgb');
    expect(ref.inGamut()).toBe(true); // in gamut, so no mapping choice can colour the comparison
    const refHex = ref.toString({ format: 'hex', collapse: false });
    expect(c.hex).toBe(refHex);
    const [r8, g8, b8] = ref.coords.map((v) => Math.round(Number(v) * 255));
    expect(c.rgb).toEqual([r8, g8, b8]);
    const lab = new Color(c.hex).to('lab'); // colorjs.io 'lab' is CIELAB D50, as CSS
    expect(c.lab.l).toBeCloseTo(Number(lab.coords[0]), 1);
    expect(c.lab.a).toBeCloseTo(Number(lab.coords[1]), 1);
    const lab65 = new Color(c.hex).to('lab-d65');
    expect(c.lab65.l).toBeCloseTo(Number(lab65.coords[0]), 1);
    expect(c.cmyk).toHaveLength(4);
    expect(c.cmykIcc).toHaveLength(4);
  });

  test('an unreadable value is refused in words and nothing is stored', async () => {
    const before = await sql('SELECT count(*)::int AS n FROM brand_colors WHERE brand_id = $1', [brandId]);
    const r = await designer.post(api('/colors'), { name: 'Mystery', value: 'bluish-ish' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_color');
    expect(r.body.error.message).toMatch(/bluish-ish/);
    const after = await sql('SELECT count(*)::int AS n FROM brand_colors WHERE brand_id = $1', [brandId]);
    expect(after[0].n).toBe(before[0].n);
  });

  test('CMYK override and spot reference are kept; bad CMYK is refused', async () => {
    const r = await designer.post(api('/colors'), { name: 'Signal', value: '#c8553d', cmyk: [0, 70, 75, 10], spot: 'Studio swatch 17-1' });
    expect(r.body.color).toMatchObject({ cmykOverride: [0, 70, 75, 10], spot: 'Studio swatch 17-1' });
    const bad = await designer.patch(api(`/colors/${r.body.color.id}`), { cmyk: [0, 120, 0, 0] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/0 to 100/);
  });

  test('the palette report gives the WCAG 2.2 worked values (W3C, definition of contrast ratio)', async () => {
    const { client, } = await signUpFresh('palette');
    const id = (await client.post('/api/brands', { name: 'Contrast Co' })).body.brand.id;
    const grey = (await client.post(`/api/brands/${id}/colors`, { name: 'Grey', value: '#767676' })).body.color;
    const white = (await client.post(`/api/brands/${id}/colors`, { name: 'White', value: '#ffffff' })).body.color;
    const paler = (await client.post(`/api/brands/${id}/colors`, { name: 'Paler', value: '#777777' })).body.color;
    const report = (await client.get(`/api/brands/${id}/palette-report`)).body;
    const pair = (fg: string, bg: string) => report.pairs.find((p: any) => p.foreground.id === fg && p.background.id === bg);
    expect(report.pairs).toHaveLength(6); // every ordered pair of 3 colours
    expect(pair(grey.id, white.id).ratio).toBeCloseTo(4.54, 2);
    expect(pair(grey.id, white.id).aa).toBe(true);
    expect(pair(paler.id, white.id).ratio).toBeCloseTo(4.48, 2);
    expect(pair(paler.id, white.id).aa).toBe(false);
    expect(pair(paler.id, white.id).aaLarge).toBe(true);
    // #767676 and #777777 differ by one step: flagged as hard to tell apart, with the ΔE00 colorjs.io gives (≈ 0.40).
    const close = report.nearDuplicates.find((d: any) => [d.a, d.b].sort().join() === [grey.id, paler.id].sort().join());
    expect(close).toBeDefined();
    expect(Math.abs(close.deltaE2000 - new Color('#767676').deltaE2000(new Color('#777777')))).toBeLessThan(1e-3);
    expect(Object.keys(report.colorVision)).toEqual(expect.arrayContaining([grey.id, white.id]));
  });

  test('reordering needs every colour once', async () => {
    const list = (await designer.get(api('/identity'))).body.identity.colors.map((c: any) => c.id);
    expect((await designer.request('PUT', api('/colors/order'), { ids: list.slice(1) })).status).toBe(400);
    const reversed = [...list].reverse();
    expect((await designer.request('PUT', api('/colors/order'), { ids: reversed })).status).toBe(200);
    expect((await designer.get(api('/identity'))).body.identity.colors.map((c: any) => c.id)).toEqual(reversed);
  });
});

// A logo of ours: a 100×50 rectangle inside a 200×100 viewBox, so a quarter of the canvas is margin on each side.
const MARGIN_SVG = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect x="50" y="25" width="100" height="50" fill="#223344"/></svg>';

describe('logos', () => {
  test('drawn bounds ignore the transparent margin; clear space follows the unit and multiple', async () => {
    const r = await designer.upload(api('/logos'), 'block.svg', MARGIN_SVG, 'image/svg+xml', { variant: 'primary' });
    expect(r.status).toBe(201);
    const { bounds, canvas } = r.body.logo;
    expect(canvas).toEqual({ x: 0, y: 0, width: 200, height: 100 });
    expect(bounds.x).toBeCloseTo(50, 0);
    expect(bounds.width).toBeCloseTo(100, 0);
    expect(bounds.height).toBeCloseTo(50, 0);
    const patched = await designer.patch(api(`/logos/${r.body.logo.id}`), { clearSpaceUnit: 10, clearSpaceMultiple: 2, clearSpaceLabel: 'the height of the bar' });
    expect(patched.status).toBe(200);
    // Worked example: the bar spans x 50–150, y 25–75; 2 × 10 units clear on every side → x 30, y 5, 140 × 90.
    expect(patched.body.logo.clearSpace.box.x).toBeCloseTo(30, 0);
    expect(patched.body.logo.clearSpace.box.y).toBeCloseTo(5, 0);
    expect(patched.body.logo.clearSpace.box.width).toBeCloseTo(140, 0);
    expect(patched.body.logo.clearSpace.box.height).toBeCloseTo(90, 0);
    const again = await designer.upload(api('/logos'), 'same.svg', MARGIN_SVG, 'image/svg+xml');
    expect(again.status).toBe(200);
    expect(again.body.duplicate).toBe(true);
    expect(again.body.logo.id).toBe(r.body.logo.id);
  });

  test('the white variant is one ink, white, on a transparent ground (drawn back with sharp)', async () => {
    const logo = (await designer.get(api('/identity'))).body.identity.logos[0];
    const white = await designer.get(logo.files.white);
    expect(white.headers.get('content-type')).toBe('image/svg+xml');
    const { data } = await sharp(Buffer.from(String(white.body))).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    let drawn = 0;
    for (let i = 0; i < data.length; i += 4) {
      if (data[i + 3] === 255) {
        drawn++;
        expect([data[i], data[i + 1], data[i + 2]]).toEqual([255, 255, 255]);
      }
    }
    expect(drawn).toBeGreaterThan(0);
  });

  const hostile: [string, string, string][] = [
    ['foreignObject', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><foreignObject width="10" height="10"><div>x</div></foreignObject></svg>', 'svg_foreign_object'],
    ['entity expansion (OWASP XXE)', '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaa">]><svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><text>&a;</text></svg>', 'svg_entity'],
    ['external image', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><image href="https://evil.example/x.png" width="10" height="10"/></svg>', 'svg_external_reference'],
    ['absurd size', '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 9999999 10"><rect width="10" height="10"/></svg>', 'svg_absurd_size'],
    ['not an image at all', 'hello, this is plain text', 'unsupported_file'],
    ['empty file', '', 'empty_file'],
  ];
  test.each(hostile)('%s is refused and nothing is stored', async (_label, content, code) => {
    const before = await sql('SELECT count(*)::int AS n FROM brand_logos WHERE brand_id = $1', [brandId]);
    const r = await designer.upload(api('/logos'), 'logo.svg', content, 'image/svg+xml');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe(code);
    const after = await sql('SELECT count(*)::int AS n FROM brand_logos WHERE brand_id = $1', [brandId]);
    expect(after[0].n).toBe(before[0].n);
  });

  test('a script inside an SVG is removed before the logo is stored (OWASP XSS prevention)', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 20" onload="alert(1)"><script>alert(2)</script><rect width="40" height="20" fill="#123"/></svg>';
    const r = await designer.upload(api('/logos'), 'sneaky.svg', svg, 'image/svg+xml');
    expect(r.status).toBe(201);
    const file = await designer.get(r.body.logo.files.original);
    expect(String(file.body)).not.toMatch(/script|onload|alert/i);
    expect(file.headers.get('content-security-policy')).toMatch(/sandbox/);
  });

  test('a PNG over the pixel limit is refused (decompression bomb)', async () => {
    // A valid PNG header declaring 20000 × 20000 pixels (400 MP): refused from its metadata, never decoded.
    const png = Buffer.from(
      '89504e470d0a1a0a0000000d4948445200004e2000004e200806000000' + '00000000' + '0000000049454e44ae426082',
      'hex',
    );
    const r = await designer.upload(api('/logos'), 'huge.png', png, 'image/png');
    expect(r.status).toBe(400);
    expect(['too_many_pixels', 'unreadable_image']).toContain(r.body.error.code);
  });
});

describe('typefaces', () => {
  const woff2 = readFileSync('node_modules/@fontsource-variable/source-serif-4/files/source-serif-4-latin-wght-normal.woff2');

  test('an uploaded font is read with its own metrics (fontkit as the reference reader) and waits for a licence', async () => {
    const r = await designer.upload(api('/typefaces'), 'serif.woff2', woff2, 'font/woff2', { role: 'body' });
    expect(r.status).toBe(201);
    const font = fontkit.create(woff2) as fontkit.Font;
    expect(r.body.typeface.metrics.unitsPerEm).toBe(font.unitsPerEm);
    expect(r.body.typeface.metrics.capHeight).toBe(font.capHeight);
    expect(r.body.typeface.metrics.isVariable).toBe(true);
    expect(r.body.typeface.licence.confirmed).toBe(false);
    const confirmed = await designer.patch(api(`/typefaces/${r.body.typeface.id}`), { licenceConfirmed: true, licenceNote: 'Web licence, order 2231' });
    expect(confirmed.body.typeface.licence).toMatchObject({ confirmed: true, note: 'Web licence, order 2231' });
    const trail = await sql(`SELECT 1 FROM audit_events WHERE brand_id = $1 AND action = 'typeface.licence'`, [brandId]);
    expect(trail).toHaveLength(1);
  });

  test.each([
    ['garbage with a WOFF2 signature', Buffer.concat([Buffer.from('wOF2'), Buffer.alloc(64, 7)]), 'font_unreadable'],
    ['a PNG renamed .woff2', Buffer.from('89504e470d0a1a0a', 'hex'), 'unsupported_file'],
  ])('%s is refused with a reason and not stored', async (_label, bytes, code) => {
    const before = await sql('SELECT count(*)::int AS n FROM brand_typefaces WHERE brand_id = $1', [brandId]);
    const r = await designer.upload(api('/typefaces'), 'font.woff2', bytes, 'font/woff2', { role: 'heading' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe(code);
    expect((await sql('SELECT count(*)::int AS n FROM brand_typefaces WHERE brand_id = $1', [brandId]))[0].n).toBe(before[0].n);
  });

  test('a shipped open font is added with its OFL licence already recorded', async () => {
    const r = await designer.post(api('/typefaces'), { shipped: 'fraunces', role: 'heading' });
    expect(r.status).toBe(201);
    expect(r.body.typeface).toMatchObject({ family: 'Fraunces', source: 'shipped', licence: { confirmed: true, shippedLicence: 'OFL-1.1' } });
  });
});

describe('type scale and tokens', () => {
  test('a major-third scale from 16 px: h1 = 16 × 1.25⁵ = 48.83 px (worked example); measure from the body face', async () => {
    const r = await designer.request('PUT', api('/type-scale'), { basePx: 16, ratioName: 'major-third', stepsUp: 5, stepsDown: 1, bodyLineHeight: 1.5, headingLineHeight: 1.2, columnPx: 560 });
    expect(r.status).toBe(200);
    const steps = r.body.typeScale.steps;
    expect(steps[0]).toMatchObject({ name: 'h1', px: 48.83, rem: 3.052 });
    expect(steps.find((s: any) => s.name === 'body')).toMatchObject({ px: 16, pt: 12 }); // 16 px = 12 pt (CSS: 96 px = 72 pt)
    expect(r.body.typeScale.measure.charsPerLine).toBeGreaterThan(30);
  });

  test('an unknown ratio is refused naming the choices', async () => {
    const r = await designer.request('PUT', api('/type-scale'), { basePx: 16, ratioName: 'silver', stepsUp: 5, stepsDown: 1, bodyLineHeight: 1.5, headingLineHeight: 1.2, columnPx: 560 });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/major-third/);
  });

  test.each([
    ['dtcg', /\.tokens\.json"/, 'json'],
    ['dtcg-hex', /\.legacy\.tokens\.json"/, 'json'],
    ['css', /-tokens\.css"/, 'text/css'],
    ['tailwind', /-theme\.css"/, 'text/css'],
    ['scss', /\.scss"/, 'text'],
  ])('tokens as %s download with a brand-named file', async (format, filename, type) => {
    const r = await designer.get(api(`/tokens?format=${format}`));
    expect(r.status).toBe(200);
    expect(r.headers.get('content-disposition')).toMatch(filename);
    expect(r.headers.get('content-type')).toContain(type);
  });

  test('the CSS tokens carry the palette hex exactly as stored', async () => {
    const identity = (await designer.get(api('/identity'))).body.identity;
    const css = String((await designer.get(api('/tokens?format=css'))).body);
    for (const c of identity.colors) expect(css).toContain(c.hex);
  });

  test('an unknown token format is a 400', async () => {
    expect((await designer.get(api('/tokens?format=xml'))).status).toBe(400);
  });
});
