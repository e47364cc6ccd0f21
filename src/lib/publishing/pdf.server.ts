// Print-ready PDFs: a pg-boss job renders a version's print page in one warm Chromium; each PDF is kept
// per version and paper size, since a version never changes.
import { existsSync } from 'node:fs';
import { CHROMIUM_PATH, DATABASE_URL, SITE_URL } from 'astro:env/server';
import PgBoss from 'pg-boss';
import puppeteer, { type Browser } from 'puppeteer-core';
import { Brand, GuidelineVersion, PdfExport } from '../../../db/models';
import { storage } from '../storage/index.server';
import { newKey } from '../storage/storage';
import { PRINT_COOKIE, printPass } from './print-grant.server';
import { versionPath } from './snapshot-urls';

export const PAPER_SIZES = ['a4', 'letter'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];
const QUEUE = 'pdf-export';

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

/** Print a page of ours to PDF: backgrounds on, page numbers in the footer, the CSS page size honoured. */
export async function printUrl(url: string, size: PaperSize, cookie?: { name: string; value: string }): Promise<Buffer> {
  const page = await (await warmBrowser()).newPage();
  try {
    if (cookie) await page.setCookie({ ...cookie, url: new URL(url).origin, httpOnly: true });
    await page.goto(url, { waitUntil: 'networkidle0', timeout: 60_000 });
    await page.evaluate(() => document.fonts.ready);
    const pdf = await page.pdf({
      format: size === 'a4' ? 'A4' : 'Letter',
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: '<span></span>',
      footerTemplate:
        '<div style="width:100%;font:8px system-ui,sans-serif;color:#666;padding:0 12mm;display:flex;justify-content:space-between"><span class="title"></span><span><span class="pageNumber"></span> / <span class="totalPages"></span></span></div>',
      margin: { top: '14mm', bottom: '16mm', left: '14mm', right: '14mm' },
    });
    return Buffer.from(pdf);
  } finally {
    await page.close();
  }
}

let boss: Promise<PgBoss> | null = null;

/** pg-boss on our PostgreSQL, with this process working the PDF queue one job at a time. */
function queue(): Promise<PgBoss> {
  boss ??= (async () => {
    const b = new PgBoss({ connectionString: DATABASE_URL, schema: 'pgboss', max: 3 });
    b.on('error', (err) => console.error('[pdf] queue error', err));
    await b.start();
    await b.createQueue(QUEUE);
    await b.work<{ exportId: string }>(QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => renderExport(job.data.exportId));
    return b;
  })();
  return boss;
}

async function renderExport(exportId: string): Promise<void> {
  const job = await PdfExport.findByPk(exportId);
  if (!job) return;
  const version = await GuidelineVersion.findByPk(job.versionId);
  const brand = version && (await Brand.findByPk(version.brandId));
  if (!version || !brand) return;
  await job.update({ state: 'rendering', progress: 20 });
  try {
    const url = `${SITE_URL}${versionPath(brand.slug, version.number)}/print?size=${job.size}`;
    const pdf = await printUrl(url, job.size, { name: PRINT_COOKIE, value: printPass(version.id) });
    await job.update({ progress: 90 });
    const key = newKey(brand.id, 'pdf', 'pdf');
    await storage.put(key, pdf, 'application/pdf');
    await job.update({ state: 'done', progress: 100, storageKey: key, error: null });
  } catch (err) {
    console.error('[pdf] render failed', err);
    await job.update({ state: 'failed', error: String((err as Error).message).slice(0, 500) });
  }
}

export interface PdfStatus {
  state: PdfExport['state'];
  progress: number;
  error: string | null;
  /** True when the server has no working browser to print with (the reason is in `error`). */
  printerMissing?: boolean;
}

/** The PDF of a version at a size: its bytes when ready, otherwise its progress (queued on first ask). */
export async function versionPdf(version: GuidelineVersion, size: PaperSize): Promise<{ pdf: Buffer } | { status: PdfStatus }> {
  const [job, created] = await PdfExport.findOrCreate({ where: { versionId: version.id, size }, defaults: { versionId: version.id, size, state: 'queued', progress: 0, storageKey: null, error: null } });
  if (job.state === 'done' && job.storageKey) {
    const pdf = await storage.get(job.storageKey);
    if (pdf) return { pdf };
  }
  // No browser to print with: say so now, naming it, instead of queueing a job that can only fail.
  const problem = pdfPrinterProblem();
  if (problem) return { status: { state: 'failed', progress: 0, error: problem, printerMissing: true } };
  // A failure is shown for a minute, then the next ask tries again.
  const stale = Date.now() - job.updatedAt.getTime() > 60_000;
  const retry = (job.state === 'failed' && stale) || (job.state === 'done' && !created);
  if (created || retry) {
    if (retry) await job.update({ state: 'queued', progress: 0, error: null });
    await (await queue()).send(QUEUE, { exportId: job.id }, { retryLimit: 1 });
  } else {
    await queue(); // make sure this process works the queue too
  }
  return { status: { state: job.state, progress: job.progress, error: job.error } };
}
