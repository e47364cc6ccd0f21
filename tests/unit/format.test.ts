// Dates for people: the month always as a word, so 3/4 is never ambiguous. Expected strings are CLDR's patterns as
// shipped in Node's ICU (checked against the Unicode CLDR date-format charts for en-GB, en-US and de).
import { describe, expect, test } from 'vitest';
import { formatDate, formatDateTime, formatFileSize, formatLongDate, formatNumber, localeFromHeader, SITE_LOCALE } from '@/lib/format';

const aprilThird = '2026-04-03T12:00:00Z';

describe('dates for the viewer', () => {
  test('month as a word in every locale (CLDR medium/long date patterns)', () => {
    expect(formatDate(aprilThird, 'en-GB')).toBe('3 Apr 2026');
    expect(formatDate(aprilThird, 'en-US')).toBe('Apr 3, 2026');
    expect(formatLongDate(aprilThird, 'en-GB')).toBe('3 April 2026');
    expect(formatLongDate(aprilThird, 'de-DE')).toBe('3. April 2026');
    for (const locale of ['en-GB', 'en-US', 'fr-FR', 'de-DE', 'ja-JP']) {
      // No all-numeric d/m/y: the month is spelled (or, in Japanese, carries its 月 unit).
      expect(formatDate(aprilThird, locale)).not.toMatch(/^\d{1,2}[/.-]\d{1,2}[/.-]\d{2,4}$/);
    }
  });
  test('date and time', () => {
    expect(formatDateTime('2026-04-03T14:05:00', 'en-GB')).toBe('3 Apr 2026, 14:05');
  });
  test('numbers grouped by the locale (CLDR number symbols)', () => {
    expect(formatNumber(12345.5, 'en-GB', 1)).toBe('12,345.5');
    expect(formatNumber(12345.5, 'de-DE', 1)).toBe('12.345,5');
    // Fixed decimals, as contrast ratios are written (WCAG 2.2 writes 4.5:1; the report shows two places).
    expect(formatNumber(4.5, 'en-GB', 2)).toBe('4.50');
  });
  test('a time zone fixes the day: 23:30 UTC on 3 April is already 4 April in Auckland (IANA tz: NZDT, UTC+13, until 5 April 2026)', () => {
    const lateEvening = '2026-04-03T23:30:00Z';
    expect(formatLongDate(lateEvening, 'en-GB', 'UTC')).toBe('3 April 2026');
    expect(formatLongDate(lateEvening, 'en-GB', 'Pacific/Auckland')).toBe('4 April 2026');
  });
});

describe('file sizes', () => {
  // 1 KiB = 1024 bytes and 1 MiB = 1 048 576 bytes (IEC 80000-13 binary prefixes), labelled KB/MB as file managers
  // do (JEDEC usage, common practice); below 1 MiB rounded up, so a file never looks smaller than it is.
  test.each([
    [1, 'en-GB', '1 KB'],
    [1024, 'en-GB', '1 KB'],
    [1025, 'en-GB', '2 KB'],
    [1_048_575, 'en-GB', '1,024 KB'],
    [1_048_576, 'en-GB', '1.0 MB'],
    [1_572_864, 'en-GB', '1.5 MB'],
    [1_572_864, 'de-DE', '1,5 MB'],
  ])('%d bytes in %s → %s', (bytes, locale, text) => {
    expect(formatFileSize(bytes, locale)).toBe(text);
  });
});

describe('the viewer locale from Accept-Language (RFC 9110 §12.5.4)', () => {
  test('first supported tag wins; quality values and wildcards are skipped', () => {
    expect(localeFromHeader('en-US,en;q=0.9')).toBe('en-US');
    expect(localeFromHeader('*;q=0.5, de-DE;q=0.8')).toBe('de-DE');
  });
  test('missing or hostile headers fall back to the site locale', () => {
    expect(localeFromHeader(null)).toBe(SITE_LOCALE);
    expect(localeFromHeader('')).toBe(SITE_LOCALE);
    expect(localeFromHeader('<script>,;;')).toBe(SITE_LOCALE);
  });
});
