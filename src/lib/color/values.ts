import { converter } from 'culori';
import { rgb255, toColor, type Color } from './parse';

/**
 * Every notation of one colour, computed from its stored 8-bit sRGB value.
 * hsl: h 0–360°, s and l 0–100 %. oklch: l 0–1, c ≥ 0, h 0–360°. lab: CIELAB D50 as CSS lab() uses it;
 * lab65: CIELAB D65. cmyk: plain formula percentages (not a press value; see iccCmyk). Hue is 0 for greys.
 */
export interface ColorValues {
  hex: string;
  alpha: number;
  rgb: [number, number, number];
  hsl: { h: number; s: number; l: number; css: string };
  oklch: { l: number; c: number; h: number; css: string };
  lab: { l: number; a: number; b: number; css: string };
  lab65: { l: number; a: number; b: number };
  cmyk: [number, number, number, number];
}

const toHsl = converter('hsl');
const toOklch = converter('oklch');
const toLab = converter('lab');
const toLab65 = converter('lab65');

const round = (v: number, places: number) => {
  const f = 10 ** places;
  const r = Math.round(v * f) / f;
  return Object.is(r, -0) ? 0 : r;
};
const hue = (h: number | undefined, chroma: number, places: number) =>
  h === undefined || Number.isNaN(h) || chroma < 1e-4 ? 0 : round(((h % 360) + 360) % 360, places);

/** Naive RGB→CMYK (common practice formula, no colour management), percentages to 1 decimal. */
export function plainCmyk(input: string | Color): [number, number, number, number] {
  const [r, g, b] = rgb255(input).map((v) => v / 255);
  const k = 1 - Math.max(r, g, b);
  if (k >= 1) return [0, 0, 0, 100];
  const part = (v: number) => round(((1 - v - k) / (1 - k)) * 100, 1);
  return [part(r), part(g), part(b), round(k * 100, 1)];
}

/** Computes HEX, RGB, HSL, OKLCH, CIELAB (D50 and D65) and plain CMYK for one colour. */
export function colorValues(input: string | Color): ColorValues {
  const color = toColor(input);
  const [r, g, b] = rgb255(color);
  const base = { mode: 'rgb' as const, r: r / 255, g: g / 255, b: b / 255 };
  const hsl = toHsl(base);
  const ok = toOklch(base);
  const lab = toLab(base);
  const lab65 = toLab65(base);
  const hs = round((hsl.s ?? 0) * 100, 1);
  const hh = hue(hsl.h, hs, 1);
  const hl = round(hsl.l * 100, 1);
  const oc = round(ok.c, 4);
  const oh = hue(ok.h, oc, 2);
  const ol = round(ok.l, 4);
  const la = { l: round(lab.l, 2), a: round(lab.a, 2), b: round(lab.b, 2) };
  const alphaCss = color.alpha < 1 ? ` / ${round(color.alpha, 3)}` : '';
  return {
    hex: color.hex,
    alpha: color.alpha,
    rgb: [r, g, b],
    hsl: { h: hh, s: hs, l: hl, css: `hsl(${hh} ${hs}% ${hl}%${alphaCss})` },
    oklch: { l: ol, c: oc, h: oh, css: `oklch(${round(ol * 100, 2)}% ${oc} ${oh}${alphaCss})` },
    lab: { ...la, css: `lab(${la.l}% ${la.a} ${la.b}${alphaCss})` },
    lab65: { l: round(lab65.l, 2), a: round(lab65.a, 2), b: round(lab65.b, 2) },
    cmyk: plainCmyk(color),
  };
}
