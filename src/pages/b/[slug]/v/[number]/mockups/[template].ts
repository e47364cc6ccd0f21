import type { APIRoute } from 'astro';
import { AppError } from '@/lib/errors';
import { log } from '@/lib/log.server';
import { versionMockup } from '@/lib/mockups/mockup.server';
import { siteAccess } from '@/lib/publishing/site-access.server';

const text = (status: number, message: string) => new Response(message, { status, headers: { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store' } });

/** A mock-up a published version shows, as PNG or (print pieces) PDF; for readers who may download. */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return text(404, 'Not found');
  if (!access.canDownload) return text(403, 'This link does not allow downloads. Ask the brand’s team for a link that does.');
  const format = context.url.searchParams.get('format') === 'pdf' ? 'pdf' : 'png';
  try {
    const file = await versionMockup(access.brand, access.version, context.params.template ?? '', format);
    return new Response(new Uint8Array(file.body), {
      headers: { 'content-type': file.contentType, 'content-disposition': `attachment; filename="${file.filename}"`, 'cache-control': 'private, no-store', 'x-content-type-options': 'nosniff' },
    });
  } catch (err) {
    if (err instanceof AppError && err.status < 500) return text(err.status, err.message);
    if (err instanceof AppError && err.code === 'printer_unavailable') return text(503, err.message);
    log.error({ err }, 'mockups: version file failed');
    return text(500, 'The mock-up could not be drawn.');
  }
};
