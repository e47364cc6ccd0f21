// The request side of a published version: access has been decided; what is left is to pick the stored file the
// version's build made for this address and stream it. Nothing is rendered here and nothing is kept in memory.
import type { Manifest } from '@/lib/publishing/build/contract';
import { heldBack } from '@/lib/handover/gate.server';
import { manifestEntry, sendBuilt } from '@/lib/publishing/build/serve.server';
import { simplePage, type SiteAccess } from '@/lib/publishing/site-access.server';
import { escapeHtml } from '@/lib/safe/escape';

/** Seconds a visitor is asked to wait before trying a version that is still being built. */
export const PREPARING_RETRY_SECONDS = 5;

/** The readable page for a version that is not built yet (it reloads itself), or whose build failed. */
export function notBuiltPage(access: SiteAccess): Response {
  const { brand, version } = access;
  if (version.state === 'failed') {
    return simplePage(503, 'This version is not available', `Version ${version.number} of the ${brand.name} guidelines could not be prepared. The brand team has been told; try again later.`);
  }
  const title = 'This version is being prepared';
  const body =
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">` +
    `<meta http-equiv="refresh" content="${PREPARING_RETRY_SECONDS}"><title>${escapeHtml(title)}</title>` +
    `<style>body{font-family:system-ui,sans-serif;background:#f8f6f2;color:#211e1a;display:grid;place-items:center;min-height:100vh;margin:0}main{max-width:32rem;padding:2rem}h1{font-size:1.6rem}p{color:#57514a;line-height:1.5}</style></head>` +
    `<body><main><h1>${escapeHtml(title)}</h1><p role="status">${escapeHtml(`Version ${version.number} of the ${brand.name} guidelines was just published and its pages are being made. This page reloads by itself in a few seconds.`)}</p></main></body></html>`;
  return new Response(body, { status: 503, headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store', 'retry-after': String(PREPARING_RETRY_SECONDS) } });
}

/** A plain-text refusal for file addresses (a browser shows it as is; nothing to escape). */
export const textAnswer = (status: number, message: string) =>
  new Response(message, { status, headers: { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store', 'x-content-type-options': 'nosniff' } });

/**
 * What a file address answers when siteAccess refused: a renamed brand's old address still redirects (a built page
 * keeps the slug it was built under), anything else is a plain 404 that says nothing about the site.
 */
export const fileRefusal = (refusal: Response) => (refusal.status === 301 ? refusal : textAnswer(404, 'Not found'));

/**
 * Stream the stored file for manifest path `path` of the visitor's version, or the answer instead: the "being
 * prepared" page while it builds, `missing()` (a 404) for a path the version does not hold, and the readable 402
 * page for a file an unpaid handover invoice holds back from this visitor (the built page itself is never changed:
 * its links stay, and the file's address says why it is not sent yet).
 */
export async function sendVersionFile(request: Request, access: SiteAccess, path: string, headers: Record<string, string>, missing: () => Response): Promise<Response> {
  if (access.version.state !== 'ready') return notBuiltPage(access);
  const entry = manifestEntry(access.version.manifest as Manifest | null, path);
  if (!entry) return missing();
  const held = await heldBack(access.brand.id, path, access);
  if (held) return simplePage(402, held.title, held.message);
  return sendBuilt(request, entry, headers);
}

