// The insights report of one brand over a range: what was read, by whom (daily keys only), what was downloaded and
// which searches found nothing. Aggregated in PostgreSQL by day, gathered into weeks or months in report.ts.
import { QueryTypes } from 'sequelize';
import { GuidelineDraft, GuidelineVersion, SiteInsight } from '@db/models';
import { outline } from '@/lib/guideline/outline';
import { describeDownload, rangeBuckets, toBuckets } from './report';
import { RANGE_LABELS, type InsightRange, type InsightsReport } from './views';

/** A read the visitor opened or saved: a PDF, a token file, or a version's file not loaded by the page itself. */
const DOWNLOAD = `(kind IN ('pdf', 'tokens') OR (kind = 'file' AND NOT embedded))`;

/** The report for `brandId` over `range`, as of `now`. */
export async function insightsReport(brandId: string, range: InsightRange, now = new Date()): Promise<InsightsReport> {
  const sequelize = SiteInsight.sequelize!;
  const { from } = rangeBuckets(range, now);
  const q = <T extends object>(sql: string) => sequelize.query<T>(sql, { replacements: { brandId, from, now }, type: QueryTypes.SELECT });
  const within = `brand_id = :brandId AND at >= :from AND at <= :now`;
  const [days, versions, sections, visitors, downloads, searches, shelfDays, shelf] = await Promise.all([
    q<{ day: string; views: string; visitors: string; downloads: string }>(
      `SELECT day::text AS day, count(*) FILTER (WHERE kind = 'page') AS views, count(DISTINCT visitor_key) AS visitors,
              count(*) FILTER (WHERE ${DOWNLOAD}) AS downloads
         FROM site_insights WHERE ${within} GROUP BY day`,
    ),
    q<{ number: number; views: string; visitors: string }>(
      `SELECT version_number AS number, count(*) AS views, count(DISTINCT (day, visitor_key)) AS visitors
         FROM site_insights WHERE ${within} AND kind = 'page' GROUP BY version_number ORDER BY version_number DESC`,
    ),
    q<{ versionNumber: number; blockId: string; views: string }>(
      `SELECT version_number AS "versionNumber", block_id AS "blockId", count(*) AS views
         FROM site_insights WHERE ${within} AND kind = 'section' GROUP BY version_number, block_id ORDER BY views DESC, version_number DESC LIMIT 200`,
    ),
    q<{ shareLinkId: string | null; member: boolean; label: string | null; createdAt: Date | null; visitors: string; views: string }>(
      `SELECT i.share_link_id AS "shareLinkId", i.member, l.label, l.created_at AS "createdAt",
              count(DISTINCT (i.day, i.visitor_key)) AS visitors, count(*) FILTER (WHERE i.kind = 'page') AS views
         FROM site_insights i LEFT JOIN share_links l ON l.id = i.share_link_id
        WHERE i.brand_id = :brandId AND i.at >= :from AND i.at <= :now AND (i.share_link_id IS NOT NULL OR i.member)
        GROUP BY i.share_link_id, i.member, l.label, l.created_at ORDER BY visitors DESC`,
    ),
    q<{ kind: string; path: string; count: string }>(
      `SELECT kind, path, count(*) AS count FROM site_insights WHERE ${within} AND ${DOWNLOAD} AND path IS NOT NULL
        GROUP BY kind, path ORDER BY count DESC LIMIT 200`,
    ),
    q<{ query: string; count: string; lastSeen: Date }>(
      `SELECT query, count(*) AS count, max(at) AS "lastSeen" FROM site_insights
        WHERE ${within} AND kind = 'search' AND results = 0 AND query IS NOT NULL GROUP BY query ORDER BY count DESC, max(at) DESC LIMIT 100`,
    ),
    // Files taken from the approved shelf (the downloads block and page) are in the download log already.
    q<{ day: string; count: string }>(
      `SELECT (created_at AT TIME ZONE 'UTC')::date::text AS day, count(*) AS count FROM asset_downloads
        WHERE brand_id = :brandId AND created_at >= :from AND created_at <= :now AND kind = 'file' GROUP BY 1`,
    ),
    q<{ name: string | null; format: string | null; assetId: string | null; count: string }>(
      `SELECT a.name, d.details->>'format' AS format, d.asset_id AS "assetId", count(*) AS count
         FROM asset_downloads d LEFT JOIN assets a ON a.id = d.asset_id
        WHERE d.brand_id = :brandId AND d.created_at >= :from AND d.created_at <= :now AND d.kind = 'file'
        GROUP BY a.name, d.details->>'format', d.asset_id ORDER BY count DESC LIMIT 200`,
    ),
  ]);

  const titles = await sectionTitles(brandId, [...new Set(sections.map((s) => s.versionNumber))]);
  const names = await fileNames(brandId);
  const timeline = toBuckets(
    [
      ...days.map((d) => ({ day: d.day, views: Number(d.views), visitors: Number(d.visitors), downloads: Number(d.downloads) })),
      ...shelfDays.map((d) => ({ day: d.day, views: 0, visitors: 0, downloads: Number(d.count) })),
    ],
    range,
    now,
  );
  const report: InsightsReport = {
    range,
    bucket: RANGE_LABELS[range].bucket,
    from: from.toISOString(),
    to: now.toISOString(),
    totals: { views: 0, visitors: 0, downloads: 0, emptySearches: searches.reduce((n, s) => n + Number(s.count), 0) },
    timeline,
    versions: versions.map((v) => ({ number: v.number, views: Number(v.views), visitors: Number(v.visitors) })),
    sections: sections.map((s) => ({
      versionNumber: s.versionNumber,
      blockId: s.blockId,
      title: titles.get(`${s.versionNumber}:${s.blockId}`) ?? titles.get(`draft:${s.blockId}`) ?? 'A section no longer in the guidelines',
      views: Number(s.views),
    })),
    visitors: visitors.map((v) => ({
      via: v.shareLinkId ? 'link' : 'members',
      shareLinkId: v.shareLinkId,
      label: v.shareLinkId ? (v.label?.trim() || `Unlabelled link made ${v.createdAt ? new Date(v.createdAt).toISOString().slice(0, 10) : ''}`.trim()) : 'Signed-in members',
      visitors: Number(v.visitors),
      views: Number(v.views),
    })),
    downloads: [
      ...downloads.map((d) => ({ ...describeDownload(d.kind, d.path, names), path: d.path, count: Number(d.count) })),
      ...shelf.map((d) => ({ label: d.name ?? 'A file since deleted from the shelf', format: d.format ?? 'original', path: `shelf/${d.assetId ?? ''}?format=${d.format ?? 'original'}`, count: Number(d.count) })),
    ].sort((a, b) => b.count - a.count),
    searches: searches.map((s) => ({ query: s.query, count: Number(s.count), lastSeen: new Date(s.lastSeen).toISOString() })),
  };
  for (const b of timeline) {
    report.totals.views += b.views;
    report.totals.visitors += b.visitors;
    report.totals.downloads += b.downloads;
  }
  return report;
}

/** Section titles by "version:blockId" from each version's snapshot, and "draft:blockId" from the working draft. */
async function sectionTitles(brandId: string, numbers: number[]): Promise<Map<string, string>> {
  const titles = new Map<string, string>();
  const [rows, draft] = await Promise.all([
    numbers.length ? GuidelineVersion.findAll({ where: { brandId, number: numbers }, attributes: ['number', 'snapshot'] }) : [],
    GuidelineDraft.findByPk(brandId, { attributes: ['doc'] }),
  ]);
  for (const v of rows) for (const e of outline((v.snapshot as { doc?: { content?: [] } }).doc)) if (e.blockId) titles.set(`${v.number}:${e.blockId}`, e.title || 'Untitled section');
  for (const e of outline(draft?.doc as { content?: [] } | undefined)) if (e.blockId) titles.set(`draft:${e.blockId}`, e.title || 'Untitled section');
  return titles;
}

/** The names of the brand's logos, typefaces and shelf files by id (what a version's files/:id copies). */
async function fileNames(brandId: string): Promise<Map<string, string>> {
  const rows = await SiteInsight.sequelize!.query<{ id: string; name: string }>(
    `SELECT id::text, name FROM brand_logos WHERE brand_id = :brandId
     UNION ALL SELECT id::text, family || ' (typeface)' FROM brand_typefaces WHERE brand_id = :brandId
     UNION ALL SELECT id::text, name FROM assets WHERE brand_id = :brandId`,
    { replacements: { brandId }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.id, r.name]));
}
