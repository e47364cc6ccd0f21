// The one upload inspector: every uploaded file (shelf assets, logos and their own versions, typefaces, mood-board
// images) is read here for what it really is. The type comes from its bytes (file-type, plus an SVG text check and the
// font tags), never from its name or the browser's header; the name must agree with the bytes; the caller's kind
// decides what is accepted and how large it may be (rules.ts). Images are decoded in full, binary files are checked
// for a second document riding along, SVGs are cleaned, fonts are opened. Anything doubtful is refused with a code.
// So the inspector takes the whole bytes (sharp decodes them, fontkit opens them, a PDF is scanned end to end, a ZIP's
// directory is at its end): an upload is held in memory up to its kind's cap (rules.ts, at most 25 MB), never streamed.
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { AppError } from '@/lib/errors';
import { drawnBounds, type DrawnBounds } from '@/lib/logo/bounds.server';
import { LogoError } from '@/lib/logo/errors';
import type { Box } from '@/lib/logo/geometry';
import { sanitizeSvg } from '@/lib/logo/sanitize';
import { fontMetrics, type FontMetrics } from '@/lib/type/metrics';
import { FORMAT_TYPES, formatList, RASTER_FORMATS, UPLOAD_RULES, type UploadFormat, type RenamableCode, type UploadKind, type UploadRule } from './rules';

/** An upload refused: the code and message the API answers with (413 for size, 400 otherwise). */
export class UploadRejection extends AppError {
  constructor(code: string, message: string) {
    super(code, message, { status: code === 'too_large' ? 413 : 400 });
  }
}

export interface InspectOptions {
  /** Which row of the upload table applies: what is accepted, and the caps. */
  as: UploadKind;
  /** The name the file arrived with; when it has an extension, it must name what the bytes are. */
  filename?: string;
}

export interface InspectedUpload {
  format: UploadFormat;
  mime: string;
  ext: string;
  /** What is stored: the bytes as uploaded, or the cleaned SVG. */
  stored: Buffer;
  /** Pixels of an image, CSS px of an SVG; null for other files. */
  width: number | null;
  height: number | null;
  /** An SVG's viewBox. */
  viewBox: Box | null;
  /** What an SVG draws (every SVG must draw something); null for other files. */
  drawn: DrawnBounds | null;
  /** What sanitising removed from an SVG, e.g. "element <script>". */
  removed: string[];
  /** A font's metrics, read while checking it. */
  font: FontMetrics | null;
}

/** file-type's names for the formats we keep; an animated PNG is a PNG (PNG, third edition). */
const DETECTED: Record<string, UploadFormat> = {
  png: 'png',
  apng: 'png',
  jpg: 'jpeg',
  webp: 'webp',
  gif: 'gif',
  avif: 'avif',
  pdf: 'pdf',
  woff2: 'woff2',
  woff: 'woff',
  ttf: 'ttf',
  otf: 'otf',
  zip: 'zip',
};

/**
 * The first four bytes of a font: the sfnt version (OpenType spec, "Organization of an OpenType font": 0x00010000,
 * 'OTTO', and Apple's 'true') and the WOFF signatures (W3C WOFF 1.0 §3 'wOFF', WOFF 2.0 §3 'wOF2'). file-type also
 * wants a plausible header after them; a file that starts with a tag but is damaged should still hear "font unreadable".
 */
const FONT_TAGS: Record<string, UploadFormat> = { wOF2: 'woff2', wOFF: 'woff', OTTO: 'otf', '\x00\x01\x00\x00': 'ttf', true: 'ttf' };

/** Markup that has no business inside an image, font or PDF: a sign of a file that is two documents at once. */
const MARKUP = /<script|<html|<\?php|<!doctype\s+html|<body[\s>]|<iframe|<object[\s>]|javascript:/i;
const MB = (n: number) => `${Math.round(n / 1024 / 1024)} MB`;
const extensionOf = (filename: string) => /\.([a-z0-9]{1,8})$/i.exec(filename)?.[1]?.toLowerCase() ?? null;

/** Refuse with the code this kind of upload answers with. */
function rejectAs(rule: UploadRule, code: RenamableCode, message: string): never {
  throw new UploadRejection(rule.codes?.[code] ?? code, message);
}
const reject = (code: string, message: string): never => {
  throw new UploadRejection(code, message);
};

/** The text of a file when it decodes as UTF-8 (an SVG candidate), else null. */
function asText(bytes: Buffer): string | null {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

/** What the bytes are: file-type's answer, else an SVG by its text, else a font by its tag; null when none of ours. */
async function sniffFormat(bytes: Buffer): Promise<{ format: UploadFormat | null; detected: { ext: string; mime: string } | null }> {
  const detected = (await fileTypeFromBuffer(bytes)) ?? null;
  if (detected && DETECTED[detected.ext]) return { format: DETECTED[detected.ext], detected };
  if (detected && detected.ext !== 'xml') return { format: null, detected };
  const text = asText(bytes);
  if (text !== null && /<svg[\s>/]/i.test(text)) return { format: 'svg', detected };
  if (!detected) {
    const tag = FONT_TAGS[bytes.toString('latin1', 0, 4)];
    if (tag && bytes.length >= 4) return { format: tag, detected };
  }
  return { format: null, detected };
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
function checkSingleDocument(format: UploadFormat, bytes: Buffer): void {
  const label = FORMAT_TYPES[format].label;
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

/** Size from the header (pixel cap enforced before decoding), then every pixel decoded, so damage shows now. */
async function inspectImage(rule: UploadRule, format: UploadFormat, bytes: Buffer): Promise<{ width: number; height: number }> {
  const limitInputPixels = Math.max(1, rule.maxPixels); // sharp reads 0 as "no limit"
  try {
    const meta = await sharp(bytes, { limitInputPixels }).metadata();
    if (!meta.width || !meta.height) throw new Error('no size');
    await sharp(bytes, { limitInputPixels, failOn: 'truncated' }).stats();
    return { width: meta.width, height: meta.height };
  } catch (err) {
    if (/pixel limit/i.test(String((err as Error).message))) {
      return rejectAs(rule, 'too_many_pixels', `The image declares more than ${rule.maxPixels / 1e6} million pixels; Plumbline refuses images that large. Export a smaller version.`);
    }
    return rejectAs(rule, 'unreadable_image', `The ${FORMAT_TYPES[format].label} could not be read to the end: it may be truncated or damaged. Export it again.`);
  }
}

/** Inspect one uploaded file for the kind of upload named in `as`; resolves to what will be stored, or throws an UploadRejection. */
export async function inspectUpload(bytes: Buffer, options: InspectOptions): Promise<InspectedUpload> {
  const rule: UploadRule = UPLOAD_RULES[options.as];
  if (bytes.length === 0) rejectAs(rule, 'empty_file', 'The file is empty (0 bytes).');
  if (bytes.length > rule.maxBytes) reject('too_large', `The file is ${MB(bytes.length)}; ${rule.noun.toLowerCase()} can be at most ${MB(rule.maxBytes)}.`);

  const { format, detected } = await sniffFormat(bytes);
  const hint = 'hint' in rule && rule.hint ? ` ${rule.hint}` : '';
  if (!format || !rule.accept.includes(format)) {
    const what = format ? FORMAT_TYPES[format].label : detected ? `${detected.ext.toUpperCase()} (${detected.mime})` : null;
    return rejectAs(rule, 'unsupported_file', `${rule.noun} must be ${formatList(rule.accept)}; this file is ${what ? `a ${what}` : 'none of them'}.${hint}`);
  }
  const ext = options.filename ? extensionOf(options.filename) : null;
  if (ext && !FORMAT_TYPES[format].extensions.includes(ext)) {
    reject('extension_mismatch', `The file is named “.${ext}” but its contents are ${FORMAT_TYPES[format].label}. Rename it to .${FORMAT_TYPES[format].ext} if that is what it should be.`);
  }
  const found: InspectedUpload = { format, mime: FORMAT_TYPES[format].mime, ext: FORMAT_TYPES[format].ext, stored: bytes, width: null, height: null, viewBox: null, drawn: null, removed: [], font: null };

  if (format === 'svg') {
    const clean = sanitizeSvg(bytes.toString('utf8'));
    if (!clean.ok) return reject(clean.error.code, clean.error.message);
    try {
      found.drawn = await drawnBounds(clean.svg);
    } catch (err) {
      if (err instanceof LogoError && err.code !== 'logo_empty') reject(err.code, err.message);
      reject('logo_empty', 'The SVG draws nothing visible.');
    }
    return { ...found, stored: Buffer.from(clean.svg), width: clean.width, height: clean.height, viewBox: clean.viewBox, removed: clean.removed };
  }
  checkSingleDocument(format, bytes);
  if (RASTER_FORMATS.includes(format)) return { ...found, ...(await inspectImage(rule, format, bytes)) };
  if (format === 'pdf') {
    if (!bytes.subarray(Math.max(0, bytes.length - 1024)).toString('latin1').includes('%%EOF')) {
      reject('truncated', 'The PDF has no end-of-file marker: it is truncated. Export it again.');
    }
    if (/\/(JavaScript|JS|Launch)[\s/<(]/.test(bytes.toString('latin1'))) {
      reject('pdf_script', 'The PDF contains scripts or launch actions; Plumbline only keeps PDFs without them. Export it again without interactive features.');
    }
    return found;
  }
  if (format === 'zip') {
    const tail = bytes.subarray(Math.max(0, bytes.length - 65_557));
    if (!tail.includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]))) reject('truncated', 'The ZIP has no central directory at its end: it is truncated. Create it again.');
    return found;
  }
  try {
    return { ...found, font: fontMetrics(bytes) };
  } catch {
    return reject('font_unreadable', `The ${FORMAT_TYPES[format].label} font could not be read: it may be truncated or damaged.`);
  }
}
