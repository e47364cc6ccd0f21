// Gives each request its id and log scope, then resolves the session and the share link into locals and nothing
// else (besides starting this process's job worker once): authorisation lives in src/lib/auth/policy.ts (members) and src/lib/publishing/site-access.server.ts (sites).
import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { forgetSession, sessionFor, sessionKey } from './lib/auth/sessions.server';
import { startChangeNotices } from './lib/live/notices.server';
import { startJobs } from './lib/jobs.server';
import { log, requestIdFrom, serveLogged } from './lib/log.server';
import { installFastPath } from './lib/publishing/fast-path.server';
import { SHARE_COOKIE, shareGrantFor } from './lib/publishing/share-links.server';

// Sessions and share grants are kept in memory by change notices, which this process starts listening for now.
startChangeNotices();
// Published reads (pages, files, PDFs) are answered ahead of Astro by scripts/serve.mjs once this module is loaded.
installFastPath();

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
  if (context.isPrerendered) return next();
  const headers = context.request.headers;
  const key = sessionKey(headers.get('cookie') ?? '');
  if (context.url.pathname.startsWith('/api/auth/')) {
    const response = await next();
    // Signing out (or any change to the session) through this process is honoured here at once, not a moment later.
    if (key && context.request.method !== 'GET') forgetSession(key);
    return response;
  }

  if (key) {
    const found = await sessionFor(key, headers);
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
    }
  }
  context.locals.shareGrant = await shareGrantFor(context.cookies.get(SHARE_COOKIE)?.value);
  return next();
}
