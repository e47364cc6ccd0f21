import Color from 'colorjs.io';
import { filterDeficiencyDeuter, filterDeficiencyProt, filterDeficiencyTrit, wcagContrast } from 'culori';
import { describe, expect, test } from 'vitest';
import {
  apcaContrast,
  colorValues,
  contrastRatio,
  deltaE2000,
  MACHADO_2009_MATRICES,
  nearestPassing,
  paletteReport,
  parseColor,
  PRINT_CAUTION,
  simulateColorVision,
  toColor,
  ColorError,
  wcagLevels,
  type ColorVisionKind,
  type Lab,
} from '@/lib/color';
import { iccCmyk } from '@/lib/color/print.server';

// Sharma, Wu & Dalal (2005), "The CIEDE2000 Color-Difference Formula: Implementation Notes, Supplementary Test Data,
// and Mathematical Observations", Color Res. Appl. 30(1), Table 1. Rows from memory of Table 1; every row is
// cross-checked below against colorjs.io. (Our deltaE2000 is culori's differenceCiede2000, so culori is no check of it.)
const SHARMA_2005: [number, Lab, Lab, number][] = [
  [1, [50.0, 2.6772, -79.7751], [50.0, 0.0, -82.7485], 2.0425],
  [2, [50.0, 3.1571, -77.2803], [50.0, 0.0, -82.7485], 2.8615],
  [3, [50.0, 2.8361, -74.02], [50.0, 0.0, -82.7485], 3.4412],
  [4, [50.0, -1.3802, -84.2814], [50.0, 0.0, -82.7485], 1.0],
  [5, [50.0, -1.1848, -84.8006], [50.0, 0.0, -82.7485], 1.0],
  [6, [50.0, -0.9009, -85.5211], [50.0, 0.0, -82.7485], 1.0],
  [7, [50.0, 0.0, 0.0], [50.0, -1.0, 2.0], 2.3669],
  [8, [50.0, -1.0, 2.0], [50.0, 0.0, 0.0], 2.3669],
  [9, [50.0, 2.49, -0.001], [50.0, -2.49, 0.0009], 7.1792],
  [10, [50.0, 2.49, -0.001], [50.0, -2.49, 0.001], 7.1792],
  [11, [50.0, 2.49, -0.001], [50.0, -2.49, 0.0011], 7.2195],
  [12, [50.0, 2.49, -0.001], [50.0, -2.49, 0.0012], 7.2195],
  [13, [50.0, -0.001, 2.49], [50.0, 0.0009, -2.49], 4.8045],
  [14, [50.0, -0.001, 2.49], [50.0, 0.001, -2.49], 4.8045],
  [15, [50.0, -0.001, 2.49], [50.0, 0.0011, -2.49], 4.7461],
  [16, [50.0, 2.5, 0.0], [50.0, 0.0, -2.5], 4.3065],
  [17, [50.0, 2.5, 0.0], [73.0, 25.0, -18.0], 27.1492],
  [18, [50.0, 2.5, 0.0], [61.0, -5.0, 29.0], 22.8977],
  [19, [50.0, 2.5, 0.0], [56.0, -27.0, -3.0], 31.903],
  [20, [50.0, 2.5, 0.0], [58.0, 24.0, 15.0], 19.4535],
  [21, [50.0, 2.5, 0.0], [50.0, 3.1736, 0.5854], 1.0],
  [22, [50.0, 2.5, 0.0], [50.0, 3.2972, 0.0], 1.0],
  [23, [50.0, 2.5, 0.0], [50.0, 1.8634, 0.5757], 1.0],
  [24, [50.0, 2.5, 0.0], [50.0, 3.2592, 0.335], 1.0],
  [25, [60.2574, -34.0099, 36.2677], [60.4626, -34.1751, 39.4387], 1.2644],
  [26, [63.0109, -31.0961, -5.8663], [62.8187, -29.7946, -4.0864], 1.263],
  [27, [61.2901, 3.7196, -5.3901], [61.4292, 2.248, -4.962], 1.8731],
  [28, [35.0831, -44.1164, 3.7933], [35.0232, -40.0716, 1.5901], 1.8645],
  [29, [22.7233, 20.0904, -46.694], [23.0331, 14.973, -42.5619], 2.0373],
  [30, [36.4612, 47.858, 18.3852], [36.2715, 50.5065, 21.2231], 1.4146],
  [31, [90.8027, -2.0831, 1.441], [91.1528, -1.6435, 0.0447], 1.4441],
  [32, [90.9257, -0.5406, -0.9208], [88.6381, -0.8985, -0.7239], 1.5381],
  [33, [6.7747, -0.2908, -2.4247], [5.8714, -0.0985, -2.2286], 0.6377],
  [34, [2.0776, 0.0795, -1.135], [0.9033, -0.0636, -0.5514], 0.9082],
];

describe('CIEDE2000 — Sharma, Wu & Dalal 2005 Table 1 (from memory, cross-checked with colorjs.io)', () => {
  test.each(SHARMA_2005)('pair %i', (_n, lab1, lab2, expected) => {
    const ours = deltaE2000(lab1, lab2);
    expect(Math.abs(ours - expected)).toBeLessThan(5e-5 + 1e-9);
    const viaColorjs = new Color('lab', [...lab1]).deltaE2000(new Color('lab', [...lab2]));
    expect(Math.abs(viaColorjs - ours)).toBeLessThan(1e-4);
  });
  test('zero for identical colours, and the same value with the pair swapped (Sharma et al. 2005: pairs 7 and 8 of Table 1)', () => {
    expect(deltaE2000([40, 10, -20], [40, 10, -20])).toBe(0);
    // Pair 17 of Table 1 taken the other way round still gives its published 27.1492.
    expect(Math.abs(deltaE2000([73, 25, -18], [50, 2.5, 0]) - 27.1492)).toBeLessThan(5e-5 + 1e-9);
  });
  test('bad Lab input is a typed error', () => {
    expect(() => deltaE2000([1, 2] as unknown as Lab, [0, 0, 0])).toThrow(ColorError);
    expect(() => deltaE2000([Number.NaN, 0, 0], [0, 0, 0])).toThrow(/three finite numbers/);
  });
});

describe('WCAG 2.2 contrast ratio (W3C Recommendation, definitions of contrast ratio and relative luminance)', () => {
  test.each([
    ['#767676 on white ≈ 4.54 (commonly quoted lightest AA grey on white)', '#767676', '#ffffff', 4.54, true],
    ['#777777 on white ≈ 4.48 fails AA', '#777777', '#ffffff', 4.48, false],
    ['black on white = 21 (maximum by the formula)', '#000000', '#ffffff', 21, true],
    ['white on black = 21 (order does not matter)', '#ffffff', '#000000', 21, true],
    ['same colour = 1 (minimum by the formula)', '#3366cc', '#3366cc', 1, false],
  ] as const)('%s', (_name, fg, bg, expected, passesAa) => {
    const ratio = contrastRatio(fg, bg);
    expect(ratio).toBeCloseTo(expected, 2);
    expect(wcagLevels(ratio).aa).toBe(passesAa);
  });
  test('levels compare unrounded: 4.499 fails AA and AAA-large (WCAG 2.2 Understanding 1.4.3: no rounding up)', () => {
    expect(wcagLevels(4.499)).toEqual({ aa: false, aaLarge: true, aaa: false, aaaLarge: false, nonText: true });
    expect(wcagLevels(7)).toEqual({ aa: true, aaLarge: true, aaa: true, aaaLarge: true, nonText: true });
    expect(wcagLevels(2.999).nonText).toBe(false);
  });
  test('relative luminance agrees with colorjs.io (general-purpose reference library) over a grid', () => {
    const steps = [0, 10, 64, 128, 200, 255];
    for (const r of steps) for (const g of steps) for (const b of steps) {
      const hex = `#${[r, g, b].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
      const theirs = new Color(hex).contrast(new Color('white'), 'WCAG21');
      // colorjs.io takes luminance from its full-precision sRGB matrix, WCAG from 4-digit coefficients
      // (0.2126, 0.7152, 0.0722): that alone moves the ratio by up to a few parts in 10 000.
      expect(Math.abs(contrastRatio(hex, '#ffffff') - theirs) / theirs).toBeLessThan(5e-4);
    }
  });
});

describe('APCA (apca-w3, draft for WCAG 3; second opinion only)', () => {
  test('#888 text on #fff ≈ Lc 63.06 (from memory of the APCA documentation example)', () => {
    expect(apcaContrast('#888888', '#ffffff')).toBeCloseTo(63.06, 1);
  });
  test('polarity: light text on dark is negative (APCA documentation)', () => {
    expect(apcaContrast('#000000', '#ffffff')).toBeGreaterThan(100);
    expect(apcaContrast('#ffffff', '#000000')).toBeLessThan(-100);
  });
});

describe('parseColor', () => {
  test.each([
    ['6-digit hex', '#1A2B3C', '#1a2b3c', 1],
    ['bare 6-digit hex', '1a2b3c', '#1a2b3c', 1],
    ['3-digit hex (CSS Color 4 §5.2)', '#abc', '#aabbcc', 1],
    ['4-digit hex with alpha', '#abc8', '#aabbcc', 0x88 / 255],
    ['8-digit hex with alpha', '#11223380', '#112233', 0x80 / 255],
    ['rgb()', 'rgb(255 0 0)', '#ff0000', 1],
    ['legacy rgba()', 'rgba(0, 128, 0, 0.5)', '#008000', 0.5],
    ['hsl(): hsl(120 100% 25%) = #008000 (CSS named "green", CSS Color 4 §6)', 'hsl(120 100% 25%)', '#008000', 1],
    ['named colour rebeccapurple = #663399 (CSS Color 4 §6.1)', 'rebeccapurple', '#663399', 1],
    ['oklch() of sRGB red (from memory of CSS Color 4 examples)', 'oklch(62.8% 0.2577 29.23)', '#ff0000', 1],
    ['lab() is D50: sRGB red = lab(54.29% 80.8 69.89) (from memory, checked by colorjs.io below)', 'lab(54.29% 80.8 69.89)', '#ff0000', 1],
  ])('%s', (_name, input, hex, alpha) => {
    const result = parseColor(input);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.color.hex).toBe(hex);
    expect(result.color.alpha).toBeCloseTo(alpha, 6);
  });
  test('a colour outside sRGB is gamut-mapped and marked', () => {
    const result = parseColor('color(display-p3 1 0 0)');
    expect(result.ok && result.color.inGamut).toBe(false);
    expect(result.ok && /^#[0-9a-f]{6}$/.test(result.color.hex)).toBe(true);
  });
  test.each([['not-a-colour'], [''], ['#12345'], ['rgb(1,2'], ['x'.repeat(500)], [42 as unknown as string], [null as unknown as string]])(
    'rejects %s with color_unparsed and says what was not understood',
    (input) => {
      const result = parseColor(input);
      expect(result.ok).toBe(false);
      if (result.ok) return;
      expect(result.error.code).toBe('color_unparsed');
      expect(result.error.message).toMatch(/colour/i);
    },
  );
  test('toColor throws a typed ColorError', () => {
    expect(() => toColor('bogus')).toThrow(ColorError);
  });
});

describe('colorValues', () => {
  test('white in CIELAB D50 and D65 is L=100, a=b=0 (definition of the reference white)', () => {
    const v = colorValues('#ffffff');
    expect(v.lab).toMatchObject({ l: 100, a: 0, b: 0 });
    expect(v.lab65).toMatchObject({ l: 100, a: 0, b: 0 });
    expect(v.oklch.l).toBeCloseTo(1, 3);
  });
  test('sRGB red in CIELAB D65 = 53.24, 80.09, 67.20 (from memory of common reference tables)', () => {
    const v = colorValues('red');
    expect(v.lab65.l).toBeCloseTo(53.24, 1);
    expect(v.lab65.a).toBeCloseTo(80.09, 1);
    expect(v.lab65.b).toBeCloseTo(67.2, 1);
    expect(v.oklch.css).toBe('oklch(62.8% 0.2577 29.23)');
    expect(v.rgb).toEqual([255, 0, 0]);
    expect(v.hsl).toMatchObject({ h: 0, s: 100, l: 50, css: 'hsl(0 100% 50%)' });
  });
  test('plain CMYK formula: #ff0000 = [0,100,100,0], black = [0,0,0,100] (common practice naive RGB→CMYK)', () => {
    expect(colorValues('#ff0000').cmyk).toEqual([0, 100, 100, 0]);
    expect(colorValues('#000000').cmyk).toEqual([0, 0, 0, 100]);
    expect(colorValues('#ffffff').cmyk).toEqual([0, 0, 0, 0]);
  });
  test('OKLCH, Lab D50 and Lab D65 agree with colorjs.io over a 5×5×5 sRGB grid (general-purpose reference library)', () => {
    const steps = [0, 64, 128, 191, 255];
    for (const r of steps) for (const g of steps) for (const b of steps) {
      const hex = `#${[r, g, b].map((x) => x.toString(16).padStart(2, '0')).join('')}`;
      const v = colorValues(hex);
      const ref = new Color(hex);
      const [ol, oc, oh] = ref.to('oklch').coords.map((x) => Number(x ?? 0));
      const lab = ref.to('lab').coords.map(Number);
      const lab65 = ref.to('lab-d65').coords.map(Number);
      expect(v.oklch.l).toBeCloseTo(ol, 3);
      expect(v.oklch.c).toBeCloseTo(oc, 3);
      if (oc > 0.02) expect(Math.abs(((v.oklch.h - oh + 540) % 360) - 180)).toBeLessThan(0.05);
      [v.lab.l, v.lab.a, v.lab.b].forEach((x, i) => expect(Math.abs(x - lab[i])).toBeLessThan(0.02));
      [v.lab65.l, v.lab65.a, v.lab65.b].forEach((x, i) => expect(Math.abs(x - lab65[i])).toBeLessThan(0.02));
    }
  });
});

describe('colour-vision simulation — Machado, Oliveira & Fernandes 2009, severity 1.0', () => {
  // Matrices from memory of the authors' published table (severity 1.0), cross-checked with the copy shipped in culori.
  const PUBLISHED: Record<ColorVisionKind, number[]> = {
    protanopia: [0.152286, 1.052583, -0.204868, 0.114503, 0.786281, 0.099216, -0.003882, -0.048116, 1.051998],
    deuteranopia: [0.367322, 0.860646, -0.227968, 0.280085, 0.672501, 0.047413, -0.01182, 0.04294, 0.968881],
    tritanopia: [1.255528, -0.076749, -0.178779, -0.078411, 0.930809, 0.147602, 0.004733, 0.691367, 0.3039],
  };
  // culori ships the same table (severity 1.0); its filter applied to the unit vectors hands back the matrix's columns.
  const CULORI = { protanopia: filterDeficiencyProt(1), deuteranopia: filterDeficiencyDeuter(1), tritanopia: filterDeficiencyTrit(1) };
  test.each(Object.keys(PUBLISHED) as ColorVisionKind[])('%s matrix matches the published values (and culori\'s copy of them)', (kind) => {
    const columns = [[1, 0, 0], [0, 1, 0], [0, 0, 1]].map(([r, g, b]) => CULORI[kind]({ mode: 'rgb', r, g, b }));
    expect([0, 1, 2].flatMap((row) => columns.map((c) => [c.r, c.g, c.b][row]))).toEqual(PUBLISHED[kind]);
    expect(MACHADO_2009_MATRICES[kind].flat()).toEqual(PUBLISHED[kind]);
    // Each row sums to 1 so greys stay grey (property of the published matrices).
    MACHADO_2009_MATRICES[kind].forEach((row) => expect(row[0] + row[1] + row[2]).toBeCloseTo(1, 5));
  });
  const primaries = ['#ff0000', '#00ff00', '#0000ff', '#336699', '#808080'];
  test.each((Object.keys(PUBLISHED) as ColorVisionKind[]).flatMap((k) => primaries.map((p) => [k, p] as const)))(
    '%s of %s equals the matrix applied independently in linear RGB (colorjs.io srgb-linear)',
    (kind, hex) => {
      const lin = new Color(hex).to('srgb-linear').coords.map(Number);
      const m = PUBLISHED[kind];
      const out = [0, 1, 2].map((i) => Math.min(1, Math.max(0, m[i * 3] * lin[0] + m[i * 3 + 1] * lin[1] + m[i * 3 + 2] * lin[2])));
      const expected = new Color('srgb-linear', out as [number, number, number]).to('srgb').toString({ format: 'hex', collapse: false });
      expect(simulateColorVision(hex, kind)).toBe(expected);
    },
  );
  test('unknown kind is a typed error', () => {
    expect(() => simulateColorVision('#fff', 'achromatopsia' as ColorVisionKind)).toThrow(ColorError);
  });
});

// The ratios of suggested shades are checked with culori's wcagContrast (a general-purpose reference library; the WCAG
// 2.2 relative-luminance definition), not with our own contrastRatio; hues and lightness with colorjs.io's OKLCH.
const oklchOf = (hex: string) => new Color(hex).to('oklch').coords.map((x) => Number(x ?? 0));
describe('nearestPassing', () => {
  test.each([
    ['mid grey on white → a darker grey reaching AA 4.5 (WCAG 2.2 ratio)', '#999999', '#ffffff', 4.5],
    ['brand orange on white → AA', '#ff8800', '#ffffff', 4.5],
    ['navy on black → a lighter tint reaching AA', '#1a2b6c', '#000000', 4.5],
    ['grey on mid grey → 5:1 needs nearly black', '#777777', '#808080', 5],
  ])('%s', (_name, fg, bg, target) => {
    const result = nearestPassing(fg, bg, target);
    expect(result).not.toBeNull();
    expect(wcagContrast(result!.hex, bg)).toBeGreaterThanOrEqual(target);
    expect(result!.ratio).toBeCloseTo(wcagContrast(result!.hex, bg), 10);
  });
  test('keeps the hue of a saturated colour (OKLCH hue within a few degrees)', () => {
    const result = nearestPassing('#ff8800', '#ffffff', 4.5)!;
    const [beforeL, , beforeH] = oklchOf('#ff8800');
    const [afterL, , afterH] = oklchOf(result.hex);
    expect(Math.abs(afterH - beforeH)).toBeLessThan(8);
    // On white only a darker shade can pass, and the lightness reported is the suggestion's own.
    expect(result.lightness).toBeLessThan(beforeL);
    expect(result.lightness).toBeCloseTo(afterL, 3);
  });
  test('returns the colour itself when it already passes, null when no lightness can reach the target', () => {
    expect(nearestPassing('#000000', '#ffffff', 4.5)?.hex).toBe('#000000');
    expect(nearestPassing('#777777', '#777777', 21)).toBeNull();
  });
  test('rejects an impossible target with a typed error', () => {
    expect(() => nearestPassing('#000', '#fff', 30)).toThrow(ColorError);
  });
});

describe('paletteReport', () => {
  const palette = [
    { id: 'ink', name: 'Ink', hex: '#1b1f3b' },
    { id: 'paper', name: 'Paper', hex: '#faf7f0' },
    { id: 'paper2', name: 'Paper warm', hex: '#f8f4ec' },
  ];
  test('every ordered pair i≠j, levels from the WCAG 2.2 ratio, near duplicates under the ΔE00 rule of thumb', () => {
    const report = paletteReport(palette);
    expect(report.pairs).toHaveLength(6);
    const inkOnPaper = report.pairs.find((p) => p.foreground.id === 'ink' && p.background.id === 'paper')!;
    expect(inkOnPaper.ratio).toBeCloseTo(wcagContrast('#1b1f3b', '#faf7f0'), 10); // culori, WCAG 2.2 definition
    expect(inkOnPaper.aaa).toBe(true);
    expect(report.nearDuplicates).toHaveLength(1);
    expect(report.nearDuplicates[0]).toMatchObject({ a: 'paper', b: 'paper2' });
    // ΔE00 on CIELAB D50, as colorjs.io computes it from the two hex values (≈ 0.84).
    expect(Math.abs(report.nearDuplicates[0].deltaE2000 - new Color('#faf7f0').deltaE2000(new Color('#f8f4ec')))).toBeLessThan(1e-3);
    expect(Object.keys(report.colorVision.ink)).toEqual(['protanopia', 'deuteranopia', 'tritanopia']);
  });
  test('a bad colour is a typed error naming it', () => {
    expect(() => paletteReport([{ id: 'x', name: 'Oops', hex: 'nope' }])).toThrow(/Oops/);
  });
});

describe('ICC CMYK through libvips (sharp)', () => {
  test('four channels in 0–100; black → high K; white → 0,0,0,0 (behaviour of any CMYK output profile)', async () => {
    const black = await iccCmyk('#000000');
    const white = await iccCmyk('#ffffff');
    expect(black).toHaveLength(4);
    black.forEach((v) => expect(v).toBeGreaterThanOrEqual(0));
    black.forEach((v) => expect(v).toBeLessThanOrEqual(100));
    expect(black[3]).toBeGreaterThan(80);
    expect(white).toEqual([0, 0, 0, 0]);
  });
  test('differs from the plain formula for saturated red (plain #ff0000 = [0,100,100,0], common practice formula)', async () => {
    expect(colorValues('#ff0000').cmyk).toEqual([0, 100, 100, 0]);
    expect(await iccCmyk('#ff0000')).not.toEqual([0, 100, 100, 0]);
    expect(PRINT_CAUTION).toMatch(/proof/);
  });
  test('bad input is a typed error', async () => {
    await expect(iccCmyk('nope')).rejects.toThrow(ColorError);
  });
});
