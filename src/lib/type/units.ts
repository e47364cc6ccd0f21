// CSS Values 4 absolute units: 1in = 96px = 72pt; the PostScript point is 1/72 in; 1 in = 25.4 mm exactly.
import { TypographyError } from './errors';

export const PX_PER_INCH = 96;
export const PT_PER_INCH = 72;
export const MM_PER_INCH = 25.4;
export const DEFAULT_ROOT_PX = 16;

function finite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TypographyError('invalid_input', `${what} must be a finite number, got ${String(value)}.`);
  }
  return value;
}

function root(rootPx: number): number {
  if (finite(rootPx, 'The root font size') <= 0) throw new TypographyError('invalid_input', 'The root font size must be above zero.');
  return rootPx;
}

/** CSS pixels to rem at a given root font size (default 16 px). */
export const pxToRem = (px: number, rootPx = DEFAULT_ROOT_PX): number => finite(px, 'A size in px') / root(rootPx);
/** rem to CSS pixels at a given root font size (default 16 px). */
export const remToPx = (rem: number, rootPx = DEFAULT_ROOT_PX): number => finite(rem, 'A size in rem') * root(rootPx);
/** CSS pixels to points (96 px = 72 pt). */
export const pxToPt = (px: number): number => (finite(px, 'A size in px') * PT_PER_INCH) / PX_PER_INCH;
/** Points to CSS pixels (72 pt = 96 px). */
export const ptToPx = (pt: number): number => (finite(pt, 'A size in pt') * PX_PER_INCH) / PT_PER_INCH;
/** Points to millimetres (1 pt = 1/72 in, 1 in = 25.4 mm). */
export const ptToMm = (pt: number): number => (finite(pt, 'A size in pt') * MM_PER_INCH) / PT_PER_INCH;
/** Millimetres to points. */
export const mmToPt = (mm: number): number => (finite(mm, 'A size in mm') * PT_PER_INCH) / MM_PER_INCH;
/** CSS pixels to millimetres (96 px = 25.4 mm). */
export const pxToMm = (px: number): number => (finite(px, 'A size in px') * MM_PER_INCH) / PX_PER_INCH;
/** Millimetres to CSS pixels. */
export const mmToPx = (mm: number): number => (finite(mm, 'A size in mm') * PX_PER_INCH) / MM_PER_INCH;
