import { parseColor } from '../color/parse';
import { LogoError } from './errors';
import { toSanitizedSvg } from './sanitize';
import { escapeXml } from '../safe/escape';

/** black, white, one-colour (in the given ink) or reversed (white marks on a field of the given colour). */
export type RecolorMode = 'black' | 'white' | 'one-colour' | 'reversed';

const PAINT_PROPS = 'fill|stroke|stop-color|flood-color|lighting-color|color';
const ATTR = new RegExp(`(?<![\\w:-])(${PAINT_PROPS})(\\s*=\\s*)(["'])(.*?)\\3`, 'gi');
const DECL = new RegExp(`(?<![\\w-])(${PAINT_PROPS})(\\s*:\\s*)([^;}"'<]+)`, 'gi');
const KEEP = /^(none|transparent|inherit|initial|unset|url\(\s*['"]?#[^)]*\))$/i;

/** The ink for one paint value: 'none', transparent and gradient references are kept; alpha is carried over. */
function repaint(value: string, ink: string): string {
  const v = value.trim().replace(/\s*!important$/i, '');
  if (KEEP.test(v)) return value;
  const parsed = parseColor(v);
  if (parsed.ok && parsed.color.alpha === 0) return value;
  const alpha = parsed.ok && parsed.color.alpha < 1 ? Math.round(parsed.color.alpha * 255).toString(16).padStart(2, '0') : '';
  return `${ink}${alpha}`;
}

/** Apply `paint` to every paint value of an SVG: attributes, inline styles and <style> sheets. */
function repaintAll(svg: string, paint: (value: string) => string): string {
  return svg
    .replace(ATTR, (_m, prop: string, eq: string, q: string, value: string) => `${prop}${eq}${q}${paint(value)}${q}`)
    .replace(/(style\s*=\s*")([^"]*)"/gi, (_m, start: string, css: string) => `${start}${css.replace(DECL, (_d, p: string, c: string, v: string) => `${p}${c}${paint(v)}`)}"`)
    .replace(/(<style\b[^>]*>)([\s\S]*?)(<\/style>)/gi, (_m, open: string, css: string, close: string) =>
      `${open}${css.replace(DECL, (_d, p: string, c: string, v: string) => `${p}${c}${paint(v)}`)}${close}`,
    );
}

/**
 * The logo for a dark ground: dark and mid paints become white, light paints take the ground's colour, so
 * details drawn light on a dark shape (a tree on a disc) stay visible instead of vanishing into white.
 */
export function reverseOnGround(svg: string, groundHex: string): string {
  const clean = toSanitizedSvg(svg);
  const ground = parseColor(groundHex);
  if (!ground.ok) throw new LogoError('invalid_input', `The ground colour: ${ground.error.message}`);
  const luminance = (hex: string) => {
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
    return 0.2126 * r + 0.7152 * g + 0.0722 * b;
  };
  // Mid-grey (#767676) is the dividing line: darker paints read as "ink", lighter ones as "paper".
  const paint = (value: string) => {
    const parsed = parseColor(value.trim());
    if (!parsed.ok || KEEP.test(value.trim())) return value;
    return repaint(value, luminance(parsed.color.hex) < 0.18 ? '#ffffff' : ground.color.hex);
  };
  const out = repaintAll(clean.svg, paint);
  // Unpainted shapes inherit black from the root: they are ink, so white.
  return out.replace(/^<svg\b([^>]*)>/i, (_m, attrs: string) => (/\sfill\s*=/.test(attrs) ? `<svg${attrs}>` : `<svg${attrs} fill="#ffffff">`));
}

/** Repaints every fill, stroke and stop colour of an SVG logo in one ink (attributes, inline styles and <style>). */
export function recolorSvg(svg: string, mode: RecolorMode, hex?: string): string {
  const clean = toSanitizedSvg(svg);
  const wanted = mode === 'black' ? '#000000' : mode === 'white' || mode === 'reversed' ? '#ffffff' : hex;
  if (mode !== 'black' && mode !== 'white' && mode !== 'one-colour' && mode !== 'reversed') {
    throw new LogoError('invalid_input', `Unknown recolour mode "${String(mode)}"; use black, white, one-colour or reversed.`);
  }
  const inkResult = parseColor(wanted ?? '');
  if (!inkResult.ok) throw new LogoError('invalid_input', `The one-colour ink: ${inkResult.error.message}`);
  const ink = inkResult.color.hex;
  let out = repaintAll(clean.svg, (value) => repaint(value, ink));
  // Shapes with no paint of their own inherit from the root, whose default fill would otherwise be black.
  out = out.replace(/^<svg\b([^>]*)>/i, (_m, attrs: string) => `<svg${attrs.replace(/\s(fill|color)\s*=\s*"[^"]*"/gi, '')} fill="${escapeXml(ink)}" color="${escapeXml(ink)}">`);
  if (mode === 'reversed') {
    const field = parseColor(hex ?? '#000000');
    if (!field.ok) throw new LogoError('invalid_input', `The reversed field colour: ${field.error.message}`);
    const { x, y, width, height } = clean.viewBox;
    out = out.replace(/^(<svg\b[^>]*>)/i, `$1<rect data-role="field" x="${x}" y="${y}" width="${width}" height="${height}" fill="${escapeXml(field.color.hex)}"/>`);
  }
  return out;
}
