// The share cookie's attributes, decided from the configured public address rather than the request, so a server
// behind a TLS-terminating proxy (which itself is reached over plain http) still marks the cookie Secure.

export interface ShareCookieOptions {
  path: '/';
  httpOnly: true;
  sameSite: 'lax';
  secure: boolean;
  maxAge: number;
}

const THIRTY_DAYS = 60 * 60 * 24 * 30;

/** Cookie options for an opened share link: Secure when SITE_URL is https; lives until the link expires (30 days at most when it never does). */
export function shareCookieOptions(siteUrl: string, expiresAt: Date | null, now = Date.now()): ShareCookieOptions {
  return {
    path: '/',
    httpOnly: true,
    sameSite: 'lax',
    secure: new URL(siteUrl).protocol === 'https:',
    maxAge: expiresAt ? Math.max(60, Math.floor((expiresAt.getTime() - now) / 1000)) : THIRTY_DAYS,
  };
}
