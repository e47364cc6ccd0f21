import type { Font } from 'fontkit';
import { requirePositive, TypographyError } from './errors';
import { openFont } from './metrics';

/** Comfortable measure for a single column of body text, in characters (Bringhurst, The Elements of Typographic Style, §2.1.2). */
export const MEASURE_RANGE = { min: 45, max: 75, ideal: 66 } as const;

/** Our own representative English running text, used to average the font's advance widths. */
export const MEASURE_SAMPLE =
  'A good measure lets the eye travel along a line and find the start of the next one without effort. ' +
  'When lines run too long, readers lose their place; when they are too short, the rhythm breaks and words ' +
  'are split by hyphens. Setting body text at a sensible size, with generous spacing between the lines, ' +
  'gives a page that feels calm and quick to read, whether it is printed or shown on a screen.';

export type MeasureVerdict = 'too-short' | 'comfortable' | 'too-long';

export interface Measure {
  charsPerLine: number;
  averageAdvancePx: number;
  verdict: MeasureVerdict;
  range: typeof MEASURE_RANGE;
}

/** Average advance of one character of the sample, as a fraction of the em. */
export function averageAdvanceEm(font: Font, sample = MEASURE_SAMPLE): number {
  const text = typeof sample === 'string' ? sample : '';
  const chars = [...text].length;
  if (chars === 0) throw new TypographyError('invalid_input', 'The sample text for measuring is empty.');
  const run = font.layout(text);
  return run.advanceWidth / chars / font.unitsPerEm;
}

/** Average characters per line of a column, from the font's own advance widths, with a verdict against 45–75. */
export function measure(input: Uint8Array | Font, options: { sizePx: number; columnWidthPx: number; sample?: string }): Measure {
  const sizePx = requirePositive(options?.sizePx, 'The font size');
  const columnWidthPx = requirePositive(options?.columnWidthPx, 'The column width');
  const font = input instanceof Uint8Array ? openFont(input) : input;
  const averageAdvancePx = averageAdvanceEm(font, options.sample) * sizePx;
  const charsPerLine = columnWidthPx / averageAdvancePx;
  const verdict: MeasureVerdict =
    charsPerLine < MEASURE_RANGE.min ? 'too-short' : charsPerLine > MEASURE_RANGE.max ? 'too-long' : 'comfortable';
  return { charsPerLine, averageAdvancePx, verdict, range: MEASURE_RANGE };
}

/** The column width in px that holds a given number of characters per line (default the ideal 66). */
export function columnWidthFor(input: Uint8Array | Font, sizePx: number, charsPerLine: number = MEASURE_RANGE.ideal): number {
  requirePositive(sizePx, 'The font size');
  requirePositive(charsPerLine, 'Characters per line');
  const font = input instanceof Uint8Array ? openFont(input) : input;
  return averageAdvanceEm(font) * sizePx * charsPerLine;
}
