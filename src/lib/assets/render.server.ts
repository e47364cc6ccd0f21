// The one rendition function: every drawn, recoloured or converted version of a logo or image (shelf renditions, logo
// versions for routes, pages and bundles, favicons, print files) comes from renderRendition, so sizing caps, colour
// treatment and output encoding are decided here once. Drawn renditions are cached under a key of asset and parameters.
// No astro:env here: the benchmark and the app share this code, each with its own store.
import { createHash } from 'node:crypto';
import sharp, { type Sharp } from 'sharp';
import { encode as encodeIco } from 'sharp-ico';
import type { LightParts } from '@/lib/identity/types';
import { knockoutSvg } from '@/lib/logo/knockout';
import { knockoutRaster, variantInk } from '@/lib/logo/recolour.server';
import { logoPrintFile } from '@/lib/logo/print-files.server';
import { toSanitizedSvg } from '@/lib/logo/sanitize';
import type { Box } from '@/lib/logo/geometry';
import type { FileStorage } from '@/lib/storage/storage';
import { MAX_IMAGE_PIXELS, renditionType, type AssetFormat, type RenditionParams } from './kinds';
import { checkRenditionSize, DEFAULT_SVG_WIDTH, paramsText, RenditionError } from './renditions';
import { escapeXml } from '@/lib/safe/escape';
import { focalCrop, renditionHeight } from './photo';

export interface RenditionSource {
  id: string;
  brandId: string;
  bytes: Buffer;
  format: AssetFormat;
  /** Drawn (non-transparent) area as fractions of the canvas; null for the whole canvas. */
  drawnBounds: Box | null;
}

/** What the drawing needs of a source; the cache needs its id and brand as well. */
export type DrawnSource = Pick<RenditionSource, 'bytes' | 'format' | 'drawnBounds'>;

/**
 * What to make, the one parameter type: size and fit (width, square, padding, sizes), format and encoding (format,
 * colorSpace, background) and colour treatment (variant, color as the ink, paintOn). format 'original' is the file as
 * stored, recoloured when a variant is asked.
 */
export interface RenditionSpec extends RenditionParams {
  /** For a one-colour SVG shown on a known ground: shapes in that ground's colour are painted, not cut out. */
  paintOn?: string | null;
  /** How the logo's light parts print in a one-colour variant (its own setting); holes when left out. */
  lightParts?: LightParts;
}

export interface Rendition {
  body: Buffer;
  mime: string;
  ext: string;
}

const TRANSPARENT = { r: 0, g: 0, b: 0, alpha: 0 };
/** Clear space of an avatar: a quarter of the logo's drawn height on each side (the identity's default unit, common practice). */
const CLEAR_SPACE_OF_HEIGHT = 0.25;

const rgba = (hex: string | null) => (hex ? hex : TRANSPARENT);

const svgMemo = new Map<string, { text: string; width: number; height: number }>();

/** The colour treatment of an SVG: the variant's ink painted in, vectors kept (knockout.ts). */
function recolourSvg(text: string, spec: RenditionSpec): string {
  if (spec.variant === 'original') return text;
  return knockoutSvg(text, { ink: variantInk(spec.variant, spec.color), paintOn: spec.paintOn ?? undefined, lightParts: spec.lightParts });
}

/** The colour treatment of a raster: the variant's ink sorted into its pixels, as a PNG. */
async function recolourRaster(bytes: Buffer, spec: RenditionSpec): Promise<Buffer> {
  return spec.variant === 'original' ? bytes : knockoutRaster(bytes, variantInk(spec.variant, spec.color), undefined, spec.lightParts);
}

/** The SVG text with the variant painted in, plus its intrinsic size; memoised, as sanitising costs more than drawing small icons. */
function svgFor(bytes: Buffer, params: RenditionSpec): { text: string; width: number; height: number } {
  const memoKey = `${createHash('sha1').update(bytes).digest('hex')}|${params.variant}|${params.color ?? ''}|${params.paintOn ?? ''}|${params.lightParts ?? 'holes'}`;
  const known = svgMemo.get(memoKey);
  if (known) return known;
  const clean = toSanitizedSvg(bytes.toString('utf8'));
  const text = recolourSvg(clean.svg, params);
  const made = { text, width: clean.width, height: clean.height };
  svgMemo.set(memoKey, made);
  if (svgMemo.size > 200) svgMemo.delete(svgMemo.keys().next().value!);
  return made;
}

/**
 * A sharp pipeline that draws the source so that `drawWidth` px covers `box` (fractions of the canvas, or all of it):
 * SVGs at the density that gives that width directly, rasters from their pixels.
 */
async function drawn(source: DrawnSource, params: RenditionSpec, contentWidth: number | null, box: Box | null): Promise<{ img: Sharp; width: number; height: number }> {
  const crop = box ?? { x: 0, y: 0, width: 1, height: 1 };
  if (source.format === 'svg') {
    const svg = svgFor(source.bytes, params);
    const canvasWidth = (contentWidth ?? DEFAULT_SVG_WIDTH) / crop.width;
    const density = boundedDensity(svg, canvasWidth);
    const img = sharp(Buffer.from(svg.text), { density, limitInputPixels: MAX_IMAGE_PIXELS });
    // Floor, so a crop never reaches past what libvips draws; the final resize sets the exact size.
    const w = Math.max(1, Math.floor((svg.width * density) / 72));
    const h = Math.max(1, Math.floor((svg.height * density) / 72));
    return cropTo(img, w, h, box);
  }
  const bytes = await recolourRaster(source.bytes, params);
  const img = sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS });
  const meta = await img.metadata();
  const w = meta.width ?? 1;
  const h = meta.height ?? 1;
  return cropTo(img, w, h, box);
}

/** A photograph cut to the aspect ratio around its focal point (EXIF orientation applied first), then scaled to the width. */
async function focalCropped(bytes: Buffer, params: RenditionSpec): Promise<Sharp> {
  const { aspect, focus } = params.focalCrop!;
  const meta = await sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS }).metadata();
  const size = meta.autoOrient ?? { width: meta.width ?? 1, height: meta.height ?? 1 };
  const box = focalCrop(size, aspect, focus);
  const width = Math.min(params.width ?? box.width, box.width); // never upscaled
  return sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS, autoOrient: true })
    .extract(box)
    .resize({ width, height: renditionHeight(width, aspect), fit: 'fill' });
}

/** A square of `size` px with the drawing centred inside `inner` px (or inside its clear space). */
async function square(source: DrawnSource, params: RenditionSpec, size: number): Promise<Sharp> {
  const clearSpace = params.padding < 0;
  const box = clearSpace ? source.drawnBounds : null;
  // The aspect of what is drawn decides the content box: first a cheap look at the proportions.
  const probe = await drawn(source, params, 64, box);
  const aspect = probe.width / probe.height;
  let cw: number;
  let ch: number;
  if (clearSpace) {
    const margin = CLEAR_SPACE_OF_HEIGHT;
    const scale = size / Math.max(aspect + 2 * margin, 1 + 2 * margin);
    cw = Math.max(1, Math.round(aspect * scale));
    ch = Math.max(1, Math.round(scale));
  } else {
    const inner = Math.max(1, Math.round(size * (1 - 2 * params.padding)));
    cw = aspect >= 1 ? inner : Math.max(1, Math.round(inner * aspect));
    ch = aspect >= 1 ? Math.max(1, Math.round(inner / aspect)) : inner;
  }
  const { img } = await drawn(source, params, cw, box);
  const left = Math.floor((size - cw) / 2);
  const top = Math.floor((size - ch) / 2);
  const background = rgba(params.background);
  return img
    .resize({ width: cw, height: ch, fit: 'fill' })
    .extend({ left, right: size - cw - left, top, bottom: size - ch - top, background });
}

/** The pipeline's output format, with the CMYK profile embedded for print. */
function encodeAs(img: Sharp, params: RenditionParams): Sharp {
  if (params.background) img = img.flatten({ background: params.background });
  if (params.colorSpace === 'cmyk') img = img.withIccProfile('cmyk');
  switch (params.format) {
    case 'jpg':
      return img.jpeg({ quality: 90 });
    case 'webp':
      return img.webp({ quality: 90 });
    case 'tiff':
      return img.tiff({ compression: 'lzw' });
    default:
      return img.png();
  }
}

/** Draw one rendition (no cache), after the size guard. */
async function drawRendition(source: DrawnSource, params: RenditionSpec): Promise<Rendition> {
  const type = renditionType(params.format, source.format);
  if (params.format === 'original') {
    // The file as stored (cleaned at upload), recoloured when a variant is asked: an SVG stays SVG, a raster becomes a PNG.
    if (params.variant === 'original') return { body: source.bytes, ...type };
    if (source.format === 'svg') return { body: Buffer.from(recolourSvg(source.bytes.toString('utf8'), params)), ...renditionType('svg', 'svg') };
    return { body: await recolourRaster(source.bytes, params), ...renditionType('png', 'png') };
  }
  if (params.format === 'svg') {
    let text = svgFor(source.bytes, params).text;
    if (params.background) {
      const { viewBox } = toSanitizedSvg(text);
      text = text.replace(/^(<svg\b[^>]*>)/i, `$1<rect data-role="background" x="${viewBox.x}" y="${viewBox.y}" width="${viewBox.width}" height="${viewBox.height}" fill="${escapeXml(params.background)}"/>`);
    }
    return { body: Buffer.from(text), ...type };
  }
  if (params.format === 'pdf' || params.format === 'eps') {
    return { body: await logoPrintFile(source.bytes.toString('utf8'), source.drawnBounds, params.format, params.colorSpace), ...type };
  }
  if (params.format === 'ico') {
    const pngs = await Promise.all((params.sizes ?? []).map(async (s) => (await square(source, { ...params, format: 'png' }, s)).png().toBuffer()));
    return { body: encodeIco(pngs), ...type };
  }
  if (params.square) return { body: await encodeAs(await square(source, params, params.width!), params).toBuffer(), ...type };
  if (params.focalCrop && source.format !== 'svg') return { body: await encodeAs(await focalCropped(source.bytes, params), params).toBuffer(), ...type };
  const { img, width } = await drawn(source, params, params.width, null);
  const target = params.width ?? width;
  return { body: await encodeAs(img.resize({ width: target }), params).toBuffer(), ...type };
}

// ---------------------------------------------------------------- limits: what a request can make us draw

/**
 * The density that draws the SVG `canvasWidth` px wide, lowered where needed so the canvas never holds more than
 * MAX_IMAGE_PIXELS (a crop to a thin drawn area would otherwise ask for a huge canvas); the final resize sets the size.
 */
function boundedDensity(svg: { width: number; height: number }, canvasWidth: number): number {
  const wanted = Math.max(1, (72 * canvasWidth) / svg.width);
  const ceiling = 72 * Math.sqrt(MAX_IMAGE_PIXELS / (svg.width * svg.height));
  return Math.min(100_000, ceiling, wanted);
}

/** Refuses a rendition over the output caps before anything is drawn: an SVG's own size, or a raster's header only. */
async function guardOutputSize(source: DrawnSource, params: RenditionSpec): Promise<void> {
  if (params.format === 'original' || params.format === 'svg') return;
  const size = source.format === 'svg' ? svgFor(source.bytes, params) : await sharp(source.bytes, { limitInputPixels: MAX_IMAGE_PIXELS }).metadata();
  checkRenditionSize(params, { format: source.format, width: size.width ?? 1, height: size.height ?? 1 });
}

/** Make one rendition (no cache); over the caps → RenditionError 422 (rendition_too_large or too_many_pixels). */
export async function renderRendition(source: DrawnSource, params: RenditionSpec): Promise<Rendition> {
  await guardOutputSize(source, params);
  try {
    return await drawRendition(source, params);
  } catch (err) {
    if (/pixel limit/i.test(String((err as Error).message))) {
      throw new RenditionError('too_many_pixels', `Drawing this would read more than ${MAX_IMAGE_PIXELS / 1e6} million pixels, the most Plumbline reads from one image. Choose a smaller width.`, 422);
    }
    throw err;
  }
}

/** Where a rendition is kept: a key derived from the asset and the parameters, in the storage's own key shape. */
export function renditionKey(source: { id: string; brandId: string }, params: RenditionParams): { key: string; paramsKey: string } {
  // Variants drawn before knockouts were filled silhouettes: a new salt keeps those cached files from being served.
  const salt = params.variant === 'original' ? '' : '\nknockout-1';
  const hash = createHash('sha256').update(`${source.id}\n${paramsText(params)}${salt}`).digest('hex');
  const uuidish = `${hash.slice(0, 8)}-${hash.slice(8, 12)}-${hash.slice(12, 16)}-${hash.slice(16, 20)}-${hash.slice(20, 32)}`;
  const ext = renditionType(params.format, 'png').ext;
  return { key: `${source.brandId}/rendition/${uuidish}.${ext}`, paramsKey: hash };
}

export interface RenditionHooks {
  /** Runs only when the rendition must be drawn (not cached): may refuse by throwing (limits, rates). */
  beforeDraw?: (entry: { paramsKey: string }) => Promise<void>;
  /** Indexes a newly stored rendition. */
  onStored?: (entry: { key: string; paramsKey: string; mime: string; size: number }) => Promise<void>;
}

/** A rendition from the store when it was made before (free), otherwise admitted by `beforeDraw`, drawn and stored. */
export async function cachedRendition(
  store: FileStorage,
  source: Omit<RenditionSource, 'bytes'> & { bytes: () => Promise<Buffer> },
  params: RenditionParams,
  hooks: RenditionHooks = {},
): Promise<Rendition & { cached: boolean }> {
  const type = renditionType(params.format, source.format);
  if (params.format === 'original') return { body: await source.bytes(), ...type, cached: true };
  const { key, paramsKey } = renditionKey(source, params);
  const hit = await store.get(key);
  if (hit) return { body: hit, ...type, cached: true };
  await hooks.beforeDraw?.({ paramsKey });
  const made = await renderRendition({ ...source, bytes: await source.bytes() }, params);
  await store.put(key, made.body, made.mime);
  await hooks.onStored?.({ key, paramsKey, mime: made.mime, size: made.body.length });
  return { ...made, cached: false };
}

/** Crop a w × h drawing to a box given as fractions of it (whole pixels, never past the edge), or leave it whole. */
function cropTo(img: Sharp, w: number, h: number, box: { x: number; y: number; width: number; height: number } | null | undefined) {
  if (!box) return { img, width: w, height: h };
  const left = Math.min(w - 1, Math.floor(box.x * w));
  const top = Math.min(h - 1, Math.floor(box.y * h));
  const width = Math.max(1, Math.min(w - left, Math.ceil(box.width * w)));
  const height = Math.max(1, Math.min(h - top, Math.ceil(box.height * h)));
  return { img: img.extract({ left, top, width, height }), width, height };
}
