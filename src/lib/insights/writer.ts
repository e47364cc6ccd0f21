// The one writer of insight records: the queue's job and the demo seed both store through it.
import { QueryTypes } from 'sequelize';
import { SiteInsight } from '@db/models';
import type { InsightRow } from './rows';

/** Store a batch of records in one statement; rows of a brand deleted meanwhile are skipped, not failed on. */
export async function writeInsights(rows: InsightRow[]): Promise<number> {
  if (rows.length === 0) return 0;
  const sequelize = SiteInsight.sequelize!;
  const brandIds = [...new Set(rows.map((r) => r.brandId))];
  const linkIds = [...new Set(rows.flatMap((r) => (r.shareLinkId ? [r.shareLinkId] : [])))];
  const [brands, links] = await Promise.all([
    sequelize.query<{ id: string }>('SELECT id FROM brands WHERE id IN (:ids)', { replacements: { ids: brandIds }, type: QueryTypes.SELECT }),
    linkIds.length ? sequelize.query<{ id: string }>('SELECT id FROM share_links WHERE id IN (:ids)', { replacements: { ids: linkIds }, type: QueryTypes.SELECT }) : [],
  ]);
  const liveBrands = new Set(brands.map((b) => b.id));
  const liveLinks = new Set(links.map((l) => l.id));
  const kept = rows
    .filter((r) => liveBrands.has(r.brandId))
    .map((r) => ({ ...r, at: new Date(r.at), shareLinkId: r.shareLinkId && liveLinks.has(r.shareLinkId) ? r.shareLinkId : null }));
  if (kept.length) await SiteInsight.bulkCreate(kept);
  return kept.length;
}
