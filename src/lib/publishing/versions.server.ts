// Publishing: one transaction turns the draft and the identity into a numbered, dated, immutable version.
import { QueryTypes } from 'sequelize';
import { Brand, GuidelineDraft, GuidelineVersion } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { withStoredAttrs } from '@/blocks';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { loadIdentity } from '@/lib/identity/identity.server';
import { log } from '@/lib/log.server';
import type { Identity, LightParts } from '@/lib/identity/types';
import { notifyPublished } from '@/lib/notices/publish.server';
import { changeSummary, compareSnapshots, type Snapshot } from './diff';
import { buildNow } from './build/build-now.server';
import { siteCache } from './site-cache';

export interface VersionView {
  number: number;
  publishedAt: string;
  note: string;
  author: { id: string | null; name: string | null };
  draftRevision: number;
}

/** The key of a logo's own version file inside a version's files. */
export const versionVariantFileId = (logoId: string, slot: string) => `${logoId}~${slot}`;

const emptyDraft = () => new ApiError(409, 'empty_draft', 'There is nothing to publish yet: add at least one block to the guidelines first.');

/** Publish the current draft as the next version. */
export async function publishVersion(caller: Caller, brand: Brand, note: string): Promise<VersionView> {
  // Refuse an empty draft before copying any file (checked again under the lock below).
  const current = await GuidelineDraft.findByPk(brand.id, { attributes: ['doc'] });
  if (!current || current.doc.content.length === 0) throw emptyDraft();
  const identity = await loadIdentity(brand);
  let previous: GuidelineVersion | null = null;
  const version = await sequelize.transaction(async (t) => {
    // One publisher at a time per brand, so numbers never collide.
    await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key: `publish:${brand.id}` }, transaction: t });
    const draft = await GuidelineDraft.findByPk(brand.id, { transaction: t });
    if (!draft || draft.doc.content.length === 0) throw emptyDraft();
    previous = await GuidelineVersion.findOne({ where: { brandId: brand.id }, order: [['number', 'DESC']], transaction: t });
    const created = await GuidelineVersion.create(
      {
        brandId: brand.id,
        number: (previous?.number ?? 0) + 1,
        note,
        draftRevision: draft.revision,
        snapshot: { doc: withStoredAttrs(draft.doc as GuidelineDoc), identity },
        // The build's "files" step copies them (build/steps/files.server.ts).
        files: {},
        publishedById: caller.id,
      },
      { transaction: t },
    );
    await audit({ actorId: caller.id, action: 'version.publish', targetType: 'version', targetId: created.id, brandId: brand.id, studioId: brand.studioId, details: { number: created.number, note, draftRevision: draft.revision } }, t);
    return created;
  });
  // STAND-IN until the build job lands (h-build): build the version in this request.
  await buildNow(version.id).catch((err) => log.error({ err }, 'publish: build failed'));
  siteCache.forget();
  const prev = previous as GuidelineVersion | null;
  const summary = prev ? changeSummary(compareSnapshots(prev.snapshot as Snapshot, version.snapshot as Snapshot)) : ['First published version'];
  await notifyPublished({
    brandId: brand.id,
    brandName: brand.name,
    slug: brand.slug,
    versionNumber: version.number,
    note,
    publishedBy: { id: caller.id, name: caller.name },
    summary,
  }).catch((err) => log.error({ err }, 'publish: notice failed'));
  return { number: version.number, publishedAt: version.publishedAt.toISOString(), note, author: { id: caller.id, name: caller.name }, draftRevision: version.draftRevision };
}

/** Every version of a brand, newest first, with its author's name. */
export async function listVersions(brand: Brand): Promise<VersionView[]> {
  const rows = await sequelize.query<{ number: number; published_at: Date; note: string; published_by_id: string | null; name: string | null; draft_revision: number }>(
    `SELECT v.number, v.published_at, v.note, v.published_by_id, u.name, v.draft_revision
       FROM guideline_versions v LEFT JOIN "user" u ON u.id = v.published_by_id
      WHERE v.brand_id = :brandId ORDER BY v.number DESC`,
    { replacements: { brandId: brand.id }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    number: r.number,
    publishedAt: new Date(r.published_at).toISOString(),
    note: r.note,
    author: { id: r.published_by_id, name: r.name },
    draftRevision: r.draft_revision,
  }));
}

/** A version's columns without its snapshot: enough to check access and draw the page frame. */
const LIGHT = ['id', 'brandId', 'number', 'note', 'draftRevision', 'files', 'publishedById', 'publishedAt', 'state', 'manifest'] as const;

/** One version by number (latest when number is null), or null; the snapshot only when asked for. */
export async function findVersion(brandId: string, number: number | null, opts: { snapshot?: boolean } = {}): Promise<GuidelineVersion | null> {
  const attributes = opts.snapshot ? undefined : [...LIGHT];
  return number === null
    ? GuidelineVersion.findOne({ where: { brandId }, order: [['number', 'DESC']], attributes })
    : GuidelineVersion.findOne({ where: { brandId, number }, attributes });
}

/** A version's frozen document and identity, read from the row when it was loaded without them. */
export async function versionSnapshot(version: GuidelineVersion): Promise<{ doc: GuidelineDoc; identity: Identity }> {
  const row = version.snapshot ? version : await GuidelineVersion.findByPk(version.id, { attributes: ['snapshot'] });
  return row!.snapshot as { doc: GuidelineDoc; identity: Identity };
}

/** How a version's logo prints its light parts in one colour: as the snapshot recorded, 'holes' for versions from before the setting. */
export async function versionLogoLightParts(version: GuidelineVersion, logoId: string): Promise<LightParts> {
  const { identity } = await versionSnapshot(version);
  return identity.logos.find((l) => l.id === logoId)?.lightParts ?? 'holes';
}

/** The newest version number of a brand, or null. */
export async function latestNumber(brandId: string): Promise<number | null> {
  return (await GuidelineVersion.max<number, GuidelineVersion>('number', { where: { brandId } })) ?? null;
}

/** What changed from version `from` to version `to` ("draft" compares against the working draft). */
export async function versionChanges(brand: Brand, from: number, to: number | 'draft') {
  const a = await findVersion(brand.id, from, { snapshot: true });
  if (!a) throw new ApiError(404, 'not_found', `Version ${from} was not found.`);
  let b: Snapshot;
  if (to === 'draft') {
    const draft = await GuidelineDraft.findByPk(brand.id);
    b = { doc: (draft?.doc ?? { content: [] }) as Snapshot['doc'], identity: await loadIdentity(brand) };
  } else {
    const v = await findVersion(brand.id, to, { snapshot: true });
    if (!v) throw new ApiError(404, 'not_found', `Version ${to} was not found.`);
    b = v.snapshot as Snapshot;
  }
  const changes = compareSnapshots(a.snapshot as Snapshot, b);
  return { from, to, changes, summary: changeSummary(changes) };
}

/** A stored version as the screens that render it see it (they read it through this module, never from db/). */
export type VersionRecord = GuidelineVersion;
