// Resolves the session and the share link into locals and nothing else: authorisation lives in
// src/lib/auth/policy.ts (members) and src/lib/publishing/site-access.server.ts (published sites).
import { defineMiddleware } from 'astro:middleware';
import { auth } from './lib/auth/auth.server';
import { TtlCache } from './lib/http/ttl-cache';
import { shareGrants } from './lib/publishing/grant-cache';
import { linkForToken, linkState, SHARE_COOKIE, tokenFromCookie } from './lib/publishing/share-links.server';

type Found = Awaited<ReturnType<typeof auth.api.getSession>>;
// Two seconds of memory for the question every page view asks again (a signed-out cookie is dropped by the browser).
const sessions = new TtlCache<Found>(2000);
const sessionKey = (cookie: string) => /session_token=([^;]+)/.exec(cookie)?.[1] ?? null;

export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.session = null;
  context.locals.shareGrant = null;
  if (context.isPrerendered || context.url.pathname.startsWith('/api/auth/')) return next();

  const headers = context.request.headers;
  const key = sessionKey(headers.get('cookie') ?? '');
  if (key) {
    let found = sessions.get(key);
    if (found === undefined) {
      found = await auth.api.getSession({ headers });
      sessions.set(key, found);
    }
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
      grant = link && linkState(link) === 'active' ? { brandId: link.brandId, linkId: link.id, allowDownloads: link.allowDownloads, version: link.versionNumber } : null;
      shareGrants.set(token, grant);
    }
    context.locals.shareGrant = grant;
  }
  return next();
});
