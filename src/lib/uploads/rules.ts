// What each kind of upload accepts, and how large it may be: the one table the upload inspector enforces.
// Browser-safe, so a form can show the same limits the server keeps.

/** Every file format Plumbline recognises in an upload, named by what its bytes are. */
export const UPLOAD_FORMATS = ['svg', 'png', 'jpeg', 'webp', 'gif', 'avif', 'pdf', 'woff2', 'woff', 'ttf', 'otf', 'zip'] as const;
export type UploadFormat = (typeof UPLOAD_FORMATS)[number];

/** The media type it is stored and served with, its usual extension, the extensions that honestly name it, and its name for people. */
export const FORMAT_TYPES: Record<UploadFormat, { mime: string; ext: string; extensions: string[]; label: string }> = {
  svg: { mime: 'image/svg+xml', ext: 'svg', extensions: ['svg'], label: 'SVG' },
  png: { mime: 'image/png', ext: 'png', extensions: ['png'], label: 'PNG' },
  jpeg: { mime: 'image/jpeg', ext: 'jpg', extensions: ['jpg', 'jpeg', 'jpe'], label: 'JPEG' },
  webp: { mime: 'image/webp', ext: 'webp', extensions: ['webp'], label: 'WebP' },
  gif: { mime: 'image/gif', ext: 'gif', extensions: ['gif'], label: 'GIF' },
  avif: { mime: 'image/avif', ext: 'avif', extensions: ['avif'], label: 'AVIF' },
  pdf: { mime: 'application/pdf', ext: 'pdf', extensions: ['pdf'], label: 'PDF' },
  woff2: { mime: 'font/woff2', ext: 'woff2', extensions: ['woff2'], label: 'WOFF2' },
  woff: { mime: 'font/woff', ext: 'woff', extensions: ['woff'], label: 'WOFF' },
  ttf: { mime: 'font/ttf', ext: 'ttf', extensions: ['ttf'], label: 'TrueType' },
  otf: { mime: 'font/otf', ext: 'otf', extensions: ['otf'], label: 'OpenType' },
  zip: { mime: 'application/zip', ext: 'zip', extensions: ['zip'], label: 'ZIP' },
};

/** Formats whose pixels are decoded (and counted against the pixel cap). */
export const RASTER_FORMATS: readonly UploadFormat[] = ['png', 'jpeg', 'webp', 'gif', 'avif'];
export const FONT_FORMATS = ['woff2', 'woff', 'ttf', 'otf'] as const;

const MB = 1024 * 1024;

/** Inspector codes a kind of upload may answer under an older name of its own. */
export type RenamableCode = 'empty_file' | 'unsupported_file' | 'unreadable_image' | 'too_many_pixels';

export interface UploadRule {
  /** What this upload is, for messages ("A logo must be …"). */
  noun: string;
  accept: readonly UploadFormat[];
  maxBytes: number;
  /** Images above this many pixels are refused before they are decoded (decompression bombs). */
  maxPixels: number;
  /** Codes this kind has always answered with in place of the inspector's own (kept stable for the API). */
  codes?: Partial<Record<RenamableCode, string>>;
  /** Added to the refusal of a format this kind does not take. */
  hint?: string;
}

/**
 * The uploads Plumbline takes. Byte caps and pixel caps are our own choices (from memory of what design tools export):
 * a logo is a small drawing, a mood-board photo may be a camera original, the shelf keeps print files.
 */
export const UPLOAD_RULES = {
  shelf: { noun: 'A file on the asset shelf', accept: ['svg', 'png', 'jpeg', 'webp', 'avif', 'pdf', 'woff2', 'woff', 'ttf', 'otf', 'zip'], maxBytes: 25 * MB, maxPixels: 60_000_000 },
  /** A photograph for the shelf: a raster picture a page shows in responsive renditions. */
  photo: {
    noun: 'A photograph',
    accept: ['jpeg', 'png', 'webp', 'avif'],
    maxBytes: 25 * MB,
    maxPixels: 60_000_000,
    hint: 'Logos, drawings and documents go on the shelf without “as photographs”.',
  },
  logo: { noun: 'A logo', accept: ['svg', 'png'], maxBytes: 5 * MB, maxPixels: 40_000_000 },
  typeface: { noun: 'A typeface', accept: FONT_FORMATS, maxBytes: 10 * MB, maxPixels: 0 }, // takes no images
  boardImage: {
    noun: 'A mood-board image',
    accept: ['jpeg', 'png', 'webp', 'gif', 'avif'],
    maxBytes: 15 * MB,
    maxPixels: 50_000_000,
    codes: { empty_file: 'not_an_image', unsupported_file: 'not_an_image', unreadable_image: 'not_an_image', too_many_pixels: 'too_large' },
    hint: 'Vector files belong in the identity or the asset shelf.',
  },
} as const satisfies Record<string, UploadRule>;
export type UploadKind = keyof typeof UPLOAD_RULES;

/** "SVG, PNG or JPEG". */
export function formatList(formats: readonly UploadFormat[]): string {
  const labels = formats.map((f) => FORMAT_TYPES[f].label);
  return labels.length < 2 ? (labels[0] ?? '') : `${labels.slice(0, -1).join(', ')} or ${labels.at(-1)}`;
}

/** The `accept` attribute of a file input for one kind of upload. */
export const acceptAttribute = (kind: UploadKind) => UPLOAD_RULES[kind].accept.flatMap((f) => FORMAT_TYPES[f].extensions.map((e) => `.${e}`)).join(',');
