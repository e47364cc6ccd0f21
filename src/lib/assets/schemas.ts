// Request shapes of the asset routes, checked once at the boundary.
import { z } from 'zod';
import { isCleanNote, isOneLine, NOTE_MESSAGE, ONE_LINE_MESSAGE } from '@/lib/safe/values';
import { EXPIRING_DEFAULT_DAYS, EXPIRING_MAX_DAYS } from './expiry';
import { ASSET_FORMATS, ASSET_KINDS, ASSET_STATES } from './kinds';
import { ALT_TEXT_MAX, CAPTION_MAX, focalPointSchema } from './photo';

const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`).refine(isOneLine, ONE_LINE_MESSAGE);
const note = (max: number) => z.string().trim().max(max, `at most ${max} characters`).refine(isCleanNote, NOTE_MESSAGE);

export const RIGHTS_MAX = 4000;
export const CREDIT_MAX = 200;
/** A calendar date, ISO 8601 extended format (YYYY-MM-DD), a real day of a year from 2000 to 2199. */
const isoDay = z.iso.date('use a date like 2026-12-31').refine((d) => d >= '2000-01-01' && d <= '2199-12-31', 'use a year from 2000 to 2199');

export const assetPatchSchema = z.strictObject({
  state: z.enum(ASSET_STATES).optional(),
  tags: z.array(text(40).min(1, 'a tag cannot be empty')).max(30, 'at most 30 tags').optional(),
  description: note(2000).nullable().optional(),
  usageNotes: note(2000).nullable().optional(),
  name: text(160).min(1, 'a name is needed').optional(),
  kind: z.enum(['logo', 'image', 'photo']).optional(),
  /** A photograph's description for screen readers (WCAG 2.2 SC 1.1.1); needed before a photo is approved. */
  altText: note(ALT_TEXT_MAX).nullable().optional(),
  caption: note(CAPTION_MAX).nullable().optional(),
  /** Where the subject sits (fractions 0–1); crops keep it in view. null goes back to the centre. */
  focus: focalPointSchema.nullable().optional(),
  /** Usage rights or licence text (the studio's record of it), a credit line, and the calendar day it expires (ISO 8601 date). */
  rights: note(RIGHTS_MAX).nullable().optional(),
  credit: text(CREDIT_MAX).nullable().optional(),
  expiresOn: isoDay.nullable().optional(),
});

/** Filters of the shelf, the same in the API's query string and the shelf page's address. */
export const assetListQuerySchema = z
  .strictObject({
    state: z.enum(ASSET_STATES).optional(),
    tag: text(40).min(1).optional(),
    kind: z.enum(ASSET_KINDS).optional(),
    /** Words to find in the name, tags, rights and credit (each word, as a word's beginning; all must match). */
    q: text(100).optional(),
    format: z.enum(ASSET_FORMATS).optional(),
    /** Whether usage rights are written down. */
    rights: z.enum(['with', 'without']).optional(),
    /** expired: past its expiry day; expiring: within `days`; none: no expiry date. */
    expiry: z.enum(['expired', 'expiring', 'none']).optional(),
    days: z.coerce.number('days must be a whole number').int('days must be a whole number').min(1, 'at least 1 day').max(EXPIRING_MAX_DAYS, `at most ${EXPIRING_MAX_DAYS} days`).optional(),
  })
  .refine((f) => f.days === undefined || f.expiry === 'expiring', { message: 'days goes with expiry=expiring', path: ['days'] })
  .transform((f) => ({ ...f, q: f.q || undefined, days: f.expiry === 'expiring' ? (f.days ?? EXPIRING_DEFAULT_DAYS) : undefined }));
export type AssetListQuery = z.infer<typeof assetListQuerySchema>;

/** The words of a shelf search: letters and digits only (everything else separates words), at most eight. */
export const searchWords = (q: string): string[] => (q.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []).slice(0, 8);

export const uploadFieldsSchema = z.strictObject({ kind: z.enum(['logo', 'image', 'photo']).optional() });

export const bundleSchema = z
  .strictObject({
    assetIds: z.array(z.uuid('each asset id must be a uuid')).max(100, 'at most 100 assets').optional(),
    allLogos: z.boolean().optional(),
  })
  .refine((b) => b.allLogos === true || (b.assetIds?.length ?? 0) > 0, { message: 'choose assetIds or set allLogos to true', path: ['assetIds'] });

const day = z.iso.date('use a date like 2026-12-01').transform((d) => new Date(`${d}T00:00:00Z`));

export const downloadLogQuerySchema = z.strictObject({
  kind: z.enum(['file', 'bundle']).optional(),
  assetId: z.uuid().optional(),
  userId: text(100).min(1).optional(),
  via: z.enum(['member', 'share-link']).optional(),
  from: day.optional(),
  /** Inclusive: downloads on this day count. */
  to: day.transform((d) => new Date(d.getTime() + 86_400_000)).optional(),
  limit: z.coerce.number().int().min(1).max(5000).default(500),
  format: z.enum(['json', 'csv']).default('json'),
});

/** A URL's query as a plain object for a schema (repeated keys: the last wins). */
export const queryObject = (url: URL) => Object.fromEntries(url.searchParams.entries());
