// Expiry days of shelf assets and the shelf's query schema. Dates are ISO 8601 calendar dates (YYYY-MM-DD,
// ISO 8601-1:2019 §5.2.2.1) in the proleptic Gregorian calendar; leap years per its rule (divisible by 4, except
// centuries not divisible by 400). Day counts checked against JavaScript's own Date arithmetic as the reference.
import { describe, expect, test } from 'vitest';
import { addDays, dayOf, daysBetween, EXPIRY_NOTICE_DAYS, expiryStatus, formatDay, noticeDue } from '@/lib/assets/expiry';
import { EMPTY_FILTERS, filterParams, filtersFrom } from '@/lib/assets/filters';
import { assetListQuerySchema, assetPatchSchema, searchWords } from '@/lib/assets/schemas';

describe('calendar days', () => {
  test.each([
    ['2026-12-31', 1, '2027-01-01'], // year end
    ['2028-02-28', 1, '2028-02-29'], // 2028 is a leap year (divisible by 4)
    ['2100-02-28', 1, '2100-03-01'], // 2100 is not (a century not divisible by 400)
    ['2000-02-28', 1, '2000-02-29'], // 2000 is (divisible by 400)
    ['2031-03-10', -7, '2031-03-03'],
    ['2026-03-29', 1, '2026-03-30'], // a European clock change does not move a UTC day
  ])('%s moved by %i days is %s', (day, n, expected) => {
    expect(addDays(day, n)).toBe(expected);
    expect(daysBetween(day, expected)).toBe(n);
  });

  test('the day of an instant is its UTC calendar date', () => {
    expect(dayOf(new Date('2031-03-09T23:59:59Z'))).toBe('2031-03-09');
    expect(dayOf(new Date('2031-03-10T00:30:00+01:00'))).toBe('2031-03-09'); // 23:30 UTC the day before
  });

  test('a day is written out in the site locale, the same day everywhere', () => {
    expect(formatDay('2031-03-10', 'en-GB')).toBe('10 March 2031');
  });
});

describe('where an expiry day stands', () => {
  // The notice goes EXPIRY_NOTICE_DAYS (7) before; from the expiry day itself the asset is expired.
  test.each([
    ['2031-03-02', 'valid', null],
    ['2031-03-03', 'expiring', 'ahead'],
    ['2031-03-09', 'expiring', 'ahead'],
    ['2031-03-10', 'expired', 'due'],
    ['2031-04-01', 'expired', 'due'],
  ])('on %s an asset expiring 2031-03-10 is %s', (today, status, notice) => {
    expect(EXPIRY_NOTICE_DAYS).toBe(7);
    expect(expiryStatus('2031-03-10', today)).toBe(status);
    expect(noticeDue('2031-03-10', today)).toBe(notice);
  });
  test('no date, no status', () => expect(expiryStatus(null, '2031-03-10')).toBeNull());
});

describe('the shelf query schema', () => {
  test('an "expiring" filter without days gets the 30-day default; other filters pass as given', () => {
    expect(assetListQuerySchema.parse({ expiry: 'expiring' })).toMatchObject({ expiry: 'expiring', days: 30 });
    expect(assetListQuerySchema.parse({ q: 'navy', rights: 'with', format: 'svg' })).toMatchObject({ q: 'navy', rights: 'with', format: 'svg', days: undefined });
  });
  test.each([{ expiry: 'expired', days: '3' }, { days: '0', expiry: 'expiring' }, { q: 'a\u0007b' }, { rights: 'yes' }, { extra: '1' }])('refuses %o', (query) => {
    expect(assetListQuerySchema.safeParse(query).success).toBe(false);
  });
  test('search words are letters and digits (any script), lower-cased, at most eight', () => {
    expect(searchWords('Navy-Logo  (v2) & Ölfarbe')).toEqual(['navy', 'logo', 'v2', 'ölfarbe']);
    expect(searchWords("'; DROP TABLE x; --")).toEqual(['drop', 'table', 'x']);
    expect(searchWords('a b c d e f g h i j')).toHaveLength(8);
    expect(searchWords('&|!:*')).toEqual([]);
  });
  test('the screen’s filters and the address agree both ways', () => {
    const query = 'q=harbour&tag=print&kind=logo&state=approved&format=svg&rights=with&expiry=expiring&days=14';
    const parsed = assetListQuerySchema.parse(Object.fromEntries(new URLSearchParams(query)));
    expect(filterParams(filtersFrom(parsed)).toString()).toBe(query);
    expect(filterParams(EMPTY_FILTERS).toString()).toBe('');
  });
  test('expiry days must be real calendar dates', () => {
    expect(assetPatchSchema.safeParse({ expiresOn: '2028-02-29' }).success).toBe(true);
    expect(assetPatchSchema.safeParse({ expiresOn: '2027-02-29' }).success).toBe(false); // 2027 is not a leap year
    expect(assetPatchSchema.safeParse({ expiresOn: null }).success).toBe(true);
  });
});

describe('the expiry notice', () => {
  // OWASP XSS Prevention, rule 1: values in HTML are entity-encoded; the text part keeps them as written.
  test('says which notice it is, and escapes the names in HTML', async () => {
    const { renderMail } = await import('@/lib/mail/templates');
    const data = { siteUrl: 'https://plumbline.test', brandName: 'Quay & Co', assetName: 'Ferry <mark>', day: '10 March 2031', days: 7, link: 'https://plumbline.test/app/brands/b/assets?expiry=expired' };
    const ahead = renderMail('asset-expiry', { ...data, ahead: true, due: false, retired: false });
    expect(ahead.subject).toBe('Expires 10 March 2031: Ferry <mark> (Quay & Co)');
    expect(ahead.html).toContain('Ferry &lt;mark&gt; expires on 10 March 2031');
    expect(ahead.html).not.toContain('<mark>');
    const due = renderMail('asset-expiry', { ...data, ahead: false, due: true, retired: true });
    expect(due.subject).toBe('Expired 10 March 2031: Ferry <mark> (Quay & Co)');
    expect(due.text).toContain('Plumbline has retired it');
    expect(due.text).toContain('the licence itself decides');
  });
});
