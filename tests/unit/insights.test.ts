// Insights: the visitor key, calendar buckets, the CSV export and the events schema, each against an outside source.
import { getISOWeek, getISOWeekYear, startOfISOWeek } from 'date-fns';
import { describe, expect, test } from 'vitest';
import { toCsv } from '@/lib/assets/csv';
import { siteEventSchema } from '@/lib/insights/contract';
import { EventLimiter } from '@/lib/insights/limiter';
import { bucketLabel, bucketStart, describeDownload, isoWeek, rangeBuckets, reportTable, toBuckets } from '@/lib/insights/report';
import { insightRowSchema, utcDay, visitorKey } from '@/lib/insights/rows';
import type { InsightsReport } from '@/lib/insights/views';

const BRAND_A = '3f0c1d0e-8a51-4c4e-9d1e-2b7f5c7a9e01';
const BRAND_B = '9a6d2c41-0b7e-4f59-8c3a-71e2d4b5f602';
const UA = 'Mozilla/5.0 (X11; Linux x86_64) ExampleBrowser/1.0';

describe('visitor key (common practice for privacy-respecting analytics: a salted hash, rotated daily)', () => {
  test('the UTC day turns at midnight UTC, whatever the local clock says (ISO 8601 "Z" times)', () => {
    expect(utcDay(new Date('2026-12-02T23:59:59.999Z'))).toBe('2026-12-02');
    expect(utcDay(new Date('2026-12-03T00:00:00.000Z'))).toBe('2026-12-03');
    // 01:30 in UTC+2 is still the previous UTC day.
    expect(utcDay(new Date('2026-12-03T01:30:00+02:00'))).toBe('2026-12-02');
  });

  test('the same visitor gets the same key within a day and brand, a different one the next day', () => {
    const monday = visitorKey('salt-of-2026-12-02', '203.0.113.7', UA, BRAND_A);
    expect(visitorKey('salt-of-2026-12-02', '203.0.113.7', UA, BRAND_A)).toBe(monday);
    expect(visitorKey('salt-of-2026-12-03', '203.0.113.7', UA, BRAND_A)).not.toBe(monday);
  });

  test('differs per brand, per address and per user agent', () => {
    const key = visitorKey('s', '203.0.113.7', UA, BRAND_A);
    expect(visitorKey('s', '203.0.113.7', UA, BRAND_B)).not.toBe(key);
    expect(visitorKey('s', '203.0.113.8', UA, BRAND_A)).not.toBe(key);
    expect(visitorKey('s', '203.0.113.7', `${UA} Other`, BRAND_A)).not.toBe(key);
  });

  test('parts cannot run into each other ("ab"+"c" is not "a"+"bc")', () => {
    expect(visitorKey('s', '10.0.0.1', '2x', BRAND_A)).not.toBe(visitorKey('s', '10.0.0.12', 'x', BRAND_A));
  });

  test('is 64 hex digits (SHA-256, FIPS 180-4) and holds neither address nor agent', () => {
    const key = visitorKey('s', '203.0.113.7', UA, BRAND_A);
    expect(key).toMatch(/^[0-9a-f]{64}$/);
    expect(key).not.toContain('203');
  });

  test('the stored row shape refuses anything but a key where the visitor goes', () => {
    const row = { brandId: BRAND_A, versionNumber: 1, kind: 'page', path: 'index.html', embedded: false, shareLinkId: null, member: true, visitorKey: 'f'.repeat(64), day: '2026-12-02', at: '2026-12-02T10:00:00.000Z', blockId: null, query: null, results: null };
    expect(insightRowSchema.safeParse(row).success).toBe(true);
    expect(insightRowSchema.safeParse({ ...row, visitorKey: '203.0.113.7' }).success).toBe(false);
    expect(insightRowSchema.safeParse({ ...row, ip: '203.0.113.7' }).success).toBe(false);
  });
});

describe('ISO 8601 week numbering, checked against date-fns getISOWeek / getISOWeekYear / startOfISOWeek', () => {
  // Every day from 2015 through 2030: years with 53 weeks (2015, 2020, 2026) and years starting on every weekday.
  const days: Date[] = [];
  for (let t = Date.UTC(2015, 0, 1); t <= Date.UTC(2030, 11, 31); t += 86_400_000) days.push(new Date(t));

  test('week and week-numbering year agree with date-fns on every day of 2015–2030', () => {
    // date-fns reads the local calendar: compare with a local date of the same Y-M-D.
    const mismatches = days.filter((d) => {
      const local = new Date(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate());
      const ours = isoWeek(d);
      return ours.week !== getISOWeek(local) || ours.year !== getISOWeekYear(local);
    });
    expect(mismatches.map((d) => d.toISOString().slice(0, 10))).toEqual([]);
  });

  test('each week bucket starts on the Monday date-fns names', () => {
    for (const d of days.filter((_, i) => i % 5 === 0)) {
      const local = startOfISOWeek(new Date(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate()));
      const monday = bucketStart(d, 'week');
      expect([monday.getUTCFullYear(), monday.getUTCMonth(), monday.getUTCDate()]).toEqual([local.getFullYear(), local.getMonth(), local.getDate()]);
    }
  });

  // Worked examples of the ISO week date (from memory of the standard's rule: week 1 holds the year's first Thursday).
  test.each([
    ['2008-12-29', '2009-W01'],
    ['2010-01-03', '2009-W53'],
    ['2005-01-01', '2004-W53'],
    ['2026-12-31', '2026-W53'],
    ['2027-01-04', '2027-W01'],
  ])('%s is in %s', (day, label) => {
    expect(bucketLabel(bucketStart(new Date(`${day}T12:00:00Z`), 'week'), 'week')).toBe(label);
  });
});

describe('ranges and buckets', () => {
  const now = new Date('2026-12-02T15:00:00Z'); // a Wednesday

  test('last 7 days: seven days ending today', () => {
    const { starts, bucket } = rangeBuckets('7d', now);
    expect(bucket).toBe('day');
    expect(starts.map((s) => bucketLabel(s, 'day'))).toEqual(['2026-11-26', '2026-11-27', '2026-11-28', '2026-11-29', '2026-11-30', '2026-12-01', '2026-12-02']);
  });

  test('last 4 weeks: four ISO weeks ending with this one, each from its Monday', () => {
    const { starts } = rangeBuckets('4w', now);
    expect(starts.map((s) => [bucketLabel(s, 'week'), s.toISOString().slice(0, 10)])).toEqual([
      ['2026-W46', '2026-11-09'],
      ['2026-W47', '2026-11-16'],
      ['2026-W48', '2026-11-23'],
      ['2026-W49', '2026-11-30'],
    ]);
  });

  test('last 12 months: calendar months ending with this one, across the year', () => {
    const labels = rangeBuckets('12m', now).starts.map((s) => bucketLabel(s, 'month'));
    expect(labels[0]).toBe('2026-01');
    expect(labels.at(-1)).toBe('2026-12');
    expect(rangeBuckets('12m', new Date('2027-02-10T00:00:00Z')).starts.map((s) => bucketLabel(s, 'month'))[0]).toBe('2026-03');
  });

  test('days are summed into their week; days outside the range are left out', () => {
    const buckets = toBuckets(
      [
        { day: '2026-11-30', views: 3, visitors: 2, downloads: 1 }, // Monday of W49
        { day: '2026-12-02', views: 4, visitors: 1, downloads: 0 },
        { day: '2026-11-29', views: 5, visitors: 5, downloads: 2 }, // Sunday: still W48
        { day: '2026-10-01', views: 99, visitors: 99, downloads: 99 },
      ],
      '4w',
      now,
    );
    expect(buckets.map((b) => [b.label, b.views, b.visitors, b.downloads])).toEqual([
      ['2026-W46', 0, 0, 0],
      ['2026-W47', 0, 0, 0],
      ['2026-W48', 5, 5, 2],
      ['2026-W49', 7, 3, 1],
    ]);
  });
});

describe('CSV export (OWASP "CSV Injection": cells starting = + - @ tab or CR are neutralised; RFC 4180 quoting)', () => {
  const report = (query: string): InsightsReport => ({
    range: '4w', bucket: 'week', from: '', to: '', totals: { views: 0, visitors: 0, downloads: 0, emptySearches: 1 },
    timeline: [], versions: [], sections: [], visitors: [], downloads: [],
    searches: [{ query, count: 2, lastSeen: '2026-12-01T10:00:00.000Z' }],
  });
  const cell = (query: string) => toCsv(reportTable(report(query), 'searches')).split('\r\n')[1];

  test.each([
    ['=HYPERLINK("http://evil.example","x")', `"'=HYPERLINK(""http://evil.example"",""x"")",2,2026-12-01T10:00:00.000Z`],
    ['+cmd|calc', `'+cmd|calc,2,2026-12-01T10:00:00.000Z`],
    ['-2+3', `'-2+3,2,2026-12-01T10:00:00.000Z`],
    ['@SUM(A1)', `'@SUM(A1),2,2026-12-01T10:00:00.000Z`],
    ['\tleading tab', `'\tleading tab,2,2026-12-01T10:00:00.000Z`],
    ['plain navy', `plain navy,2,2026-12-01T10:00:00.000Z`],
    ['a, b', `"a, b",2,2026-12-01T10:00:00.000Z`],
  ])('%j', (query, line) => {
    expect(cell(query)).toBe(line);
  });

  test('a carriage return at the start is neutralised and quoted (RFC 4180 §2.6)', () => {
    expect(toCsv([['\r=1+1']])).toBe(`"'\r=1+1"\r\n`);
  });

  test('rows end with CRLF and the header comes first (RFC 4180 §2.1, §2.3)', () => {
    expect(toCsv(reportTable(report('x'), 'searches'))).toBe('search,times,last seen\r\nx,2,2026-12-01T10:00:00.000Z\r\n');
  });
});

describe('what a download was', () => {
  const names = new Map([['0b1c', 'Primary logo']]);
  test.each([
    ['pdf', 'guideline.pdf?size=a4', 'Guidelines PDF', 'PDF, A4'],
    ['pdf', 'guideline.pdf?size=letter', 'Guidelines PDF', 'PDF, Letter'],
    ['pdf', 'presentation.pdf', 'Presentation PDF', 'PDF, 16:9 slides'],
    ['tokens', 'tokens?format=css', 'Design tokens', 'css'],
    ['file', 'files/0b1c', 'Primary logo', 'as uploaded'],
    ['file', 'files/0b1c?variant=reversed', 'Primary logo', 'variant reversed'],
    ['file', 'files/gone', 'A file no longer in the identity', 'as uploaded'],
  ])('%s %s', (kind, path, label, format) => {
    expect(describeDownload(kind, path, names)).toEqual({ label, format });
  });
});

describe('events from the page', () => {
  test('a section event names one block id of safe characters', () => {
    expect(siteEventSchema.safeParse({ kind: 'section', blockId: 'b_12-x' }).success).toBe(true);
    expect(siteEventSchema.safeParse({ kind: 'section', blockId: '"><script>' }).success).toBe(false);
    expect(siteEventSchema.safeParse({ kind: 'section', blockId: 'x'.repeat(65) }).success).toBe(false);
  });
  test('a search is one line, trimmed, at most 120 characters, with a whole result count', () => {
    expect(siteEventSchema.parse({ kind: 'search', query: '  navy  ', results: 0 })).toEqual({ kind: 'search', query: 'navy', results: 0 });
    expect(siteEventSchema.safeParse({ kind: 'search', query: 'a\u0000b', results: 0 }).success).toBe(false);
    expect(siteEventSchema.safeParse({ kind: 'search', query: 'a\u202Eb', results: 0 }).success).toBe(false);
    expect(siteEventSchema.safeParse({ kind: 'search', query: 'n'.repeat(121), results: 0 }).success).toBe(false);
    expect(siteEventSchema.safeParse({ kind: 'search', query: 'navy', results: -1 }).success).toBe(false);
    expect(siteEventSchema.safeParse({ kind: 'view', path: '/' }).success).toBe(false);
  });
  test('the limiter lets a visitor send its share per window, then refuses until the next', () => {
    const limiter = new EventLimiter(3, 60_000);
    expect([1, 2, 3, 4].map(() => limiter.take('v', 1000))).toEqual([true, true, true, false]);
    expect(limiter.take('other', 1000)).toBe(true);
    expect(limiter.take('v', 61_000)).toBe(true);
  });
});

describe('repeated reads count once within the window (common practice for page-view counts)', () => {
  test('the same key within the window is a repeat; after it, or another key, is not', async () => {
    const { RepeatFilter } = await import('@/lib/insights/repeats');
    const f = new RepeatFilter(30_000, 100);
    expect(f.repeats('a', 0)).toBe(false);
    expect(f.repeats('a', 29_999)).toBe(true);
    expect(f.repeats('b', 29_999)).toBe(false);
    expect(f.repeats('a', 30_000)).toBe(false);
  });
  test('memory is bounded: past the limit it starts afresh', async () => {
    const { RepeatFilter } = await import('@/lib/insights/repeats');
    const f = new RepeatFilter(30_000, 2);
    f.repeats('a', 0);
    f.repeats('b', 0);
    expect(f.repeats('c', 1)).toBe(false);
    expect(f.repeats('a', 2)).toBe(false);
  });
});
