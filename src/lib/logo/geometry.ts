/** A rectangle in the logo's own units (viewBox units for SVG, pixels for raster images). */
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Largest width, height or viewBox extent accepted, in user units; anything larger is treated as hostile. */
export const MAX_SVG_UNITS = 100_000;

const CSS_UNIT_PX: Record<string, number> = { '': 1, px: 1, pt: 96 / 72, pc: 16, in: 96, cm: 96 / 2.54, mm: 96 / 25.4, q: 96 / 101.6 };

/** Reads an SVG length (number with an absolute CSS unit) as px; undefined for %, auto or missing. */
export function svgLengthPx(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const match = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*([a-z]*)\s*$/i.exec(value);
  if (!match) return undefined;
  const factor = CSS_UNIT_PX[match[2].toLowerCase()];
  return factor === undefined ? undefined : Number(match[1]) * factor;
}

/** Reads a viewBox attribute ("x y w h", spaces or commas) or undefined if malformed. */
export function parseViewBox(value: string | undefined): Box | undefined {
  if (value === undefined) return undefined;
  const parts = value.trim().split(/[\s,]+/).map(Number);
  if (parts.length !== 4 || !parts.every(Number.isFinite)) return undefined;
  const [x, y, width, height] = parts;
  return { x, y, width, height };
}
