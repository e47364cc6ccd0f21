// Gives each request its id and log scope, then resolves the session and the share link into locals and nothing
// else (besides starting this process's job worker once): authorisation lives in src/lib/auth/policy.ts (members) and src/lib/publishing/site-access.server.ts (sites).
import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { auth } from './lib/auth/auth.server';
import { startJobs } from './lib/jobs.server';
import { log, requestIdFrom, serveLogged } from './lib/log.server';
import { shareGrants } from './lib/publishing/grant-cache';
import { linkForToken, linkState, SHARE_COOKIE, tokenFromCookie } from './lib/publishing/share-links.server';

// No memory of sessions here: a signed-out or revoked session is refused on the very next request, in every process.
const sessionKey = (cookie: string) => /session_token=([^;]+)/.exec(cookie)?.[1] ?? null;

export const onRequest = defineMiddleware((context, next) => {
  // The web process works the job queue too (builds, notices) unless QUEUE_WORKER is off; started once, on the
  // first request (serve.mjs sends one as soon as it listens), never waited for.
  if (!context.isPrerendered) void startJobs();
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
    let grant = shareGrants.get(token);
    if (grant === undefined) {
      const link = await linkForToken(token);
      grant = link && linkState(link) === 'active' ? { brandId: link.brandId, linkId: link.id, allowDownloads: link.allowDownloads, allowPresentation: link.allowPresentation, version: link.versionNumber } : null;
      shareGrants.set(token, grant);
    }
    context.locals.shareGrant = grant;
  }
  return next();
}
