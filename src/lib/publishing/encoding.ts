// Content codings for published reads (RFC 9110 §8.4, §12.5.3) and the validators that tell them apart (§8.8.3,
// §13.1.2). Pure: the fast path (fast-path.server.ts) uses them.

export type ContentCoding = 'br' | 'gzip';

/** Types worth compressing: text, markup, scripts, JSON and SVG (images, fonts and PDFs are compressed already). */
export const isCompressible = (type: string): boolean =>
  /^(?:text\/|image\/svg\+xml|application\/(?:json|javascript|xml|xhtml\+xml|manifest\+json|[\w.-]+\+(?:json|xml)))/i.test(type);

/**
 * The coding to send for an Accept-Encoding header: the highest q among br and gzip (a `*` counts for both), br on a
 * tie since it is smaller; identity when neither is acceptable (q=0 or not named). Browsers send "gzip, deflate, br".
 */
export function chooseEncoding(header: string | string[] | undefined): ContentCoding | 'identity' {
  if (!header) return 'identity';
  const q: Record<string, number> = {};
  for (const part of (Array.isArray(header) ? header.join(',') : header).split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    let weight = 1;
    for (const p of params) {
      const m = /^\s*q\s*=\s*([01](?:\.\d{0,3})?)\s*$/.exec(p);
      if (m) weight = Number(m[1]);
    }
    q[name] = weight;
  }
  const of = (coding: ContentCoding) => q[coding] ?? q['*'] ?? 0;
  const br = of('br');
  const gz = of('gzip');
  if (br <= 0 && gz <= 0) return 'identity';
  return br >= gz ? 'br' : 'gzip';
}

/** Whether an If-None-Match header matches `etag` (weak comparison, RFC 9110 §13.1.2; `*` matches any). */
export function etagMatches(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  const opaque = etag.replace(/^W\//, '');
  for (const tag of header.split(',')) if (tag.trim().replace(/^W\//, '') === opaque) return true;
  return false;
}
