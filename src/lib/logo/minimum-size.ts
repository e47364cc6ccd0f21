import { requireSize } from './errors';

/** Thinnest stroke that still renders on screen: one CSS pixel (common practice). */
export const MIN_STROKE_SCREEN_PX = 1;
/** Thinnest stroke most presses hold reliably: 0.25 pt (common practice; confirm with the printer). */
export const MIN_STROKE_PRINT_PT = 0.25;

export interface MinimumSize {
  /** Smallest logo width on screen, CSS px, rounded up. */
  screenPx: number;
  /** Smallest logo width in print, mm, rounded up to 0.1 mm. */
  printMm: number;
  /** The same print width in points, rounded up to 0.1 pt. */
  printPt: number;
}

const ceilTo = (v: number, step: number) => Math.ceil(v / step - 1e-9) * step;

/** Smallest logo widths at which its thinnest stroke stays ≥ 1 px on screen and ≥ 0.25 pt in print. */
export function minimumSize({ logoWidthUnits, thinnestStrokeUnits }: { logoWidthUnits: number; thinnestStrokeUnits: number }): MinimumSize {
  const widthPerStroke = requireSize(logoWidthUnits, 'The logo width') / requireSize(thinnestStrokeUnits, 'The thinnest stroke');
  const printPt = widthPerStroke * MIN_STROKE_PRINT_PT;
  return {
    screenPx: Math.ceil(widthPerStroke * MIN_STROKE_SCREEN_PX - 1e-9),
    printMm: Number(ceilTo((printPt * 25.4) / 72, 0.1).toFixed(1)),
    printPt: Number(ceilTo(printPt, 0.1).toFixed(1)),
  };
}
