// The one writer of insight records: the queue's job and the demo seed both store through it.
import { SiteInsight } from '@db/models';
import type { InsightRow } from './rows';

// One statement per batch, columns as arrays (unnest): no model instances to build, so a busy site's batches cost the
// worker little. Rows of a brand deleted meanwhile are skipped; a link deleted meanwhile is left out of its rows.
const INSERT = `
  INSERT INTO site_insights (brand_id, version_number, kind, path, embedded, share_link_id, member, visitor_key, day, at, block_id, query, results)
  SELECT u.brand_id, u.version_number, u.kind, u.path, u.embedded,
         (SELECT l.id FROM share_links l WHERE l.id = u.share_link_id), u.member, u.visitor_key, u.day, u.at, u.block_id, u.query, u.results
    FROM unnest($1::uuid[], $2::int[], $3::text[], $4::text[], $5::boolean[], $6::uuid[], $7::boolean[], $8::text[], $9::date[],
                $10::timestamptz[], $11::text[], $12::text[], $13::int[])
         AS u(brand_id, version_number, kind, path, embedded, share_link_id, member, visitor_key, day, at, block_id, query, results)
   WHERE EXISTS (SELECT 1 FROM brands b WHERE b.id = u.brand_id)`;

/** Store a batch of records in one statement; answers how many were stored. */
export async function writeInsights(rows: InsightRow[]): Promise<number> {
  if (rows.length === 0) return 0;
  const column = <K extends keyof InsightRow>(key: K) => rows.map((r) => r[key]);
  const [, count] = await SiteInsight.sequelize!.query(INSERT, {
    bind: [
      column('brandId'), column('versionNumber'), column('kind'), column('path'), column('embedded'), column('shareLinkId'), column('member'),
      column('visitorKey'), column('day'), column('at'), column('blockId'), column('query'), column('results'),
    ],
  });
  return typeof count === 'number' ? count : ((count as { rowCount?: number } | null)?.rowCount ?? rows.length);
}
