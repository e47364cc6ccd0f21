// The hot path of a published site: /b/:slug and /b/:slug/v/:n. Access is decided for every request; then the
// page the build drew for this visitor's audience is streamed from storage with the manifest's ETag.
import type { APIContext } from 'astro';
import { pagePath, type PageAudience } from '@/lib/publishing/build/contract';
import { notFoundPage, siteAccess, type SiteAccess } from '@/lib/publishing/site-access.server';
import { siteCache } from '@/lib/publishing/site-cache';
import { latestNumber } from '@/lib/publishing/versions.server';
import { noteRead } from '@/lib/insights/site-read.server';
import { sendVersionFile } from './built.server';

/** Which of a version's built pages this visitor reads. */
export async function audienceOf(access: SiteAccess, number: number | null): Promise<PageAudience> {
  const latest = number === null || (await siteCache.latest.remember(access.brand.id, () => latestNumber(access.brand.id))) === access.version.number;
  return { latest, who: access.viaShareLink ? 'link' : access.isEditor ? 'editor' : 'member', downloads: access.canDownload };
}

/** The page of version `number` (latest when null) for this visitor. */
export async function versionPageResponse(context: APIContext, number: number | null): Promise<Response> {
  if (number !== null && (!Number.isInteger(number) || number < 1)) return notFoundPage();
  const access = await siteAccess(context, context.params.slug!, number);
  if (access instanceof Response) return access;
  const headers = { 'cache-control': 'private, no-cache', vary: 'Cookie' };
  const path = pagePath(await audienceOf(access, number));
  return noteRead(context, access, 'page', path, await sendVersionFile(context.request, access, path, headers, notFoundPage));
}
