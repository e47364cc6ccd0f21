// One-colour proofs: greys by WCAG 2.2 relative luminance, the warning for touching colours that run together in grey,
// and the knockout proofs that keep a logo's holes.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Color from 'colorjs.io';
import { wcagContrast, wcagLuminance } from 'culori';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { relativeLuminance } from '@/lib/color/contrast';
import { greyscaleProof, logoTones, oneColourProof, PROOF_MARGIN, PROOF_SIZE, proofSheet, type LogoSource } from '@/lib/logo/proofs.server';
import { encodeSrgb, greyLevel, greyOf, greyscalePixels, TONE_CONTRAST, toneReport } from '@/lib/logo/tones';

const rgbOf = (hex: string): [number, number, number] => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
const svg = (text: string, width: number, height: number): LogoSource => ({ bytes: Buffer.from(text), format: 'svg', canvas: { width, height } });

/** The pixel at (x, y) of a PNG, read back with sharp. */
async function pixel(png: Buffer, x: number, y: number): Promise<number[]> {
  const { data, info } = await sharp(png).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  const at = (Math.round(y) * info.width + Math.round(x)) * info.channels;
  return [...data.subarray(at, at + info.channels)];
}

/** The green #00gg00 whose relative luminance is closest to pure red's, found with colorjs.io's own luminance. */
function greenMatchingRed(): string {
  const red = new Color('#ff0000').luminance;
  let best = 0;
  for (let g = 0; g <= 255; g++) {
    const lum = new Color('srgb', [0, g / 255, 0]).luminance;
    if (Math.abs(lum - red) < Math.abs(new Color('srgb', [0, best / 255, 0]).luminance - red)) best = g;
  }
  return `#00${best.toString(16).padStart(2, '0')}00`;
}

describe('greys by WCAG 2.2 relative luminance (sRGB, IEC 61966-2-1)', () => {
  const table = ['#ff0000', '#00ff00', '#0000ff', '#808080', '#1f3a5f', '#2b4c78', '#e0a526', '#c8553d', '#4a2c21', '#e9d8b8', '#000000', '#ffffff'];
  test.each(table)('%s: luminance agrees with colorjs.io and culori (general-purpose reference libraries)', (hex) => {
    const ours = relativeLuminance(rgbOf(hex));
    // colorjs.io uses the full-precision sRGB matrix, WCAG four-digit coefficients: a few parts in 10 000 apart.
    expect(Math.abs(ours - new Color(hex).luminance)).toBeLessThan(3e-4);
    expect(Math.abs(ours - wcagLuminance(hex))).toBeLessThan(1e-9);
  });
  test.each(table)('%s: the grey is sRGB-encoded luminance, as colorjs.io converts linear light to sRGB', (hex) => {
    const y = relativeLuminance(rgbOf(hex));
    const theirs = Math.round(new Color('srgb-linear', [y, y, y]).to('srgb').coords[0]! * 255);
    expect(greyLevel(rgbOf(hex))).toBe(theirs);
    expect(encodeSrgb(y)).toBeCloseTo(new Color('srgb-linear', [y, y, y]).to('srgb').coords[0]!, 9);
  });
  test('neutral greys stay as they are; pure red is level 127, not the channel average 85 (WCAG 2.2 definition)', () => {
    for (const v of [0, 17, 128, 200, 255]) expect(greyLevel([v, v, v])).toBe(v);
    expect(greyLevel([255, 0, 0])).toBe(127);
    expect(greyOf([255, 0, 0])).toBe('#7f7f7f');
  });
  test('greyscalePixels keeps alpha and greys each pixel (checked against colorjs.io)', () => {
    const data = Uint8Array.from([255, 0, 0, 255, 0, 0, 255, 128]);
    const out = greyscalePixels({ data, width: 2, height: 1, channels: 4 });
    const yb = new Color('#0000ff').luminance;
    const blue = Math.round(new Color('srgb-linear', [yb, yb, yb]).to('srgb').coords[0]! * 255);
    expect([...out]).toEqual([127, 127, 127, 255, blue, blue, blue, 128]);
  });
});

describe('touching colours that run together in grey (WCAG 2.2 SC 1.4.11: 3:1 between adjacent parts)', () => {
  const green = greenMatchingRed();
  test('the fixture green has the relative luminance of #ff0000 (colorjs.io)', () => {
    expect(Math.abs(new Color(green).luminance - new Color('#ff0000').luminance)).toBeLessThan(0.005);
  });
  test('a red and an equally light green side by side are flagged, with their contrast', async () => {
    const report = await logoTones(svg(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="${green}"/></svg>`, 200, 100));
    expect(report.parts.map((p) => p.hex).sort()).toEqual([green, '#ff0000'].sort());
    expect(report.dependsOnColour).toBe(true);
    expect(report.collapses).toHaveLength(1);
    // culori's wcagContrast as the reference for the ratio.
    expect(report.collapses[0].contrast).toBeCloseTo(wcagContrast('#ff0000', green), 6);
    expect(report.collapses[0].contrast).toBeLessThan(1.02);
    expect(report.threshold.contrast).toBe(3);
  });
  test('the same mark as a small PNG is flagged too (rasters are analysed at their own size, never enlarged)', async () => {
    const png = await sharp(Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="${green}"/></svg>`), { density: 18 }).png().toBuffer();
    const { width, height } = await sharp(png).metadata();
    const report = await logoTones({ bytes: png, format: 'png', canvas: { width: width!, height: height! } });
    expect(width).toBe(50);
    expect(report.dependsOnColour).toBe(true);
  });
  test('the same two colours apart from each other are not: they never need telling apart', async () => {
    const report = await logoTones(svg(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 240 100"><rect width="100" height="100" fill="#ff0000"/><rect x="140" width="100" height="100" fill="${green}"/></svg>`, 240, 100));
    expect(report.parts).toHaveLength(2);
    expect(report.dependsOnColour).toBe(false);
  });
  test('red against black touches at 5.25:1 (WCAG formula: (0.2126 + 0.05) / 0.05) and is not flagged', async () => {
    const report = await logoTones(svg('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="#000000"/></svg>', 200, 100));
    expect(report.dependsOnColour).toBe(false);
    expect(wcagContrast('#ff0000', '#000000')).toBeGreaterThan(TONE_CONTRAST);
  });
  test('a one-colour logo has one part and nothing to flag', async () => {
    const report = await logoTones(svg('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="40" fill="#1a4d8f"/></svg>', 100, 100));
    expect(report.parts.map((p) => p.hex)).toEqual(['#1a4d8f']);
    expect(report.dependsOnColour).toBe(false);
  });
  test('pure analysis: an anti-aliased seam of mixed pixels between two parts still counts as touching', () => {
    // 40 × 10: red | two mixed columns | green, all opaque; the mixed colours are under the part share.
    const width = 40;
    const height = 10;
    const data = new Uint8Array(width * height * 4);
    const g = rgbOf(green);
    for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) {
      const rgb = x < 19 ? [255, 0, 0] : x === 19 ? [200, 40, 0] : x === 20 ? [60, 120, 0] : g;
      data.set([...rgb, 255], (y * width + x) * 4);
    }
    const report = toneReport({ data, width, height, channels: 4 });
    expect(report.dependsOnColour).toBe(true);
  });
});

describe('the demo logos (db/seeders/files), reported as they are', () => {
  const demo = (file: string) => {
    const text = readFileSync(join(process.cwd(), 'db/seeders/files', file), 'utf8');
    const [, , , w, h] = /viewBox="([\d.]+) ([\d.]+) ([\d.]+) ([\d.]+)"/.exec(text)!.map(Number);
    return svg(text, w, h);
  };
  test('the open-book mark reads without colour: its two blues are parted by the cream spine', async () => {
    const report = await logoTones(demo('pellow-mark.svg'));
    expect(report.parts.map((p) => p.hex)).toEqual(expect.arrayContaining(['#1f3a5f', '#2b4c78', '#e0a526']));
    expect(report.dependsOnColour).toBe(false);
  });
  test.each(['larchmere-mark.svg', 'larchmere-lockup.svg'])('%s is flagged: the red ring on the brown disc is under 3:1 (culori)', async (file) => {
    const report = await logoTones(demo(file));
    expect(report.dependsOnColour).toBe(true);
    const pairs = report.collapses.map((c) => [c.a.hex, c.b.hex].sort().join(' '));
    expect(pairs).toEqual(['#4a2c21 #c8553d']);
    expect(report.collapses[0].contrast).toBeCloseTo(wcagContrast('#4a2c21', '#c8553d'), 6);
    expect(report.collapses[0].contrast).toBeLessThan(3);
  });
});

describe('one-colour proofs through the knockout (inner shapes stay visible)', () => {
  // A disc with a hole painted in white: white reads as the ground (knockout.ts), so it is cut out.
  const disc = svg('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="48" fill="#1a4d8f"/><circle cx="50" cy="50" r="20" fill="#ffffff"/></svg>', 100, 100);
  const m = PROOF_SIZE * PROOF_MARGIN;
  const at = (units: number) => m + (units / 100) * PROOF_SIZE;

  test('black on white: the disc is black, the hole and the ground are white (sampled with sharp)', async () => {
    const png = await oneColourProof(disc, 'black-on-white');
    expect((await sharp(png).metadata()).width).toBe(PROOF_SIZE + 2 * m);
    expect(await pixel(png, at(50), at(50))).toEqual([255, 255, 255, 255]);
    expect(await pixel(png, at(84), at(50))).toEqual([0, 0, 0, 255]);
    expect(await pixel(png, 2, 2)).toEqual([255, 255, 255, 255]);
  });
  test('white on black inverts it: the disc is white, the hole and the ground black', async () => {
    const png = await oneColourProof(disc, 'white-on-black');
    expect(await pixel(png, at(50), at(50))).toEqual([0, 0, 0, 255]);
    expect(await pixel(png, at(84), at(50))).toEqual([255, 255, 255, 255]);
    expect(await pixel(png, 2, 2)).toEqual([0, 0, 0, 255]);
  });
  test('greyscale: the disc is the grey of #1a4d8f by relative luminance (colorjs.io), the hole white', async () => {
    const png = await greyscaleProof(disc);
    const y = new Color('#1a4d8f').luminance;
    const level = Math.round(new Color('srgb-linear', [y, y, y]).to('srgb').coords[0]! * 255);
    const [r, g, b] = await pixel(png, at(84), at(50));
    expect([r, g, b].every((v) => Math.abs(v - level) <= 1)).toBe(true);
    expect(await pixel(png, at(50), at(50))).toEqual([255, 255, 255, 255]);
  });
  test('the proof sheet is one PNG with the three proofs', async () => {
    const png = await proofSheet(disc, {});
    const meta = await sharp(png).metadata();
    expect(meta.format).toBe('png');
    expect(meta.width! > meta.height!).toBe(true);
  });
});
