// Rendering a published version to HTML, once per version and audience: a version never changes.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import GuidelineDocument from '@/components/guideline/GuidelineDocument';
import { outline, type OutlineEntry } from '@/lib/guideline/outline';
import type { Identity } from '@/lib/identity/types';
import { withVersionUrls } from '@/lib/publishing/snapshot-urls';
import { versionSnapshot, type VersionRecord } from '@/lib/publishing/versions.server';

export interface RenderedVersion {
  html: string;
  outline: OutlineEntry[];
  identity: Identity;
  etag: string;
}

/** Differs per process start, so a new build's HTML is never mistaken for an old one's. */
const RENDER_EPOCH = Date.now().toString(36);
const cache = new Map<string, RenderedVersion>();
const MAX_CACHED = 200;

/**
 * The version's document as HTML for one slug and mode. The cache key holds everything the HTML depends on;
 * access is checked by the caller before this is ever reached, so the cache cannot leak a page.
 */
export async function renderVersion(version: VersionRecord, slug: string, mode: 'site' | 'print'): Promise<RenderedVersion> {
  const key = `${version.id}:${slug}:${mode}`;
  const hit = cache.get(key);
  if (hit) return hit;
  // The snapshot is read only here, on a cache miss: the hot path never parses it.
  const snapshot = await versionSnapshot(version);
  const identity = withVersionUrls(snapshot.identity, slug, version.number, version.files ?? {});
  const html = renderToStaticMarkup(createElement(GuidelineDocument, { doc: snapshot.doc, identity, mode }));
  const rendered = { html, outline: outline(snapshot.doc), identity, etag: `"v${version.id.slice(0, 8)}-${version.number}-${mode}-${RENDER_EPOCH}"` };
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
  cache.set(key, rendered);
  return rendered;
}
