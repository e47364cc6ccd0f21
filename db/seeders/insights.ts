// Demo insights for the first demo brand: invented readers over the last five weeks, written through the same writer
// the queue's job uses. Visitor keys are made from invented visitor names, never from an address. Safe to run again.
import { randomBytes, createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { outline } from '@/lib/guideline/outline';
import { utcDay, visitorKey, type InsightRow } from '@/lib/insights/rows';
import { writeInsights } from '@/lib/insights/writer';
import { Brand, GuidelineDraft, GuidelineVersion, ShareLink, SiteInsight } from '@db/models';

const DAYS = 35;
/** Invented searches a reader might try and find nothing for. */
const EMPTY_SEARCHES: [string, number][] = [
  ['letterhead', 9],
  ['email signature', 7],
  ['pms 7421', 5],
  ['favicon', 4],
  ['social avatar', 3],
  ['embroidery', 2],
];
const FOUND_SEARCHES = ['roast green', '#1f3b2d', 'logo', 'clear space', 'cmyk'];
const DEMO_LINKS = ['Inkwell print run, spring bags', 'Café fit-out agency'];

/** A small deterministic generator (mulberry32), so the demo reads the same on every machine. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Reads, downloads and searches for the demo brand (once); section views once its guidelines have sections. */
export async function seedInsights(sequelize: Sequelize, slug: string, now = new Date()): Promise<void> {
  const brand = await Brand.findOne({ where: { slug } });
  if (!brand) return;
  const versions = await GuidelineVersion.findAll({ where: { brandId: brand.id }, attributes: ['number', 'snapshot'], order: [['number', 'DESC']] });
  const latest = versions[0]?.number ?? 1;
  const sections = outline(((versions[0]?.snapshot as { doc?: { content?: [] } } | undefined)?.doc ?? ((await GuidelineDraft.findByPk(brand.id))?.doc as { content?: [] } | undefined)) ?? undefined)
    .map((e) => e.blockId)
    .filter(Boolean);
  const hasReads = (await SiteInsight.count({ where: { brandId: brand.id } })) > 0;
  const hasSections = (await SiteInsight.count({ where: { brandId: brand.id, kind: 'section' } })) > 0;
  if (hasReads && (hasSections || sections.length === 0)) return;

  let links = await ShareLink.findAll({ where: { brandId: brand.id, revokedAt: null }, attributes: ['id'] });
  if (!hasReads && links.length === 0) {
    // Invented links nobody holds: a random token whose hash is all that is kept, as for any link.
    links = await Promise.all(
      DEMO_LINKS.map((label, i) =>
        ShareLink.create({ brandId: brand.id, tokenHash: createHash('sha256').update(randomBytes(32)).digest('hex'), label, versionNumber: null, allowDownloads: i === 0, passwordHash: null, expiresAt: null, revokedAt: null, lastUsedAt: null, createdById: brand.createdById }),
      ),
    );
  }
  const files = await sequelize.query<{ id: string }>(`SELECT id::text FROM brand_logos WHERE brand_id = :b ORDER BY created_at LIMIT 3`, { replacements: { b: brand.id }, type: QueryTypes.SELECT });

  const next = random(0x51ab1e);
  const pick = <T>(list: T[]) => list[Math.floor(next() * list.length)];
  const rows: InsightRow[] = [];
  for (let d = DAYS - 1; d >= 0; d--) {
    const dayStart = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - d);
    const weekday = new Date(dayStart).getUTCDay();
    const readers = (weekday === 0 || weekday === 6 ? 1 : 4) + Math.floor(next() * 6);
    const salt = `demo-${utcDay(new Date(dayStart))}`;
    for (let r = 0; r < readers; r++) {
      const at = (offset: number) => {
        const t = new Date(Math.min(dayStart + (8 + next() * 10) * 3_600_000 + offset, now.getTime()));
        return { at: t.toISOString(), day: utcDay(t) };
      };
      const link = next() < 0.65 && links.length ? pick(links).id : null;
      const base = { brandId: brand.id, versionNumber: d > 20 ? Math.max(1, latest - 1) : latest, shareLinkId: link, member: link === null, visitorKey: visitorKey(salt, `demo-reader-${r}`, 'demo', brand.id), embedded: false, blockId: null, query: null, results: null };
      if (!hasReads) {
        const views = 1 + Math.floor(next() * 3);
        for (let v = 0; v < views; v++) rows.push({ ...base, kind: 'page', path: 'index.html', ...at(v * 60_000) });
        if (next() < 0.3) rows.push({ ...base, kind: 'pdf', path: pick(['guideline.pdf?size=a4', 'guideline.pdf?size=a4', 'guideline.pdf?size=letter', 'presentation.pdf']), ...at(120_000) });
        if (next() < 0.15) rows.push({ ...base, kind: 'tokens', path: pick(['tokens?format=css', 'tokens?format=dtcg', 'tokens?format=tailwind']), ...at(180_000) });
        if (files.length && next() < 0.25) rows.push({ ...base, kind: 'file', path: `files/${pick(files).id}`, ...at(240_000) });
        if (next() < 0.2) rows.push({ ...base, kind: 'search', path: null, query: pick(FOUND_SEARCHES), results: 1 + Math.floor(next() * 5), ...at(30_000) });
      }
      if (!hasSections && sections.length) {
        for (const blockId of sections.slice(0, 2 + Math.floor(next() * sections.length))) rows.push({ ...base, kind: 'section', path: null, blockId, ...at(90_000) });
      }
    }
  }
  if (!hasReads) {
    for (const [query, times] of EMPTY_SEARCHES) {
      for (let i = 0; i < times; i++) {
        const t = new Date(now.getTime() - Math.floor(next() * (DAYS - 1)) * 86_400_000 - Math.floor(next() * 3_600_000));
        rows.push({ brandId: brand.id, versionNumber: latest, kind: 'search', path: null, embedded: false, shareLinkId: links.length ? pick(links).id : null, member: false, visitorKey: visitorKey(`demo-${utcDay(t)}`, `demo-searcher-${i}`, 'demo', brand.id), day: utcDay(t), at: t.toISOString(), blockId: null, query, results: 0 });
      }
    }
  }
  // Sorted by time, so the table fills as it would have.
  rows.sort((a, b) => a.at.localeCompare(b.at));
  for (let i = 0; i < rows.length; i += 500) await writeInsights(rows.slice(i, i + 500));
}
