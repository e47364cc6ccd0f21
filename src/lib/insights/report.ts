// The pure half of the insights report: ranges, calendar buckets (ISO 8601 weeks), what a stored path names, and the
// CSV tables. The queries live in report.server.ts.
import type { InsightBucket, InsightRange, InsightsReport, InsightTable } from './views';

const DAY_MS = 86_400_000;
const ymd = (d: Date) => d.toISOString().slice(0, 10);
const utcDate = (y: number, m: number, d: number) => new Date(Date.UTC(y, m, d));
const startOfDay = (d: Date) => utcDate(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate());

/** ISO 8601 week-numbering year and week of a UTC day: weeks start on Monday; week 1 holds the year's first Thursday. */
export function isoWeek(date: Date): { year: number; week: number } {
  const day = startOfDay(date);
  const weekday = (day.getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
  const thursday = new Date(day.getTime() + (3 - weekday) * DAY_MS);
  const year = thursday.getUTCFullYear();
  const week = 1 + Math.floor((thursday.getTime() - utcDate(year, 0, 1).getTime()) / (7 * DAY_MS));
  return { year, week };
}

/** The Monday (UTC) that starts the ISO week holding `date`. */
export const weekStart = (date: Date) => new Date(startOfDay(date).getTime() - ((date.getUTCDay() + 6) % 7) * DAY_MS);

/** The first day of the bucket holding `date`. */
export function bucketStart(date: Date, bucket: 'day' | 'week' | 'month'): Date {
  if (bucket === 'day') return startOfDay(date);
  if (bucket === 'week') return weekStart(date);
  return utcDate(date.getUTCFullYear(), date.getUTCMonth(), 1);
}

/** A bucket in ISO 8601 notation: 2026-12-02, 2026-W49 (week-numbering year) or 2026-12. */
export function bucketLabel(start: Date, bucket: 'day' | 'week' | 'month'): string {
  if (bucket === 'day') return ymd(start);
  if (bucket === 'month') return ymd(start).slice(0, 7);
  const { year, week } = isoWeek(start);
  return `${year}-W${String(week).padStart(2, '0')}`;
}

/** The range's buckets, oldest first, ending with the one holding `now`: 7 days, 4 ISO weeks or 12 months. */
export function rangeBuckets(range: InsightRange, now: Date): { bucket: 'day' | 'week' | 'month'; starts: Date[]; from: Date } {
  const bucket = range === '7d' ? 'day' : range === '4w' ? 'week' : 'month';
  const count = range === '7d' ? 7 : range === '4w' ? 4 : 12;
  const last = bucketStart(now, bucket);
  const starts: Date[] = [];
  for (let i = count - 1; i >= 0; i--) {
    starts.push(bucket === 'month' ? utcDate(last.getUTCFullYear(), last.getUTCMonth() - i, 1) : new Date(last.getTime() - i * (bucket === 'week' ? 7 : 1) * DAY_MS));
  }
  return { bucket, starts, from: starts[0] };
}

/** Per-day figures gathered into the range's buckets (a visitor counts once per day, as keys change daily). */
export function toBuckets(days: { day: string; views: number; visitors: number; downloads: number }[], range: InsightRange, now: Date): InsightBucket[] {
  const { bucket, starts } = rangeBuckets(range, now);
  const out = starts.map((s) => ({ start: ymd(s), label: bucketLabel(s, bucket), views: 0, visitors: 0, downloads: 0 }));
  const index = new Map(out.map((b, i) => [b.start, i]));
  for (const d of days) {
    const i = index.get(ymd(bucketStart(new Date(`${d.day}T00:00:00Z`), bucket)));
    if (i === undefined) continue;
    out[i].views += d.views;
    out[i].visitors += d.visitors;
    out[i].downloads += d.downloads;
  }
  return out;
}

/** What a downloaded manifest path was, in words, given the names of the brand's files by id. */
export function describeDownload(kind: string, path: string, names: Map<string, string>): { label: string; format: string } {
  const [rest, query = ''] = path.split('?');
  const params = new URLSearchParams(query);
  if (kind === 'pdf' && rest === 'presentation.pdf') return { label: 'Presentation PDF', format: 'PDF, 16:9 slides' };
  if (kind === 'pdf') return { label: 'Guidelines PDF', format: `PDF, ${(params.get('size') ?? 'a4') === 'letter' ? 'Letter' : 'A4'}` };
  if (kind === 'tokens') return { label: 'Design tokens', format: params.get('format') ?? 'dtcg' };
  const id = rest.startsWith('files/') ? rest.slice('files/'.length) : rest;
  const label = names.get(id) ?? 'A file no longer in the identity';
  const parts = [...params.entries()].map(([k, v]) => (v ? `${k} ${v}` : k));
  return { label, format: parts.length ? parts.join(', ') : 'as uploaded' };
}

/** One table of the report as CSV rows, header first (cells are escaped by toCsv). */
export function reportTable(report: InsightsReport, what: InsightTable): unknown[][] {
  switch (what) {
    case 'timeline':
      return [['bucket', 'start', 'views', 'visitors', 'downloads'], ...report.timeline.map((b) => [b.label, b.start, b.views, b.visitors, b.downloads])];
    case 'versions':
      return [['version', 'views', 'visitors'], ...report.versions.map((v) => [v.number, v.views, v.visitors])];
    case 'sections':
      return [['version', 'section', 'block id', 'views'], ...report.sections.map((s) => [s.versionNumber, s.title, s.blockId, s.views])];
    case 'visitors':
      return [['came through', 'visitors (daily)', 'page views'], ...report.visitors.map((v) => [v.label, v.visitors, v.views])];
    case 'downloads':
      return [['file', 'format', 'path', 'downloads'], ...report.downloads.map((d) => [d.label, d.format, d.path, d.count])];
    case 'searches':
      return [['search', 'times', 'last seen'], ...report.searches.map((s) => [s.query, s.count, s.lastSeen])];
  }
}
