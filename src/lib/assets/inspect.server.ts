// Reads an uploaded file for what it really is: the type from its bytes (never its name or header), decoded in full,
// checked for a second document riding along, SVGs cleaned. Anything doubtful is refused with a reason.
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { drawnBounds } from '@/lib/logo/bounds.server';
import type { Box } from '@/lib/logo/geometry';
import { sanitizeSvg } from '@/lib/logo/sanitize';
import { AppError } from '@/lib/errors';
import { fontMetrics } from '@/lib/type/metrics';
import { EXTENSIONS, FORMAT_INFO, MAX_ASSET_BYTES, MAX_IMAGE_PIXELS, type AssetFormat, type AssetKind } from './kinds';

/** A file refused with its reason; the upload route lists each one and answers 400 when none was accepted. */
export class UploadRejection extends AppError {
  constructor(code: string, message: string) {
    super(code, message, { status: 400 });
  }
}

export interface InspectedFile {
  format: AssetFormat;
  kind: AssetKind;
  mime: string;
  /** What is stored: the bytes as uploaded, or the cleaned SVG. */
  stored: Buffer;
  width: number | null;
  height: number | null;
  drawnBounds: Box | null;
  /** What sanitising removed from an SVG, e.g. "element <script>". */
  removed: string[];
}

const DETECTED: Record<string, AssetFormat> = { png: 'png', jpg: 'jpeg', webp: 'webp', pdf: 'pdf', woff2: 'woff2', woff: 'woff', ttf: 'ttf', otf: 'otf', zip: 'zip' };
/** Markup that has no business inside an image, font or PDF: a sign of a file that is two documents at once. */
const MARKUP = /<script|<html|<\?php|<!doctype\s+html|<body[\s>]|<iframe|<object[\s>]|javascript:/i;
const MB = (n: number) => `${Math.round(n / 1024 / 1024)} MB`;
const reject = (code: string, message: string): never => {
  throw new UploadRejection(code, message);
};

const extensionOf = (filename: string) => /\.([a-z0-9]{1,8})$/i.exec(filename)?.[1]?.toLowerCase() ?? null;

/** The text of a file when it decodes as UTF-8 (an SVG candidate), else null. */
function asText(bytes: Buffer): string | null {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

/** Bytes after the PNG's IEND chunk, walking the chunks; throws when the chunk chain is broken (truncated). */
function pngTrailingBytes(bytes: Buffer): number {
  let at = 8;
  while (at + 12 <= bytes.length) {
    const length = bytes.readUInt32BE(at);
    const type = bytes.toString('latin1', at + 4, at + 8);
    at += 12 + length;
    if (type === 'IEND') return bytes.length - at;
  }
  return reject('truncated', 'The PNG ends before its last chunk: the file is truncated or damaged. Export it again.');
}

/** Checks each binary format for a second document hidden inside or after it. */
function checkSingleDocument(format: AssetFormat, bytes: Buffer): void {
  const label = FORMAT_INFO[format].label;
  if (format !== 'zip' && MARKUP.test(bytes.toString('latin1'))) {
    reject('polyglot', `This ${label} file also carries web page or script markup, so it could be read as two different files. Export it again from the original program.`);
  }
  if (format === 'png' && pngTrailingBytes(bytes) > 0) {
    reject('polyglot', 'This PNG has extra data after its end marker (another file hidden behind the image). Export it again.');
  }
  if (format === 'jpeg') {
    const end = bytes.lastIndexOf(Buffer.from([0xff, 0xd9]));
    if (end < 0) reject('truncated', 'The JPEG has no end marker: the file is truncated. Export it again.');
    const tail = bytes.subarray(end + 2);
    if (tail.length > 16 && tail.some((b) => b !== 0)) reject('polyglot', 'This JPEG has extra data after its end marker (another file hidden behind the image). Export it again.');
  }
  if (format === 'webp') {
    const declared = bytes.readUInt32LE(4) + 8;
    if (declared > bytes.length) reject('truncated', 'The WebP file is shorter than its header says: it is truncated. Export it again.');
    if (declared + 1 < bytes.length) reject('polyglot', 'This WebP has extra data after its end (another file hidden behind the image). Export it again.');
  }
}

async function inspectImage(format: AssetFormat, bytes: Buffer): Promise<{ width: number; height: number }> {
  try {
    const meta = await sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS }).metadata();
    if (!meta.width || !meta.height) throw new Error('no size');
    // Decode every pixel, so a truncated or damaged file is caught now rather than when someone downloads it.
    await sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS, failOn: 'truncated' }).stats();
    return { width: meta.width, height: meta.height };
  } catch (err) {
    const message = String((err as Error).message);
    if (/pixel limit/i.test(message)) {
      return reject('too_many_pixels', `The image declares more than ${MAX_IMAGE_PIXELS / 1e6} million pixels; Plumbline refuses images that large. Export a smaller version.`);
    }
    return reject('unreadable_image', `The ${FORMAT_INFO[format].label} could not be read to the end: it may be truncated or damaged. Export it again.`);
  }
}

/** Bounds of what a logo draws, as fractions of its canvas; null when nothing usable could be measured. */
async function boundsFraction(input: Buffer | string): Promise<Box | null> {
  try {
    return (await drawnBounds(input)).fraction;
  } catch {
    return null;
  }
}

/** Inspect one uploaded file; resolves to what will be stored or throws an UploadRejection. */
export async function inspectUpload(filename: string, bytes: Buffer, wantedKind?: AssetKind): Promise<InspectedFile> {
  if (bytes.length === 0) reject('empty_file', 'The file is empty (0 bytes).');
  if (bytes.length > MAX_ASSET_BYTES) reject('too_large', `The file is ${MB(bytes.length)}; each file can be at most ${MB(MAX_ASSET_BYTES)}.`);
  const detected = await fileTypeFromBuffer(bytes);
  let format: AssetFormat;
  let stored = bytes;
  let width: number | null = null;
  let height: number | null = null;
  let bounds: Box | null = null;
  let removed: string[] = [];

  if (detected && DETECTED[detected.ext]) {
    format = DETECTED[detected.ext];
  } else if (!detected || detected.ext === 'xml') {
    const text = asText(bytes);
    if (text === null || !/<svg[\s>/]/i.test(text)) {
      return reject('unsupported_file', 'This file is not one Plumbline keeps: upload SVG, PNG, JPEG, WebP, PDF, WOFF2, WOFF, TTF, OTF or ZIP.');
    }
    format = 'svg';
  } else {
    return reject('unsupported_file', `This file is a ${detected.ext.toUpperCase()} (${detected.mime}); upload SVG, PNG, JPEG, WebP, PDF, a font (WOFF2, WOFF, TTF, OTF) or ZIP.`);
  }

  const ext = extensionOf(filename);
  if (ext && !EXTENSIONS[format].includes(ext)) {
    reject('extension_mismatch', `The file is named “.${ext}” but its contents are ${FORMAT_INFO[format].label}. Rename it to .${FORMAT_INFO[format].ext} if that is what it should be.`);
  }

  if (format === 'svg') {
    const clean = sanitizeSvg(bytes.toString('utf8'));
    if (!clean.ok) return reject(clean.error.code, clean.error.message);
    stored = Buffer.from(clean.svg);
    ({ width, height, removed } = clean);
    bounds = await boundsFraction(clean.svg);
    if (!bounds) reject('logo_empty', 'The SVG draws nothing visible.');
  } else {
    checkSingleDocument(format, bytes);
    if (format === 'png' || format === 'jpeg' || format === 'webp') {
      ({ width, height } = await inspectImage(format, bytes));
      if (format === 'png' && wantedKind === 'logo') bounds = await boundsFraction(bytes);
    } else if (format === 'pdf') {
      if (!bytes.subarray(Math.max(0, bytes.length - 1024)).toString('latin1').includes('%%EOF')) {
        reject('truncated', 'The PDF has no end-of-file marker: it is truncated. Export it again.');
      }
      if (/\/(JavaScript|JS|Launch)[\s/<(]/.test(bytes.toString('latin1'))) {
        reject('pdf_script', 'The PDF contains scripts or launch actions; Plumbline only keeps PDFs without them. Export it again without interactive features.');
      }
    } else if (format === 'zip') {
      const tail = bytes.subarray(Math.max(0, bytes.length - 65_557));
      if (!tail.includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]))) reject('truncated', 'The ZIP has no central directory at its end: it is truncated. Create it again.');
    } else {
      try {
        fontMetrics(bytes);
      } catch {
        reject('font_unreadable', `The ${FORMAT_INFO[format].label} font could not be read: it may be truncated or damaged.`);
      }
    }
  }

  const rasterish = format === 'svg' || format === 'png' || format === 'jpeg' || format === 'webp';
  const kind: AssetKind = rasterish && wantedKind && (wantedKind === 'logo' || wantedKind === 'image') ? wantedKind : FORMAT_INFO[format].kind;
  return { format, kind, mime: FORMAT_INFO[format].mime, stored, width, height, drawnBounds: bounds, removed };
}
