// The working draft of a brand's guidelines: read, save with an optimistic revision lock, start from a template.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { Asset, Brand, GuidelineDraft } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import type { Identity } from '@/lib/identity/types';
import { isAssetRef } from '@/lib/safe/values';
import { blockRefs } from '@/blocks';
import { OUTSIDE_IMAGE_MESSAGE } from '@/blocks/imagery/definition';
import { validateGuideline, type GuidelineDoc } from './document';
import { instantiateTemplate, templateInstructions } from './templates';

export const TEMPLATES = ['essentials', 'brand-book'] as const;
export type TemplateName = (typeof TEMPLATES)[number];

const EMPTY: GuidelineDoc = { type: 'doc', content: [] };

/** The draft, created empty (revision 0) the first time a brand's guidelines are opened. */
export async function readDraft(brand: Brand): Promise<{ revision: number; doc: GuidelineDoc; updatedAt: string }> {
  const [draft] = await GuidelineDraft.findOrCreate({ where: { brandId: brand.id }, defaults: { brandId: brand.id, revision: 0, doc: EMPTY, updatedById: null } });
  return { revision: draft.revision, doc: draft.doc as GuidelineDoc, updatedAt: draft.updatedAt.toISOString() };
}

/** A doc through the shared schemas, or a 400 naming the first bad path. */
export function checkDoc(doc: unknown): GuidelineDoc {
  const result = validateGuideline(doc);
  if (!result.ok) {
    throw new ApiError(400, 'invalid_input', `The document is not valid at ${result.error.path}: ${result.error.message}`, { path: result.error.path });
  }
  return result.doc;
}

/** Every asset id a block declares as an image must be a file of this brand's own shelf; else a 400 naming the first. */
async function checkShelfImages(brand: Brand, doc: GuidelineDoc): Promise<void> {
  const used: { id: string; path: string }[] = [];
  doc.content.forEach((node, i) => {
    for (const ref of blockRefs(node.type, node.attrs)) {
      if (ref.kind === 'image' && isAssetRef(ref.value)) used.push({ id: ref.value, path: `content.${i}.attrs.${ref.path.join('.')}` });
    }
  });
  if (used.length === 0) return;
  const found = new Set((await Asset.findAll({ where: { brandId: brand.id, id: [...new Set(used.map((u) => u.id))] }, attributes: ['id'] })).map((a) => a.id));
  const stranger = used.find((u) => !found.has(u.id));
  if (stranger) throw new ApiError(400, 'invalid_input', `The document is not valid at ${stranger.path}: ${OUTSIDE_IMAGE_MESSAGE}`, { path: stranger.path });
}

/**
 * Save against the revision the editor started from. One UPDATE … WHERE revision = base decides the race:
 * of two saves from the same base exactly one wins, the other gets a 409 with the current revision.
 */
export async function saveDraft(caller: Caller, brand: Brand, baseRevision: number, doc: unknown): Promise<{ revision: number }> {
  const valid = checkDoc(doc);
  await checkShelfImages(brand, valid);
  await readDraft(brand);
  return sequelize.transaction(async (t) => {
    const rows = await sequelize.query<{ revision: number }>(
      `UPDATE guideline_drafts SET doc = :doc::jsonb, revision = revision + 1, updated_by_id = :userId, updated_at = now()
        WHERE brand_id = :brandId AND revision = :base RETURNING revision`,
      { replacements: { doc: JSON.stringify(valid), userId: caller.id, brandId: brand.id, base: baseRevision }, type: QueryTypes.SELECT, transaction: t },
    );
    if (rows.length === 0) {
      const current = await GuidelineDraft.findByPk(brand.id, { transaction: t, attributes: ['revision', 'updatedAt'] });
      throw new ApiError(409, 'conflict', 'Someone saved these guidelines after you opened them. Compare both versions and choose.', undefined, {
        current: { revision: current!.revision, updatedAt: current!.updatedAt.toISOString() },
      });
    }
    await audit({ actorId: caller.id, action: 'guideline.save', targetType: 'guideline', targetId: brand.id, brandId: brand.id, studioId: brand.studioId, details: { revision: rows[0].revision, blocks: valid.content.length } }, t);
    return { revision: rows[0].revision };
  });
}

const readTemplate = async (name: TemplateName): Promise<unknown> => JSON.parse(await readFile(join(process.cwd(), 'templates', 'guidelines', `${name}.json`), 'utf8'));

/** A starter template filled with this brand's identity (its colours, logos, faces), ready to save. */
export async function templateDoc(name: TemplateName, identity: Identity): Promise<GuidelineDoc> {
  return checkDoc(instantiateTemplate(await readTemplate(name), identity));
}

/** Every instruction text of every starter template, for the check before publishing. */
export async function allTemplateInstructions(): Promise<string[]> {
  return (await Promise.all(TEMPLATES.map(async (name) => templateInstructions(await readTemplate(name))))).flat();
}
