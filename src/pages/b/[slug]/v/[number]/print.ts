import type { APIRoute } from 'astro';
import { printPath } from '@/lib/publishing/build/contract';
import { notFoundPage, siteAccess } from '@/lib/publishing/site-access.server';
import { sendVersionFile } from '@/site/built.server';

const HEADERS = {
  'cache-control': 'private, no-cache',
  vary: 'Cookie',
  // Even a value that slipped past every schema cannot make this page load anything but our own files (the version's
  // own search script and index included).
  'content-security-policy': "default-src 'none'; img-src 'self' data:; font-src 'self' data:; style-src 'self' 'unsafe-inline'; script-src 'self'; connect-src 'self'; base-uri 'none'; form-action 'none'",
};

/** The print edition of a version (?size=a4|letter), as its build set it; the PDF step prints this page. */
export const GET: APIRoute = async (context) => {
  const number = Number(context.params.number);
  if (!Number.isInteger(number) || number < 1) return notFoundPage();
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const size = context.url.searchParams.get('size') === 'letter' ? 'letter' : 'a4';
  return sendVersionFile(context.request, access, printPath(size), HEADERS, notFoundPage);
};
