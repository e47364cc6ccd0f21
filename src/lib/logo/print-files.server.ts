// Print-ready vector files of an SVG logo: Chromium prints the SVG onto one PDF page the size of the artwork's drawn
// bounds (paths stay paths), and Ghostscript turns that page into CMYK (pdfwrite) and EPS (eps2write).
// Only SVG logos get these: a PDF or EPS around a raster would only wrap pixels.
// Settings are read from the environment here (CHROMIUM_PATH, GHOSTSCRIPT_PATH) because the benchmark shares this code.
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFNumber } from 'pdf-lib';
import puppeteer, { type Browser } from 'puppeteer-core';
import { plainCmyk } from '@/lib/color/values';
import type { Box } from './geometry';
import { LogoError } from './errors';
import { toSanitizedSvg } from './sanitize';

const run = promisify(execFile);

export type PrintFileFormat = 'pdf' | 'eps';
export type PrintColorSpace = 'rgb' | 'cmyk';

/** 1 CSS px = 0.75 pt (CSS Values and Units: 1 in = 96 px = 72 pt). */
const PT_PER_PX = 0.75;
const IDLE_CLOSE_MS = 30_000;

const chromiumPath = () => process.env.CHROMIUM_PATH || '/usr/bin/chromium';
const ghostscriptPath = () => process.env.GHOSTSCRIPT_PATH || '/usr/bin/gs';

let browser: Promise<Browser> | null = null;
let idle: NodeJS.Timeout | null = null;

/** A Chromium for print files and mock-ups, started on first use and closed after half a minute without work. */
export function printBrowser(): Promise<Browser> {
  if (!existsSync(chromiumPath())) throw new LogoError('logo_unreadable', `Print files need Chromium at ${chromiumPath()} (Debian's "chromium" package).`);
  if (idle) clearTimeout(idle);
  browser ??= puppeteer
    .launch({ executablePath: chromiumPath(), headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run', '--disable-dev-shm-usage'] })
    .then((b) => {
      b.on('disconnected', () => (browser = null));
      return b;
    });
  return browser;
}

export function releaseBrowser() {
  if (idle) clearTimeout(idle);
  idle = setTimeout(() => {
    const closing = browser;
    browser = null;
    void closing?.then((b) => b.close()).catch(() => {});
  }, IDLE_CLOSE_MS);
  idle.unref();
}

/** The artwork's box in viewBox units and its size in pt: the drawn bounds (fractions of the canvas), or the whole canvas. */
export function artworkBox(svgText: string, drawn: Box | null): { viewBox: Box; widthPt: number; heightPt: number } {
  const clean = toSanitizedSvg(svgText);
  const vb = clean.viewBox;
  const f = drawn ?? { x: 0, y: 0, width: 1, height: 1 };
  const viewBox = { x: vb.x + f.x * vb.width, y: vb.y + f.y * vb.height, width: f.width * vb.width, height: f.height * vb.height };
  return { viewBox, widthPt: f.width * clean.width * PT_PER_PX, heightPt: f.height * clean.height * PT_PER_PX };
}

/** The SVG printed by Chromium onto one RGB PDF page exactly the size of the artwork; vectors stay vectors. */
export async function vectorPdf(svgText: string, drawn: Box | null): Promise<Buffer> {
  const clean = toSanitizedSvg(svgText);
  const { viewBox, widthPt, heightPt } = artworkBox(clean.svg, drawn);
  const w = widthPt / PT_PER_PX;
  const h = heightPt / PT_PER_PX;
  const svg = clean.svg.replace(/^<svg\b([^>]*)>/i, (_m, attrs: string) => {
    const rest = attrs.replace(/\s(width|height|viewBox|preserveAspectRatio|x|y)\s*=\s*"[^"]*"/gi, '');
    return `<svg${rest} width="${w}" height="${h}" viewBox="${viewBox.x} ${viewBox.y} ${viewBox.width} ${viewBox.height}" preserveAspectRatio="none">`;
  });
  const html = `<!doctype html><html><head><meta charset="utf-8"><style>@page{size:${w}px ${h}px;margin:0}html,body{margin:0;padding:0;overflow:hidden;background:transparent}svg{display:block}</style></head><body>${svg}</body></html>`;
  const page = await (await printBrowser()).newPage();
  try {
    await page.setJavaScriptEnabled(false);
    await page.setRequestInterception(true);
    // The sanitised SVG refers to nothing outside itself; refuse anything else all the same.
    page.on('request', (request) => (request.url().startsWith('data:') ? request.continue() : request.abort()));
    await page.setContent(html, { waitUntil: 'load', timeout: 30_000 });
    const pdf = await page.pdf({ width: `${w}px`, height: `${h}px`, printBackground: true, pageRanges: '1', margin: { top: 0, right: 0, bottom: 0, left: 0 } });
    return await fitPage(Buffer.from(pdf), widthPt, heightPt);
  } finally {
    await page.close().catch(() => {});
    releaseBrowser();
  }
}

/**
 * Chromium rounds the page to whole 1/300 in; the media and trim boxes are set back to the artwork's exact size,
 * anchored at the top left where Chromium draws from.
 */
async function fitPage(pdf: Buffer, widthPt: number, heightPt: number): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const page = doc.getPage(0);
  const { height } = page.getMediaBox();
  for (const set of [page.setMediaBox, page.setCropBox, page.setTrimBox]) set.call(page, 0, height - heightPt, widthPt, heightPt);
  return Buffer.from(await doc.save({ useObjectStreams: false }));
}

/**
 * Ghostscript 10 rasterises an RGB shading when it converts to CMYK; axial and radial shadings with a two-colour
 * interpolation (what Chromium writes for SVG gradients) are turned into DeviceCMYK here first, by the plain formula
 * (common practice), so they stay vector.
 */
async function cmykShadings(pdf: Buffer): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const toCmyk = (rgb: PDFArray | undefined) => {
    if (!(rgb instanceof PDFArray) || rgb.size() !== 3) return null;
    const [r, g, b] = [0, 1, 2].map((i) => Math.round((rgb.get(i) as PDFNumber).asNumber() * 255));
    const hex = `#${[r, g, b].map((v) => Math.max(0, Math.min(255, v)).toString(16).padStart(2, '0')).join('')}`;
    return doc.context.obj(plainCmyk(hex).map((v) => v / 100));
  };
  const visit = (dict: PDFDict) => {
    if (!dict.get(PDFName.of('ShadingType')) || dict.get(PDFName.of('ColorSpace')) !== PDFName.of('DeviceRGB')) return;
    const fn = dict.lookup(PDFName.of('Function'));
    const fns = fn instanceof PDFArray ? [] : fn instanceof PDFDict ? [fn, ...stitched(fn)] : [];
    if (!fns.length || fns.some((f) => f.lookup(PDFName.of('FunctionType'), PDFNumber).asNumber() === 0)) return;
    for (const f of fns) {
      for (const key of ['C0', 'C1']) {
        const cmyk = toCmyk(f.lookup(PDFName.of(key)) as PDFArray | undefined);
        if (cmyk) f.set(PDFName.of(key), cmyk);
        else if (f.lookup(PDFName.of('FunctionType'), PDFNumber).asNumber() === 2) f.set(PDFName.of(key), doc.context.obj(key === 'C0' ? [0, 0, 0, 0] : [0, 0, 0, 1]));
      }
    }
    dict.set(PDFName.of('ColorSpace'), PDFName.of('DeviceCMYK'));
  };
  const stitched = (fn: PDFDict): PDFDict[] => {
    const parts = fn.lookup(PDFName.of('Functions'));
    return parts instanceof PDFArray ? parts.asArray().map((p) => doc.context.lookup(p)).filter((p): p is PDFDict => p instanceof PDFDict) : [];
  };
  const walk = (obj: unknown, seen: Set<unknown>) => {
    if (!(obj instanceof PDFDict) || seen.has(obj)) return;
    seen.add(obj);
    visit(obj);
    for (const [, value] of obj.entries()) walk(value instanceof PDFDict ? value : doc.context.lookup(value), seen);
  };
  const seen = new Set<unknown>();
  for (const [, obj] of doc.context.enumerateIndirectObjects()) walk(obj instanceof PDFDict ? obj : (obj as { dict?: PDFDict }).dict, seen);
  return Buffer.from(await doc.save({ useObjectStreams: false }));
}

/** Ghostscript over one PDF: CMYK PDF (pdfwrite) or EPS (eps2write), RGB or CMYK. */
async function ghostscript(pdf: Buffer, format: PrintFileFormat, colorSpace: PrintColorSpace): Promise<Buffer> {
  if (!existsSync(ghostscriptPath())) throw new LogoError('logo_unreadable', `Print files need Ghostscript at ${ghostscriptPath()} (Debian's "ghostscript" package).`);
  const dir = await mkdtemp(join(tmpdir(), 'plumbline-print-'));
  try {
    const input = join(dir, 'in.pdf');
    const output = join(dir, `out.${format}`);
    await writeFile(input, colorSpace === 'cmyk' ? await cmykShadings(pdf) : pdf);
    const colour = colorSpace === 'cmyk' ? ['-sColorConversionStrategy=CMYK', '-sProcessColorModel=DeviceCMYK'] : ['-sColorConversionStrategy=RGB', '-sProcessColorModel=DeviceRGB'];
    const device = format === 'pdf' ? ['-sDEVICE=pdfwrite', '-dCompatibilityLevel=1.6'] : ['-sDEVICE=eps2write'];
    await run(ghostscriptPath(), ['-dSAFER', '-dBATCH', '-dNOPAUSE', '-dQUIET', '-dNOCACHE', ...device, ...colour, `-sOutputFile=${output}`, input], { timeout: 60_000 });
    return await readFile(output);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/**
 * A print-ready vector file of an SVG logo: PDF or EPS, RGB or CMYK, one page the size of its drawn bounds.
 * CMYK values come from Ghostscript's default conversion (a formula, not the printer's profile): proof on press.
 */
export async function logoPrintFile(svgText: string, drawn: Box | null, format: PrintFileFormat, colorSpace: PrintColorSpace): Promise<Buffer> {
  const pdf = await vectorPdf(svgText, drawn);
  if (format === 'pdf' && colorSpace === 'rgb') return pdf;
  return ghostscript(pdf, format, colorSpace);
}
