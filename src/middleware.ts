// Resolves the session and the share link into locals and nothing else: authorisation lives in
// src/lib/auth/policy.ts (members) and src/lib/publishing/site-access.server.ts (published sites).
import { defineMiddleware } from 'astro:middleware';
import { auth } from './lib/auth/auth.server';
import { linkForToken, linkState, SHARE_COOKIE, tokenFromCookie } from './lib/publishing/share-links.server';

export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.session = null;
  context.locals.shareGrant = null;
  if (context.isPrerendered || context.url.pathname.startsWith('/api/auth/')) return next();

  const headers = context.request.headers;
  if (headers.get('cookie')?.includes('session_token')) {
    const found = await auth.api.getSession({ headers });
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
    }
  }
  const token = tokenFromCookie(context.cookies.get(SHARE_COOKIE)?.value);
  if (token) {
    const link = await linkForToken(token);
    if (link && linkState(link) === 'active') {
      context.locals.shareGrant = { brandId: link.brandId, linkId: link.id, allowDownloads: link.allowDownloads, version: link.versionNumber };
    }
  }
  return next();
});
