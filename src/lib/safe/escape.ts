// Escaping at output: one escaper per language a user's value can land in (HTML, XML/SVG, CSS).
// Values are escaped even when a schema accepted them, because an old row may predate the schema.

/** The five characters of the OWASP XSS Prevention Cheat Sheet, rule 1, as HTML character references. */
const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text for HTML element content or a quoted attribute value. */
export function escapeHtml(value: unknown): string {
  return String(value ?? '').replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

/** Characters outside the XML 1.0 `Char` production (§2.2): no document may hold them, even escaped. */
const NOT_XML_CHAR = /[^\t\n\r\u0020-\ud7ff\ue000-\ufffd\u{10000}-\u{10ffff}]/gu;
const XML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };

/** Text for XML or SVG character data or a quoted attribute (XML 1.0 §2.4, §3.1 AttValue); illegal characters become U+FFFD. */
export function escapeXml(value: unknown): string {
  return String(value ?? '')
    .replace(NOT_XML_CHAR, '\ufffd')
    .replace(/[&<>"']/g, (c) => XML_ESCAPES[c]);
}

/** "escape a character as code point" (CSSOM §2.1): a backslash, lower-case hex, then a space that ends the escape. */
const codePoint = (c: string) => `\\${c.codePointAt(0)!.toString(16)} `;

/** Characters that can end a <style> element or an HTML attribute; escaping them keeps the CSS meaning (CSS Syntax 3 §4.3.7). */
const HTML_SENSITIVE = /[<>&]/;

/**
 * "serialize a string" (CSSOM §2.1): the value in double quotes, NUL as U+FFFD, controls as code points, `"` and `\`
 * backslash-escaped (`quote` may be `'` where a file format prefers it). `<`, `>` and `&` are also written as code points, so the result is safe inside <style> and style="".
 */
export function cssString(value: unknown, quote: '"' | "'" = '"'): string {
  let out = quote;
  for (const c of String(value ?? '')) {
    const n = c.codePointAt(0)!;
    if (n === 0) out += '\ufffd';
    else if ((n >= 0x01 && n <= 0x1f) || n === 0x7f || HTML_SENSITIVE.test(c)) out += codePoint(c);
    else if (c === quote || c === '\\') out += `\\${c}`;
    else out += c;
  }
  return `${out}${quote}`;
}

/** "serialize an identifier" (CSSOM §2.1, the algorithm behind CSS.escape()), with `<`, `>`, `&` as code points. */
export function cssIdentifier(value: unknown): string {
  const chars = [...String(value ?? '')];
  let out = '';
  chars.forEach((c, i) => {
    const n = c.codePointAt(0)!;
    const digit = n >= 0x30 && n <= 0x39;
    if (n === 0) out += '\ufffd';
    else if ((n >= 0x01 && n <= 0x1f) || n === 0x7f) out += codePoint(c);
    else if (digit && (i === 0 || (i === 1 && chars[0] === '-'))) out += codePoint(c);
    else if (i === 0 && c === '-' && chars.length === 1) out += `\\${c}`;
    else if (HTML_SENSITIVE.test(c)) out += codePoint(c);
    else if (n >= 0x80 || c === '-' || c === '_' || digit || /[A-Za-z]/.test(c)) out += c;
    else out += `\\${c}`;
  });
  return out;
}

/** Generic font families (CSS Fonts 4 §4.2.1), written bare; every other name is written as a CSS string. */
const GENERIC_FAMILIES = new Set([
  'serif', 'sans-serif', 'cursive', 'fantasy', 'monospace', 'system-ui', 'emoji', 'math', 'fangsong',
  'ui-serif', 'ui-sans-serif', 'ui-monospace', 'ui-rounded', '-apple-system', 'blinkmacsystemfont',
]);

/** CSS-wide keywords (CSS Cascade 5 §7.3) and `default`: a family with such a name must be quoted (CSS Fonts 4 §4.2). */
const RESERVED = new Set(['inherit', 'initial', 'unset', 'revert', 'revert-layer', 'default']);

/** One font-family name for CSS: a generic family or a plain one-word ASCII name bare, any other name as an escaped CSS string. */
export function cssFamilyName(name: string): string {
  const trimmed = String(name ?? '').trim();
  const lower = trimmed.toLowerCase();
  if (GENERIC_FAMILIES.has(lower)) return lower;
  return /^-?[A-Za-z][A-Za-z0-9-]*$/.test(trimmed) && !RESERVED.has(lower) ? trimmed : cssString(trimmed);
}

/** A CSS font-family list from names, each escaped. */
export const cssFontFamilyList = (names: readonly string[]): string => names.map(cssFamilyName).join(', ');

/** A url() for CSS: the address as an escaped CSS string (CSS Values 4 §4.5.1 allows a string inside url()). */
export const cssUrl = (address: string): string => `url(${cssString(address)})`;
