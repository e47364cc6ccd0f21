// One-colour logos that keep their drawing: every paint is sorted into "ink" (it contrasts with the ground the logo
// was drawn for) or "knockout" (it is painted in that ground's colour, like a light tree on a dark disc). The drawing
// moves, untouched in shape and order, into an SVG <mask> where ink paints white and knockouts paint black; one rectangle
// of the chosen ink shows through the mask. The result is one colour on a transparent ground, with holes where the
// inner shapes were, so it works on any ground without knowing it.
//
// Luminance is the relative luminance of WCAG 2.2 (its definition of relative luminance, with the sRGB transfer
// function of IEC 61966-2-1); a paint reads as the ground when it contrasts less with the ground than with the
// opposite extreme (black for a light ground, white for a dark one), i.e. the dividing luminance is √(1.05·0.05) − 0.05
// ≈ 0.179, the point where a colour's WCAG contrast ratio against white and against black are equal.
import { converter } from 'culori';
import { parseColor } from '@/lib/color/parse';
import { relativeLuminance } from '@/lib/color/contrast';
import { deltaE2000 } from '@/lib/color/difference';
import type { LightParts } from '@/lib/identity/types';
import { LogoError } from './errors';
import { toSanitizedSvg } from './sanitize';
import { PART_DELTA_E } from './tones';

/** The relative luminance at which WCAG contrast against white equals contrast against black: √(1.05 × 0.05) − 0.05. */
export const GROUND_SPLIT_LUMINANCE = Math.sqrt(1.05 * 0.05) - 0.05;

export type PaintRole = 'ink' | 'knockout';
/** The ground a logo was drawn for: light (the usual) or dark (a logo made for dark grounds). */
export type DrawnGround = 'light' | 'dark';

const PAINT_PROPS = 'fill|stroke|stop-color|flood-color|lighting-color|color';
const ATTR = new RegExp(`(?<![\\w:-])(${PAINT_PROPS})(\\s*=\\s*)(["'])(.*?)\\3`, 'gi');
const DECL = new RegExp(`(?<![\\w-])(${PAINT_PROPS})(\\s*:\\s*)([^;}"'<]+)`, 'gi');
const KEEP = /^(none|transparent|inherit|initial|unset|currentcolor|context-fill|context-stroke|url\(\s*['"]?#[^)]*\).*)$/i;
const GRADIENT = /<((?:linear|radial)Gradient)\b([^>]*)>([\s\S]*?)<\/\1>/gi;
const MASK_INK = '#ffffff';
const MASK_KNOCKOUT = '#000000';
const ROLE_TOKEN = { ink: 'plumbline-ink', knockout: 'plumbline-knockout' } as const;

/** WCAG 2.2 relative luminance of a CSS colour, or undefined when it is not one. */
export function paintLuminance(value: string): number | undefined {
  const parsed = parseColor(value.trim().replace(/\s*!important$/i, ''));
  if (!parsed.ok) return undefined;
  const hex = parsed.color.hex;
  return relativeLuminance([1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number]);
}

/**
 * Below this contrast against its ground a shape does not stand out as a graphic (WCAG 2.2 SC 1.4.11, non-text
 * contrast, 3:1): such a shape reads as the ground itself and becomes a hole.
 */
export const KNOCKOUT_CONTRAST = 3;

/**
 * Ink when a paint stands out from the ground, knockout when it reads as the ground itself (under 3:1 against white on
 * a light ground, against black on a dark one). Mid-tones, such as a red accent rule, stay ink.
 */
export function paintRole(luminance: number, ground: DrawnGround): PaintRole {
  const contrast = ground === 'light' ? 1.05 / (luminance + 0.05) : (luminance + 0.05) / 0.05;
  return contrast < KNOCKOUT_CONTRAST ? 'knockout' : 'ink';
}

const toLab = converter('lab65');
const labOfHex = (hex: string): [number, number, number] => {
  const lab = toLab(hex.slice(0, 7))!;
  return [lab.l, lab.a, lab.b];
};
const GROUND_EXTREME = { light: labOfHex('#ffffff'), dark: labOfHex('#000000') } as const;

/**
 * True when a colour is the ground's own (white or near-white for a light ground, black or near-black for a dark one):
 * closer to it than ΔE00 5, the distance under which the tone check counts two colours as one part (common practice).
 */
export function isGroundColour(hex: string, ground: DrawnGround): boolean {
  return deltaE2000(labOfHex(hex), GROUND_EXTREME[ground]) < PART_DELTA_E;
}

/**
 * The role of one colour under the designer's choice for light parts: as `paintRole`, except that with 'ink' a light
 * part prints in the ink unless it is the ground's own colour (a white gap stays a gap).
 */
export function paintRoleFor(hex: string, ground: DrawnGround, lightParts: LightParts = 'holes'): PaintRole {
  const role = paintRole(relativeLuminance([1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number]), ground);
  return role === 'knockout' && lightParts === 'ink' && !isGroundColour(hex, ground) ? 'ink' : role;
}

/** Every paint of an SVG passed through `paint`: attributes, inline styles and <style> sheets. */
function repaintAll(svg: string, paint: (value: string) => string): string {
  const decls = (css: string) => css.replace(DECL, (_d, p: string, c: string, v: string) => `${p}${c}${paint(v)}`);
  return svg
    .replace(ATTR, (_m, prop: string, eq: string, q: string, value: string) => `${prop}${eq}${q}${paint(value)}${q}`)
    .replace(/(style\s*=\s*")([^"]*)"/gi, (_m, start: string, css: string) => `${start}${decls(css)}"`)
    .replace(/(style\s*=\s*')([^']*)'/gi, (_m, start: string, css: string) => `${start}${decls(css)}'`)
    .replace(/(<style\b[^>]*>)([\s\S]*?)(<\/style>)/gi, (_m, open: string, css: string, close: string) => `${open}${decls(css)}${close}`);
}

/** The opacity-weighted mean luminance of a gradient's own stops, or undefined when it has none (it borrows another's). */
function gradientLuminance(body: string): number | undefined {
  let sum = 0;
  let weight = 0;
  for (const stop of body.matchAll(/<stop\b([^>]*)>/gi)) {
    const attrs = stop[1];
    const style = /style\s*=\s*"([^"]*)"/i.exec(attrs)?.[1] ?? '';
    const colour = /stop-color\s*:\s*([^;]+)/i.exec(style)?.[1] ?? /stop-color\s*=\s*"([^"]*)"/i.exec(attrs)?.[1] ?? 'black';
    const opacityText = /stop-opacity\s*:\s*([^;]+)/i.exec(style)?.[1] ?? /stop-opacity\s*=\s*"([^"]*)"/i.exec(attrs)?.[1] ?? '1';
    const luminance = paintLuminance(colour);
    const parsed = parseColor(colour.trim());
    const opacity = Math.min(1, Math.max(0, Number.parseFloat(opacityText) || 0)) * (parsed.ok ? parsed.color.alpha : 1);
    if (luminance === undefined) continue;
    // A stop with no opacity still counts a little, so a fully faded gradient still has a colour.
    const w = Math.max(opacity, 1e-3);
    sum += luminance * w;
    weight += w;
  }
  return weight > 0 ? sum / weight : undefined;
}

/** The stop colours a gradient names itself ('#rrggbb'), for telling whether all of them are the ground's own. */
function gradientStopHexes(body: string): string[] {
  const found: string[] = [];
  for (const stop of body.matchAll(/<stop\b([^>]*)>/gi)) {
    const attrs = stop[1];
    const style = /style\s*=\s*"([^"]*)"/i.exec(attrs)?.[1] ?? '';
    const colour = /stop-color\s*:\s*([^;]+)/i.exec(style)?.[1] ?? /stop-color\s*=\s*"([^"]*)"/i.exec(attrs)?.[1] ?? 'black';
    const parsed = parseColor(colour.trim());
    if (parsed.ok) found.push(parsed.color.hex.slice(0, 7));
  }
  return found;
}

/** A gradient's one role: by its mean luminance, and with 'ink' for light parts, ink unless every stop is the ground's own colour. */
function gradientRole(body: string, luminance: number, ground: DrawnGround, lightParts: LightParts): PaintRole {
  const role = paintRole(luminance, ground);
  if (role === 'ink' || lightParts === 'holes') return role;
  return gradientStopHexes(body).every((hex) => isGroundColour(hex, ground)) ? 'knockout' : 'ink';
}

/** What the sorting found: how many paints are ink and how many knockouts, for the given ground. */
export function paintCensus(svg: string, ground: DrawnGround): { ink: number; knockout: number } {
  const census = { ink: 0, knockout: 0 };
  const count = (value: string) => {
    const v = value.trim();
    if (KEEP.test(v)) return value;
    const luminance = paintLuminance(v);
    if (luminance !== undefined) census[paintRole(luminance, ground)]++;
    return value;
  };
  repaintAll(svg.replace(GRADIENT, (_m, _tag: string, _attrs: string, body: string) => {
    const luminance = gradientLuminance(body);
    if (luminance !== undefined) census[paintRole(luminance, ground)]++;
    return '';
  }), count);
  return census;
}

/**
 * The ground a logo was drawn for: light, unless every paint it names would read as a light ground (a white logo
 * made for dark grounds), in which case dark.
 */
export function drawnGround(svg: string): DrawnGround {
  const light = paintCensus(svg, 'light');
  return light.ink === 0 && light.knockout > 0 ? 'dark' : 'light';
}

/** The drawing with every paint turned into mask white (ink) or mask black (knockout), opacity kept. */
export function maskPaints(svg: string, ground: DrawnGround, lightParts: LightParts = 'holes'): string {
  // Gradients first: each one takes a single role from its mean luminance, marked with a token the next pass reads.
  const marked = svg.replace(GRADIENT, (whole, tag: string, attrs: string, body: string) => {
    const luminance = gradientLuminance(body);
    if (luminance === undefined) return whole;
    const token = ROLE_TOKEN[gradientRole(body, luminance, ground, lightParts)];
    const stops = body
      .replace(/(stop-color\s*=\s*")[^"]*"/gi, `$1${token}"`)
      .replace(/(stop-color\s*:\s*)[^;"]+/gi, `$1${token}`)
      .replace(/<stop\b(?![^>]*stop-color)/gi, `<stop stop-color="${token}"`);
    return `<${tag}${attrs}>${stops}</${tag}>`;
  });
  return repaintAll(marked, (value) => {
    const v = value.trim().replace(/\s*!important$/i, '');
    if (v === ROLE_TOKEN.ink) return MASK_INK;
    if (v === ROLE_TOKEN.knockout) return MASK_KNOCKOUT;
    if (KEEP.test(v)) return value;
    const parsed = parseColor(v);
    // Unreadable paint draws nothing in a browser; keep it so.
    if (!parsed.ok) return 'none';
    if (parsed.color.alpha === 0) return value;
    const base = paintRoleFor(parsed.color.hex, ground, lightParts) === 'ink' ? MASK_INK : MASK_KNOCKOUT;
    const alpha = parsed.color.alpha < 1 ? Math.round(parsed.color.alpha * 255).toString(16).padStart(2, '0') : '';
    return `${base}${alpha}`;
  });
}

/** Presentation attributes of the root <svg> that its children inherit, moved onto the group inside the mask. */
const INHERITED_ROOT = /\s((?:fill|stroke|color|fill-opacity|stroke-opacity|fill-rule|stroke-width|stroke-linecap|stroke-linejoin|stroke-miterlimit|stroke-dasharray|stroke-dashoffset|opacity|style|class|font-family|font-size|font-weight|font-style|text-anchor)\s*=\s*"[^"]*")/gi;

export interface KnockoutOptions {
  /** The one ink, any CSS colour; the result is this colour on a transparent ground. */
  ink: string;
  /** The ground the logo was drawn for; found from its paints when left out. */
  ground?: DrawnGround;
  /** How light parts print (the logo's own setting): holes, the default, or ink. */
  lightParts?: LightParts;
  /**
   * For print on a known solid ground: paint the knockout shapes in this colour instead of cutting them out. The look
   * is the same on that ground, and the file needs no mask, which PDF writers (Chromium's among them) turn into images.
   */
  paintOn?: string;
}

/**
 * The one-colour logo with knockouts: shapes painted in the ground's colour become holes (light parts too, unless the
 * designer chose to print them in ink), the rest the ink; fills, strokes, gradients (by mean luminance), opacity,
 * groups and <use> are kept, since the drawing itself is untouched.
 */
export function knockoutSvg(svgText: string, options: KnockoutOptions): string {
  const inkResult = parseColor(options.ink ?? '');
  if (!inkResult.ok) throw new LogoError('invalid_input', `The one-colour ink: ${inkResult.error.message}`);
  const ink = inkResult.color.hex;
  const clean = toSanitizedSvg(svgText);
  const ground = options.ground ?? drawnGround(clean.svg);
  const open = /^<svg\b([^>]*)>/i.exec(clean.svg);
  if (!open) throw new LogoError('svg_not_svg', 'The logo must start with an <svg> element.');
  const rootAttrs = open[1];
  const inner = clean.svg.slice(open[0].length, clean.svg.length - '</svg>'.length);
  const inherited = [...rootAttrs.matchAll(INHERITED_ROOT)].map((m) => m[1]);
  const bareRoot = rootAttrs.replace(INHERITED_ROOT, '');
  // Unpainted shapes inherit black (and currentColor black) from the root: sorted like any other paint.
  const defaultPaint = ROLE_TOKEN[paintRole(0, ground)];
  const hasFill = inherited.some((a) => /^fill\s*=/i.test(a));
  const hasColor = inherited.some((a) => /^color\s*=/i.test(a));
  const groupAttrs = [hasFill ? '' : ` fill="${defaultPaint}"`, hasColor ? '' : ` color="${defaultPaint}"`, ...inherited.map((a) => ` ${a}`)].join('');
  const drawing = maskPaints(`<g${groupAttrs}>${inner}</g>`, ground, options.lightParts ?? 'holes');
  if (options.paintOn !== undefined) {
    const groundResult = parseColor(options.paintOn);
    if (!groundResult.ok) throw new LogoError('invalid_input', `The ground colour: ${groundResult.error.message}`);
    // One pass over both mask paints: in two passes a black ink, once painted, would be taken for a knockout.
    const paint = (c: string) => `${c.slice(0, 7).toLowerCase() === MASK_INK ? ink : groundResult.color.hex}${c.slice(7)}`;
    const painted = drawing.replace(/#(?:ffffff|000000)(?:[0-9a-f]{2})?\b/gi, paint);
    return `<svg${bareRoot}>${painted}</svg>`;
  }
  const { x, y, width, height } = clean.viewBox;
  // Room around the viewBox for strokes that run past it; the root still clips to its viewport.
  const pad = Math.max(width, height);
  const id = uniqueId(clean.svg, 'plumbline-knockout');
  const area = `x="${x - pad}" y="${y - pad}" width="${width + 2 * pad}" height="${height + 2 * pad}"`;
  // !important so that a sheet in the logo (e.g. `rect { fill: red }`) cannot repaint the ink.
  const fillStyle = `fill:${ink} !important;stroke:none !important;opacity:1 !important;mask:url(#${id}) !important;transform:none !important`;
  return (
    `<svg${bareRoot}>` +
    `<mask id="${id}" maskUnits="userSpaceOnUse" maskContentUnits="userSpaceOnUse" ${area} style="mask-type:luminance">${drawing}</mask>` +
    `<rect data-role="ink" ${area} style="${fillStyle}" mask="url(#${id})"/>` +
    `</svg>`
  );
}

/** An id not yet used in the document. */
function uniqueId(svg: string, base: string): string {
  let id = base;
  for (let n = 2; svg.includes(`"${id}"`); n++) id = `${base}-${n}`;
  return id;
}
