import type { APIRoute } from 'astro';
import { staticPath } from '@/lib/publishing/build/contract';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { fileRefusal, sendVersionFile, textAnswer } from '@/site/built.server';

/** The version's own copy of a stylesheet, script or font of the app, as it was when the version was built. */
export const GET: APIRoute = async (context) => {
  const access = await siteAccess(context, context.params.slug!, Number(context.params.number));
  if (access instanceof Response) return fileRefusal(access);
  const headers = { 'cache-control': 'private, max-age=31536000, immutable', 'x-content-type-options': 'nosniff' };
  return sendVersionFile(context.request, access, staticPath(context.params.name ?? ''), headers, () => textAnswer(404, 'Not found'));
};
