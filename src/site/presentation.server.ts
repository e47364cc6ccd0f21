// The reveal presentation of a published version: who may open it, and what it is drawn from: the version's document,
// its identity, and the tone check of the logos it shows, read from the version's own copies of the logo files (a
// version never changes, so all three are made once per version and kept).
import type { APIContext } from 'astro';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { markLogo, primaryLogo } from '@/lib/guideline/identity';
import type { Identity } from '@/lib/identity/types';
import { logoTones } from '@/lib/logo/proofs.server';
import type { ToneReport } from '@/lib/logo/tones';
import { log } from '@/lib/log.server';
import { notSharedPage, siteAccess, type SiteAccess } from '@/lib/publishing/site-access.server';
import { withVersionUrls } from '@/lib/publishing/snapshot-urls';
import { versionSnapshot, type VersionRecord } from '@/lib/publishing/versions.server';
import { storage } from '@/lib/storage/index.server';

export interface PresentationMaterial {
  doc: GuidelineDoc;
  identity: Identity;
  /** The tone check of each logo the slides show (primary and mark), by logo id. */
  tones: Record<string, ToneReport>;
}

const cache = new Map<string, PresentationMaterial>();
const MAX_CACHED = 100;

/** The version a visitor may present at /b/:slug[/v/:n]/presentation, or the response to send instead. */
export async function presentationAccess(context: Pick<APIContext, 'locals' | 'url' | 'redirect' | 'cookies'>, slug: string, number: number | null): Promise<SiteAccess | Response> {
  const access = await siteAccess(context, slug, number);
  if (access instanceof Response) return access;
  return access.canPresent ? access : notSharedPage();
}

/** The tone check of the logos the presentation shows, from the version's own file copies; a logo without one is left out. */
async function versionTones(version: VersionRecord, identity: Identity): Promise<Record<string, ToneReport>> {
  const shown = [primaryLogo(identity), markLogo(identity)].filter((l, i, all) => !!l && all.findIndex((o) => o?.id === l.id) === i);
  const tones: Record<string, ToneReport> = {};
  for (const logo of shown) {
    const copy = Object.hasOwn(version.files ?? {}, logo!.id) ? version.files[logo!.id] : undefined;
    const bytes = copy ? await storage.get(copy.key) : null;
    if (!bytes) continue;
    try {
      tones[logo!.id] = await logoTones({ bytes, format: logo!.format, canvas: logo!.canvas });
    } catch (err) {
      // A logo that cannot be drawn loses its slide, never the presentation.
      log.warn({ versionId: version.id, logoId: logo!.id, problem: (err as Error).message }, 'presentation: no tone check');
    }
  }
  return tones;
}

/** The version's document, its identity with file addresses inside the version, and the tone check of its logos. */
export async function presentationMaterial(version: VersionRecord, slug: string): Promise<PresentationMaterial> {
  const key = `${version.id}:${slug}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const snapshot = await versionSnapshot(version);
  const material = {
    doc: snapshot.doc,
    identity: withVersionUrls(snapshot.identity, slug, version.number, version.files ?? {}),
    tones: await versionTones(version, snapshot.identity),
  };
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
  cache.set(key, material);
  return material;
}
