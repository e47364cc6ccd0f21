// The PDF address of a version: the built file when the version is ready (streamed from storage with its manifest
// ETag), otherwise a progress page (or JSON) that waits for the version's build.
import type { APIContext } from 'astro';
import { GuidelineVersion } from '@db/models';
import { notSharedPage, simplePage, siteAccess, type SiteAccess } from './site-access.server';
import { PAPER_SIZES, pdfPrinterProblem, type PaperSize, type PdfEdition } from './pdf.server';
import { pdfPath } from './build/contract';
import { manifestEntry, sendBuilt } from './build/serve.server';
import { ApiError, errorResponse } from '@/lib/http/api';
import { escapeHtml } from '@/lib/safe/escape';
import { noteRead } from '@/lib/insights/site-read.server';

export interface PdfStatus {
  state: 'queued' | 'rendering' | 'failed';
  progress: number;
  error: string | null;
  /** True when the server has no working browser to print with (the reason is in `error`). */
  printerMissing?: boolean;
}

/** Where a version that is not ready stands, as the PDF address reports it. */
function buildStatus(version: GuidelineVersion): PdfStatus {
  if (version.state === 'failed') {
    const printerMissing = pdfPrinterProblem() !== null && (version.buildError ?? '').includes('Chromium');
    return { state: 'failed', progress: 0, error: version.buildError ?? 'the build failed', printerMissing };
  }
  const steps = version.buildSteps ?? [];
  const done = steps.filter((s) => s.state === 'done').length;
  const printing = steps.some((s) => s.id === 'pdf' && s.state === 'running');
  return { state: printing ? 'rendering' : 'queued', progress: steps.length ? Math.round((100 * done) / steps.length) : 0, error: null };
}

/** Answer GET …/guideline.pdf?size=a4|letter for the version `number` (latest when null). */
export async function pdfResponse(context: APIContext, number: number | null): Promise<Response> {
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const size = (context.url.searchParams.get('size') ?? 'a4').toLowerCase();
  if (!PAPER_SIZES.includes(size as PaperSize)) {
    return errorResponse(new ApiError(400, 'invalid_input', 'Choose a paper size: a4 or letter.'));
  }
  return editionResponse(context, access, size as PaperSize, `${access.brand.slug}-guidelines-v${access.version.number}-${size}.pdf`);
}

/**
 * Answer GET …/presentation.pdf for the version `number` (latest when null): the reveal presentation as 16:9 pages,
 * for members and for share links that include the presentation.
 */
export async function presentationPdfResponse(context: APIContext, number: number | null): Promise<Response> {
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  if (!access.canPresent) return notSharedPage();
  return editionResponse(context, access, 'slides', `${access.brand.slug}-identity-v${access.version.number}.pdf`);
}

/** The file when the version is built, otherwise its progress as JSON or a page that waits for it. */
async function editionResponse(context: APIContext, access: SiteAccess, edition: PdfEdition, filename: string): Promise<Response> {
  const wantsJson = (context.request.headers.get('accept') ?? '').includes('application/json');
  // A version not ready when the access check looked (it may hold a row a moment old) is read again.
  const version = access.version.state === 'ready' ? access.version : ((await GuidelineVersion.findByPk(access.version.id, { attributes: ['id', 'number', 'state', 'manifest', 'buildSteps', 'buildError'] })) ?? access.version);
  if (version.state === 'ready') {
    const entry = manifestEntry(version.manifest, pdfPath(edition));
    if (!entry) return simplePage(404, 'No PDF for this version', 'This version was built without this PDF.');
    const sent = await sendBuilt(context.request, entry, { 'content-disposition': `inline; filename="${filename}"`, 'cache-control': 'private, max-age=3600' });
    return noteRead(context, access, 'pdf', pdfPath(edition), sent);
  }
  const status = buildStatus(version);
  const failedStatus = status.printerMissing ? 503 : 500;
  if (wantsJson) return Response.json(status, { status: status.state === 'failed' ? failedStatus : 202, headers: { 'cache-control': 'no-store' } });
  if (status.printerMissing) return simplePage(503, 'PDFs cannot be printed on this server', status.error ?? 'The browser that prints PDFs is missing.');
  if (status.state === 'failed') return simplePage(500, 'The PDF could not be made', `Plumbline could not build this version: ${status.error ?? 'unknown error'}. The studio can try the build again from the publishing page.`);
  return new Response(progressPage(access.brand.name, version.number, edition), {
    status: 202,
    headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' },
  });
}

const progressPage = (brand: string, number: number, edition: PdfEdition) => `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Preparing the PDF</title><style>body{font-family:system-ui,sans-serif;background:#f8f6f2;color:#211e1a;display:grid;place-items:center;min-height:100vh;margin:0}main{max-width:30rem;padding:2rem}progress{width:100%;height:.6rem}p{color:#57514a}</style></head>
<body><main><h1>Preparing the PDF</h1><p>${escapeHtml(brand)} ${edition === 'slides' ? 'presentation' : 'guidelines'}, version ${Number(number)}, ${edition === 'slides' ? '16:9 slides' : `${escapeHtml(edition.toUpperCase())} paper`}. The version is still being built; the PDF opens here as soon as it is ready.</p>
<progress id="bar" max="100" value="5" aria-label="Progress"></progress><p id="state" role="status">Queued…</p></main>
<script>
const tick = async () => {
  const r = await fetch(location.href, { headers: { accept: 'application/json' } });
  if (r.headers.get('content-type')?.includes('application/pdf')) { location.reload(); return; }
  const s = await r.json();
  document.getElementById('bar').value = Math.max(5, s.progress || 0);
  document.getElementById('state').textContent = s.state === 'failed' ? 'It failed: ' + (s.error || 'unknown error') : s.state === 'rendering' ? 'Printing…' : 'Building the version…';
  if (s.state !== 'failed') setTimeout(tick, 700);
};
setTimeout(tick, 500);
</script></body></html>`;
