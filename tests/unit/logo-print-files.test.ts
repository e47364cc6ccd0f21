// Print-ready vector files, read back with a general-purpose PDF library (pdf-lib) and checked against the PDF 1.7
// specification (ISO 32000-1: §8.5 path operators m l c re h f S; §8.6.8 colour operators rg/RG for DeviceRGB and
// k/K for DeviceCMYK; §8.9 image XObjects /Subtype /Image) and the EPS convention of Adobe's Encapsulated PostScript
// File Format Specification 3.0 (%%BoundingBox: llx lly urx ury in points). Needs Chromium and Ghostscript.
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { decodePDFRawStream, PDFDocument, PDFRawStream, PDFName } from 'pdf-lib';
import sharp from 'sharp';
import { beforeAll, describe, expect, test } from 'vitest';
import { drawnBounds } from '@/lib/logo/bounds.server';
import { artworkBox, logoPrintFile } from '@/lib/logo/print-files.server';

const fixture = (name: string) => readFileSync(join(__dirname, '../fixtures/knockout', name), 'utf8');

/** Every stream of the file decoded to text, and whether any object is an image XObject. */
async function readBack(pdf: Buffer) {
  const doc = await PDFDocument.load(pdf);
  const streams: string[] = [];
  let images = 0;
  for (const [, obj] of doc.context.enumerateIndirectObjects()) {
    if (!(obj instanceof PDFRawStream)) continue;
    if (obj.dict.get(PDFName.of('Subtype')) === PDFName.of('Image')) images++;
    const type = obj.dict.get(PDFName.of('Type'));
    if (type === PDFName.of('Metadata') || type === PDFName.of('XRef')) continue;
    try {
      streams.push(Buffer.from(decodePDFRawStream(obj).decode()).toString('latin1'));
    } catch {
      // fonts and other binary streams are of no interest here
    }
  }
  const page = doc.getPage(0);
  return { pages: doc.getPageCount(), media: page.getMediaBox(), trim: page.getTrimBox(), content: streams.join('\n'), images };
}

const cases = [
  { name: 'disc-tree.svg', label: 'a navy disc with a light tree' },
  { name: 'ring.svg', label: 'a ring with a gradient dot' },
];

describe.each(cases)('print files of $label', ({ name }) => {
  const svg = fixture(name);
  let box: { widthPt: number; heightPt: number };
  let drawn: Awaited<ReturnType<typeof drawnBounds>>['fraction'];
  beforeAll(async () => {
    drawn = (await drawnBounds(Buffer.from(svg))).fraction;
    box = artworkBox(svg, drawn);
  });

  test('the artwork box is the drawn disc: radius 45 in a 100 px square = 90 px = 67.5 pt (CSS: 96 px = 72 pt)', () => {
    // The fixture's own geometry; the bounds are measured on a raster, so within a fifth of a point.
    expect(Math.abs(box.widthPt - 67.5)).toBeLessThan(0.2);
    expect(Math.abs(box.heightPt - 67.5)).toBeLessThan(0.2);
  });

  test('the RGB PDF is one page the size of the artwork, drawn with paths in RGB, no images', async () => {
    const pdf = await readBack(await logoPrintFile(svg, drawn, 'pdf', 'rgb'));
    expect(pdf.pages).toBe(1);
    expect(pdf.media.width).toBeCloseTo(box.widthPt, 2);
    expect(pdf.media.height).toBeCloseTo(box.heightPt, 2);
    expect(pdf.trim.width).toBeCloseTo(box.widthPt, 2);
    expect(pdf.images).toBe(0);
    expect(pdf.content).toMatch(/\s(re|c|l)\s/);
    expect(pdf.content).toMatch(/\srg\b/);
    expect(pdf.content).not.toMatch(/\sk\b/);
  }, 60_000);

  test('the CMYK PDF keeps the page and the vectors, its colours in DeviceCMYK (k), none in RGB', async () => {
    const pdf = await readBack(await logoPrintFile(svg, drawn, 'pdf', 'cmyk'));
    expect(pdf.pages).toBe(1);
    expect(pdf.media.width).toBeCloseTo(box.widthPt, 1);
    expect(pdf.media.height).toBeCloseTo(box.heightPt, 1);
    expect(pdf.images).toBe(0);
    expect(pdf.content).toMatch(/\s(re|c|l)\s/);
    expect(pdf.content).toMatch(/\sk\b/);
    expect(pdf.content).not.toMatch(/\srg\b/);
  }, 60_000);

  test('the EPS has a bounding box the size of the artwork and draws back at that size', async () => {
    const eps = (await logoPrintFile(svg, drawn, 'eps', 'cmyk')).toString('latin1');
    expect(eps.startsWith('%!PS-Adobe-3.0 EPSF-3.0')).toBe(true);
    const hi = /%%HiResBoundingBox:\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)/.exec(eps)!.slice(1).map(Number);
    const whole = /%%BoundingBox:\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)/.exec(eps)!.slice(1).map(Number);
    // Ghostscript measures the marks it draws: within half a point of the page (anti-aliasing of the bounds scan).
    expect(Math.abs(hi[2] - hi[0] - box.widthPt)).toBeLessThan(0.5);
    expect(Math.abs(hi[3] - hi[1] - box.heightPt)).toBeLessThan(0.5);
    expect(Math.abs(whole[2] - whole[0] - box.widthPt)).toBeLessThanOrEqual(1.5);
    // Ghostscript reads the EPS back cropped to its box: 72 dpi gives one pixel per point.
    const png = execFileSync('/usr/bin/gs', ['-dSAFER', '-dBATCH', '-dNOPAUSE', '-dQUIET', '-dEPSCrop', '-sDEVICE=png16m', '-r72', '-sOutputFile=-', '-'], { input: Buffer.from(eps, 'latin1') });
    const meta = await sharp(png).metadata();
    expect(Math.abs(meta.width! - box.widthPt)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(meta.height! - box.heightPt)).toBeLessThanOrEqual(1.5);
  }, 60_000);
});

test('the RGB PDF drawn back by Ghostscript shows the logo: navy disc, light tree (pixel sampling)', async () => {
  const svg = fixture('disc-tree.svg');
  const pdf = await logoPrintFile(svg, null, 'pdf', 'rgb');
  const png = execFileSync('/usr/bin/gs', ['-dSAFER', '-dBATCH', '-dNOPAUSE', '-dQUIET', '-sDEVICE=png16m', '-r144', '-sOutputFile=-', '-'], { input: pdf });
  const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
  const px = (fx: number, fy: number) => {
    const at = (Math.round(fy * info.height) * info.width + Math.round(fx * info.width)) * info.channels;
    return Array.from(data.subarray(at, at + 3));
  };
  // 100 units = 100 px = 75 pt (CSS: 96 px per inch, 72 pt per inch) → 150 px at 144 dpi.
  expect(info.width).toBe(150);
  expect(px(0.15, 0.5).map((v, i) => Math.abs(v - [0x1d, 0x2b, 0x53][i]) <= 3)).toEqual([true, true, true]);
  expect(px(0.5, 0.4).map((v, i) => Math.abs(v - [0xf4, 0xef, 0xe3][i]) <= 3)).toEqual([true, true, true]);
}, 60_000);
