// One-colour logos keep their drawing: shapes painted in the ground's colour become holes, read back by pixel sampling.
// Luminance: WCAG 2.2 relative luminance (sRGB transfer of IEC 61966-2-1); the split where contrast against white and
// black are equal is √(1.05 × 0.05) − 0.05 (from WCAG 2.2's contrast-ratio formula).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { drawnGround, GROUND_SPLIT_LUMINANCE, knockoutSvg, paintLuminance, paintRole } from '@/lib/logo/knockout';
import { knockoutRaster, oneColourLogo } from '@/lib/logo/knockout.server';

const fixture = (name: string) => readFileSync(join(__dirname, '../fixtures/knockout', name), 'utf8');

/** RGBA of the output drawn at `scale` px per unit, sampled at logo units (x, y). */
async function sampler(image: Buffer | string, scale = 1) {
  const input = typeof image === 'string' ? Buffer.from(image) : image;
  const { data, info } = await sharp(input, { density: 72 * scale }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return (x: number, y: number) => {
    const at = (Math.round(y * scale) * info.width + Math.round(x * scale)) * 4;
    return Array.from(data.subarray(at, at + 4));
  };
}

describe('paint sorting (WCAG 2.2 relative luminance)', () => {
  test.each([
    // Relative luminance of white is 1 and of black 0 (WCAG 2.2 definition).
    ['#ffffff', 1],
    ['#000000', 0],
    // #767676 is the mid grey with 4.54:1 against white: luminance 0.1812 (WCAG 2.2 formula, worked by hand).
    ['#767676', 0.1812],
  ])('%s has luminance %f', (hex, luminance) => {
    expect(paintLuminance(hex)).toBeCloseTo(luminance, 3);
  });

  test('the split is where contrast against white equals contrast against black (WCAG 2.2 contrast ratio)', () => {
    const L = GROUND_SPLIT_LUMINANCE;
    expect((1.05 / (L + 0.05))).toBeCloseTo((L + 0.05) / 0.05, 9);
  });

  test.each([
    ['#1d2b53', 'light', 'ink'],
    ['#f4efe3', 'light', 'knockout'],
    ['#f4efe3', 'dark', 'ink'],
    ['#1d2b53', 'dark', 'knockout'],
    // A brick-red accent rule (luminance ≈ 0.19) stands out on both grounds (≥ 3:1, WCAG 2.2 SC 1.4.11): it stays ink.
    ['#c8553d', 'light', 'ink'],
    ['#c8553d', 'dark', 'ink'],
  ] as const)('%s on a %s ground is %s', (hex, ground, role) => {
    expect(paintRole(paintLuminance(hex)!, ground)).toBe(role);
  });

  test('a white logo is taken as drawn for a dark ground', () => {
    expect(drawnGround('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><rect width="10" height="10" fill="#fff"/></svg>')).toBe('dark');
    expect(drawnGround(fixture('disc-tree.svg'))).toBe('light');
  });
});

describe('SVG knockouts, read back by pixel sampling (shapes inside shapes)', () => {
  test('for print on a known ground: the tree painted in the ground colour, no mask, same look (PDF writers rasterise masks)', async () => {
    const painted = knockoutSvg(fixture('disc-tree.svg'), { ink: '#ffffff', paintOn: '#1d2a44' });
    expect(painted).not.toMatch(/<mask/i);
    const px = await sampler(painted, 2);
    expect(px(15, 50), 'the disc is the ink').toEqual([255, 255, 255, 255]);
    expect(px(50, 40), 'the tree is the ground colour').toEqual([0x1d, 0x2a, 0x44, 255]);
    expect(px(3, 3)[3], 'outside the disc stays transparent').toBe(0);
  });
  test('painted in black on white: the disc black, the tree white (a black ink is never taken for a knockout)', async () => {
    const px = await sampler(knockoutSvg(fixture('disc-tree.svg'), { ink: '#000000', paintOn: '#ffffff' }), 2);
    expect(px(15, 50), 'the disc is the ink').toEqual([0, 0, 0, 255]);
    expect(px(50, 40), 'the tree is the ground colour').toEqual([255, 255, 255, 255]);
    expect(px(3, 3)[3], 'outside the disc stays transparent').toBe(0);
  });
  test('a light tree on a navy disc: disc in the ink, the tree cut out, outside transparent', async () => {
    for (const ink of ['#ffffff', '#000000', '#c8553d']) {
      const px = await sampler(knockoutSvg(fixture('disc-tree.svg'), { ink }), 2);
      const rgb = [1, 3, 5].map((i) => parseInt(ink.slice(i, i + 2), 16));
      expect(px(50, 40)[3], 'tree centre is a hole').toBe(0);
      expect(px(50, 70)[3], 'tree trunk is a hole').toBe(0);
      expect(px(15, 50), 'the disc is the ink').toEqual([...rgb, 255]);
      expect(px(3, 3)[3], 'outside the disc stays transparent').toBe(0);
    }
  });

  test('a ring (white disc on a red disc, gradient dot in the middle): the gap is a hole, the dot is ink', async () => {
    const px = await sampler(knockoutSvg(fixture('ring.svg'), { ink: '#ffffff' }), 2);
    expect(px(50, 30)[3]).toBe(0);
    expect(px(50, 50)).toEqual([255, 255, 255, 255]);
    expect(px(50, 10)).toEqual([255, 255, 255, 255]);
  });

  test('letters with counters ("O" through <use>, "A" with evenodd): counters stay open', async () => {
    const px = await sampler(knockoutSvg(fixture('letters.svg'), { ink: '#ffffff' }), 2);
    expect(px(50, 50)[3], 'the O counter').toBe(0);
    expect(px(50, 20), 'the O bowl').toEqual([255, 255, 255, 255]);
    expect(px(150, 52)[3], 'the A counter').toBe(0);
    expect(px(150, 30), 'the A apex').toEqual([255, 255, 255, 255]);
  });

  test('a half-transparent white star on a green disc (styled by a sheet): half the ink shows through', async () => {
    const px = await sampler(knockoutSvg(fixture('star-on-disc-stroke.svg'), { ink: '#000000' }), 2);
    expect(px(50, 50)[3]).toBeGreaterThan(100);
    expect(px(50, 50)[3]).toBeLessThan(155);
    expect(px(50, 14)).toEqual([0, 0, 0, 255]);
  });

  test('a white wordmark made for dark grounds stays whole in one colour', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 40"><rect x="10" y="10" width="80" height="20" fill="#fafafa"/></svg>';
    const px = await sampler(knockoutSvg(svg, { ink: '#000000' }));
    expect(px(50, 20)).toEqual([0, 0, 0, 255]);
  });

  test('a bad ink is a clear error', () => {
    expect(() => knockoutSvg(fixture('ring.svg'), { ink: 'midnight-ish' })).toThrow(/ink/);
  });

  test('a sheet in the logo cannot repaint the ink rectangle', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><style>rect{fill:red}</style><rect width="10" height="10"/></svg>';
    const px = await sampler(knockoutSvg(svg, { ink: '#0000ff' }), 4);
    expect(px(5, 5)).toEqual([0, 0, 255, 255]);
  });
});

describe('raster knockouts (PNG logos), read back by pixel sampling', () => {
  test('black lettering on transparent becomes white lettering on transparent', async () => {
    const png = await sharp(Buffer.from(fixture('letters.svg').replace('fill="#111"', 'fill="#000"'))).png().toBuffer();
    const px = await sampler((await oneColourLogo({ bytes: png, format: 'png' }, 'white')).body);
    expect(px(50, 20)).toEqual([255, 255, 255, 255]);
    expect(px(50, 50)[3], 'the O counter').toBe(0);
    expect(px(5, 5)[3]).toBe(0);
  });

  test('a white tree on a dark disc: the disc is ink, the tree a hole', async () => {
    const png = await sharp(Buffer.from(fixture('disc-tree.svg')), { density: 144 }).png().toBuffer();
    const px = await sampler(await knockoutRaster(png, '#ffffff'), 2);
    expect(px(50, 40)[3]).toBe(0);
    expect(px(15, 50)).toEqual([255, 255, 255, 255]);
    expect(px(3, 3)[3]).toBe(0);
  });

  test('the original bytes are never handed back for a variant', async () => {
    const png = await sharp(Buffer.from(fixture('disc-tree.svg'))).png().toBuffer();
    const out = await oneColourLogo({ bytes: png, format: 'png' }, 'white');
    expect(out.body.equals(png)).toBe(false);
  });

  test("the designer's own file for a slot wins", async () => {
    const own = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1 1"/>');
    const out = await oneColourLogo({ bytes: Buffer.from(fixture('ring.svg')), format: 'svg' }, 'white', { override: { bytes: own, format: 'svg' } });
    expect(out.body).toBe(own);
  });
});
