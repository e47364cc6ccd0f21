// Gives each request its id and log scope, then resolves the session and the share link into locals and nothing
// else: authorisation lives in src/lib/auth/policy.ts (members) and src/lib/publishing/site-access.server.ts (sites).
import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { auth } from './lib/auth/auth.server';
import { startChangeNotices } from './lib/live/notices.server';
import { log, requestIdFrom, serveLogged } from './lib/log.server';
import { shareGrants } from './lib/publishing/grant-cache';
import { linkForToken, linkState, SHARE_COOKIE, tokenFromCookie } from './lib/publishing/share-links.server';

// No memory of sessions here: a signed-out or revoked session is refused on the very next request, in every process.
// The share grants are kept by change notices, which this process starts listening for now.
startChangeNotices();
const sessionKey = (cookie: string) => /session_token=([^;]+)/.exec(cookie)?.[1] ?? null;

export const onRequest = defineMiddleware((context, next) => {
  const requestId = requestIdFrom(context.request.headers.get('x-request-id'));
  context.locals.requestId = requestId;
  // Prerendering runs at build time: there is no request to log.
  if (context.isPrerendered) return resolveCaller(context, next);
  return serveLogged(log, { method: context.request.method, pathname: context.url.pathname, requestId }, () => resolveCaller(context, next));
});

async function resolveCaller(context: APIContext, next: MiddlewareNext): Promise<Response> {
  context.locals.user = null;
  context.locals.session = null;
  context.locals.shareGrant = null;
  if (context.isPrerendered || context.url.pathname.startsWith('/api/auth/')) return next();

  const headers = context.request.headers;
  const key = sessionKey(headers.get('cookie') ?? '');
  if (key) {
    const found = await auth.api.getSession({ headers });
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
    }
  }
  const token = tokenFromCookie(context.cookies.get(SHARE_COOKIE)?.value);
  if (token) {
    const kept = await shareGrants.remember(token, async () => {
      const link = await linkForToken(token);
      if (!link || linkState(link) !== 'active') return { grant: null, expiresAt: null };
      const grant = { brandId: link.brandId, linkId: link.id, allowDownloads: link.allowDownloads, allowPresentation: link.allowPresentation, version: link.versionNumber };
      return { grant, expiresAt: link.expiresAt?.getTime() ?? null };
    });
    // No notice marks the moment a link expires: the kept grant carries its expiry.
    context.locals.shareGrant = kept.expiresAt !== null && kept.expiresAt <= Date.now() ? null : kept.grant;
  }
  return next();
}
