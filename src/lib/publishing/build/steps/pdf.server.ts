// Build step: the print-ready PDFs (A4 and Letter books, the 16:9 slides), printed by the warm Chromium from the
// pages this build already wrote: every request the page makes under the version is answered from the writer's
// entries, so printing reads exactly the files the version serves and never goes through the web server.
import { SITE_URL } from 'astro:env/server';
import { Brand, GuidelineVersion, Studio } from '@db/models';
import { log } from '@/lib/log.server';
import { bookMeta, PAPER_SIZES, pdfPrinterProblem, printBook, printSlides, slidesMeta, type PrintSource } from '@/lib/publishing/pdf.server';
import { PRINT_COOKIE, printPass } from '@/lib/publishing/print-grant.server';
import { versionPath } from '@/lib/publishing/snapshot-urls';
import { BuildBlocked, filePath, pdfPath, presentationPath, printPath, type BuildContext, type BuildStepDefinition } from '../contract';

/** Where Chromium reads `pagePath` of this build: from the built files, or (page not built) from the server. */
function printSource(ctx: BuildContext, pagePath: string, url: string): PrintSource {
  const root = `${new URL(SITE_URL).origin}${versionPath(ctx.slug, ctx.number)}/`;
  const built = async (requested: URL) => {
    if (!requested.href.startsWith(root)) return null;
    const path = filePath(requested.pathname.slice(new URL(root).pathname.length), requested.search);
    const entry = ctx.writer.entry(path);
    const body = entry && (await ctx.writer.read(path));
    return entry && body ? { body, type: entry.type } : null;
  };
  if (ctx.writer.entry(pagePath)) return { url, built };
  // Until a pages step writes the print pages, they are read from the server with the print pass (the old way).
  log.warn({ versionId: ctx.versionId, page: pagePath }, 'build: print page not built; printing it from the server');
  return { url, built, serverFallback: true, cookie: { name: PRINT_COOKIE, value: printPass(ctx.versionId) } };
}

export const pdfStep: BuildStepDefinition = {
  id: 'pdf',
  label: 'Print-ready PDFs',
  async run(ctx) {
    const problem = pdfPrinterProblem();
    if (problem) throw new BuildBlocked(problem);
    const version = await GuidelineVersion.findByPk(ctx.versionId, { attributes: ['publishedAt'] });
    const brand = await Brand.findByPk(ctx.brandId, { attributes: ['name', 'studioId'] });
    if (!version || !brand) throw new Error(`version ${ctx.number} is gone`);
    const author = (await Studio.findByPk(brand.studioId, { attributes: ['name'] }))?.name ?? brand.name;
    const base = `${new URL(SITE_URL).origin}${versionPath(ctx.slug, ctx.number)}`;
    // The three print at once in separate tabs of the one warm Chromium; each is written as it is done.
    let written = 0;
    const made = async (path: string, pdf: Promise<Buffer>) => {
      await ctx.writer.write(path, await pdf, 'application/pdf');
      await ctx.progress(++written);
    };
    // Settled, not raced: the step ends only when no tab is still printing into this build.
    const outcomes = await Promise.allSettled([
      ...PAPER_SIZES.map((size) => made(pdfPath(size), printBook(printSource(ctx, printPath(size), `${base}/print?size=${size}`), bookMeta(brand.name, author, ctx.number, version.publishedAt)))),
      made(pdfPath('slides'), printSlides(printSource(ctx, presentationPath('print'), `${base}/presentation?print`), slidesMeta(brand.name, author, ctx.number, version.publishedAt))),
    ]);
    const failure = outcomes.find((o): o is PromiseRejectedResult => o.status === 'rejected');
    if (failure) throw failure.reason;
  },
};
