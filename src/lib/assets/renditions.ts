// Turns a file request (format, width, preset, variant…) into one fully resolved rendition, or a plain-worded refusal.
import { parseColor } from '@/lib/color/parse';
import { AppError } from '@/lib/errors';
import { FAVICON_SIZES, MAX_RENDITION_PIXELS, MAX_RENDITION_SIDE, type AssetFormat, type AssetKind, type RenditionParams, type RenditionQuery } from './kinds';

/** A refused rendition request; 400 for a request that makes no sense, 422 for one over a limit. */
export class RenditionError extends AppError {
  constructor(code: string, message: string, status = 400) {
    super(code, message, { status });
  }
}

/** Width of a raster drawn from an SVG when none is asked for. */
export const DEFAULT_SVG_WIDTH = 1024;

const RASTER_SOURCES: AssetFormat[] = ['svg', 'png', 'jpeg', 'webp', 'avif'];

/** '#rrggbb' for a typed colour, null for "transparent", or a refusal naming the field. */
function colour(value: string | undefined, field: string): string | null | undefined {
  if (value === undefined) return undefined;
  if (/^(transparent|none)$/i.test(value.trim())) return null;
  const parsed = parseColor(value);
  if (!parsed.ok) throw new RenditionError('invalid_color', `${field}: ${parsed.error.message}`);
  return parsed.color.hex.slice(0, 7).toLowerCase();
}

/** Resolve a request against an asset; presets fix sizes, the rest is checked for sense (no SVG from a photo, no transparent JPEG). */
export function resolveRendition(query: RenditionQuery, asset: { kind: AssetKind; format: AssetFormat }): RenditionParams {
  const color = colour(query.color, 'color') ?? null;
  const variant = query.variant ?? 'original';
  // A reversed logo is white on a transparent ground; a colour given with it is the field it is shown on.
  const asked = colour(query.background, 'background');
  const background = asked === undefined && variant === 'reversed' && color ? color : asked;
  const wantsWork = query.preset || query.width || (query.format && query.format !== 'original') || variant !== 'original' || query.colorSpace;
  const base: RenditionParams = { format: 'original', width: null, square: false, padding: 0, background: null, variant, color, colorSpace: 'rgb', sizes: null };
  if (!wantsWork) {
    if (background !== undefined) throw new RenditionError('invalid_input', 'A background needs a rendered format (png, jpg, webp or tiff).');
    return base;
  }
  if (query.format === 'original') throw new RenditionError('invalid_input', 'The original file is served as uploaded: drop width, variant and preset, or choose another format.');
  if (!RASTER_SOURCES.includes(asset.format)) {
    throw new RenditionError('no_renditions', `A ${asset.format.toUpperCase()} file is served as uploaded; renditions are made from logos and images only.`);
  }
  if (variant !== 'original' && asset.kind !== 'logo') {
    throw new RenditionError('invalid_input', 'Black, white, reversed and one-colour versions are made from logos only.');
  }
  if (variant === 'one-colour' && !color) throw new RenditionError('invalid_input', 'A one-colour version needs its ink: add color=#rrggbb.');

  let params: RenditionParams;
  switch (query.preset) {
    case 'favicon':
      params = { ...base, format: 'ico', square: true, padding: 0, sizes: [...FAVICON_SIZES], background: background ?? null };
      break;
    case 'apple-touch':
      // Home-screen icons are shown on an opaque tile (common practice): white unless a background is chosen.
      params = { ...base, format: 'png', width: 180, square: true, padding: 0.1, background: background ?? '#ffffff' };
      break;
    case 'app-icon-192':
    case 'app-icon-512':
      params = { ...base, format: 'png', width: query.preset === 'app-icon-192' ? 192 : 512, square: true, padding: 0.05, background: background ?? null };
      break;
    case 'social-avatar':
      // padding -1 marks "the logo's clear space" rather than a fixed fraction.
      params = { ...base, format: query.format === 'jpg' ? 'jpg' : 'png', width: query.width ?? 800, square: true, padding: -1, background: background ?? '#ffffff' };
      break;
    case 'print':
      params = { ...base, format: query.format === 'jpg' ? 'jpg' : 'tiff', width: query.width ?? 2048, colorSpace: 'cmyk', background: background ?? '#ffffff' };
      break;
    default: {
      const format = query.format ?? 'png';
      if (format === 'svg') {
        if (asset.format !== 'svg') throw new RenditionError('svg_from_raster', 'An SVG can only be made from an SVG original; this asset is a raster image.');
        if (query.width || query.colorSpace) throw new RenditionError('invalid_input', 'An SVG scales to any size: drop width and colorSpace.');
        return { ...base, format: 'svg', background: background ?? null };
      }
      if (format === 'ico') return resolveRendition({ ...query, preset: 'favicon' }, asset);
      if (format === 'pdf' || format === 'eps') {
        if (asset.format !== 'svg') {
          throw new RenditionError('vector_from_raster', `A print-ready ${format.toUpperCase()} is made from an SVG original only: this logo is a raster image, and wrapping its pixels would not make a vector file. Ask for the SVG, or use the CMYK TIFF.`);
        }
        if (query.width || variant !== 'original' || background) {
          throw new RenditionError('invalid_input', `A print-ready ${format.toUpperCase()} is the logo as drawn, at its own size: drop width, variant and background.`);
        }
        return { ...base, format, colorSpace: query.colorSpace ?? 'cmyk' };
      }
      const opaque = format === 'jpg' || format === 'tiff';
      if (opaque && background === null) throw new RenditionError('invalid_input', `${format.toUpperCase()} has no transparency: choose a background colour.`);
      params = { ...base, format, width: query.width ?? null, background: opaque ? (background ?? '#ffffff') : (background ?? null), colorSpace: query.colorSpace ?? (format === 'tiff' ? 'cmyk' : 'rgb') };
    }
  }
  if (params.colorSpace === 'cmyk' && params.format !== 'jpg' && params.format !== 'tiff') {
    throw new RenditionError('invalid_input', 'CMYK is for print files: choose format=tiff, jpg, pdf or eps.');
  }
  return params;
}

/** The canonical text of resolved parameters, the part of the cache key that is not the asset. */
export function paramsText(params: RenditionParams): string {
  const keys = Object.keys(params).sort() as (keyof RenditionParams)[];
  return JSON.stringify(keys.map((k) => [k, params[k]]));
}

/**
 * The pixel size a rendition is drawn at, from the source's own size (an SVG's intrinsic size, a raster's header);
 * null when nothing is drawn (the original, an SVG rendition).
 */
export function renditionSize(params: RenditionParams, source: { format: AssetFormat; width: number; height: number }): { width: number; height: number } | null {
  if (params.format === 'original' || params.format === 'svg') return null;
  if (params.format === 'ico') {
    const side = Math.max(...(params.sizes ?? [0]));
    return { width: side, height: side };
  }
  if (params.square) return { width: params.width!, height: params.width! };
  const width = params.width ?? (source.format === 'svg' ? DEFAULT_SVG_WIDTH : source.width);
  return { width, height: Math.max(1, Math.round((width * source.height) / Math.max(source.width, 1e-9))) };
}

/** Refuses (422 rendition_too_large) a rendition over MAX_RENDITION_PIXELS or MAX_RENDITION_SIDE, naming the limit. */
export function checkRenditionSize(params: RenditionParams, source: { format: AssetFormat; width: number; height: number }): void {
  const size = renditionSize(params, source);
  if (!size) return;
  const { width, height } = size;
  const asked = `${width.toLocaleString('en')} × ${height.toLocaleString('en')} px`;
  if (width > MAX_RENDITION_SIDE || height > MAX_RENDITION_SIDE) {
    throw new RenditionError('rendition_too_large', `At that width this file would be ${asked}; a rendition can be at most ${MAX_RENDITION_SIDE} px on each side. Choose a smaller width.`, 422);
  }
  if (width * height > MAX_RENDITION_PIXELS) {
    throw new RenditionError('rendition_too_large', `At that width this file would be ${asked}; a rendition can hold at most ${MAX_RENDITION_PIXELS / 1e6} million pixels. Choose a smaller width.`, 422);
  }
}
