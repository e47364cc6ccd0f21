import type { APIRoute } from 'astro';
import { searchPath } from '@/lib/publishing/build/contract';
import { siteAccess } from '@/lib/publishing/site-access.server';
import { fileRefusal, sendVersionFile, textAnswer } from '@/site/built.server';
import { audienceOf } from '@/site/version-page.server';

/** The version's search index for this visitor, picked as the page route picks the page (member, editor or link; downloads or not). */
export const GET: APIRoute = async (context) => {
  const number = Number(context.params.number);
  if (!Number.isInteger(number) || number < 1) return textAnswer(404, 'Not found');
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return fileRefusal(access);
  const headers = { 'cache-control': 'private, no-cache', vary: 'Cookie', 'x-content-type-options': 'nosniff' };
  return sendVersionFile(context.request, access, searchPath(await audienceOf(access, number)), headers, () => textAnswer(404, 'This version was published before search; publish it again to search it.'));
};
