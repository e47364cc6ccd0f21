// Resolves the session into locals and nothing else: authorisation lives in src/lib/auth/policy.ts.
import { defineMiddleware } from 'astro:middleware';
import { auth } from './lib/auth/auth.server';

export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.session = null;
  context.locals.shareGrant = null;
  if (!context.url.pathname.startsWith('/api/auth/') && !context.isPrerendered) {
    const found = await auth.api.getSession({ headers: context.request.headers });
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
    }
  }
  return next();
});
