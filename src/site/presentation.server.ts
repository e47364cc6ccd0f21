// The reveal presentation of a published version: who may open it, and the version's document and identity it is
// drawn from (a version never changes, so both are read once per version and kept).
import type { APIContext } from 'astro';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { notSharedPage, siteAccess, type SiteAccess } from '@/lib/publishing/site-access.server';
import { withVersionUrls } from '@/lib/publishing/snapshot-urls';
import { versionSnapshot, type VersionRecord } from '@/lib/publishing/versions.server';

const cache = new Map<string, { doc: GuidelineDoc; identity: Identity }>();
const MAX_CACHED = 100;

/** The version a visitor may present at /b/:slug[/v/:n]/presentation, or the response to send instead. */
export async function presentationAccess(context: Pick<APIContext, 'locals' | 'url' | 'redirect' | 'cookies'>, slug: string, number: number | null): Promise<SiteAccess | Response> {
  const access = await siteAccess(context, slug, number);
  if (access instanceof Response) return access;
  return access.canPresent ? access : notSharedPage();
}

/** The version's document and its identity with file addresses inside the version. */
export async function presentationMaterial(version: VersionRecord, slug: string): Promise<{ doc: GuidelineDoc; identity: Identity }> {
  const key = `${version.id}:${slug}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const snapshot = await versionSnapshot(version);
  const material = { doc: snapshot.doc, identity: withVersionUrls(snapshot.identity, slug, version.number, version.files ?? {}) };
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
  cache.set(key, material);
  return material;
}
