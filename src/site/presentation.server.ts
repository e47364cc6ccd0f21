// The reveal presentation of a published version: who may open it, and the page its build drew.
import type { APIContext } from 'astro';
import { presentationPath } from '@/lib/publishing/build/contract';
import { notSharedPage, notFoundPage, siteAccess, type SiteAccess } from '@/lib/publishing/site-access.server';
import { sendVersionFile } from './built.server';

/** The version a visitor may present at /b/:slug[/v/:n]/presentation, or the response to send instead. */
export async function presentationAccess(context: Pick<APIContext, 'locals' | 'url' | 'redirect' | 'cookies'>, slug: string, number: number | null): Promise<SiteAccess | Response> {
  const access = await siteAccess(context, slug, number);
  if (access instanceof Response) return access;
  return access.canPresent ? access : notSharedPage();
}

// Nothing from elsewhere: every file the slides show is the version's own.
const HEADERS = {
  'cache-control': 'private, no-cache',
  vary: 'Cookie',
  'content-security-policy': "default-src 'self'; img-src 'self' data:; font-src 'self' data:; style-src 'self' 'unsafe-inline'; script-src 'self' 'unsafe-inline'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'",
};

/**
 * /b/:slug/presentation (number null: the current version, whose links lead to the current site) or
 * /b/:slug/v/:n/presentation; `?print` is the form our PDF step prints.
 */
export async function presentationResponse(context: APIContext, number: number | null): Promise<Response> {
  if (number !== null && (!Number.isInteger(number) || number < 1)) return notFoundPage();
  const access = await presentationAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const form = context.url.searchParams.has('print') ? 'print' : number === null ? 'current' : 'version';
  return sendVersionFile(context.request, access, presentationPath(form), HEADERS, notFoundPage);
}
