// The compact record the recorder hands to the queue and the writer stores: no address, no user agent, only the
// visitor's daily key. Pure (no database, no settings), so the demo seed writes through the same shape.
import { createHash } from 'node:crypto';
import { z } from 'zod';

export const INSIGHT_KINDS = ['page', 'file', 'pdf', 'presentation', 'tokens', 'section', 'search'] as const;
export type InsightKind = (typeof INSIGHT_KINDS)[number];

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);

/** One stored record, as it travels in a queued job (checked again on the worker: job data is read back from the database). */
export const insightRowSchema = z.strictObject({
  brandId: z.uuid(),
  versionNumber: z.number().int().min(1),
  kind: z.enum(INSIGHT_KINDS),
  path: z.string().max(400).nullable(),
  embedded: z.boolean(),
  shareLinkId: z.uuid().nullable(),
  member: z.boolean(),
  visitorKey: z.string().regex(/^[0-9a-f]{64}$/),
  day,
  at: z.iso.datetime(),
  blockId: z.string().max(64).nullable(),
  query: z.string().max(120).nullable(),
  results: z.number().int().min(0).nullable(),
});
export type InsightRow = z.infer<typeof insightRowSchema>;

/** A batch of records: the data of one insights job. */
export const insightBatchSchema = z.strictObject({ rows: z.array(insightRowSchema).max(5000) });
export type InsightBatch = z.infer<typeof insightBatchSchema>;

/** The UTC calendar day of an instant, YYYY-MM-DD. */
export const utcDay = (at: Date): string => at.toISOString().slice(0, 10);

/**
 * The visitor key: SHA-256 of the day's salt, the address, the user agent and the brand, each length-prefixed so no
 * two different inputs run together. A new salt each UTC day (deleted after) means keys link a visitor within one
 * day and one brand only (common practice for privacy-respecting web analytics).
 */
export function visitorKey(salt: string, ip: string, userAgent: string, brandId: string): string {
  const hash = createHash('sha256');
  for (const part of [salt, ip, userAgent, brandId]) hash.update(`${Buffer.byteLength(part)}:${part}\n`);
  return hash.digest('hex');
}

/** Cut text to at most `max` UTF-16 units without splitting a surrogate pair. */
export function clip(text: string, max: number): string {
  if (text.length <= max) return text;
  const cut = text.slice(0, max);
  return /[\uD800-\uDBFF]$/.test(cut) ? cut.slice(0, -1) : cut;
}
