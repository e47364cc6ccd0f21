// Stable ids: block ids anchor review comments, so they are generated once and never reused.
import * as z from 'zod';

/** Longest id accepted for a block or an identity reference. */
export const ID_MAX = 100;

/** A block id: letters, digits, '-' and '_' (a UUID fits). */
export const blockIdSchema = z
  .string({ error: 'A block id must be text.' })
  .regex(/^[A-Za-z0-9_-]{1,100}$/, { error: 'A block id must be 1–100 letters, digits, "-" or "_".' });

/** A reference to a colour, logo or asset of the identity; "$" is kept for template placeholders. */
export const refIdSchema = (what: string) =>
  z
    .string({ error: `A ${what} id must be text.` })
    .regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,99}$/, { error: `Expected a ${what} id (1–100 letters, digits, "-", "_" or ".").` });

/** A fresh random block id; falls back to getRandomValues where randomUUID is missing (plain-http origins). */
export function newBlockId(): string {
  const c = globalThis.crypto;
  if (typeof c?.randomUUID === 'function') return c.randomUUID();
  const bytes = new Uint8Array(16);
  c.getRandomValues(bytes);
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
