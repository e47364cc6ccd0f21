// Link tokens for people without an account: 32 random bytes in the link, only the SHA-256 hash stored.
import { randomBytes } from 'node:crypto';
import { hashToken } from '@/lib/brands/brands.server';
import { formatLongDate, SITE_LOCALE } from '@/lib/format';

export { hashToken };

/** A fresh token and the hash to store. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** Whether a path segment could be one of our tokens (43 base64url characters); anything else names nothing. */
export const looksLikeToken = (value: string | undefined): value is string => !!value && /^[A-Za-z0-9_-]{43}$/.test(value);

/** A date as people read it in an e-mail, e.g. "14 December 2026". */
export const longDate = (d: Date) => formatLongDate(d, SITE_LOCALE, 'UTC');
