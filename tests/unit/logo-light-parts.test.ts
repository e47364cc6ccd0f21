// How a logo's light parts print in one colour, the designer's choice: cut out (holes, the default) or printed in the
// ink, with white and near-white parts cut out either way. Read back by pixel sampling.
// Worked examples: relative luminance and contrast by the WCAG 2.2 formulas (definition of relative luminance, sRGB
// transfer of IEC 61966-2-1; contrast ratio (L1 + 0.05) / (L2 + 0.05)); the 3:1 is WCAG 2.2 SC 1.4.11. "Near-white" is
// CIEDE2000 under 5 against white (common practice for "hard to tell apart"), checked against culori's own
// differenceCiede2000 (a general-purpose colour library, CIE 142-2001 / Sharma, Wu & Dalal 2005).
import { differenceCiede2000 } from 'culori';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { contrastRatio } from '@/lib/color/contrast';
import { isGroundColour, knockoutSvg, paintLuminance, paintRoleFor } from '@/lib/logo/knockout';
import { knockoutRaster, oneColourLogo } from '@/lib/logo/knockout.server';

/** An open book with a light gap for its spine and an amber lamp standing apart (our own test drawing). */
const BOOK_AND_LAMP = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 160 120">
  <path d="M80 30 C62 18 36 16 14 22 L14 100 C36 94 62 96 80 108 Z" fill="#1f3a5f"/>
  <path d="M80 30 C98 18 124 16 146 22 L146 100 C124 94 98 96 80 108 Z" fill="#2b4c78"/>
  <path d="M80 30 L80 108" stroke="#faf7f0" stroke-width="6"/>
  <circle cx="118" cy="12" r="9" fill="#e0a526"/>
</svg>`;
const LAMP = [118, 12] as const;
const SPINE = [80, 70] as const;
const PAGE = [40, 60] as const;

async function sampler(image: Buffer | string, scale = 2) {
  const input = typeof image === 'string' ? Buffer.from(image) : image;
  const { data, info } = await sharp(input, { density: 72 * scale }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return (x: number, y: number) => {
    const at = (Math.round(y * scale) * info.width + Math.round(x * scale)) * 4;
    return Array.from(data.subarray(at, at + 4));
  };
}

const ciede = differenceCiede2000();

describe('worked examples: which light colours the choice decides', () => {
  test.each([
    // #e0a526, an amber: L = 0.4290 (WCAG 2.2 formula, worked by hand), 1.05 / 0.4790 = 2.19:1 against white, under 3:1.
    ['#e0a526', 0.429, 2.19],
    // #faf7f0, a paper white: L = 0.9314, 1.07:1 against white.
    ['#faf7f0', 0.9314, 1.07],
    // #1f3a5f, a dark blue: L = 0.0414, 1.05 / 0.0914 = 11.48:1 against white, ink whatever the choice.
    ['#1f3a5f', 0.0414, 11.48],
  ])('%s: luminance %f, %f:1 against white', (hex, luminance, ratio) => {
    expect(paintLuminance(hex)).toBeCloseTo(luminance, 3);
    expect(contrastRatio(hex, '#ffffff')).toBeCloseTo(ratio, 2);
  });

  test.each([
    // [colour, ground, role with holes, role with ink]
    ['#e0a526', 'light', 'knockout', 'ink'],
    ['#fff3b0', 'light', 'knockout', 'ink'], // a pale yellow: 1.12:1, yet ΔE00 19.7 from white, a colour of its own
    ['#dddddd', 'light', 'knockout', 'ink'], // a light grey: ΔE00 7.2 from white, a deliberate part
    ['#faf7f0', 'light', 'knockout', 'knockout'], // paper white: ΔE00 3.8 from white, the ground itself
    ['#f2f2f2', 'light', 'knockout', 'knockout'], // ΔE00 2.6
    ['#ffffff', 'light', 'knockout', 'knockout'],
    ['#1f3a5f', 'light', 'ink', 'ink'],
    // A logo drawn for dark grounds: its dark parts are the ones the choice decides; black stays cut out.
    ['#1f3a5f', 'dark', 'knockout', 'ink'],
    ['#050505', 'dark', 'knockout', 'knockout'],
  ] as const)('%s on a %s ground: %s when cut out, %s when printed', (hex, ground, holes, ink) => {
    expect(paintRoleFor(hex, ground, 'holes')).toBe(holes);
    expect(paintRoleFor(hex, ground, 'ink')).toBe(ink);
    expect(paintRoleFor(hex, ground), 'the default is today’s rule').toBe(holes);
  });

  test.each(['#faf7f0', '#f2f2f2', '#fff3b0', '#dddddd', '#e0a526', '#f7f7f7'])('near-white agrees with culori’s CIEDE2000 for %s', (hex) => {
    expect(isGroundColour(hex, 'light')).toBe(ciede(hex, '#ffffff') < 5);
  });
});

describe('SVG: the choice read back by pixel sampling', () => {
  test('cut out (the default): the lamp and the spine are holes, the pages ink', async () => {
    for (const svg of [knockoutSvg(BOOK_AND_LAMP, { ink: '#000000' }), knockoutSvg(BOOK_AND_LAMP, { ink: '#000000', lightParts: 'holes' })]) {
      const px = await sampler(svg);
      expect(px(...LAMP)[3], 'the lamp vanishes').toBe(0);
      expect(px(...SPINE)[3], 'the spine is a gap').toBe(0);
      expect(px(...PAGE)).toEqual([0, 0, 0, 255]);
    }
    expect(knockoutSvg(BOOK_AND_LAMP, { ink: '#000000' })).toBe(knockoutSvg(BOOK_AND_LAMP, { ink: '#000000', lightParts: 'holes' }));
  });

  test('printed in the ink: the lamp is ink, the paper-white spine stays a gap', async () => {
    for (const ink of ['#000000', '#ffffff', '#c8553d']) {
      const px = await sampler(knockoutSvg(BOOK_AND_LAMP, { ink, lightParts: 'ink' }));
      const rgb = [1, 3, 5].map((i) => parseInt(ink.slice(i, i + 2), 16));
      expect(px(...LAMP), 'the lamp prints').toEqual([...rgb, 255]);
      expect(px(...SPINE)[3], 'the spine is still a gap').toBe(0);
      expect(px(...PAGE)).toEqual([...rgb, 255]);
    }
  });

  test('painted on a known ground (print): the lamp in the ink, the spine in the ground colour', async () => {
    const px = await sampler(knockoutSvg(BOOK_AND_LAMP, { ink: '#000000', paintOn: '#ffffff', lightParts: 'ink' }));
    expect(px(...LAMP)).toEqual([0, 0, 0, 255]);
    expect(px(...SPINE)).toEqual([255, 255, 255, 255]);
  });

  test('a gradient of pale yellows prints as ink; one of whites stays a hole', async () => {
    const svg = (a: string, b: string) =>
      `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 20"><defs><linearGradient id="g"><stop offset="0" stop-color="${a}"/><stop offset="1" stop-color="${b}"/></linearGradient></defs><rect width="40" height="20" fill="#1f3a5f"/><rect x="10" y="5" width="20" height="10" fill="url(#g)"/></svg>`;
    const yellow = await sampler(knockoutSvg(svg('#fff3b0', '#ffe8a0'), { ink: '#000000', lightParts: 'ink' }));
    expect(yellow(20, 10)).toEqual([0, 0, 0, 255]);
    const white = await sampler(knockoutSvg(svg('#ffffff', '#f7f7f7'), { ink: '#000000', lightParts: 'ink' }));
    expect(white(20, 10)[3]).toBe(0);
  });
});

describe('raster logos and the one function', () => {
  const png = () => sharp(Buffer.from(BOOK_AND_LAMP), { density: 144 }).png().toBuffer();

  test('a PNG with the lamp: faded toward a hole when cut out, full ink when printed; the spine a gap either way', async () => {
    const source = await png();
    const holes = await sampler(await knockoutRaster(source, '#000000'), 2);
    // Rasters ramp coverage by lightness (anti-aliasing kept): the amber lies under halfway to the ink.
    expect(holes(...LAMP)[3]).toBeLessThan(128);
    expect(holes(...SPINE)[3]).toBe(0);
    expect(holes(...PAGE)[3]).toBe(255);
    const ink = await sampler(await knockoutRaster(source, '#000000', undefined, 'ink'), 2);
    expect(ink(...LAMP)).toEqual([0, 0, 0, 255]);
    expect(ink(...SPINE)[3]).toBe(0);
    expect(ink(...PAGE)[3]).toBe(255);
  });

  test('oneColourLogo honours the logo’s own setting', async () => {
    const bytes = Buffer.from(BOOK_AND_LAMP);
    const cut = await sampler((await oneColourLogo({ bytes, format: 'svg' }, 'white')).body);
    const printed = await sampler((await oneColourLogo({ bytes, format: 'svg', lightParts: 'ink' }, 'white')).body);
    expect(cut(...LAMP)[3]).toBe(0);
    expect(printed(...LAMP)).toEqual([255, 255, 255, 255]);
  });
});
