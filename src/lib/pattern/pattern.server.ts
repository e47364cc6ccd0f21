// The pattern generator: the brand's mark through the one-colour knockout (inner shapes stay open as the ground),
// placed by the layout into one seamless tile, exported as SVG and, through sharp, PNG. Mock-ups and the shelf call
// `patternTile()`; nothing else draws a pattern.
import sharp from 'sharp';
import { MAX_IMAGE_PIXELS, MAX_RENDITION_PIXELS, MAX_RENDITION_SIDE } from '@/lib/assets/kinds';
import { AppError } from '@/lib/errors';
import { findLogo } from '@/lib/guideline/identity';
import { parseWith } from '@/lib/http/api';
import type { Identity, IdentityLogo } from '@/lib/identity/types';
import { oneColourLogo } from '@/lib/logo/knockout.server';
import { patternColours } from './colours';
import { patternLayout, patternSettingsSchema, type PatternSettings, type PatternSettingsInput, type TileLayout } from './layout';
import { tileSvg, type TileMark } from './tile';

/** A logo's stored file. */
export interface MarkFile {
  bytes: Buffer;
  format: 'svg' | 'png';
}

/** Where the mark's bytes come from: the working identity by default; a published version passes its own copies. */
export type MarkReader = (brandId: string, logo: IdentityLogo) => Promise<MarkFile | null>;

/** The logo as the brand keeps it now (the working identity); loaded on first use, so the maths runs without a database. */
const draftMark: MarkReader = async (brandId, logo) => (await import('./mark.server')).draftMark(brandId, logo);

export interface PatternTile {
  /** One tile, no <pattern> element: repeat it edge to edge. */
  svg: string;
  /** Tile size in CSS px. */
  width: number;
  height: number;
  /** The settings after defaults, enough to draw the same tile again. */
  settings: PatternSettings;
  colours: { ground: { id: string; hex: string }; ink: { id: string; hex: string } };
  layout: TileLayout;
}

export interface PatternTileOptions {
  readMark?: MarkReader;
  /** Lay out several tiles in one drawing (previews, checks); one by default. */
  repeat?: { columns: number; rows: number };
}

/** The seamless tile of a pattern of the brand's mark, with ground and ink from its palette. */
export async function patternTile(identity: Identity, input: PatternSettingsInput, options: PatternTileOptions = {}): Promise<PatternTile> {
  const settings = parseWith(patternSettingsSchema, input, 'pattern');
  const logo = findLogo(identity, settings.logoId);
  if (!logo) throw new AppError('pattern_logo_missing', 'The mark of this pattern is not among the brand’s logos: choose another.', { status: 422 });
  const picked = patternColours(identity, settings);
  if (!picked.ok) throw new AppError(picked.code, picked.message, { status: 422 });
  const { ground, ink } = picked.colours;
  const file = await (options.readMark ?? draftMark)(identity.brand.id, logo);
  if (!file) throw new AppError('pattern_logo_missing', 'The mark’s file is missing from storage.', { status: 422 });
  // The one-colour knockout in the ink: shapes painted in the ground's colour become holes, so the ground shows through
  // (light parts too, unless the logo's own setting prints them in the ink).
  const knocked = await oneColourLogo({ bytes: file.bytes, format: file.format, lightParts: logo.lightParts }, 'one-colour', { ink: ink.hex.slice(0, 7) });
  const mark: TileMark = knocked.format === 'svg' ? { format: 'svg', svg: knocked.body.toString('utf8'), viewBox: logo.canvas } : { format: 'png', png: knocked.body };
  const layout = patternLayout(settings, logo.canvas.width / logo.canvas.height, options.repeat);
  const svg = tileSvg(layout, mark, { ground: ground.hex.slice(0, 7), opacity: settings.opacity });
  return {
    svg,
    width: layout.width,
    height: layout.height,
    settings,
    colours: { ground: { id: ground.id, hex: ground.hex.slice(0, 7) }, ink: { id: ink.id, hex: ink.hex.slice(0, 7) } },
    layout,
  };
}

/** Pixel densities a PNG tile can be asked for (1× for screens, 2× for sharp screens, 4× for print proofs). */
export const PATTERN_PIXEL_RATIOS = [1, 2, 4] as const;

/** The tile as a PNG at a pixel density; refused with the limit named when it would pass the rendition limits. */
export async function patternPng(tile: Pick<PatternTile, 'svg' | 'width' | 'height'>, pixelRatio = 2): Promise<Buffer> {
  const width = Math.round(tile.width * pixelRatio);
  const height = Math.round(tile.height * pixelRatio);
  if (width > MAX_RENDITION_SIDE || height > MAX_RENDITION_SIDE || width * height > MAX_RENDITION_PIXELS) {
    throw new AppError('rendition_too_large', `This tile would be ${width} × ${height} px; at most ${MAX_RENDITION_SIDE} px a side and ${MAX_RENDITION_PIXELS / 1e6} million pixels are drawn. Lower the size, the gap or the density.`, { status: 422 });
  }
  return sharp(Buffer.from(tile.svg), { density: 72 * pixelRatio, limitInputPixels: MAX_IMAGE_PIXELS })
    .resize(width, height, { fit: 'fill' })
    .png()
    .toBuffer();
}
