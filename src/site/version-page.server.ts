// The hot path of a published site: /b/:slug and /b/:slug/v/:n. A version never changes, so its whole page is
// rendered once per audience and kept; access is still decided for every request before anything is served.
import type { APIContext } from 'astro';
import cssHref from '@/styles/global.css?url';
import { siteFrameHtml } from '@/components/site/SiteFrame';
import { notFoundPage, siteAccess } from '@/lib/publishing/site-access.server';
import { latestNumber } from '@/lib/publishing/versions.server';
import { renderVersion } from './render.server';

const pages = new Map<string, string>();
const MAX_PAGES = 500;

/** The page of version `number` (latest when null) for this visitor, with validators. */
export async function versionPageResponse(context: APIContext, number: number | null): Promise<Response> {
  if (number !== null && (!Number.isInteger(number) || number < 1)) return notFoundPage();
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const { brand, version } = access;
  const latest = number === null || (await latestNumber(brand.id)) === version.number;
  // Everything the HTML depends on besides the version itself.
  const audience = `${latest ? 'L' : 'o'}${access.isEditor ? 'E' : 'r'}${access.viaShareLink ? 'S' : 'm'}${access.canDownload ? 'D' : 'n'}`;
  const rendered = await renderVersion(version, brand.slug, 'site');
  const etag = `${rendered.etag.slice(0, -1)}-${audience}"`;
  const headers = { etag, 'cache-control': 'private, no-cache', vary: 'Cookie', 'content-type': 'text/html; charset=utf-8' };
  if (context.request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });
  const key = `${etag}:${brand.slug}`;
  let html = pages.get(key);
  if (!html) {
    html = await siteFrameHtml({
      identity: rendered.identity,
      slug: brand.slug,
      version,
      latest,
      outline: rendered.outline,
      isEditor: access.isEditor,
      viaShareLink: !!access.viaShareLink,
      canDownload: access.canDownload,
      cssHref,
      bodyHtml: rendered.html,
    });
    if (pages.size >= MAX_PAGES) pages.delete(pages.keys().next().value!);
    pages.set(key, html);
  }
  return new Response(html, { headers });
}
