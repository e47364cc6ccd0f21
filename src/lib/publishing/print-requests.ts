// Which requests our PDF renderer may let Chromium make: the print edition of one version and its own files,
// nothing else (no other port on loopback, no outside address, no file:, no other page of ours).

/**
 * True when Chromium, printing `printUrl`, may fetch `requestUrl`: a GET (or HEAD) on the print page's own origin
 * under that version's path (/b/:slug/v/:n/) or our built static files (/_astro/), or a data: URL — which reaches
 * no address itself, and whatever it loads is asked about again here.
 */
export function printRequestAllowed(requestUrl: string, method: string, printUrl: string): boolean {
  let request: URL;
  let print: URL;
  try {
    request = new URL(requestUrl);
    print = new URL(printUrl);
  } catch {
    return false;
  }
  if (request.protocol === 'data:') return true;
  if (method !== 'GET' && method !== 'HEAD') return false;
  if (request.protocol !== print.protocol || request.origin !== print.origin || request.username || request.password) return false;
  const version = print.pathname.match(/^\/b\/[a-z0-9-]+\/v\/[1-9][0-9]*\//)?.[0];
  if (!version) return false;
  // URL() has already resolved dot segments, so a path that starts right stays inside.
  const path = request.pathname;
  if (/%2e|%2f|%5c/i.test(path)) return false;
  return path.startsWith(version) || path.startsWith('/_astro/');
}
