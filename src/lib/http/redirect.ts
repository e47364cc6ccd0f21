// Safe "next" targets after sign-in: only paths on our own site, judged after decoding and URL normalisation.

const BASE = 'http://plumbline.invalid';
/** Control characters, whitespace and backslashes: browsers drop or reinterpret them when they parse a URL. */
const UNSAFE = /[\p{Cc}\s\\]/u;
/** Encoded layers we unwrap before giving up on a value as deliberately obscured. */
const MAX_DECODES = 3;

/** The path to return to, or the dashboard when `next` is missing or could lead anywhere but this site. */
export function safeNext(next: string | null | undefined, fallback = '/app'): string {
  if (!next || next.length > 2048) return fallback;
  // Every decoded layer must still be a plain same-site path (catches /%2F/x, %2f%2fx, /%09/x, double encoding).
  let layer = next;
  for (let round = 0; ; round++) {
    if (UNSAFE.test(layer) || !layer.startsWith('/') || layer.startsWith('//')) return fallback;
    let decoded: string;
    try {
      decoded = decodeURIComponent(layer);
    } catch {
      return fallback;
    }
    if (decoded === layer) break;
    if (round === MAX_DECODES) return fallback;
    layer = decoded;
  }
  // Normalise as a browser would (dot segments, ports, schemes) and keep only what stays on our origin.
  const url = new URL(next, BASE);
  if (url.origin !== BASE || url.pathname.startsWith('//')) return fallback;
  return url.pathname + url.search + url.hash;
}
