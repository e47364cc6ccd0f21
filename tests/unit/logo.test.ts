import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import {
  clearSpace,
  LogoError,
  minimumSize,
  MIN_STROKE_PRINT_PT,
  MIN_STROKE_SCREEN_PX,
  knockoutSvg,
  sanitizeSvg,
  type LogoErrorCode,
} from '@/lib/logo';
import { drawnBounds } from '@/lib/logo/bounds.server';

const fixture = (name: string) => readFileSync(`tests/fixtures/svg/${name}`, 'utf8');

// Hostile inputs follow the attack classes listed in the OWASP XSS Prevention and XXE Prevention cheat sheets
// (script, event handlers, javascript: URLs, foreignObject, external resources, entity expansion).
describe('sanitizeSvg: hostile corpus is rejected with a clear code (OWASP XXE / XSS prevention cheat sheets)', () => {
  test.each<[string, LogoErrorCode]>([
    ['billion-laughs.svg', 'svg_entity'],
    ['foreign-object.svg', 'svg_foreign_object'],
    ['external-use.svg', 'svg_external_reference'],
    ['external-image.svg', 'svg_external_reference'],
    ['embedded-svg-image.svg', 'svg_external_reference'],
    ['external-css-url.svg', 'svg_external_reference'],
    ['style-import.svg', 'svg_external_reference'],
    ['absurd-size.svg', 'svg_absurd_size'],
    ['zero-size.svg', 'svg_absurd_size'],
    ['no-size.svg', 'svg_no_size'],
    ['not-svg.txt', 'svg_not_svg'],
    ['html-page.svg', 'svg_not_svg'],
  ])('%s → %s', (name, code) => {
    const result = sanitizeSvg(fixture(name));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe(code);
    expect(result.error.message.length).toBeGreaterThan(10);
  });
  test.each([[''], [42 as unknown as string], ['<svg' + ' '.repeat(3 * 1024 * 1024) + '/>']])('non-SVG or oversized input is an error, never a crash', (input) => {
    const result = sanitizeSvg(input);
    expect(result.ok).toBe(false);
  });
});

describe('sanitizeSvg: dangerous parts are stripped (OWASP XSS prevention cheat sheet: script, handlers, javascript: URLs)', () => {
  test.each([
    ['script.svg', /<script/i, 'element <script>'],
    ['onload.svg', /\son\w+=/i, 'attribute onload'],
    ['javascript-link.svg', /javascript:/i, 'javascript: link'],
    ['animate-href.svg', /<animate|<set|javascript:/i, 'element <animate>'],
  ])('%s', (name, forbidden, reported) => {
    const result = sanitizeSvg(fixture(name));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.svg).not.toMatch(forbidden);
    expect(result.svg).toMatch(/<(rect|circle)/);
    expect(result.removed).toContain(reported);
  });
});

describe('sanitizeSvg: a clean logo survives (SVG 2 viewBox and intrinsic sizing)', () => {
  test('shapes, style, gradient and internal <use> are kept; size is read', () => {
    const result = sanitizeSvg(fixture('clean-logo.svg'));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.viewBox).toEqual({ x: 0, y: 0, width: 200, height: 100 });
    expect([result.width, result.height]).toEqual([200, 100]);
    for (const shape of ['<circle', '<rect', '<path', '<linearGradient', '<use', '<style>']) expect(result.svg).toContain(shape);
    expect(result.removed).toEqual([]);
  });
  test('width and height in mm are read as CSS px (CSS Values 4: 1in = 25.4mm = 96px)', () => {
    const result = sanitizeSvg('<svg xmlns="http://www.w3.org/2000/svg" width="25.4mm" height="12.7mm"><rect width="5" height="5"/></svg>');
    expect(result.ok && [result.width, result.height]).toEqual([96, 48]);
    expect(result.ok && result.viewBox).toEqual({ x: 0, y: 0, width: 96, height: 48 });
  });
  test('a missing xmlns is added so the file stands alone', () => {
    const result = sanitizeSvg('<svg viewBox="0 0 4 4"><rect width="4" height="4"/></svg>');
    expect(result.ok && result.svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  });
});

describe('drawnBounds from a raster (sharp/libvips rendering)', () => {
  test('viewBox 0 0 200 100 with a rect at 50,25 100×50 → ≈ that rect within 1 unit (worked example)', async () => {
    const b = await drawnBounds(fixture('margin-rect.svg'));
    expect(Math.abs(b.box.x - 50)).toBeLessThan(1);
    expect(Math.abs(b.box.y - 25)).toBeLessThan(1);
    expect(Math.abs(b.box.width - 100)).toBeLessThan(1);
    expect(Math.abs(b.box.height - 50)).toBeLessThan(1);
    expect(b.fraction.x).toBeCloseTo(0.25, 2);
    expect(b.fraction.width).toBeCloseTo(0.5, 2);
  });
  test('offset viewBox: a circle r=40 at the origin → box −40…40 in viewBox units', async () => {
    const b = await drawnBounds(fixture('offset-viewbox.svg'));
    expect(Math.abs(b.box.x + 40)).toBeLessThan(1);
    expect(Math.abs(b.box.y + 40)).toBeLessThan(1);
    expect(Math.abs(b.box.width - 80)).toBeLessThan(1.5);
  });
  test('a PNG gives its bounds in pixels', async () => {
    const png = await sharp({ create: { width: 40, height: 20, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
      .composite([{ input: { create: { width: 10, height: 5, channels: 4, background: '#ff0000' } }, left: 12, top: 3 }])
      .png()
      .toBuffer();
    const b = await drawnBounds(png);
    expect(b.box).toEqual({ x: 12, y: 3, width: 10, height: 5 });
  });
  test('hostile, empty and unreadable inputs are typed errors', async () => {
    await expect(drawnBounds(fixture('external-use.svg'))).rejects.toMatchObject({ code: 'svg_external_reference' });
    await expect(drawnBounds('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"></svg>')).rejects.toMatchObject({ code: 'logo_empty' });
    await expect(drawnBounds(Buffer.from([0x89, 0x50, 0x4e, 0x47, 1, 2, 3]))).rejects.toMatchObject({ code: 'logo_unreadable' });
  });
});

describe('clearSpace (common practice: clear space as a multiple of a unit taken from the mark)', () => {
  test('bounds 50,25 100×50 with unit 10 × 1.5 → margin 15 on every side', () => {
    expect(clearSpace({ bounds: { x: 50, y: 25, width: 100, height: 50 }, unitSize: 10, multiple: 1.5 })).toEqual({
      x: 35,
      y: 10,
      width: 130,
      height: 80,
      margin: 15,
    });
  });
  test('bad input is a typed error', () => {
    expect(() => clearSpace({ bounds: { x: 0, y: 0, width: 0, height: 1 }, unitSize: 1, multiple: 1 })).toThrow(LogoError);
    expect(() => clearSpace({ bounds: { x: 0, y: 0, width: 1, height: 1 }, unitSize: -1, multiple: 1 })).toThrow(LogoError);
  });
});

describe('minimumSize (common practice: thinnest stroke ≥ 1 px on screen, ≥ 0.25 pt in print)', () => {
  test('rule constants', () => {
    expect(MIN_STROKE_SCREEN_PX).toBe(1);
    expect(MIN_STROKE_PRINT_PT).toBe(0.25);
  });
  test('0.5-unit stroke on a 100-unit logo → 200 px on screen; 50 pt = 17.64 mm → 17.7 mm in print (1 pt = 1/72 in)', () => {
    expect(minimumSize({ logoWidthUnits: 100, thinnestStrokeUnits: 0.5 })).toEqual({ screenPx: 200, printPt: 50, printMm: 17.7 });
  });
  test('bad input is a typed error', () => {
    expect(() => minimumSize({ logoWidthUnits: 100, thinnestStrokeUnits: 0 })).toThrow(LogoError);
  });
});

describe('knockoutSvg: one ink on a transparent ground', () => {
  const logo = fixture('clean-logo.svg');
  test('the drawn result has only the ink in opaque pixels (librsvg render as an independent check)', async () => {
    const out = knockoutSvg(logo, { ink: '#0a7e8c' });
    const { data, info } = await sharp(Buffer.from(out)).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    let opaque = 0;
    for (let i = 0; i < data.length; i += info.channels) {
      if (data[i + 3] === 255) {
        opaque++;
        expect([data[i], data[i + 1], data[i + 2]]).toEqual([0x0a, 0x7e, 0x8c]);
      }
    }
    expect(opaque).toBeGreaterThan(100);
  });
  test('bad ink or hostile SVG is a typed error', () => {
    expect(() => knockoutSvg(logo, { ink: 'nope' })).toThrow(LogoError);
    expect(() => knockoutSvg(fixture('billion-laughs.svg'), { ink: '#000000' })).toThrow(LogoError);
  });
});
