// The pattern generator: layouts, the seeded scatter, seamless tiles, the knockout's holes and palette-only colours,
// read back from the PNG with sharp.
// Sources: half-drop and brick repeats (a half-drop moves every other column down by half a repeat, a brick moves every
// other row across by half a repeat: common practice in surface-pattern and textile design, from memory);
// WCAG 2.2 relative luminance for the knockout (its ground split, see tests/unit/logo-knockout.test.ts); sharp/libvips
// (a general-purpose image library) draws and reads back every pixel checked here.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { colorValues } from '@/lib/color/values';
import type { Identity, IdentityColor, IdentityLogo } from '@/lib/identity/types';
import { patternColours } from '@/lib/pattern/colours';
import { patternLayout, patternSettingsSchema, PATTERN_LAYOUTS, seededRandom, type PatternLayout, type PatternSettingsInput } from '@/lib/pattern/layout';
import { patternPng, patternTile, type MarkFile } from '@/lib/pattern/pattern.server';

const DISC = readFileSync(join(__dirname, '../fixtures/pattern/disc-with-hole.svg'));

const colour = (id: string, hex: string, role: IdentityColor['role'], position: number): IdentityColor =>
  ({ id, name: id, value: hex, role, ...colorValues(hex), cmykIcc: [0, 0, 0, 0], cmykOverride: null, spot: null, position }) as IdentityColor;

const logo = (id: string, format: 'svg' | 'png', size = 100): IdentityLogo => ({
  id,
  name: 'Disc with a hole',
  variant: 'mark',
  format,
  canvas: { x: 0, y: 0, width: size, height: size },
  bounds: { x: 5, y: 5, width: size * 0.9, height: size * 0.9 },
  clearSpace: { unitSize: 10, unitLabel: 'a tenth', multiple: 1, box: { x: 0, y: 0, width: size, height: size } },
  minimumSize: { thinnestStroke: 1, suggested: { screenPx: 16, printMm: 5 }, screenPx: 16, printMm: 5 },
  files: { original: `/x/${id}`, black: `/x/${id}?variant=black`, white: `/x/${id}?variant=white`, reversed: `/x/${id}?variant=reversed` },
  position: 0,
});

// An invented test palette: a warm paper ground, a deep teal ink, and a third colour the pattern must not use unasked.
const IDENTITY: Identity = {
  brand: { id: '00000000-0000-4000-8000-000000000000', name: 'Test', slug: 'test' },
  colors: [colour('paper', '#f3ead8', 'background', 0), colour('teal', '#0f4c5c', 'primary', 1), colour('flame', '#e36414', 'accent', 2)],
  logos: [logo('disc', 'svg')],
  typefaces: [],
  typeScale: {} as Identity['typeScale'],
};
const GROUND = [0xf3, 0xea, 0xd8];
const INK = [0x0f, 0x4c, 0x5c];

const discFiles: Record<string, MarkFile> = { disc: { bytes: DISC, format: 'svg' } };
const readMark = async (_brand: string, l: IdentityLogo) => discFiles[l.id] ?? null;

/** RGB of a PNG at pixel (x, y), and its size. */
async function pixels(png: Buffer) {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return { info, at: (x: number, y: number) => Array.from(data.subarray((y * info.width + x) * 3, (y * info.width + x) * 3 + 3)) };
}
const near = (a: number[], b: number[], tolerance = 3) => a.every((v, i) => Math.abs(v - b[i]) <= tolerance);

/** Marks whose centre lies inside the tile (the copies across the edges left out). */
function ownMarks(layout: PatternLayout, extra: Partial<PatternSettingsInput> = {}) {
  const tile = patternLayout(patternSettingsSchema.parse({ logoId: 'disc', layout, scale: 40, spacing: 1, ...extra }), 1);
  return { tile, marks: tile.placements.filter((p) => p.x >= 0 && p.x < tile.width && p.y >= 0 && p.y < tile.height) };
}

describe('layouts (common practice, from memory)', () => {
  test('grid: one mark per repeat, repeat = mark + gap', () => {
    const { tile, marks } = ownMarks('grid');
    expect([tile.width, tile.height]).toEqual([80, 80]);
    expect(marks).toEqual([{ x: 40, y: 40, rotation: 0 }]);
  });

  test('half-drop: the second column sits half a repeat lower', () => {
    const { tile, marks } = ownMarks('half-drop');
    expect([tile.width, tile.height]).toEqual([160, 80]);
    const [first, second] = [...marks].sort((a, b) => a.x - b.x);
    expect(second.x - first.x).toBe(80);
    expect(Math.abs(second.y - first.y)).toBe(tile.height / 2);
  });

  test('brick: the second row sits half a repeat across', () => {
    const { tile, marks } = ownMarks('brick');
    expect([tile.width, tile.height]).toEqual([80, 160]);
    const [first, second] = [...marks].sort((a, b) => a.y - b.y);
    expect(second.y - first.y).toBe(80);
    expect(Math.abs(second.x - first.x)).toBe(tile.width / 2);
  });

  test('diagonal: each row steps a third of a repeat further across', () => {
    const { marks } = ownMarks('diagonal');
    const rows = [...marks].sort((a, b) => a.y - b.y);
    const expected = [40, 40 + 80 / 3, 40 + 160 / 3 - 80];
    rows.forEach((m, i) => expect(m.x).toBeCloseTo(expected[i], 9));
  });

  test('scatter is the same for the same seed and differs for another', () => {
    const once = ownMarks('scatter', { seed: 7 }).tile.placements;
    expect(ownMarks('scatter', { seed: 7 }).tile.placements).toEqual(once);
    expect(ownMarks('scatter', { seed: 8 }).tile.placements).not.toEqual(once);
    expect(ownMarks('scatter', { seed: 7 }).marks).toHaveLength(9);
  });

  test('the seeded generator repeats its sequence and stays in [0, 1)', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const run = Array.from({ length: 1000 }, () => a());
    expect(Array.from({ length: 1000 }, () => b())).toEqual(run);
    expect(run.every((v) => v >= 0 && v < 1)).toBe(true);
    // Roughly uniform: the mean of 1000 draws of U(0,1) is 0.5 ± 0.05 (its standard error is 1/√12000 ≈ 0.009).
    expect(Math.abs(run.reduce((s, v) => s + v, 0) / run.length - 0.5)).toBeLessThan(0.05);
  });

  test('settings outside their limits are refused with the field named', () => {
    expect(patternSettingsSchema.safeParse({ logoId: 'disc', scale: 1000 }).error?.issues[0].path).toEqual(['scale']);
    expect(patternSettingsSchema.safeParse({ logoId: 'disc', layout: 'zigzag' }).success).toBe(false);
    expect(patternSettingsSchema.safeParse({ logoId: '"><script>' }).success).toBe(false);
  });
});

describe('the tile is seamless (sharp draws a 2 × 2 repeat of the tile and the same lattice in one piece)', () => {
  test.each(PATTERN_LAYOUTS.map((l) => [l]))('%s', async (layout) => {
    const settings = { logoId: 'disc', layout, scale: 36, spacing: 0.6, rotation: 25, seed: 3, opacity: 1 } as const;
    const one = await patternTile(IDENTITY, settings, { readMark });
    const png = await patternPng(one, 1);
    const { width: W, height: H } = one;
    const repeated = await sharp({ create: { width: 2 * W, height: 2 * H, channels: 3, background: '#000000' } })
      .composite([0, 1].flatMap((i) => [0, 1].map((j) => ({ input: png, left: i * W, top: j * H }))))
      .png()
      .toBuffer();
    const lattice = await patternPng(await patternTile(IDENTITY, settings, { readMark, repeat: { columns: 2, rows: 2 } }), 1);
    const a = await pixels(repeated);
    const b = await pixels(lattice);
    expect([b.info.width, b.info.height]).toEqual([2 * W, 2 * H]);
    let inkAtSeams = 0;
    let worst = 0;
    // Across the vertical seam: columns W-1 and W (the last column of one tile, the first of the next); likewise rows.
    for (const [x0, y0, dx, dy, n] of [[W - 1, 0, 0, 1, 2 * H], [W, 0, 0, 1, 2 * H], [0, H - 1, 1, 0, 2 * W], [0, H, 1, 0, 2 * W]]) {
      for (let k = 0; k < n; k++) {
        const [x, y] = [x0 + dx * k, y0 + dy * k];
        const [p, q] = [a.at(x, y), b.at(x, y)];
        worst = Math.max(worst, ...p.map((v, i) => Math.abs(v - q[i])));
        if (!near(q, GROUND, 40)) inkAtSeams++;
      }
    }
    // Marks cross the seams (the check is not empty; a grid keeps its mark centred, away from them), and the repeat
    // matches the lattice there within anti-aliasing.
    if (layout !== 'grid') expect(inkAtSeams).toBeGreaterThan(0);
    expect(worst).toBeLessThanOrEqual(8);
  });
});

describe('inner shapes stay visible through the knockout', () => {
  // Grid, mark 100 px with a gap of 50: the mark's centre is at (75, 75); the hole has radius 18, the disc 45.
  const settings = { logoId: 'disc', layout: 'grid', scale: 100, spacing: 0.5 } as const;

  test('SVG mark: the hole shows the ground, the ring is ink', async () => {
    const tile = await patternTile(IDENTITY, settings, { readMark });
    const { at } = await pixels(await patternPng(tile, 1));
    expect(at(75, 75)).toEqual(GROUND);
    expect(at(75 + 31, 75)).toEqual(INK);
    expect(at(75, 75 - 31)).toEqual(INK);
    expect(at(2, 2)).toEqual(GROUND); // outside the disc
    expect(tile.svg).not.toContain('<pattern');
  });

  test('PNG mark: the raster knockout keeps the hole too', async () => {
    const png = await sharp(DISC, { density: 72 * 4 }).png().toBuffer();
    const identity = { ...IDENTITY, logos: [logo('raster', 'png', 400)] };
    const tile = await patternTile(identity, { ...settings, logoId: 'raster' }, { readMark: async () => ({ bytes: png, format: 'png' }) });
    const { at } = await pixels(await patternPng(tile, 1));
    expect(near(at(75, 75), GROUND)).toBe(true);
    expect(near(at(75 + 31, 75), INK, 6)).toBe(true);
  });
});

describe('colours come from the palette only', () => {
  test('every pixel lies between the ground and the ink', async () => {
    const tile = await patternTile(IDENTITY, { logoId: 'disc', layout: 'scatter', scale: 30, spacing: 0.4, rotation: 10, opacity: 0.6 }, { readMark });
    expect(tile.colours).toEqual({ ground: { id: 'paper', hex: '#f3ead8' }, ink: { id: 'teal', hex: '#0f4c5c' } });
    const { data } = await sharp(await patternPng(tile, 1)).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    const span = INK.map((v, i) => v - GROUND[i]);
    const length2 = span.reduce((s, v) => s + v * v, 0);
    let off = 0;
    for (let i = 0; i < data.length; i += 3) {
      const p = [data[i], data[i + 1], data[i + 2]];
      const t = Math.min(1, Math.max(0, p.reduce((s, v, c) => s + (v - GROUND[c]) * span[c], 0) / length2));
      off = Math.max(off, Math.hypot(...p.map((v, c) => v - (GROUND[c] + t * span[c]))));
    }
    // Blends of the two (anti-aliasing, opacity) only: never a third colour.
    expect(off).toBeLessThan(3);
  });

  test('chosen colours are used; one no longer in the palette is refused, not guessed', async () => {
    expect(patternColours(IDENTITY, { groundColorId: 'teal', inkColorId: 'flame' })).toMatchObject({ ok: true, colours: { ground: { id: 'teal' }, ink: { id: 'flame' } } });
    await expect(patternTile(IDENTITY, { logoId: 'disc', inkColorId: 'gone' }, { readMark })).rejects.toMatchObject({ code: 'pattern_colour_missing', status: 422 });
    expect(patternColours({ ...IDENTITY, colors: [] }, { groundColorId: null, inkColorId: null })).toMatchObject({ ok: false, code: 'pattern_needs_palette' });
  });

  test('a script in the mark never reaches the tile (OWASP XSS prevention: no script in served SVG)', async () => {
    const hostile = Buffer.from(DISC.toString().replace('</svg>', '<script>alert(1)</script></svg>').replace('<circle', '<circle onload="alert(2)"'));
    const tile = await patternTile(IDENTITY, { logoId: 'disc' }, { readMark: async () => ({ bytes: hostile, format: 'svg' }) });
    expect(tile.svg).not.toMatch(/<script|onload|alert/i);
  });
});
