// A pattern tile kept on the asset shelf: the SVG tile as the original (the shelf draws its PNG renditions), with the
// settings it was drawn from, so it can be drawn again when the mark or the palette changes.
import { createHash } from 'node:crypto';
import { Asset } from '@db/models/assets';
import type { Brand } from '@db/models';
import { assetView, type AssetView } from '@/lib/assets/assets.server';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import type { Identity } from '@/lib/identity/types';
import { cleanName } from '@/lib/safe/values';
import { newKey } from '@/lib/storage/storage';
import { storage } from '@/lib/storage/index.server';
import { inspectUpload } from '@/lib/uploads/inspect.server';
import { PATTERN_LAYOUT_LABELS, type PatternSettingsInput } from './layout';
import { patternTile } from './pattern.server';

/** Draw the tile and put it on the shelf as a draft `pattern` asset; the same tile twice is one asset. */
export async function savePattern(caller: Caller, brand: Brand, identity: Identity, input: PatternSettingsInput, name?: string): Promise<{ asset: AssetView; duplicate: boolean }> {
  const tile = await patternTile(identity, input);
  const logoName = identity.logos.find((l) => l.id === tile.settings.logoId)?.name ?? 'mark';
  const title = cleanName(name ?? `Pattern: ${logoName}, ${PATTERN_LAYOUT_LABELS[tile.settings.layout].toLowerCase()}`, 'Pattern', 160);
  const filename = `${brand.slug}-pattern-${tile.settings.layout}.svg`;
  // Through the one upload inspector like any shelf file: cleaned and measured the same way.
  const checked = await inspectUpload(Buffer.from(tile.svg, 'utf8'), { as: 'shelf', filename });
  const contentHash = createHash('sha256').update(checked.stored).digest('hex');
  const existing = await Asset.findOne({ where: { brandId: brand.id, contentHash } });
  if (existing) return { asset: assetView(existing), duplicate: true };
  const key = newKey(brand.id, 'asset', 'svg');
  await storage.put(key, checked.stored, checked.mime);
  try {
    const row = await sequelize.transaction(async (t) => {
      const asset = await Asset.create(
        {
          brandId: brand.id,
          name: title,
          kind: 'pattern',
          format: 'svg',
          mime: checked.mime,
          storageKey: key,
          contentHash,
          byteSize: checked.stored.length,
          width: tile.width,
          height: tile.height,
          drawnBounds: null,
          patternSettings: tile.settings,
          originalFilename: filename,
          description: null,
          usageNotes: 'Repeat this tile edge to edge: it is seamless.',
          uploadedById: caller.id,
          stateChangedAt: null,
          stateChangedById: null,
        },
        { transaction: t },
      );
      await audit(
        { actorId: caller.id, action: 'asset.pattern', targetType: 'asset', targetId: asset.id, brandId: brand.id, studioId: brand.studioId, details: { name: title, settings: tile.settings } },
        t,
      );
      return asset;
    });
    return { asset: assetView(row), duplicate: false };
  } catch (err) {
    await storage.delete(key); // no orphan file when the row could not be written
    throw err;
  }
}
