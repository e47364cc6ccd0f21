// One way to write dates, times and numbers for people: the viewer's locale, and the month always as a word so that
// 3/4 can never be read as March or April. Published pages are cached for every reader, so they pass SITE_LOCALE.
export type DateInput = string | number | Date;

/** The locale published pages and e-mail use: their bytes are the same for every reader. */
export const SITE_LOCALE = 'en-GB';

const supported = (locale: string | null | undefined): string | undefined => {
  if (!locale) return undefined;
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([locale])[0];
  } catch {
    return undefined;
  }
};

/** The first locale of an Accept-Language header that this runtime can format, else SITE_LOCALE. */
export function localeFromHeader(header: string | null | undefined): string {
  for (const part of (header ?? '').split(',')) {
    const tag = part.split(';')[0]?.trim();
    const found = tag && tag !== '*' ? supported(tag) : undefined;
    if (found) return found;
  }
  return SITE_LOCALE;
}

/** In a browser: the reader's own locale; on the server (no reader to ask): SITE_LOCALE. */
export function viewerLocale(): string {
  if (typeof navigator !== 'undefined' && navigator.language) return supported(navigator.language) ?? SITE_LOCALE;
  return SITE_LOCALE;
}

const toDate = (value: DateInput) => (value instanceof Date ? value : new Date(value));
const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(locale: string, kind: 'date' | 'long' | 'dateTime' | 'time', timeZone?: string): Intl.DateTimeFormat {
  const key = `${locale}|${kind}|${timeZone ?? ''}`;
  let f = formatters.get(key);
  if (!f) {
    const options: Intl.DateTimeFormatOptions =
      kind === 'date' ? { day: 'numeric', month: 'short', year: 'numeric' }
      : kind === 'long' ? { day: 'numeric', month: 'long', year: 'numeric' }
      : kind === 'dateTime' ? { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }
      : { hour: '2-digit', minute: '2-digit' };
    f = new Intl.DateTimeFormat(locale, timeZone ? { ...options, timeZone } : options);
    formatters.set(key, f);
  }
  return f;
}

// `timeZone`: the runtime's own unless given (e-mail gives UTC, so a date never depends on the server's clock zone).
/** "2 Dec 2026" / "Dec 2, 2026": a date with the month as a word. */
export const formatDate = (value: DateInput, locale = viewerLocale(), timeZone?: string) => formatter(locale, 'date', timeZone).format(toDate(value));
/** "2 December 2026": for documents and letters. */
export const formatLongDate = (value: DateInput, locale = viewerLocale(), timeZone?: string) => formatter(locale, 'long', timeZone).format(toDate(value));
/** "2 Dec 2026, 14:05". */
export const formatDateTime = (value: DateInput, locale = viewerLocale(), timeZone?: string) => formatter(locale, 'dateTime', timeZone).format(toDate(value));
/** "14:05" / "2:05 PM". */
export const formatTime = (value: DateInput, locale = viewerLocale(), timeZone?: string) => formatter(locale, 'time', timeZone).format(toDate(value));
/** Grouped digits in the viewer's locale: 12,345 / 12 345 / 12.345; `digits` fixes the decimals (4.50). */
export const formatNumber = (value: number, locale = viewerLocale(), digits?: number) =>
  new Intl.NumberFormat(locale, digits === undefined ? undefined : { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(value);

const KIB = 1024;
const MIB = 1024 * 1024;
/**
 * A file's size for people: "12 KB" below a mebibyte (rounded up, so nothing looks smaller than it is), "3.4 MB" from
 * there. Binary multiples written KB/MB, as file managers and the JEDEC convention do (common practice).
 */
export const formatFileSize = (bytes: number, locale = viewerLocale()) =>
  bytes < MIB ? `${formatNumber(Math.max(1, Math.ceil(bytes / KIB)), locale)} KB` : `${formatNumber(bytes / MIB, locale, 1)} MB`;
