// The one rule for values that end up in HTML, CSS, SVG or e-mail: every boundary accepts them through these schemas.
// Accepting is half the job; escape.ts escapes at output, so a row stored before these rules is still harmless.
import * as z from 'zod';
import { parseColor } from '@/lib/color/parse';

/** C0 and C1 controls, DEL, line and paragraph separators, bidi overrides and isolates, BOM: never part of a name. */
// eslint-disable-next-line no-control-regex -- control characters are what this rule looks for
const NAME_FORBIDDEN = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069\ufeff]/u;
/** The same for notes, which may hold line breaks (\n, and \r\n from a textarea) and tabs. */
// eslint-disable-next-line no-control-regex -- as above
const NOTE_FORBIDDEN = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069\ufeff]/u;

/** True when a name holds a character no name may hold. */
export const hasForbiddenNameCharacter = (value: string) => NAME_FORBIDDEN.test(value);

/**
 * A display name (brand, colour, logo, asset, board, person): one trimmed line of printable text, length-capped.
 * Quotes and angle brackets are allowed: they are escaped wherever the name is shown.
 */
export const displayName = (what: string, max = 120) =>
  z
    .string({ error: `Give the ${what} a name.` })
    .trim()
    .min(1, `Give the ${what} a name.`)
    .max(max, `A ${what} name can be at most ${max} characters.`)
    .refine((v) => !NAME_FORBIDDEN.test(v), `A ${what} name must be one line of text, without control characters.`);

/** One line of optional text (a label, a spot-colour reference, a tag): like a name but may be empty. */
export const singleLine = (what: string, max: number) =>
  z
    .string({ error: `The ${what} must be text.` })
    .trim()
    .max(max, `The ${what} can be at most ${max} characters.`)
    .refine((v) => !NAME_FORBIDDEN.test(v), `The ${what} must be one line of text, without control characters.`);

/** Free text (a note, a message, a caption): line breaks and tabs allowed, other control characters refused. */
export const noteText = (what: string, max: number) =>
  z
    .string({ error: `The ${what} must be text.` })
    .max(max, `The ${what} can be at most ${max} characters.`)
    .refine((v) => !NOTE_FORBIDDEN.test(v), `The ${what} cannot hold control characters.`);

/** Letters and marks of any script, digits, spaces, hyphen, apostrophe, full stop: nothing that can end a CSS string or block. */
export const TYPEFACE_FAMILY_PATTERN = /^[\p{L}\p{M}\p{N}][\p{L}\p{M}\p{N} '.-]*$/u;
export const TYPEFACE_FAMILY_MAX = 100;
const FAMILY_HINT = 'A typeface name may hold letters, digits, spaces, hyphens, apostrophes and full stops only.';

/** A typeface family name, e.g. "Source Serif 4" or "Bricolage Grotesque". */
export const typefaceFamily = z
  .string({ error: 'Give the typeface family name.' })
  .trim()
  .min(1, 'Give the typeface family name.')
  .max(TYPEFACE_FAMILY_MAX, `A typeface name can be at most ${TYPEFACE_FAMILY_MAX} characters.`)
  .regex(TYPEFACE_FAMILY_PATTERN, FAMILY_HINT);

/** A fallback in a font stack: a family name, or a generic family such as sans-serif or -apple-system. */
export const fallbackFamily = z
  .string({ error: 'A fallback font must be text.' })
  .trim()
  .min(1, 'A fallback font name cannot be empty.')
  .max(60, 'A fallback font name can be at most 60 characters.')
  .regex(/^-?[\p{L}\p{M}\p{N}][\p{L}\p{M}\p{N} '.-]*$/u, FAMILY_HINT);

/**
 * A family name read from storage or a font file, made fit for CSS: disallowed characters removed, length capped.
 * Escaping still follows; this keeps an old hostile row from even looking like CSS.
 */
export function cleanTypefaceFamily(value: unknown, fallback = 'Unnamed typeface'): string {
  const kept = String(value ?? '')
    .replace(/[^\p{L}\p{M}\p{N} '.-]+/gu, ' ')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/^[^\p{L}\p{M}\p{N}]+/u, '')
    .slice(0, TYPEFACE_FAMILY_MAX)
    .trim();
  return kept || fallback;
}

/** The text of a colour value before parsing: one line, at most 200 characters; the caller parses it (and answers invalid_color). */
export const cssColorInput = z
  .string({ error: 'Type a colour value, e.g. #1f6f5c or oklch(55% 0.1 170).' })
  .trim()
  .min(1, 'Type a colour value, e.g. #1f6f5c or oklch(55% 0.1 170).')
  .max(200, 'A colour value can be at most 200 characters.')
  .refine((v) => !NAME_FORBIDDEN.test(v), 'A colour value must be one line of text, without control characters.');

/** A CSS colour our colour parser reads (hex, rgb(), hsl(), oklch(), lab(), names), kept as typed. */
export const cssColorText = z
  .string({ error: 'Type a colour value, e.g. #1f6f5c or oklch(55% 0.1 170).' })
  .trim()
  .min(1, 'Type a colour value, e.g. #1f6f5c or oklch(55% 0.1 170).')
  .max(200, 'A colour value can be at most 200 characters.')
  .superRefine((v, ctx) => {
    const parsed = parseColor(v);
    if (!parsed.ok) ctx.addIssue({ code: 'custom', message: parsed.error.message });
  });

/** A CSS colour turned into the only form we ever write into CSS or SVG: lower-case #rrggbb. */
export const cssColorHex = cssColorText.transform((v) => {
  const parsed = parseColor(v);
  return parsed.ok ? parsed.color.hex : '#000000';
});

/** A colour already stored, as hex for CSS/SVG, or the fallback when the row does not hold one. */
export const storedHex = (value: unknown, fallback: string): string => (typeof value === 'string' && /^#[0-9a-f]{6}$/i.test(value) ? value.toLowerCase() : fallback);

/** An http(s) address, only where a web address is really wanted (links in text, a studio's site); never for files we fetch. */
export const webAddress = z
  .string({ error: 'Give a web address.' })
  .trim()
  .max(2048, 'A web address can be at most 2048 characters.')
  .refine((v) => !NAME_FORBIDDEN.test(v) && !/[\s"'<>`\\]/.test(v), 'A web address cannot hold spaces, quotes, angle brackets or control characters.')
  .refine((v) => {
    try {
      const url = new URL(v);
      return (url.protocol === 'https:' || url.protocol === 'http:') && url.hostname !== '';
    } catch {
      return false;
    }
  }, 'Give a full web address starting with https:// or http://.');

/** A reference to a file on the brand's own asset shelf (its id); an outside address is refused with a clear message. */
export const assetRef = z
  .string({ error: 'Choose a file from the brand’s asset shelf.' })
  .trim()
  .refine((v) => !/^[a-z][a-z0-9+.-]*:|^\/\//i.test(v), 'Images come from the brand’s asset shelf; outside addresses are not accepted. Upload the file on the Assets page and choose it here.')
  .pipe(z.uuid({ error: 'Choose a file from the brand’s asset shelf (an asset id).' }));

/** True when a stored value is a reference to a shelf asset (and not an outside address or a leftover placeholder). */
export const isAssetRef = (value: unknown): value is string => assetRef.safeParse(value).success;

/** For a schema that keeps its own wording: true when a value is one line without control characters. */
export const isOneLine = (value: string) => !NAME_FORBIDDEN.test(value);
/** For a schema that keeps its own wording: true when free text holds no control characters but line breaks and tabs. */
export const isCleanNote = (value: string) => !NOTE_FORBIDDEN.test(value);
export const ONE_LINE_MESSAGE = 'Use one line of text, without control characters.';
export const NOTE_MESSAGE = 'The text cannot hold control characters.';

/** A name made from something we did not type (a file name, a font's own metadata): forbidden characters become spaces. */
export function cleanName(value: unknown, fallback: string, max = 160): string {
  return String(value ?? '').replace(new RegExp(NAME_FORBIDDEN.source, 'gu'), ' ').replace(/\s+/g, ' ').trim().slice(0, max).trim() || fallback;
}
