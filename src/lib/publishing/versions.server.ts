// Publishing: one transaction turns the draft and the identity into a numbered, dated, immutable version in the
// `building` state and queues its build; readers see it once the build job has made it `ready`.
import { readFile } from 'node:fs/promises';
import { QueryTypes } from 'sequelize';
import { join } from 'node:path';
import { Asset, Brand, BrandLogo, BrandTypeface, GuidelineDraft, GuidelineVersion, type VersionFile } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { documentRefs, withStoredAttrs } from '@/blocks';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { loadIdentity } from '@/lib/identity/identity.server';
import type { Identity } from '@/lib/identity/types';
import { isAssetRef } from '@/lib/safe/values';
import { storage } from '@/lib/storage/index.server';
import { newKey } from '@/lib/storage/storage';
import { shippedFont } from '@/lib/type/shipped-fonts';
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

/** Copy every file the identity refers to, so later edits or deletions cannot reach this version. */
async function copyFiles(brand: Brand, identity: Identity, doc: GuidelineDoc): Promise<Record<string, VersionFile>> {
  const files: Record<string, VersionFile> = {};
  const copy = async (fileId: string, storageKey: string, format: string, contentType: string) => {
    const bytes = await storage.get(storageKey);
    if (!bytes) return;
    const key = newKey(brand.id, 'version', format);
    await storage.put(key, bytes, contentType);
    files[fileId] = { key, contentType };
  };
  const logoType = (format: 'svg' | 'png') => (format === 'svg' ? 'image/svg+xml' : 'image/png');
  // Blocks show approved images of the brand's own shelf only (their declared image references), copied like the logos;
  // a name that is not yet an asset ("photo-to-come-1") has nothing to copy.
  const approvedImages = new Set((identity.assets ?? []).filter((a) => a.kind === 'image' || a.kind === 'photo').map((a) => a.id));
  const wanted = documentRefs(doc, 'image').filter((id) => isAssetRef(id) && approvedImages.has(id));
  const images = wanted.length ? await Asset.findAll({ where: { brandId: brand.id, id: wanted, state: 'approved', kind: ['image', 'photo'] }, attributes: ['id', 'storageKey', 'mime', 'format'] }) : [];
  for (const image of images) await copy(image.id, image.storageKey, image.format, image.mime);
  const logos = await BrandLogo.findAll({ where: { brandId: brand.id }, attributes: ['id', 'storageKey', 'format', 'variantFiles'] });
  for (const logo of logos) {
    await copy(logo.id, logo.storageKey, logo.format, logoType(logo.format));
    // The designer's own version files travel with the version, under "<logo id>~<slot>".
    for (const [slot, own] of Object.entries(logo.variantFiles ?? {})) if (own) await copy(versionVariantFileId(logo.id, slot), own.key, own.format, logoType(own.format));
  }
  const licensed = new Set(identity.typefaces.filter((f) => f.licence.confirmed).map((f) => f.id));
  const faces = await BrandTypeface.findAll({ where: { brandId: brand.id } });
  for (const face of faces) {
    if (!licensed.has(face.id)) continue; // a font without a confirmed licence is never served
    const bytes = face.source === 'shipped' ? await readFile(join(process.cwd(), shippedFont(face.shippedKey ?? '')!.file)) : face.storageKey ? await storage.get(face.storageKey) : null;
    if (!bytes) continue;
    const key = newKey(brand.id, 'version', face.format);
    await storage.put(key, bytes, `font/${face.format}`);
    files[face.id] = { key, contentType: `font/${face.format}` };
  }
  return files;
}

const emptyDraft = () => new ApiError(409, 'empty_draft', 'There is nothing to publish yet: add at least one block to the guidelines first.');

/** Publish the current draft as the next version. */
export async function publishVersion(caller: Caller, brand: Brand, note: string): Promise<VersionView> {
  // Refuse an empty draft before copying any file (checked again under the lock below).
  const current = await GuidelineDraft.findByPk(brand.id, { attributes: ['doc'] });
  if (!current || current.doc.content.length === 0) throw emptyDraft();
  const identity = await loadIdentity(brand);
  const files = await copyFiles(brand, identity, current.doc as GuidelineDoc);
  let version: GuidelineVersion;
  try {
    version = await sequelize.transaction(async (t) => {
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
          files,
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
  } catch (err) {
    await Promise.all(Object.values(files).map((f) => storage.delete(f.key)));
    throw err;
  }
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
