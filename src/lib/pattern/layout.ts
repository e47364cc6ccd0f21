// Where the marks of a pattern sit inside one repeating tile. Pure maths, shared by the tile export (the server) and
// the pattern block (the page): the tile is seamless because every mark that crosses a tile edge is placed again on
// the opposite side(s), so tiles laid edge to edge continue each other.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';

/** How marks repeat: in a grid, rows or columns shifted by half a repeat, rows stepping into diagonals, or scattered. */
export const PATTERN_LAYOUTS = ['grid', 'half-drop', 'brick', 'diagonal', 'scatter'] as const;
export type PatternLayout = (typeof PATTERN_LAYOUTS)[number];

export const PATTERN_LAYOUT_LABELS: Record<PatternLayout, string> = {
  grid: 'Grid',
  'half-drop': 'Half-drop (columns down by half)',
  brick: 'Brick (rows across by half)',
  diagonal: 'Diagonal steps',
  scatter: 'Scatter (seeded)',
};

/** Limits of the settings, shared by the block, the API and the shelf. */
export const PATTERN_LIMITS = {
  scale: { min: 8, max: 240 },
  spacing: { min: 0, max: 8 },
  rotation: { min: -180, max: 180 },
  opacity: { min: 0.05, max: 1 },
  seed: { min: 0, max: 2 ** 31 - 1 },
} as const;

/** Marks in one scatter tile (a tile of three by three repeats). */
export const SCATTER_MARKS = 9;
/** Rows a diagonal tile steps through: each row moves a third of a repeat further across. */
export const DIAGONAL_STEPS = 3;
/** Largest extra turn a scattered mark takes, either way, on top of the chosen rotation (degrees). */
export const SCATTER_TURN = 20;

const num = (what: string, limits: { min: number; max: number }, fallback: number) =>
  z
    .number({ error: `${what} must be a number.` })
    .min(limits.min, { error: `${what} must be at least ${limits.min}.` })
    .max(limits.max, { error: `${what} must be at most ${limits.max}.` })
    .default(fallback);

/** The settings of one pattern: which mark, how it repeats, its size, gap, turn, seed and the two palette colours. */
export const patternSettingsSchema = z.strictObject({
  logoId: refIdSchema('logo'),
  layout: z.enum(PATTERN_LAYOUTS, { error: `layout must be one of ${PATTERN_LAYOUTS.join(', ')}.` }).default('brick'),
  /** Height of one mark in CSS px. */
  scale: num('scale', PATTERN_LIMITS.scale, 40),
  /** Gap between marks as a multiple of the mark's height. */
  spacing: num('spacing', PATTERN_LIMITS.spacing, 1),
  /** Turn of every mark about its own centre, in degrees (the tile itself stays square to the page). */
  rotation: num('rotation', PATTERN_LIMITS.rotation, 0),
  /** Seed of the scatter: the same seed always gives the same tile. */
  seed: z.number({ error: 'seed must be a number.' }).int({ error: 'seed must be a whole number.' }).min(0).max(PATTERN_LIMITS.seed.max).default(1),
  /** Ground and ink: colours of the brand's palette, by id (null: the background and primary roles). */
  groundColorId: refIdSchema('colour').nullable().default(null),
  inkColorId: refIdSchema('colour').nullable().default(null),
  opacity: num('opacity', PATTERN_LIMITS.opacity, 1),
});
export type PatternSettings = z.infer<typeof patternSettingsSchema>;
export type PatternSettingsInput = z.input<typeof patternSettingsSchema>;

/** One mark drawn in the tile: its centre and its turn in degrees. */
export interface Placement {
  x: number;
  y: number;
  rotation: number;
}

export interface TileLayout {
  /** Tile size in CSS px (whole numbers, so a raster tile repeats on whole pixels). */
  width: number;
  height: number;
  /** Size of one mark in CSS px. */
  mark: { width: number; height: number };
  /** Every mark to draw, copies across the edges included, in drawing order. */
  placements: Placement[];
}

/** A small seeded generator (mulberry32): the same seed gives the same sequence in every browser and on the server. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const wrap = (v: number, size: number) => ((v % size) + size) % size;

/** Shortest distance between two points on the tile repeated in both directions. */
function wrappedDistance(a: { x: number; y: number }, b: { x: number; y: number }, width: number, height: number): number {
  const dx = Math.abs(a.x - b.x);
  const dy = Math.abs(a.y - b.y);
  return Math.hypot(Math.min(dx, width - dx), Math.min(dy, height - dy));
}

/** Centres of the marks of one tile, before copies across the edges. */
function centres(settings: PatternSettings, cell: { width: number; height: number }): { width: number; height: number; marks: Placement[] } {
  const { width: cw, height: ch } = cell;
  const r = settings.rotation;
  switch (settings.layout) {
    case 'grid':
      return { width: cw, height: ch, marks: [{ x: cw / 2, y: ch / 2, rotation: r }] };
    case 'brick':
      // Every other row moves across by half a repeat: two rows make the tile.
      return { width: cw, height: 2 * ch, marks: [{ x: cw / 2, y: ch / 2, rotation: r }, { x: 0, y: (3 * ch) / 2, rotation: r }] };
    case 'half-drop':
      // Every other column drops by half a repeat: two columns make the tile.
      return { width: 2 * cw, height: ch, marks: [{ x: cw / 2, y: ch / 2, rotation: r }, { x: (3 * cw) / 2, y: 0, rotation: r }] };
    case 'diagonal': {
      const marks = Array.from({ length: DIAGONAL_STEPS }, (_, row) => ({ x: wrap(cw / 2 + (row * cw) / DIAGONAL_STEPS, cw), y: ch / 2 + row * ch, rotation: r }));
      return { width: cw, height: DIAGONAL_STEPS * ch, marks };
    }
    case 'scatter': {
      const width = 3 * cw;
      const height = 3 * ch;
      const random = seededRandom(settings.seed);
      // Dart throwing: keep a point only when it is far enough from the others (across edges too); relax the distance
      // when the tile is crowded, so the count is always reached.
      const marks: Placement[] = [];
      let minimum = Math.min(cw, ch) * 0.9;
      let tries = 0;
      while (marks.length < SCATTER_MARKS) {
        const point = { x: random() * width, y: random() * height, rotation: r + (random() * 2 - 1) * SCATTER_TURN };
        if (marks.every((m) => wrappedDistance(m, point, width, height) >= minimum)) marks.push(point);
        if (++tries % 200 === 0) minimum *= 0.85;
      }
      return { width, height, marks };
    }
  }
}

/**
 * The tile of a pattern for a mark of the given width ÷ height: its size and every placement, with the marks that cross
 * an edge drawn again on the opposite side(s). `repeat` lays out several tiles at once (for checks and previews).
 */
export function patternLayout(settings: PatternSettings, markAspect: number, repeat: { columns: number; rows: number } = { columns: 1, rows: 1 }): TileLayout {
  const aspect = Number.isFinite(markAspect) && markAspect > 0 ? markAspect : 1;
  const mark = { width: settings.scale * aspect, height: settings.scale };
  const gap = settings.spacing * settings.scale;
  // Whole pixels per repeat, so the raster tile meets itself exactly.
  const cell = { width: Math.max(1, Math.round(mark.width + gap)), height: Math.max(1, Math.round(mark.height + gap)) };
  const one = centres(settings, cell);
  const width = one.width * repeat.columns;
  const height = one.height * repeat.rows;
  // A turned mark stays inside the circle through its corners; copies are drawn wherever that circle meets the tile.
  const reach = Math.hypot(mark.width, mark.height) / 2;
  const placements: Placement[] = [];
  for (let column = 0; column < repeat.columns; column++) {
    for (let row = 0; row < repeat.rows; row++) {
      for (const m of one.marks) {
        const x = wrap(m.x, one.width) + column * one.width;
        const y = wrap(m.y, one.height) + row * one.height;
        for (const dx of [0, -width, width]) {
          for (const dy of [0, -height, height]) {
            const cx = x + dx;
            const cy = y + dy;
            if (cx + reach > 0 && cx - reach < width && cy + reach > 0 && cy - reach < height) placements.push({ x: cx, y: cy, rotation: m.rotation });
          }
        }
      }
    }
  }
  return { width, height, mark, placements };
}

const NUMERIC_KEYS = ['scale', 'spacing', 'rotation', 'seed', 'opacity'] as const;

/** The settings as a query string (for preview and export addresses); defaults are left out. */
export function patternQuery(settings: PatternSettings): URLSearchParams {
  const query = new URLSearchParams({ logoId: settings.logoId, layout: settings.layout });
  for (const key of NUMERIC_KEYS) query.set(key, String(settings[key]));
  if (settings.groundColorId) query.set('groundColorId', settings.groundColorId);
  if (settings.inkColorId) query.set('inkColorId', settings.inkColorId);
  return query;
}

/** Settings read back from a query string, still to be checked by `patternSettingsSchema` (numbers stay numbers only when they are). */
export function settingsFromQuery(query: Record<string, string>): Record<string, unknown> {
  const out: Record<string, unknown> = { ...query };
  for (const key of NUMERIC_KEYS) if (key in query) out[key] = query[key].trim() === '' ? query[key] : Number(query[key]);
  return out;
}
