// Publishing: one transaction turns the draft and the identity into a numbered, dated, immutable version in the
// `building` state and queues its build; readers see it once the build job has made it `ready`.
import { QueryTypes } from 'sequelize';
import { Brand, GuidelineDraft, GuidelineVersion } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { withStoredAttrs } from '@/blocks';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { loadIdentity } from '@/lib/identity/identity.server';
import type { Identity, LightParts } from '@/lib/identity/types';
import type { BuildStep, VersionState } from './build/contract';
import { queueBuild } from './build/run.server';
import { changeSummary, compareSnapshots, type Snapshot } from './diff';
import { siteCache } from './site-cache';

export interface VersionView {
  number: number;
  publishedAt: string;
  note: string;
  author: { id: string | null; name: string | null };
  draftRevision: number;
  /** building until the build job has written every file; only ready versions are served as "latest". */
  state: VersionState;
  /** Why the build failed (the step and its reason), or null. */
  buildError: string | null;
  buildSteps: BuildStep[];
  builtAt: string | null;
}

/** The key of a logo's own version file inside a version's files. */
export const versionVariantFileId = (logoId: string, slot: string) => `${logoId}~${slot}`;

const emptyDraft = () => new ApiError(409, 'empty_draft', 'There is nothing to publish yet: add at least one block to the guidelines first.');

/** Publish the current draft as the next version. */
export async function publishVersion(caller: Caller, brand: Brand, note: string): Promise<VersionView> {
  // Refuse an empty draft at once (checked again under the lock below).
  const current = await GuidelineDraft.findByPk(brand.id, { attributes: ['doc'] });
  if (!current || current.doc.content.length === 0) throw emptyDraft();
  const identity = await loadIdentity(brand);
  const version = await sequelize.transaction(async (t) => {
    // One publisher at a time per brand, so numbers never collide.
    await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key: `publish:${brand.id}` }, transaction: t });
    const draft = await GuidelineDraft.findByPk(brand.id, { transaction: t });
    if (!draft || draft.doc.content.length === 0) throw emptyDraft();
    const previous = await GuidelineVersion.findOne({ where: { brandId: brand.id }, order: [['number', 'DESC']], attributes: ['number'], transaction: t });
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
        state: 'building',
      },
      { transaction: t },
    );
    await audit({ actorId: caller.id, action: 'version.publish', targetType: 'version', targetId: created.id, brandId: brand.id, studioId: brand.studioId, details: { number: created.number, note, draftRevision: draft.revision } }, t);
    // The build job exists exactly when the version does; the follower notices go out once it is ready.
    await queueBuild(created.id, t);
    return created;
  });
  siteCache.forget();
  return viewOf(version, { id: caller.id, name: caller.name });
}

/** A version row as the API shows it. */
function viewOf(v: GuidelineVersion, author: VersionView['author']): VersionView {
  return {
    number: v.number,
    publishedAt: new Date(v.publishedAt).toISOString(),
    note: v.note,
    author,
    draftRevision: v.draftRevision,
    state: v.state,
    buildError: v.buildError ?? null,
    buildSteps: v.buildSteps ?? [],
    builtAt: v.builtAt ? new Date(v.builtAt).toISOString() : null,
  };
}

/** Every version of a brand, newest first, with its author's name and its build's state. */
export async function listVersions(brand: Brand): Promise<VersionView[]> {
  const rows = await GuidelineVersion.findAll({ where: { brandId: brand.id }, order: [['number', 'DESC']], attributes: ['number', 'note', 'draftRevision', 'publishedById', 'publishedAt', 'state', 'builtAt', 'buildSteps', 'buildError'] });
  const ids = [...new Set(rows.map((r) => r.publishedById).filter((id): id is string => Boolean(id)))];
  const people = ids.length ? await sequelize.query<{ id: string; name: string }>('SELECT id, name FROM "user" WHERE id IN (:ids)', { replacements: { ids }, type: QueryTypes.SELECT }) : [];
  const names = new Map(people.map((p) => [p.id, p.name]));
  return rows.map((r) => viewOf(r, { id: r.publishedById, name: r.publishedById ? (names.get(r.publishedById) ?? null) : null }));
}

/** One version of a brand as the API shows it (the publishing screen polls this while it builds), or null. */
export async function versionView(brand: Brand, number: number): Promise<VersionView | null> {
  return (await listVersions(brand)).find((v) => v.number === number) ?? null;
}

/** A version's columns without its snapshot: enough to check access and draw the page frame. */
const LIGHT = ['id', 'brandId', 'number', 'note', 'draftRevision', 'files', 'publishedById', 'publishedAt', 'state', 'manifest', 'builtAt'] as const;

/**
 * One version by number, or the latest READY one when number is null (a version still building, or failed, is
 * never "latest": readers keep the previous one meanwhile); null when there is none. The snapshot only when asked.
 */
export async function findVersion(brandId: string, number: number | null, opts: { snapshot?: boolean } = {}): Promise<GuidelineVersion | null> {
  const attributes = opts.snapshot ? undefined : [...LIGHT];
  return number === null
    ? GuidelineVersion.findOne({ where: { brandId, state: 'ready' }, order: [['number', 'DESC']], attributes })
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

/** The newest READY version number of a brand, or null. */
export async function latestNumber(brandId: string): Promise<number | null> {
  return (await GuidelineVersion.max<number, GuidelineVersion>('number', { where: { brandId, state: 'ready' } })) ?? null;
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
