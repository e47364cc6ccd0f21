// The PDF address of a version: the file when ready, otherwise a progress page (or JSON) that waits for it.
import type { APIContext } from 'astro';
import { notSharedPage, simplePage, siteAccess, type SiteAccess } from './site-access.server';
import { PAPER_SIZES, versionPdf, type PaperSize, type PdfEdition } from './pdf.server';
import { AppError } from '@/lib/errors';
import { ApiError, errorAnswer, errorResponse } from '@/lib/http/api';
import { escapeHtml } from '@/lib/safe/escape';

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

/** The file when ready, otherwise its progress as JSON or a page that waits for it. */
async function editionResponse(context: APIContext, access: SiteAccess, edition: PdfEdition, filename: string): Promise<Response> {
  const wantsJson = (context.request.headers.get('accept') ?? '').includes('application/json');
  let result;
  try {
    result = await versionPdf(access.version, edition);
  } catch (err) {
    return errorAnswer(new AppError('pdf_unavailable', (err as Error).message, { status: 503, cause: err }), context);
  }
  if ('pdf' in result) {
    return new Response(new Uint8Array(result.pdf), {
      headers: {
        'content-type': 'application/pdf',
        'content-disposition': `inline; filename="${filename}"`,
        'cache-control': 'private, max-age=3600',
      },
    });
  }
  const { status } = result;
  const failedStatus = status.printerMissing ? 503 : 500;
  if (wantsJson) return Response.json(status, { status: status.state === 'failed' ? failedStatus : 202 });
  if (status.printerMissing) return simplePage(503, 'PDFs cannot be printed on this server', status.error ?? 'The browser that prints PDFs is missing.');
  if (status.state === 'failed') return simplePage(500, 'The PDF could not be made', `Plumbline could not print this version: ${status.error ?? 'unknown error'}. Try again in a minute.`);
  return new Response(progressPage(access.brand.name, access.version.number, edition), {
    status: 202,
    headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' },
  });
}

const progressPage = (brand: string, number: number, edition: PdfEdition) => `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Preparing the PDF</title><style>body{font-family:system-ui,sans-serif;background:#f8f6f2;color:#211e1a;display:grid;place-items:center;min-height:100vh;margin:0}main{max-width:30rem;padding:2rem}progress{width:100%;height:.6rem}p{color:#57514a}</style></head>
<body><main><h1>Preparing the PDF</h1><p>${escapeHtml(brand)} ${edition === 'slides' ? 'presentation' : 'guidelines'}, version ${Number(number)}, ${edition === 'slides' ? '16:9 slides' : `${escapeHtml(edition.toUpperCase())} paper`}. This takes a few seconds the first time; after that it is ready at once.</p>
<progress id="bar" max="100" value="5" aria-label="Progress"></progress><p id="state" role="status">Queued…</p></main>
<script>
const tick = async () => {
  const r = await fetch(location.href, { headers: { accept: 'application/json' } });
  if (r.headers.get('content-type')?.includes('application/pdf')) { location.reload(); return; }
  const s = await r.json();
  document.getElementById('bar').value = Math.max(5, s.progress || 0);
  document.getElementById('state').textContent = s.state === 'failed' ? 'It failed: ' + (s.error || 'unknown error') : s.state === 'rendering' ? 'Printing…' : 'Queued…';
  if (s.state !== 'failed') setTimeout(tick, 700);
};
setTimeout(tick, 500);
</script></body></html>`;
