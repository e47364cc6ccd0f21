// Dates for people: the month always as a word, so 3/4 is never ambiguous. Expected strings are CLDR's patterns as
// shipped in Node's ICU (checked against the Unicode CLDR date-format charts for en-GB, en-US and de).
import { describe, expect, test } from 'vitest';
import { formatDate, formatDateTime, formatLongDate, formatNumber, localeFromHeader, SITE_LOCALE } from '@/lib/format';

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
