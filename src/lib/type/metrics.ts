import * as fontkit from 'fontkit';
import type { Font } from 'fontkit';
import { TypographyError } from './errors';

/** Vertical metrics and naming of a font, in font units unless said otherwise. */
export interface FontMetrics {
  family: string;
  subfamily: string;
  postscriptName: string;
  format: string;
  unitsPerEm: number;
  /** hhea ascender, descender (negative) and line gap. */
  ascender: number;
  descender: number;
  lineGap: number;
  /** OS/2 typographic metrics, used by browsers when useTypoMetrics is set. */
  typo: { ascender: number; descender: number; lineGap: number; useTypoMetrics: boolean };
  capHeight: number;
  xHeight: number;
  /** Weight range: the wght axis of a variable font, otherwise OS/2 usWeightClass for all three. */
  weight: { min: number; default: number; max: number };
  isVariable: boolean;
  axes: { tag: string; name: string; min: number; default: number; max: number }[];
}

/** Opens font bytes (TTF, OTF, WOFF, WOFF2; first face of a collection) or throws font_unreadable. */
export function openFont(buffer: Uint8Array): Font {
  if (!(buffer instanceof Uint8Array) || buffer.length < 12) {
    throw new TypographyError('font_unreadable', 'The file is empty or too small to be a font.');
  }
  let opened: ReturnType<typeof fontkit.create>;
  try {
    opened = fontkit.create(Buffer.from(buffer.buffer, buffer.byteOffset, buffer.byteLength));
  } catch (error) {
    throw new TypographyError('font_unreadable', `The file could not be read as a font (${(error as Error).message}). Use TTF, OTF, WOFF or WOFF2.`);
  }
  const font = 'fonts' in opened ? opened.fonts[0] : opened;
  if (!font || !font.unitsPerEm) throw new TypographyError('font_unreadable', 'The file holds no readable font face.');
  return font;
}

/** Reads family, vertical metrics, weight range and variation axes from a font file. */
export function fontMetrics(input: Uint8Array | Font): FontMetrics {
  const font = input instanceof Uint8Array ? openFont(input) : input;
  try {
    const os2 = font['OS/2'];
    const axes = Object.entries(font.variationAxes ?? {}).flatMap(([tag, axis]) => (axis ? [{ tag, ...axis }] : []));
    const wght = axes.find((a) => a.tag === 'wght');
    const weightClass = os2?.usWeightClass ?? 400;
    return {
      family: font.familyName ?? '',
      subfamily: font.subfamilyName ?? '',
      postscriptName: font.postscriptName ?? '',
      format: font.type,
      unitsPerEm: font.unitsPerEm,
      ascender: font.ascent,
      descender: font.descent,
      lineGap: font.lineGap,
      typo: {
        ascender: os2?.typoAscender ?? font.ascent,
        descender: os2?.typoDescender ?? font.descent,
        lineGap: os2?.typoLineGap ?? font.lineGap,
        useTypoMetrics: Boolean(os2?.fsSelection?.useTypoMetrics),
      },
      capHeight: font.capHeight,
      xHeight: font.xHeight,
      weight: wght ? { min: wght.min, default: wght.default, max: wght.max } : { min: weightClass, default: weightClass, max: weightClass },
      isVariable: axes.length > 0,
      axes,
    };
  } catch (error) {
    if (error instanceof TypographyError) throw error;
    throw new TypographyError('font_unreadable', `The font's tables could not be read (${(error as Error).message}).`);
  }
}

/** The font's own default line spacing as a multiple of the font size: (ascender − descender + line gap) / em. */
export function naturalLineHeight(metrics: FontMetrics): number {
  const m = metrics.typo.useTypoMetrics ? metrics.typo : metrics;
  return (m.ascender - m.descender + m.lineGap) / metrics.unitsPerEm;
}

/** Minimum body line height: WCAG 2.2 SC 1.4.8 (AAA) asks for line spacing of at least 1.5 within paragraphs. */
export const BODY_LINE_HEIGHT_MIN = 1.5;

/** Suggested line heights from the font's metrics: body at least 1.5, headings near the font's own spacing, never below 1. */
export function lineHeightFromMetrics(metrics: FontMetrics): { natural: number; body: number; heading: number } {
  const natural = naturalLineHeight(metrics);
  const round = (v: number) => Math.round(v * 20) / 20;
  return { natural, body: Math.max(BODY_LINE_HEIGHT_MIN, round(natural * 1.15)), heading: Math.max(1, round(natural * 0.9)) };
}
