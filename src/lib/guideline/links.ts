// Links in guideline text may only lead to web pages or e-mail addresses.

const ALLOWED = /^(https?:\/\/[^/]|mailto:[^/])/i;
const QUOTES_AND_BRACKETS = /["'<>`\\]/;

/** Longest link address accepted. */
export const MAX_HREF = 2048;

// Control characters and whitespace inside a URL are a common way to smuggle a scheme past a check.
function hasHiddenCharacters(value: string): boolean {
  for (let i = 0; i < value.length; i++) {
    const code = value.charCodeAt(i);
    if (code <= 0x20 || (code >= 0x7f && code <= 0xa0) || code === 0x2028 || code === 0x2029 || code === 0xfeff) return true;
  }
  return false;
}

/** True for an http(s):// or mailto: address with no hidden characters. */
export function isSafeHref(href: unknown): href is string {
  return typeof href === 'string' && href.length <= MAX_HREF && ALLOWED.test(href) && !hasHiddenCharacters(href) && !QUOTES_AND_BRACKETS.test(href);
}

/** A file address we may put in src/href: only a path on our own site, so neither a reader's browser nor the PDF renderer fetches elsewhere. */
export function safeAssetUrl(url: unknown): string | null {
  if (typeof url !== 'string' || url.length > MAX_HREF || hasHiddenCharacters(url) || QUOTES_AND_BRACKETS.test(url)) return null;
  if (/^\/[^/\\]/.test(url)) return url;
  return null;
}
