// A page opened from an e-mailed secret link (brief, mood board, palette routes): one way to open it and to fail.
import type { AstroGlobal } from 'astro';
import { AppError } from '@/lib/errors';
import { looksLikeToken } from '@/lib/invitations/tokens';

/**
 * Opens what the link's token names. A malformed token is a 404 with `invalid`; a refusal from `open` (expired,
 * decided, unknown) sets its status and message. The answer is never cached and never leaks the link as a referrer.
 */
export async function openLinkPage<T>(astro: AstroGlobal, open: (token: string) => Promise<T>, invalid: string): Promise<{ token: string; value: T | null; problem: string }> {
  const token = astro.params.token ?? '';
  astro.response.headers.set('cache-control', 'no-store');
  astro.response.headers.set('referrer-policy', 'no-referrer');
  if (!looksLikeToken(token)) {
    astro.response.status = 404;
    return { token, value: null, problem: invalid };
  }
  try {
    return { token, value: await open(token), problem: invalid };
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    astro.response.status = err.status;
    return { token, value: null, problem: err.message };
  }
}
