// From a served request to the recorder: who read what, decided by the same access check that let the read happen.
import type { APIContext } from 'astro';
import { requestClientAddress } from '@/lib/http/client-address.server';
import type { SiteAccess } from '@/lib/publishing/site-access.server';
import { asksNotToTrack, type SiteRead } from './contract';
import { recordRead } from './record.server';

type Context = Pick<APIContext, 'request' | 'locals' | 'clientAddress'>;

/** The reader of a published version as the recorder sees it (address and agent stay in memory only). */
export function siteVisitor(context: Context, access: SiteAccess): Omit<SiteRead, 'kind' | 'path'> {
  let ip = '';
  try {
    ip = requestClientAddress(context);
  } catch {
    // No socket address (not served by scripts/serve.mjs): the key still separates agents.
  }
  const headers = context.request.headers;
  return {
    brandId: access.brand.id,
    versionNumber: access.version.number,
    shareLinkId: access.viaShareLink,
    userId: access.role ? (context.locals.user?.id ?? null) : null,
    ip,
    userAgent: headers.get('user-agent') ?? '',
    doNotTrack: asksNotToTrack((name) => headers.get(name)),
    fetchedAs: headers.get('sec-fetch-dest'),
  };
}

/** Record a read when the answer is a 200 (a 304, a refusal or a "being built" page is not a read); returns the answer. */
export function noteRead(context: Context, access: SiteAccess, kind: SiteRead['kind'], path: string, response: Response): Response {
  if (response.status === 200 && context.request.method === 'GET') recordRead({ ...siteVisitor(context, access), kind, path });
  return response;
}
