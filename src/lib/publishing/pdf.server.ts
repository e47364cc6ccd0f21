// Print-ready PDFs: the build job (steps/pdf.server.ts) prints a version's built print edition as a book, and its
// presentation as slides, in one warm Chromium; each PDF is written once with the version's other files.
import { existsSync } from 'node:fs';
import { CHROMIUM_PATH } from 'astro:env/server';
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFString } from 'pdf-lib';
import puppeteer, { type Browser, type HTTPRequest, type Page } from 'puppeteer-core';
import { formatLongDate, SITE_LOCALE } from '@/lib/format';
import { log } from '@/lib/log.server';
import { printRequestAllowed } from './print-requests';

/**
 * pdf-lib parses and writes this many objects, then lets the event loop run: a multi-megabyte book is never one long
 * block, so the requests a web process serves while a build prints are not held up (pdf-lib's own default is 100,
 * which costs a timer per 100 objects; a few thousand keeps the pauses short and the yields few).
 */
const PDF_OBJECTS_PER_TICK = 2000;

export const PAPER_SIZES = ['a4', 'letter'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];
/** What a PDF export prints: the print edition on a paper size, or the reveal presentation's 16:9 slides. */
export type PdfEdition = PaperSize | 'slides';

let browser: Promise<Browser> | null = null;
/** The last time Chromium failed to start, remembered for a minute so readers get the reason at once. */
let launchFailure: { at: number; message: string } | null = null;
const LAUNCH_FAILURE_MS = 60_000;

/** Why this server cannot print PDFs right now, in words for the reader; null when it can. */
export function pdfPrinterProblem(): string | null {
  if (!existsSync(CHROMIUM_PATH)) {
    return (
      `This server cannot print PDFs: the browser that prints them, Chromium (Debian's "chromium" package), is not installed at ${CHROMIUM_PATH}. ` +
      'Whoever runs this Plumbline can install it by running `npm start` once as root, or with `apt-get install chromium`.'
    );
  }
  if (launchFailure && Date.now() - launchFailure.at < LAUNCH_FAILURE_MS) {
    return `This server cannot print PDFs: the browser that prints them (Chromium at ${CHROMIUM_PATH}) did not start: ${launchFailure.message}`;
  }
  return null;
}

/** The one warm Chromium of this process, started on first use. */
export function warmBrowser(): Promise<Browser> {
  const problem = pdfPrinterProblem();
  if (problem) return Promise.reject(new Error(problem));
  browser ??= puppeteer
    .launch({
      executablePath: CHROMIUM_PATH,
      headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-dev-shm-usage'],
    })
    .then(
      (b) => {
        launchFailure = null;
        b.on('disconnected', () => (browser = null));
        return b;
      },
      (err: Error) => {
        browser = null;
        launchFailure = { at: Date.now(), message: String(err.message).split('\n')[0].slice(0, 300) };
        throw new Error(pdfPrinterProblem() ?? err.message);
      },
    );
  return browser;
}

export interface BookMeta {
  title: string;
  author: string;
  subject: string;
  keywords: string[];
  published: Date;
}

/**
 * Where Chromium reads a page to print. `built` answers the version's own requests (the page, its CSS, fonts and
 * images) from the files a build wrote, so printing never goes through the web server; without it, or with
 * `serverFallback` for a file the build did not write, an allowed request goes to the server with the print pass.
 */
export interface PrintSource {
  url: string;
  cookie?: { name: string; value: string };
  built?: (url: URL) => Promise<{ body: Buffer; type: string } | null>;
  serverFallback?: boolean;
}

/**
 * A page of the warm Chromium loaded from `source` with scripts off, allowed only the version's own files
 * (printRequestAllowed), fonts settled. `blocked` collects what was refused, for the log.
 */
async function openPrintPage(source: PrintSource): Promise<{ page: Page; blocked: string[] }> {
  const page = await (await warmBrowser()).newPage();
  const blocked: string[] = [];
  const refuse = (request: HTTPRequest) => {
    blocked.push(request.url().slice(0, 120));
    return request.abort('blockedbyclient');
  };
  try {
    await page.setJavaScriptEnabled(false);
    await page.setRequestInterception(true);
    page.on('request', (request) => {
      void (async () => {
        if (!printRequestAllowed(request.url(), request.method(), source.url)) return refuse(request);
        if (source.built && !request.url().startsWith('data:')) {
          const hit = await source.built(new URL(request.url()));
          if (hit) return request.respond({ status: 200, contentType: hit.type, body: hit.body });
          if (!source.serverFallback) return refuse(request);
        }
        return request.continue();
      })().catch((err) => log.warn({ err, url: request.url().slice(0, 120) }, 'pdf: a print request failed'));
    });
    if (source.cookie) await page.setCookie({ ...source.cookie, url: new URL(source.url).origin, httpOnly: true });
    await page.goto(source.url, { waitUntil: 'load', timeout: 60_000 });
    await page.evaluate(() => document.fonts.ready.then(() => undefined));
    return { page, blocked };
  } catch (err) {
    await page.close();
    throw err;
  }
}

/**
 * Print a version's print edition as a book, in two passes on one loaded page: the body first (running heads,
 * folios from 1, an outline from its section headings), then the cover and contents with the page each section
 * starts on, read back from the body's outline; pdf-lib puts the front matter before the body and sets the metadata.
 * Chromium may fetch only that version's own files (printRequestAllowed); scripts never run.
 */
export async function printBook(source: PrintSource, meta: BookMeta, onProgress?: (percent: number) => Promise<unknown>): Promise<Buffer> {
  const t0 = performance.now();
  const { page, blocked } = await openPrintPage(source);
  const times: number[] = [];
  try {
    await page.evaluate(() => void (document.documentElement.dataset.part = 'body'));
    const titles = await page.evaluate(() => [...document.querySelectorAll('.print-body section[data-print-page] > header > h1')].map((h) => h.textContent ?? ''));
    times.push(performance.now());
    const body = await page.pdf({ preferCSSPageSize: true, printBackground: true, outline: true, tagged: true, timeout: 120_000 });
    times.push(performance.now());
    await onProgress?.(60);
    const book = await PDFDocument.load(body, { updateMetadata: false, parseSpeed: PDF_OBJECTS_PER_TICK });
    const starts = sectionStarts(book, titles);
    await page.evaluate((pages: number[]) => {
      document.querySelectorAll<HTMLElement>('[data-contents-page]').forEach((el, i) => (el.textContent = pages[i] ? String(pages[i]) : ''));
      // The body is not in this pass, so the rows link to a marker address that bindBook() turns into page jumps.
      document.querySelectorAll<HTMLAnchorElement>('a[data-contents-link]').forEach((a) => (a.href = `https://contents.invalid/${a.dataset.contentsLink}`));
      document.documentElement.dataset.part = 'front';
    }, starts.map((p) => p + 1));
    const front = await PDFDocument.load(await page.pdf({ preferCSSPageSize: true, printBackground: true, tagged: false, timeout: 60_000 }), { parseSpeed: PDF_OBJECTS_PER_TICK });
    times.push(performance.now());
    const path = new URL(source.url).pathname;
    if (blocked.length) log.warn({ path, blocked: blocked.length, first: blocked.slice(0, 3) }, 'pdf: requests blocked while printing');
    const bound = Buffer.from(await bindBook(book, front, starts, meta));
    const ms = (a: number, b: number) => Math.round(b - a);
    log.info({ path, loadMs: ms(t0, times[0]), bodyMs: ms(times[0], times[1]), frontMs: ms(times[1], times[2]), bindMs: ms(times[2], performance.now()) }, 'pdf: printed');
    return bound;
  } finally {
    await page.close();
  }
}

/**
 * Print the reveal presentation: one 16:9 page per slide (the page size is the presentation's own @page rule),
 * under the same rules as the book: scripts off, only the version's own files, then the metadata set by pdf-lib.
 */
export async function printSlides(source: PrintSource, meta: BookMeta): Promise<Buffer> {
  const { page, blocked } = await openPrintPage(source);
  try {
    if (blocked.length) log.warn({ path: new URL(source.url).pathname, blocked: blocked.length, first: blocked.slice(0, 3) }, 'pdf: requests blocked while printing slides');
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true, tagged: true, timeout: 120_000 });
    const doc = await PDFDocument.load(pdf, { updateMetadata: false, parseSpeed: PDF_OBJECTS_PER_TICK });
    describe(doc, meta);
    return Buffer.from(await doc.save({ objectsPerTick: PDF_OBJECTS_PER_TICK }));
  } finally {
    await page.close();
  }
}

/**
 * The body page index (0-based) where each section starts, read from the outline Chromium wrote: its top-level
 * entries are the section headings (<h1>), matched to `titles` in order, since rich-text headings placed before
 * the first section are top-level entries too. A section not found gets -1 (its contents row shows no number).
 */
function sectionStarts(book: PDFDocument, titles: string[]): number[] {
  const pageIndex = new Map(book.getPages().map((p, i) => [p.ref.toString(), i]));
  const entries: { title: string; page: number }[] = [];
  const outlines = book.catalog.lookupMaybe(PDFName.of('Outlines'), PDFDict);
  let item = outlines?.lookupMaybe(PDFName.of('First'), PDFDict);
  while (item) {
    const target = item.lookupMaybe(PDFName.of('Dest'), PDFArray)?.get(0);
    const title = item.lookupMaybe(PDFName.of('Title'), PDFString, PDFHexString)?.decodeText() ?? '';
    entries.push({ title: normalise(title), page: target instanceof PDFRef ? (pageIndex.get(target.toString()) ?? -1) : -1 });
    item = item.lookupMaybe(PDFName.of('Next'), PDFDict);
  }
  let next = 0;
  return titles.map((title) => {
    const found = entries.findIndex((e, i) => i >= next && e.title === normalise(title));
    if (found < 0) return -1;
    next = found + 1;
    return entries[found].page;
  });
}

const normalise = (text: string) => text.replace(/\s+/g, ' ').trim();

/** Title, author, subject, keywords, dates and language in the document information (ISO 32000-1 §14.3.3). */
function describe(doc: PDFDocument, meta: BookMeta): void {
  doc.setTitle(meta.title, { showInWindowTitleBar: true });
  doc.setAuthor(meta.author);
  doc.setSubject(meta.subject);
  doc.setKeywords(meta.keywords);
  doc.setCreator('Plumbline');
  doc.setProducer('Plumbline (Chromium and pdf-lib)');
  doc.setCreationDate(meta.published);
  doc.setModificationDate(new Date());
  doc.setLanguage('en');
}

/** Front matter before the body, contents links pointed at their pages, page labels i, ii, 1, 2…, and metadata. */
async function bindBook(book: PDFDocument, front: PDFDocument, starts: number[], meta: BookMeta): Promise<Uint8Array> {
  const bodyPages = book.getPages();
  const copied = await book.copyPages(front, front.getPageIndices());
  copied.forEach((p, i) => book.insertPage(i, p));
  // The contents rows link to https://contents.invalid/<n> in the front pass; here each becomes a jump to its page.
  for (const p of copied) {
    const annots = p.node.lookupMaybe(PDFName.of('Annots'), PDFArray);
    for (let i = 0; annots && i < annots.size(); i++) {
      const annot = annots.lookupMaybe(i, PDFDict);
      const uri = annot?.lookupMaybe(PDFName.of('A'), PDFDict)?.lookupMaybe(PDFName.of('URI'), PDFString, PDFHexString)?.decodeText();
      const n = Number(uri?.match(/^https:\/\/contents\.invalid\/(\d+)$/)?.[1] ?? NaN);
      const target = bodyPages[starts[n]];
      if (!annot || !uri?.startsWith('https://contents.invalid/')) continue;
      annot.delete(PDFName.of('A'));
      if (target) annot.set(PDFName.of('Dest'), book.context.obj([target.ref, PDFName.of('Fit')]));
    }
  }
  book.catalog.set(PDFName.of('PageLabels'), book.context.obj({ Nums: [0, { S: PDFName.of('r') }, copied.length, { S: PDFName.of('D') }] }));
  describe(book, meta);
  return book.save({ objectsPerTick: PDF_OBJECTS_PER_TICK });
}

/** Title, author (the studio), subject and keywords of a version's PDF. */
export function bookMeta(brandName: string, studioName: string, number: number, published: Date): BookMeta {
  const date = formatLongDate(published, SITE_LOCALE);
  return {
    title: `${brandName} brand guidelines, version ${number}`,
    author: studioName,
    subject: `How to use the ${brandName} identity: logo, colour, type and imagery. Version ${number}, published ${date}.`,
    keywords: [brandName, 'brand guidelines', `version ${number}`],
    published,
  };
}

/** Title, author and subject of a version's presentation PDF. */
export function slidesMeta(brandName: string, studioName: string, number: number, published: Date): BookMeta {
  return {
    title: `${brandName}: the identity, version ${number}`,
    author: studioName,
    subject: `The ${brandName} identity in slides: logo, mark, colour, type and more. Version ${number}, published ${formatLongDate(published, SITE_LOCALE)}.`,
    keywords: [brandName, 'brand identity', 'presentation', `version ${number}`],
    published,
  };
}
