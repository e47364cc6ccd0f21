// Expiry dates of shelf assets as calendar days (ISO 8601 dates, YYYY-MM-DD, counted in UTC), and the notices they call for.

/** Days before the expiry date that the owners are told it is coming. */
export const EXPIRY_NOTICE_DAYS = 7;
/** The shelf's default window for "expiring within N days", and the longest it may be. */
export const EXPIRING_DEFAULT_DAYS = 30;
export const EXPIRING_MAX_DAYS = 3660;

/** Shown wherever rights are: Plumbline keeps the studio's note, the licence itself decides. */
export const RIGHTS_CAUTION =
  'Usage rights here are the studio’s record of the licence, not legal advice and not the licence itself: the licence’s own terms decide what is allowed. Ask the brand’s owner when in doubt.';

const DAY_MS = 86_400_000;

/** The calendar day of an instant, in UTC (ISO 8601 calendar date). */
export const dayOf = (instant: Date): string => instant.toISOString().slice(0, 10);

/** A calendar day moved by whole days (negative goes back). */
export const addDays = (day: string, days: number): string => dayOf(new Date(Date.parse(`${day}T00:00:00Z`) + days * DAY_MS));

/** Whole days from `from` to `to` (0 on the same day, negative when `to` is earlier). */
export const daysBetween = (from: string, to: string): number => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);

export type ExpiryStatus = 'expired' | 'expiring' | 'valid';

/**
 * Where an expiry date stands on `today`: from the expiry day on the asset is expired (the job retires it that day);
 * within EXPIRY_NOTICE_DAYS before it, expiring.
 */
export function expiryStatus(expiresOn: string | null, today: string): ExpiryStatus | null {
  if (!expiresOn) return null;
  const left = daysBetween(today, expiresOn);
  return left <= 0 ? 'expired' : left <= EXPIRY_NOTICE_DAYS ? 'expiring' : 'valid';
}

/** The notice an asset is due on `today`: 'due' from its expiry day, 'ahead' within the notice days before, else none. */
export function noticeDue(expiresOn: string, today: string): 'ahead' | 'due' | null {
  const status = expiryStatus(expiresOn, today);
  return status === 'expired' ? 'due' : status === 'expiring' ? 'ahead' : null;
}

/** "3 December 2026" style, in UTC so every reader sees the same calendar day. */
export const formatDay = (day: string, locale: string): string =>
  new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`));
