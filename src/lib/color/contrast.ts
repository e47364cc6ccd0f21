import { rgb255, toColor, type Color } from './parse';

/** WCAG 2.2 thresholds (Success Criteria 1.4.3, 1.4.6 and 1.4.11). */
export const WCAG_THRESHOLDS = { aa: 4.5, aaLarge: 3, aaa: 7, aaaLarge: 4.5, nonText: 3 } as const;

export type WcagLevels = { [K in keyof typeof WCAG_THRESHOLDS]: boolean };

/** WCAG 2.2 linearisation of one 8-bit sRGB channel (cut-off 0.04045). */
function linear(channel255: number): number {
  const c = channel255 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** WCAG 2.2 relative luminance of an opaque sRGB colour, 0 (black) to 1 (white). */
export function relativeLuminance(rgb: readonly [number, number, number]): number {
  return 0.2126 * linear(rgb[0]) + 0.7152 * linear(rgb[1]) + 0.0722 * linear(rgb[2]);
}

/** Composites a translucent colour over an opaque one (simple alpha blending in sRGB, common practice). */
export function flatten(top: string | Color, under: readonly [number, number, number]): [number, number, number] {
  const color = toColor(top);
  const rgb = rgb255(color);
  return rgb.map((v, i) => Math.round(v * color.alpha + under[i] * (1 - color.alpha))) as [number, number, number];
}

/** WCAG 2.2 contrast ratio (L1 + 0.05) / (L2 + 0.05), unrounded; translucent colours are flattened (background over white). */
export function contrastRatio(foreground: string | Color, background: string | Color): number {
  const bg = flatten(background, [255, 255, 255]);
  const fg = flatten(foreground, bg);
  const [l1, l2] = [relativeLuminance(fg), relativeLuminance(bg)].sort((a, b) => b - a);
  return (l1 + 0.05) / (l2 + 0.05);
}

/** Which WCAG 2.2 levels a ratio meets; compared unrounded, so 4.499 fails AA. */
export function wcagLevels(ratio: number): WcagLevels {
  return {
    aa: ratio >= WCAG_THRESHOLDS.aa,
    aaLarge: ratio >= WCAG_THRESHOLDS.aaLarge,
    aaa: ratio >= WCAG_THRESHOLDS.aaa,
    aaaLarge: ratio >= WCAG_THRESHOLDS.aaaLarge,
    nonText: ratio >= WCAG_THRESHOLDS.nonText,
  };
}
