// Build step "files": the version's own copies of every file its identity and document name (logos and the
// designer's own logo version files, licensed fonts, approved photographs and images), so a later edit or deletion
// on the brand never reaches a published version. Each copy is a content-addressed object under the version; the
// ones a visitor may ask for by address (…/files/<id>) go into the manifest, and all are recorded on the version's
// `files` (the logo version files by "<logo>~<slot>") for the functions that make derived files from them.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { Asset, BrandLogo, BrandTypeface, GuidelineVersion, type VersionFile } from '@db/models';
import { documentRefs } from '@/blocks';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { mockupPattern } from '@/lib/mockups/pattern';
import { isAssetRef } from '@/lib/safe/values';
import { storage } from '@/lib/storage/index.server';
import { shippedFont } from '@/lib/type/shipped-fonts';
import { versionVariantFileId } from '@/lib/publishing/versions.server';
import { builtKey, filePath, type BuildContext, type BuildStepDefinition } from '../contract';

const logoType = (format: 'svg' | 'png') => (format === 'svg' ? 'image/svg+xml' : 'image/png');

async function copyFiles(ctx: BuildContext, identity: Identity, doc: GuidelineDoc): Promise<Record<string, VersionFile>> {
  const files: Record<string, VersionFile> = {};
  const keep = async (fileId: string, bytes: Buffer | null, format: string, contentType: string, what: string) => {
    if (!bytes) throw new Error(`${what} has no stored file to copy into the version.`);
    if (fileId.includes('~')) {
      // A logo version file is never asked for by address (…/files/<logo>?variant= is): stored, not in the manifest.
      const key = builtKey(ctx.brandId, ctx.versionId, createHash('sha256').update(bytes).digest('hex'), format);
      await storage.put(key, bytes, contentType);
      files[fileId] = { key, contentType };
    } else {
      const entry = await ctx.writer.write(filePath(`files/${fileId}`), bytes, contentType);
      files[fileId] = { key: entry.key, contentType };
    }
    await ctx.progress(Object.keys(files).length);
  };
  // Blocks show approved images of the brand's own shelf only (their declared image references); a name that is not
  // yet an asset ("photo-to-come-1") has nothing to copy, and neither has an image no longer approved.
  const approvedImages = new Set((identity.assets ?? []).filter((a) => a.kind === 'image' || a.kind === 'photo').map((a) => a.id));
  const wanted = documentRefs(doc, 'image').filter((id) => isAssetRef(id) && approvedImages.has(id));
  const images = wanted.length ? await Asset.findAll({ where: { brandId: ctx.brandId, id: wanted, state: 'approved', kind: ['image', 'photo'] }, attributes: ['id', 'storageKey', 'mime', 'format', 'name'] }) : [];
  for (const image of images) await keep(image.id, await storage.get(image.storageKey), image.format, image.mime, `The image "${image.name}"`);
  // Shelf patterns the blocks link (declared asset references) and the one the mock-ups draw: their tiles travel with the version.
  const approvedPatterns = new Set((identity.assets ?? []).filter((a) => a.kind === 'pattern').map((a) => a.id));
  const patternIds = [...new Set([...documentRefs(doc, 'asset'), mockupPattern(identity).assetId ?? ''])].filter((id) => approvedPatterns.has(id));
  const patterns = patternIds.length ? await Asset.findAll({ where: { brandId: ctx.brandId, id: patternIds, state: 'approved', kind: 'pattern' }, attributes: ['id', 'storageKey', 'mime', 'format', 'name'] }) : [];
  for (const pattern of patterns) await keep(pattern.id, await storage.get(pattern.storageKey), pattern.format, pattern.mime, `The pattern "${pattern.name}"`);
  const logoIds = identity.logos.map((l) => l.id);
  const logos = logoIds.length ? await BrandLogo.findAll({ where: { brandId: ctx.brandId, id: logoIds }, attributes: ['id', 'name', 'storageKey', 'format', 'variantFiles'] }) : [];
  for (const logo of logos) {
    await keep(logo.id, await storage.get(logo.storageKey), logo.format, logoType(logo.format), `The logo "${logo.name}"`);
    // The designer's own version files travel with the version, under "<logo id>~<slot>".
    for (const [slot, own] of Object.entries(logo.variantFiles ?? {})) {
      if (own) await keep(versionVariantFileId(logo.id, slot), await storage.get(own.key), own.format, logoType(own.format), `The ${slot} file of the logo "${logo.name}"`);
    }
  }
  // A font without a confirmed licence is never served, so never copied.
  const licensed = identity.typefaces.filter((f) => f.licence.confirmed).map((f) => f.id);
  const faces = licensed.length ? await BrandTypeface.findAll({ where: { brandId: ctx.brandId, id: licensed } }) : [];
  for (const face of faces) {
    const shipped = face.source === 'shipped' ? shippedFont(face.shippedKey ?? '') : null;
    const bytes = shipped ? await readFile(join(process.cwd(), shipped.file)) : face.storageKey ? await storage.get(face.storageKey) : null;
    await keep(face.id, bytes, face.format, `font/${face.format}`, `The typeface "${face.family}"`);
  }
  return files;
}

export const filesStep: BuildStepDefinition = {
  id: 'files',
  label: 'Copy the logos, fonts and images',
  async run(ctx) {
    const version = await GuidelineVersion.findByPk(ctx.versionId, { attributes: ['id', 'snapshot'] });
    if (!version) throw new Error('The version is gone.');
    const { doc, identity } = version.snapshot as { doc: GuidelineDoc; identity: Identity };
    const files = await copyFiles(ctx, identity, doc);
    await GuidelineVersion.update({ files }, { where: { id: ctx.versionId } });
  },
};
