// The one upload inspector, read against the published file signatures: each file below is made by a general-purpose
// library (sharp/libvips, fontsource's WOFF2, archiver) or by hand, and its first bytes are checked against the standard
// that defines them before the inspector is asked what it is.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { crc32 } from 'node:zlib';
import * as fontkit from 'fontkit';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { inspectUpload, UploadRejection, type InspectOptions } from '@/lib/uploads/inspect.server';
import { acceptAttribute, UPLOAD_RULES } from '@/lib/uploads/rules';

const corpus = (name: string) => readFileSync(join(__dirname, '../fixtures/files', name));
const hex = (bytes: Buffer, n: number) => bytes.subarray(0, n).toString('hex');

/** The code (and status) an upload is refused with, or 'accepted'. */
async function refusal(bytes: Buffer, options: InspectOptions): Promise<{ code: string; status: number } | 'accepted'> {
  try {
    await inspectUpload(bytes, options);
    return 'accepted';
  } catch (err) {
    if (!(err instanceof UploadRejection)) throw err;
    expect(err.message.length).toBeGreaterThan(10);
    return { code: err.code, status: err.status };
  }
}

/** A PNG chunk: length, type, data, CRC-32 over type and data (PNG spec, ISO/IEC 15948 §5.3). */
function chunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const out = Buffer.alloc(body.length + 8);
  out.writeUInt32BE(data.length, 0);
  body.copy(out, 4);
  out.writeUInt32BE(crc32(body), body.length + 4);
  return out;
}

/** A PNG whose IHDR (ISO/IEC 15948 §11.2.2) declares width × height, with one tiny IDAT: a header that lies about its size. */
function pngDeclaring(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 6, 0, 0, 0], 8);
  const signature = Buffer.from('89504e470d0a1a0a', 'hex');
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', Buffer.from('789c030000000001', 'hex')), chunk('IEND', Buffer.alloc(0))]);
}

const pixels = sharp({ create: { width: 40, height: 30, channels: 4, background: '#2b4a3f' } });
const png = await pixels.clone().png().toBuffer();
const jpeg = await pixels.clone().flatten({ background: '#ffffff' }).jpeg().toBuffer();
const webp = await pixels.clone().webp().toBuffer();
const gif = await pixels.clone().gif().toBuffer();
const woff2 = readFileSync('node_modules/@fontsource-variable/source-serif-4/files/source-serif-4-latin-wght-normal.woff2');
const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 40" onload="alert(1)"><script>alert(2)</script><rect x="10" y="10" width="80" height="20" fill="#7a3b69"/></svg>');
const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');

describe('signatures from the standards are read as what they are', () => {
  test.each([
    // PNG signature 89 50 4E 47 0D 0A 1A 0A (PNG spec, W3C / ISO/IEC 15948 §5.2).
    ['PNG', png, 'photo.png', '89504e470d0a1a0a', { format: 'png', mime: 'image/png', ext: 'png', width: 40, height: 30 }],
    // JPEG starts with the SOI marker FF D8 and the next marker's FF (ITU-T T.81 Annex B.1.1.3, B.2.1).
    ['JPEG', jpeg, 'photo.jpeg', 'ffd8ff', { format: 'jpeg', mime: 'image/jpeg', ext: 'jpg', width: 40, height: 30 }],
    // WebP: "RIFF", a 32-bit size, then "WEBP" (RFC 9649 §2.5); only the first four bytes are fixed.
    ['WebP', webp, 'photo.webp', '52494646', { format: 'webp', mime: 'image/webp', ext: 'webp', width: 40, height: 30 }],
    // PDF header "%PDF-" (ISO 32000-1 §7.5.2).
    ['PDF', pdf, 'sheet.pdf', '255044462d', { format: 'pdf', mime: 'application/pdf', ext: 'pdf', width: null, height: null }],
    // WOFF2 signature 0x774F4632 "wOF2" (W3C WOFF File Format 2.0 §3).
    ['WOFF2', woff2, 'serif.woff2', '774f4632', { format: 'woff2', mime: 'font/woff2', ext: 'woff2', width: null, height: null }],
  ])('%s', async (_label, bytes, filename, signature, expected) => {
    expect(hex(bytes, signature.length / 2)).toBe(signature);
    const found = await inspectUpload(bytes, { as: 'shelf', filename });
    expect(found).toMatchObject(expected);
    expect(found.stored).toBe(bytes);
  });

  test('a GIF ("GIF89a", GIF89a specification §17) is a mood-board image, not a shelf file', async () => {
    expect(gif.subarray(0, 6).toString('latin1')).toBe('GIF89a');
    expect(await inspectUpload(gif, { as: 'boardImage', filename: 'swatch.gif' })).toMatchObject({ format: 'gif', mime: 'image/gif', width: 40, height: 30 });
    expect(await refusal(gif, { as: 'shelf', filename: 'swatch.gif' })).toEqual({ code: 'unsupported_file', status: 400 });
  });

  test('a font is opened while it is checked: the metrics agree with fontkit, the reference reader', async () => {
    const found = await inspectUpload(woff2, { as: 'typeface', filename: 'serif.woff2' });
    const reference = fontkit.create(woff2) as fontkit.Font;
    expect(found.font).toMatchObject({ unitsPerEm: reference.unitsPerEm, capHeight: reference.capHeight, family: reference.familyName });
  });

  test('an SVG is recognised by its text, cleaned (OWASP XSS prevention: no script in a served SVG) and measured', async () => {
    const found = await inspectUpload(svg, { as: 'logo', filename: 'mark.svg' });
    expect(found).toMatchObject({ format: 'svg', mime: 'image/svg+xml', width: 100, height: 40, viewBox: { x: 0, y: 0, width: 100, height: 40 } });
    expect(found.removed).toEqual(expect.arrayContaining(['element <script>', 'attribute onload']));
    expect(found.stored.toString()).not.toMatch(/script|onload/i);
    // The rectangle covers x 10–90 and y 10–30 of the 100 × 40 canvas.
    expect(found.drawn!.fraction.x).toBeCloseTo(0.1, 2);
    expect(found.drawn!.fraction.width).toBeCloseTo(0.8, 2);
    expect(found.drawn!.fraction.height).toBeCloseTo(0.5, 2);
  });
});

describe('the name and the kind must agree with the bytes', () => {
  test('PNG bytes named .svg are refused, whatever the upload', async () => {
    const renamed = corpus('wrong-extension.svg');
    expect(hex(renamed, 8)).toBe('89504e470d0a1a0a'); // a PNG (ISO/IEC 15948 §5.2)
    expect(await refusal(renamed, { as: 'shelf', filename: 'logo.svg' })).toEqual({ code: 'extension_mismatch', status: 400 });
    expect(await refusal(renamed, { as: 'logo', filename: 'logo.svg' })).toEqual({ code: 'extension_mismatch', status: 400 });
    expect(await inspectUpload(renamed, { as: 'logo', filename: 'logo.png' })).toMatchObject({ format: 'png' });
  });

  test.each([
    ['an SVG as a mood-board image', svg, 'boardImage', 'mark.svg', 'not_an_image'],
    ['a PNG as a typeface', png, 'typeface', 'font.png', 'unsupported_file'],
    ['a JPEG as a logo', jpeg, 'logo', 'mark.jpg', 'unsupported_file'],
    ['a WOFF2 as a logo', woff2, 'logo', 'serif.woff2', 'unsupported_file'],
    ['plain text as a logo', Buffer.from('hello, this is plain text'), 'logo', 'logo.svg', 'unsupported_file'],
    // "wOF2" (W3C WOFF2 §3) followed by nothing a font reader can use: a damaged font, not an unknown file.
    ['a WOFF2 tag over garbage as a typeface', Buffer.concat([Buffer.from('wOF2'), Buffer.alloc(64, 7)]), 'typeface', 'font.woff2', 'font_unreadable'],
    ['an empty file as a logo', Buffer.alloc(0), 'logo', 'logo.svg', 'empty_file'],
    ['an empty file as a mood-board image', Buffer.alloc(0), 'boardImage', 'photo.png', 'not_an_image'],
  ] as const)('%s is refused (%s)', async (_label, bytes, as, filename, code) => {
    expect(await refusal(bytes, { as, filename })).toEqual({ code, status: 400 });
  });

  test('no name, or a name without an extension, leaves the bytes to speak', async () => {
    expect(await inspectUpload(png, { as: 'logo' })).toMatchObject({ format: 'png' });
    expect(await inspectUpload(png, { as: 'logo', filename: 'mark' })).toMatchObject({ format: 'png' });
  });
});

describe('two documents in one file, damaged files and oversized ones', () => {
  test.each([
    // An HTML page after the PNG's IEND chunk (ISO/IEC 15948 §11.2.5: IEND is the last chunk).
    ['polyglot.png', 'mark.png', 'polyglot'],
    // A ZIP local-file header ("PK\x03\x04", PKWARE APPNOTE §4.3.7) after the JPEG's EOI marker FF D9 (ITU-T T.81 B.2.1).
    ['polyglot.jpg', 'photo.jpg', 'polyglot'],
    // The chunk chain stops before IEND.
    ['truncated.png', 'cut.png', 'truncated'],
    // No EOI marker.
    ['truncated.jpg', 'cut.jpg', 'truncated'],
    // "%PDF-" but no "%%EOF" (ISO 32000-1 §7.5.5).
    ['no-end.pdf', 'brief.pdf', 'truncated'],
    // An OpenAction running JavaScript (ISO 32000-1 §12.6.4.16).
    ['script.pdf', 'brief.pdf', 'pdf_script'],
    // A DOCTYPE with entities ("billion laughs", OWASP XXE prevention).
    ['entity.svg', 'entity.svg', 'svg_entity'],
  ])('%s is refused as %s', async (file, filename, code) => {
    expect(await refusal(corpus(file), { as: 'shelf', filename })).toEqual({ code, status: 400 });
  });

  test('an image that declares more pixels than its kind allows is refused from its header', async () => {
    const bomb = pngDeclaring(10_000, 10_000); // 100 MP, over every cap
    expect(await refusal(bomb, { as: 'shelf', filename: 'bomb.png' })).toEqual({ code: 'too_many_pixels', status: 400 });
    expect(await refusal(bomb, { as: 'logo', filename: 'bomb.png' })).toEqual({ code: 'too_many_pixels', status: 400 });
    // Mood boards have always answered this one as 413 too_large.
    expect(await refusal(bomb, { as: 'boardImage', filename: 'bomb.png' })).toEqual({ code: 'too_large', status: 413 });
    // 7000 × 7000 = 49 MP: over a logo's 40 MP, inside a mood board's 50 MP (the header passes; the dummy pixels then fail to decode).
    const between = pngDeclaring(7000, 7000);
    expect(await refusal(between, { as: 'logo', filename: 'big.png' })).toEqual({ code: 'too_many_pixels', status: 400 });
    expect(await refusal(between, { as: 'boardImage', filename: 'big.png' })).toEqual({ code: 'not_an_image', status: 400 });
  });

  test('a file over its kind\'s byte cap is refused as 413 before it is read', async () => {
    const cap = UPLOAD_RULES.logo.maxBytes;
    const big = Buffer.alloc(cap + 1, 0x20);
    png.copy(big); // a real PNG signature in front, so only the size can refuse it
    expect(await refusal(big, { as: 'logo', filename: 'huge.png' })).toEqual({ code: 'too_large', status: 413 });
    // The shelf's cap is larger: there the same bytes are read, and the spaces after IEND are a second document.
    expect(await refusal(big, { as: 'shelf', filename: 'huge.png' })).toEqual({ code: 'polyglot', status: 400 });
  });
});

test('the file picker offers what the table accepts', () => {
  expect(acceptAttribute('logo')).toBe('.svg,.png');
  expect(acceptAttribute('typeface')).toBe('.woff2,.woff,.ttf,.otf');
});
