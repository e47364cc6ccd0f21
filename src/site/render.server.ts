// What a published version's pages are drawn from: its frozen document and its identity with file addresses
// inside the version. Read fresh each time: the build draws a version once, and the live pages that still need
// an identity (downloads, version history) ask for it on their own request; nothing is kept between requests.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import GuidelineDocument from '@/components/guideline/GuidelineDocument';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { outline, type OutlineEntry } from '@/lib/guideline/outline';
import type { Identity } from '@/lib/identity/types';
import { withVersionUrls } from '@/lib/publishing/snapshot-urls';
import { versionSnapshot, type VersionRecord } from '@/lib/publishing/versions.server';

/** Everything a version's pages are drawn from. */
export interface VersionMaterial {
  version: Pick<VersionRecord, 'id' | 'number' | 'note' | 'publishedAt'>;
  slug: string;
  doc: GuidelineDoc;
  /** The identity with file URLs under /b/<slug>/v/<number>/files/. */
  identity: Identity;
}

/** The version's document and identity, with its file addresses under `slug`. */
export async function versionMaterial(version: VersionRecord, slug: string): Promise<VersionMaterial> {
  const snapshot = await versionSnapshot(version);
  return { version, slug, doc: snapshot.doc, identity: withVersionUrls(snapshot.identity, slug, version.number, version.files ?? {}) };
}

/** The version's document as HTML for the site or the print edition, and its contents. */
export function renderGuideline(material: VersionMaterial, mode: 'site' | 'print'): { html: string; outline: OutlineEntry[] } {
  return { html: renderToStaticMarkup(createElement(GuidelineDocument, { doc: material.doc, identity: material.identity, mode })), outline: outline(material.doc) };
}
