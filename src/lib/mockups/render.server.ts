// Mock-ups drawn by Chromium: a PNG for screen (the trimmed pieces side by side) and, for print pieces, a PDF with one
// page per piece at trim + 3 mm bleed on every side, crop marks in the bleed, and TrimBox/BleedBox set (ISO 32000-1 §14.11.2).
import { PDFDocument } from 'pdf-lib';
import type { Page } from 'puppeteer-core';
import { printBrowser, releaseBrowser } from '@/lib/logo/print-files.server';
import { mmToPt } from '@/lib/type/units';
import { AppError } from '@/lib/errors';
import type { MockupLayout } from './compose';
import { BLEED_MM, pageSvg } from './svg';

/** CSS px per mm (CSS Values and Units 4: 96 px = 1 in = 25.4 mm). */
const PX_PER_MM = 96 / 25.4;
/** Longest side of a screen PNG of a print piece, in device pixels. */
const PNG_MAX_SIDE = 3600;

const shell = (fontCss: string, pageCss: string, body: string) =>
  `<!doctype html><html><head><meta charset="utf-8"><style>${fontCss}\n${pageCss}</style></head><body>${body}</body></html>`;

/** Smallest share of its scale size a text may be set at to fit its box. */
export const FIT_FLOOR = 0.7;

/** Text that a brand's larger type scale would clip is set smaller, in small steps down to FIT_FLOOR, so nothing is cut off. */
export function fitText(floor: number): void {
  for (const el of Array.from(document.querySelectorAll<HTMLElement>('foreignObject > div'))) {
    const size = parseFloat(el.style.fontSize);
    for (let scale = 0.96; el.scrollHeight > el.clientHeight + 0.5 && scale >= floor; scale -= 0.04) el.style.fontSize = `${size * scale}px`;
  }
}

/** Loads our own HTML into a fresh page; only data: addresses load (the sources are embedded), fonts settle before drawing. */
async function withPage<T>(html: string, viewport: { width: number; height: number; deviceScaleFactor: number } | null, work: (page: Page) => Promise<T>): Promise<T> {
  let browser;
  try {
    browser = await printBrowser();
  } catch (err) {
    throw new AppError('printer_unavailable', (err as Error).message, { status: 503 });
  }
  const page = await browser.newPage();
  try {
    await page.setRequestInterception(true);
    page.on('request', (request) => (request.url().startsWith('data:') ? request.continue() : request.abort()));
    if (viewport) await page.setViewport(viewport);
    await page.setContent(html, { waitUntil: 'load', timeout: 30_000 });
    await page.evaluate(() => document.fonts.ready.then(() => undefined));
    await page.evaluate(fitText, FIT_FLOOR);
    return await work(page);
  } finally {
    await page.close().catch(() => {});
    releaseBrowser();
  }
}

/** The pieces side by side on a transparent ground, trimmed (no bleed, no marks): what a screen shows. */
export async function mockupPng(layout: MockupLayout, fontCss = ''): Promise<Buffer> {
  const cssPerUnit = layout.unit === 'mm' ? PX_PER_MM : 1;
  const w = layout.trim.width * cssPerUnit;
  const h = layout.trim.height * cssPerUnit;
  const gap = layout.pages.length > 1 ? Math.round(w * 0.06) : 0;
  // Whole CSS px, rounded down: the last fraction of a pixel of the ground is cut rather than left as a transparent hairline.
  const total = { width: Math.floor(w * layout.pages.length + gap * (layout.pages.length - 1)), height: Math.floor(h) };
  // Screen pieces are drawn at their own pixels; paper at about 2 device px per CSS px, within the size cap.
  const scale = layout.unit === 'px' ? 1 : Math.min(2, PNG_MAX_SIDE / Math.max(total.width, total.height));
  const svgs = layout.pages.map((p, i) => pageSvg(layout, p, { width: `${w}px`, height: `${h}px`, label: `${layout.template.name}, ${p.name}` }).replace('<svg ', `<svg style="left:${i * (w + gap)}px" `));
  const html = shell(fontCss, 'html,body{margin:0;padding:0;background:transparent}svg{position:absolute;top:0;display:block}', svgs.join(''));
  return withPage(html, { ...total, deviceScaleFactor: scale }, async (page) =>
    Buffer.from(await page.screenshot({ type: 'png', omitBackground: true, clip: { x: 0, y: 0, ...total } })),
  );
}

/** Page size of a print piece in points: trim + 2 × 3 mm bleed. */
export function bleedPagePt(layout: MockupLayout): { width: number; height: number; bleed: number } {
  return { width: mmToPt(layout.trim.width + 2 * BLEED_MM), height: mmToPt(layout.trim.height + 2 * BLEED_MM), bleed: mmToPt(BLEED_MM) };
}

/** The print PDF: one page per piece at trim + bleed, crop marks in the bleed, trim and bleed boxes recorded. */
export async function mockupPdf(layout: MockupLayout, fontCss = ''): Promise<Buffer> {
  if (layout.unit !== 'mm') throw new AppError('not_print', `${layout.template.name} is a screen piece; it is offered as a PNG only.`, { status: 422 });
  const wMm = layout.trim.width + 2 * BLEED_MM;
  const hMm = layout.trim.height + 2 * BLEED_MM;
  const body = layout.pages
    .map((p) => `<section>${pageSvg(layout, p, { bleed: true, marks: true, width: `${wMm}mm`, height: `${hMm}mm`, label: `${layout.template.name}, ${p.name}` })}</section>`)
    .join('');
  const css = `@page{size:${wMm}mm ${hMm}mm;margin:0}html,body{margin:0;padding:0}section{width:${wMm}mm;height:${hMm}mm;overflow:hidden;break-after:page}section:last-child{break-after:auto}svg{display:block}`;
  const pdf = await withPage(shell(fontCss, css, body), null, async (page) =>
    Buffer.from(await page.pdf({ preferCSSPageSize: true, printBackground: true, margin: { top: 0, right: 0, bottom: 0, left: 0 } })),
  );
  return boxed(pdf, layout);
}

/** Chromium rounds page sizes; each page is set back to the exact bleed size (anchored top left) with its trim box inside. */
async function boxed(pdf: Buffer, layout: MockupLayout): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const { width, height, bleed } = bleedPagePt(layout);
  for (const page of doc.getPages()) {
    const top = page.getMediaBox().y + page.getMediaBox().height;
    const y = top - height;
    page.setMediaBox(0, y, width, height);
    page.setCropBox(0, y, width, height);
    page.setBleedBox(0, y, width, height);
    page.setTrimBox(bleed, y + bleed, width - 2 * bleed, height - 2 * bleed);
  }
  doc.setTitle(`${layout.template.name} (mock-up)`);
  doc.setProducer('Plumbline');
  return Buffer.from(await doc.save({ useObjectStreams: false }));
}
