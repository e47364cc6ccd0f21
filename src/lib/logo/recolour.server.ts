// The colour treatments of a logo: which ink each one-colour version uses, and the knockout of a raster logo.
// SVG logos keep their vectors (knockout.ts); raster logos are sorted pixel by pixel with the same luminance rule.
// Only the one rendition function (assets/render.server.ts) calls these; everything else asks it or oneColourLogo.
import sharp from 'sharp';
import { MAX_IMAGE_PIXELS } from '@/lib/assets/kinds';
import { parseColor } from '@/lib/color/parse';
import { relativeLuminance } from '@/lib/color/contrast';
import type { LightParts } from '@/lib/identity/types';
import { LogoError } from './errors';
import { GROUND_SPLIT_LUMINANCE, isGroundColour, paintRole, type DrawnGround } from './knockout';

/** The one-colour versions: black ink, white ink, reversed (white ink for coloured grounds) and a chosen ink. */
export type OneColourVariant = 'black' | 'white' | 'reversed' | 'one-colour';

/** sRGB-encoded value (0–1) of the dividing luminance, where the ramp from ink to ground is centred. */
const SPLIT_ENCODED = 1.055 * GROUND_SPLIT_LUMINANCE ** (1 / 2.4) - 0.055;

/** The ink of a variant as '#rrggbb'. */
export function variantInk(variant: OneColourVariant, ink?: string | null): string {
  if (variant === 'black') return '#000000';
  if (variant === 'white' || variant === 'reversed') return '#ffffff';
  const parsed = parseColor(ink ?? '');
  if (!parsed.ok) throw new LogoError('invalid_input', `A one-colour version needs its ink: ${parsed.error.message}`);
  return parsed.color.hex.slice(0, 7);
}

/**
 * A raster logo in one ink on a transparent ground: each pixel's coverage is its alpha times how far its colour lies
 * from the ground the logo was drawn for toward its darkest (or lightest) ink, so anti-aliased edges stay smooth and
 * shapes painted in the ground's colour become holes. With `lightParts: 'ink'` a light pixel that is not the ground's
 * own colour (the same rule as the SVG knockout) is full ink instead.
 */
export async function knockoutRaster(bytes: Buffer, ink: string, ground?: DrawnGround, lightParts: LightParts = 'holes'): Promise<Buffer> {
  const { data, info } = await sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS }).ensureAlpha().toColourspace('srgb').raw().toBuffer({ resolveWithObject: true });
  const { width, height, channels } = info;
  const count = width * height;
  // Encoded luma (Rec. 709 weights on sRGB values) for the ramp; WCAG relative luminance to sort light from dark.
  const luma = new Float32Array(count);
  let lightOpaque = 0;
  let opaque = 0;
  for (let i = 0; i < count; i++) {
    const at = i * channels;
    luma[i] = (0.2126 * data[at] + 0.7152 * data[at + 1] + 0.0722 * data[at + 2]) / 255;
    if (data[at + channels - 1] >= 128) {
      opaque++;
      if (relativeLuminance([data[at], data[at + 1], data[at + 2]]) > GROUND_SPLIT_LUMINANCE) lightOpaque++;
    }
  }
  if (opaque === 0) throw new LogoError('logo_empty', 'The logo draws nothing visible: every pixel is transparent.');
  // Drawn for a dark ground when nearly everything it draws is light (white lettering meant for dark).
  const onDark = (ground ?? (lightOpaque / opaque > 0.98 ? 'dark' : 'light')) === 'dark';
  // How far "ink" lies from the ground: the 5th percentile of opaque pixels, at least a little past the split.
  const inkward = Float32Array.from({ length: opaque });
  for (let i = 0, n = 0; i < count; i++) if (data[i * channels + channels - 1] >= 128) inkward[n++] = onDark ? luma[i] : 1 - luma[i];
  inkward.sort();
  const inkDepth = Math.max(inkward[Math.floor(opaque * 0.95)] ?? 1, 1 - SPLIT_ENCODED + 0.1);
  const out = Buffer.alloc(count * 4);
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(ink.slice(i, i + 2), 16));
  const drawnOn: DrawnGround = onDark ? 'dark' : 'light';
  // Light parts printed in ink: memoised per colour, since a logo has few and ΔE00 is not cheap.
  const inked = new Map<number, boolean>();
  const printsAsInk = (at: number) => {
    const key = (data[at] << 16) | (data[at + 1] << 8) | data[at + 2];
    let yes = inked.get(key);
    if (yes === undefined) {
      const hex = `#${key.toString(16).padStart(6, '0')}`;
      const rgb: [number, number, number] = [data[at], data[at + 1], data[at + 2]];
      yes = paintRole(relativeLuminance(rgb), drawnOn) === 'knockout' && !isGroundColour(hex, drawnOn);
      inked.set(key, yes);
    }
    return yes;
  };
  for (let i = 0; i < count; i++) {
    const at = i * channels;
    const depth = (onDark ? luma[i] : 1 - luma[i]) / inkDepth;
    // Below 15 % of the way to the ink reads as ground, above 85 % as full ink, linear between (keeps anti-aliasing).
    const coverage = lightParts === 'ink' && printsAsInk(at) ? 1 : Math.min(1, Math.max(0, (depth - 0.15) / 0.7));
    out[i * 4] = r;
    out[i * 4 + 1] = g;
    out[i * 4 + 2] = b;
    out[i * 4 + 3] = Math.round(data[at + channels - 1] * coverage);
  }
  return sharp(out, { raw: { width, height, channels: 4 } }).png().toBuffer();
}
