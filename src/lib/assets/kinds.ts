// What the asset shelf accepts, the states an asset moves through, and the renditions it can be asked for.
// Browser-safe: the shelf island imports the same lists the server validates with.
import { z } from 'zod';
import { acceptAttribute, FORMAT_TYPES, UPLOAD_RULES } from '@/lib/uploads/rules';
import type { FocalPoint, PhotoAspect } from './photo';

export const ASSET_FORMATS = UPLOAD_RULES.shelf.accept;
export type AssetFormat = (typeof ASSET_FORMATS)[number];

/**
 * What an asset is for: logos get every rendition, images get web sizes, photographs also carry alt text, a caption
 * and a focal point for the imagery block; patterns are tiles Plumbline drew from the mark (never uploaded), kept with
 * their settings; the rest are served as uploaded.
 */
export const ASSET_KINDS = ['logo', 'image', 'photo', 'document', 'font', 'archive', 'pattern'] as const;
export type AssetKind = (typeof ASSET_KINDS)[number];

const DEFAULT_KIND: Record<AssetFormat, AssetKind> = { svg: 'logo', png: 'image', jpeg: 'image', webp: 'image', avif: 'photo', pdf: 'document', woff2: 'font', woff: 'font', ttf: 'font', otf: 'font', zip: 'archive' };

/** Formats that can be filed as photographs (the photo row of the upload table). */
export const PHOTO_FORMATS = UPLOAD_RULES.photo.accept;
export const PHOTO_ACCEPT_ATTRIBUTE = acceptAttribute('photo');

export const ASSET_STATES = ['draft', 'approved', 'retired'] as const;
export type AssetState = (typeof ASSET_STATES)[number];

export const STATE_LABELS: Record<AssetState, { label: string; summary: string }> = {
  draft: { label: 'Draft', summary: 'visible to the studio and reviewers only' },
  approved: { label: 'Approved', summary: 'on the shelf for partners and download-enabled share links' },
  retired: { label: 'Retired', summary: 'kept for the record, no longer handed out' },
};

/** Allowed moves: draft → approved → retired, retired → approved again, and back to draft from anywhere. */
export function canMoveState(from: AssetState, to: AssetState): boolean {
  if (from === to) return true;
  if (to === 'draft') return true;
  if (to === 'approved') return from === 'draft' || from === 'retired';
  return from === 'approved';
}

/** Type, extension and label of each shelf format (from the one upload table), and the asset kind it defaults to. */
export const FORMAT_INFO: Record<AssetFormat, { mime: string; ext: string; kind: AssetKind; label: string }> = Object.fromEntries(
  ASSET_FORMATS.map((f) => [f, { mime: FORMAT_TYPES[f].mime, ext: FORMAT_TYPES[f].ext, kind: DEFAULT_KIND[f], label: FORMAT_TYPES[f].label }]),
) as Record<AssetFormat, { mime: string; ext: string; kind: AssetKind; label: string }>;

export const ACCEPT_ATTRIBUTE = acceptAttribute('shelf');

export const MAX_ASSET_BYTES = UPLOAD_RULES.shelf.maxBytes;
export const MAX_FILES_PER_UPLOAD = 20;
/** Images above this many pixels are refused before they are decoded (decompression bombs), at upload and when drawn. */
export const MAX_IMAGE_PIXELS = UPLOAD_RULES.shelf.maxPixels;

export const RENDITION_FORMATS = ['original', 'svg', 'png', 'jpg', 'webp', 'ico', 'tiff', 'pdf', 'eps'] as const;
/** Print-ready vector formats, made from SVG logos only (a raster would only be wrapped, not turned into vectors). */
export const VECTOR_PRINT_FORMATS = ['pdf', 'eps'] as const;
export type RenditionFormat = (typeof RENDITION_FORMATS)[number];
export const RENDITION_VARIANTS = ['original', 'black', 'white', 'reversed', 'one-colour'] as const;
export type RenditionVariant = (typeof RENDITION_VARIANTS)[number];
export const RENDITION_PRESETS = ['favicon', 'apple-touch', 'app-icon-192', 'app-icon-512', 'social-avatar', 'print'] as const;
export type RenditionPreset = (typeof RENDITION_PRESETS)[number];

/**
 * Every drawn rendition holds at most 40 megapixels (width × height once the aspect ratio is applied) and at most
 * 8192 px on either side: a 4 × 2000 px image asked 2000 px wide would be 2000 × 1,000,000 px. Larger asks are refused
 * with the limit named, never clamped silently. Our own choice: 40 MP covers A3 at 300 ppi (3508 × 4961 px ≈ 17 MP)
 * twice over; 8192 px (2^13) is the largest side we draw.
 */
export const MAX_RENDITION_PIXELS = 40_000_000;
export const MAX_RENDITION_SIDE = 8192;

export const MIN_WIDTH = 16;
export const MAX_WIDTH = 8000;
/** Sizes inside the favicon ICO (common practice: 16 and 32 for tabs, 48 for desktop shortcuts). */
export const FAVICON_SIZES = [16, 32, 48] as const;

export const PRESET_INFO: Record<RenditionPreset, { label: string; hint: string }> = {
  favicon: { label: 'Favicon (ICO 16/32/48)', hint: 'one .ico file holding 16, 32 and 48 px squares' },
  'apple-touch': { label: 'Home-screen icon 180 px', hint: '180 × 180 PNG on a solid background' },
  'app-icon-192': { label: 'App icon 192 px', hint: '192 × 192 PNG, transparent' },
  'app-icon-512': { label: 'App icon 512 px', hint: '512 × 512 PNG, transparent' },
  'social-avatar': { label: 'Social avatar', hint: 'a square with the clear space kept around the logo' },
  print: { label: 'Print (CMYK TIFF)', hint: 'CMYK with an embedded profile; proof with your printer' },
};

const hexish = z.string().trim().min(1).max(60);

/** The query of a file request, validated once for the endpoint, the bundle and the benchmark. */
export const renditionQuerySchema = z.strictObject({
  format: z.enum(RENDITION_FORMATS).optional(),
  width: z.coerce
    .number({ message: 'width must be a number of pixels' })
    .int('width must be a whole number of pixels')
    .min(MIN_WIDTH, `width must be at least ${MIN_WIDTH} px`)
    .max(MAX_WIDTH, `width must be at most ${MAX_WIDTH} px`)
    .optional(),
  background: hexish.optional(),
  variant: z.enum(RENDITION_VARIANTS).optional(),
  color: hexish.optional(),
  preset: z.enum(RENDITION_PRESETS).optional(),
  colorSpace: z.enum(['rgb', 'cmyk']).optional(),
  download: z.enum(['0', '1']).optional(),
  /** The shelf's own thumbnails: small PNGs only, and not written to the download log. */
  preview: z.enum(['1']).optional(),
});

/** The largest thumbnail the shelf asks for without logging a download. */
export const PREVIEW_MAX_WIDTH = 480;
export type RenditionQuery = z.infer<typeof renditionQuerySchema>;

/** A fully resolved rendition request: what the renderer draws, and what the cache key is made of. */
export interface RenditionParams {
  format: Exclude<RenditionFormat, 'original'> | 'original';
  width: number | null;
  /** A square canvas of `width` px (icons, avatars). */
  square: boolean;
  /** Fraction of the square kept free on each side (icons and avatars). */
  padding: number;
  /** '#rrggbb' or null for transparent. */
  background: string | null;
  variant: RenditionVariant;
  /** Ink for one-colour; for reversed, the field it is placed on (the background when none is given). */
  color: string | null;
  colorSpace: 'rgb' | 'cmyk';
  /** Only for ICO: the sizes inside. */
  sizes: number[] | null;
  /** Photographs on a published page: cut to this aspect ratio around the focal point before the resize (absent otherwise). */
  focalCrop?: { aspect: PhotoAspect; focus: FocalPoint };
}

/** The twelve renditions the shelf offers for every logo (the benchmark and the bundle draw from this list). */
export const STANDARD_RENDITIONS: { name: string; query: RenditionQuery }[] = [
  { name: 'png-512', query: { format: 'png', width: 512 } },
  { name: 'png-2048', query: { format: 'png', width: 2048 } },
  { name: 'jpg-1024-white', query: { format: 'jpg', width: 1024, background: '#ffffff' } },
  { name: 'webp-1024', query: { format: 'webp', width: 1024 } },
  { name: 'black-512', query: { format: 'png', width: 512, variant: 'black' } },
  { name: 'white-512', query: { format: 'png', width: 512, variant: 'white' } },
  { name: 'favicon', query: { preset: 'favicon' } },
  { name: 'apple-touch-180', query: { preset: 'apple-touch' } },
  { name: 'app-icon-192', query: { preset: 'app-icon-192' } },
  { name: 'app-icon-512', query: { preset: 'app-icon-512' } },
  { name: 'social-avatar-800', query: { preset: 'social-avatar', width: 800 } },
  { name: 'print-cmyk-2048', query: { preset: 'print', width: 2048 } },
];

/** The print-ready vector files the shelf, the downloads page and the bundle offer for every SVG logo. */
export const VECTOR_PRINT_RENDITIONS: { name: string; label: string; query: RenditionQuery }[] = [
  { name: 'pdf-rgb', label: 'PDF (vector, RGB)', query: { format: 'pdf', colorSpace: 'rgb' } },
  { name: 'pdf-cmyk', label: 'PDF (vector, CMYK)', query: { format: 'pdf', colorSpace: 'cmyk' } },
  { name: 'eps-rgb', label: 'EPS (vector, RGB)', query: { format: 'eps', colorSpace: 'rgb' } },
  { name: 'eps-cmyk', label: 'EPS (vector, CMYK)', query: { format: 'eps', colorSpace: 'cmyk' } },
];

/** The file extension and media type a rendition is served with. */
export function renditionType(format: RenditionParams['format'], original: AssetFormat): { ext: string; mime: string } {
  switch (format) {
    case 'original':
      return { ext: FORMAT_INFO[original].ext, mime: FORMAT_INFO[original].mime };
    case 'svg':
      return { ext: 'svg', mime: 'image/svg+xml' };
    case 'png':
      return { ext: 'png', mime: 'image/png' };
    case 'jpg':
      return { ext: 'jpg', mime: 'image/jpeg' };
    case 'webp':
      return { ext: 'webp', mime: 'image/webp' };
    case 'ico':
      return { ext: 'ico', mime: 'image/x-icon' };
    case 'tiff':
      return { ext: 'tif', mime: 'image/tiff' };
    case 'pdf':
      return { ext: 'pdf', mime: 'application/pdf' };
    case 'eps':
      return { ext: 'eps', mime: 'application/postscript' };
  }
}

/** A readable download name: brand-asset-variant-width.ext, safe for every file system. */
export function renditionFilename(brandSlug: string, assetName: string, params: RenditionParams, original: AssetFormat): string {
  const slug = (s: string) => s.toLowerCase().normalize('NFKD').replace(/[^\w]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'asset';
  const parts = [slug(brandSlug), slug(assetName)];
  if (params.variant !== 'original') parts.push(params.variant);
  if (params.format === 'ico') parts.push('favicon');
  else if (params.format === 'pdf' || params.format === 'eps') parts.push('print');
  else if (params.width) parts.push(params.square ? `${params.width}x${params.width}` : `${params.width}w`);
  if (params.colorSpace === 'cmyk') parts.push('cmyk');
  return `${parts.join('-')}.${renditionType(params.format, original).ext}`;
}
