import { formatHex, parse, rgb as toRgb, toGamut } from 'culori';
import { ColorError } from './errors';

/** A colour as stored: sRGB hex (6 digits, lower case) plus alpha 0–1. */
export interface Color {
  hex: string;
  alpha: number;
  /** false when the input lay outside sRGB and was gamut-mapped (OKLCH chroma reduced). */
  inGamut: boolean;
}

export type ParseColorResult =
  | { ok: true; color: Color }
  | { ok: false; error: { code: 'color_unparsed'; message: string } };

const MAX_INPUT = 200;
const BARE_HEX = /^[0-9a-f]{6}$/i;
const HINT = 'Use hex (#1a2b3c), rgb(), hsl(), oklch(), lab() or a CSS colour name.';
const toSrgbGamut = toGamut('rgb', 'oklch');

function unparsed(message: string): ParseColorResult {
  return { ok: false, error: { code: 'color_unparsed', message } };
}

/** Reads any CSS colour (hex, rgb(), hsl(), oklch(), lab() in D50, names) into a canonical sRGB colour. */
export function parseColor(input: string): ParseColorResult {
  if (typeof input !== 'string') return unparsed(`A colour must be text, got ${input === null ? 'null' : typeof input}. ${HINT}`);
  const text = input.trim();
  if (text === '') return unparsed(`The colour is empty. ${HINT}`);
  if (text.length > MAX_INPUT) return unparsed(`The colour text is too long (${text.length} characters). ${HINT}`);
  const parsed = parse(BARE_HEX.test(text) ? `#${text}` : text);
  if (!parsed) return unparsed(`"${text}" is not a colour Plumbline understands. ${HINT}`);
  const srgb = toRgb(parsed);
  const inGamut = [srgb.r, srgb.g, srgb.b].every((v) => v >= -1e-6 && v <= 1 + 1e-6);
  const mapped = inGamut ? srgb : toRgb(toSrgbGamut(parsed));
  const alpha = parsed.alpha === undefined ? 1 : Math.min(1, Math.max(0, parsed.alpha));
  return { ok: true, color: { hex: formatHex({ ...mapped, mode: 'rgb' }), alpha, inGamut } };
}

/** Like parseColor but throws a ColorError; accepts an already parsed Color. */
export function toColor(input: string | Color): Color {
  if (typeof input === 'object' && input !== null && typeof input.hex === 'string') return input;
  const result = parseColor(input as string);
  if (!result.ok) throw new ColorError('color_unparsed', result.error.message);
  return result.color;
}

/** The 8-bit sRGB channels of a colour. */
export function rgb255(input: string | Color): [number, number, number] {
  const hex = toColor(input).hex;
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
}
