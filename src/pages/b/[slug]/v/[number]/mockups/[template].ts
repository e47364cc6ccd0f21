import type { APIRoute } from 'astro';
import { filePath } from '@/lib/publishing/build/contract';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { fileRefusal, sendVersionFile, textAnswer } from '@/site/built.server';

/** A mock-up a published version shows, as PNG or (print pieces, ?format=pdf) PDF; for readers who may download. */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return fileRefusal(access);
  if (!access.canDownload) return textAnswer(403, 'This link does not allow downloads. Ask the brand’s team for a link that does.');
  const template = context.params.template ?? '';
  const format = context.url.searchParams.get('format') === 'pdf' ? 'pdf' : 'png';
  // Only the version's own mock-ups are in its manifest, so the name in the file name is one of ours.
  const filename = `${access.brand.slug}-v${access.version.number}-${template.replace(/[^a-z0-9-]/gi, '')}.${format}`;
  const headers = { 'content-disposition': `attachment; filename="${filename}"`, 'cache-control': 'private, max-age=31536000, immutable', 'x-content-type-options': 'nosniff' };
  return sendVersionFile(context.request, access, filePath(`mockups/${template}`, context.url.searchParams), headers, () => textAnswer(404, 'This version shows no such mock-up.'));
};
