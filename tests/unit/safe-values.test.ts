// The shared escapers and value rules, checked against the specs that define them and against reference parsers:
// css-tree (a CSS Syntax Level 3 tokenizer) and parse5 (the HTML parsing algorithm of the WHATWG HTML standard).
import { ident, string as cssStringUtils, tokenize, tokenTypes } from 'css-tree';
import { parseFragment, serialize } from 'parse5';
import { describe, expect, test } from 'vitest';
import { cssFamilyName, cssIdentifier, cssString, escapeHtml, escapeXml } from '@/lib/safe/escape';
import { assetRef, cleanTypefaceFamily, displayName, fallbackFamily, noteText, typefaceFamily, webAddress } from '@/lib/safe/values';

/** The CSS tokens of a text, as [type, text] pairs (css-tree follows CSS Syntax Level 3 §4 tokenization). */
function cssTokens(source: string): [number, string][] {
  const out: [number, string][] = [];
  tokenize(source, (type: number, start: number, end: number) => out.push([type, source.slice(start, end)]));
  return out;
}

const HOSTILE = ['Plain', 'Two Words', 'X"; } body { color: red } /*', 'a\nb', 'a\\b', '</style><script>alert(1)</script>', '\u0000nul', 'tab\there', 'ünïcødé 日本', "it's", '0starts-with-digit', '-', '--custom', '\u007f'];

describe('cssString follows CSSOM §2.1 "serialize a string"', () => {
  // Rows: the rules of the algorithm, one per row (CSSOM, W3C Editor's Draft, §2.1 Common Serializing Idioms).
  test.each([
    ['wrapped in double quotes', 'Inter', '"Inter"'],
    ['NUL becomes U+FFFD', 'a\u0000b', '"a\ufffdb"'],
    ['U+0001–U+001F escaped as a code point', 'a\nb', '"a\\a b"'],
    ['U+007F escaped as a code point', 'a\u007fb', '"a\\7f b"'],
    ['" is backslash-escaped', 'a"b', '"a\\"b"'],
    ['\\ is backslash-escaped', 'a\\b', '"a\\\\b"'],
    ['other characters are kept', 'Fraunces 9pt ünï', '"Fraunces 9pt ünï"'],
    // Our addition for HTML contexts: still a valid CSS escape (CSS Syntax 3 §4.3.7), so the value is unchanged.
    ['< > & escaped as code points', '</style>&', '"\\3c /style\\3e \\26 "'],
  ])('%s', (_rule, input, expected) => expect(cssString(input)).toBe(expected));

  test.each(HOSTILE)('%j is one <string-token> that decodes back to the value (css-tree)', (value) => {
    const tokens = cssTokens(cssString(value));
    expect(tokens).toHaveLength(1);
    expect(tokens[0][0]).toBe(tokenTypes.String);
    expect(cssStringUtils.decode(tokens[0][1])).toBe(value.replaceAll('\u0000', '\ufffd'));
  });

  test.each(HOSTILE)('%j cannot end a <style> element or a CSS block', (value) => {
    expect(cssString(value)).not.toMatch(/[<>\n]/);
    expect(cssString(value).slice(1, -1)).not.toMatch(/(^|[^\\])"/);
  });
});

describe('cssIdentifier follows CSSOM §2.1 "serialize an identifier" (the algorithm of CSS.escape())', () => {
  // Rows: the algorithm's rules; the expected strings are what CSS.escape() gives in browsers (from memory).
  test.each([
    ['NUL becomes U+FFFD', '\u0000', '\ufffd'],
    ['controls escaped as code points', '\u0001\u001f\u007f', '\\1 \\1f \\7f '],
    ['a leading digit escaped as a code point', '0a', '\\30 a'],
    ['a digit after a leading hyphen escaped', '-1a', '-\\31 a'],
    ['a lone hyphen backslash-escaped', '-', '\\-'],
    ['two hyphens kept', '--a', '--a'],
    ['non-ASCII kept', '©ü', '©ü'],
    ['space and punctuation backslash-escaped', 'a b.c', 'a\\ b\\.c'],
    ['< > & as code points (our HTML-context addition)', '<&>', '\\3c \\26 \\3e '],
  ])('%s', (_rule, input, expected) => expect(cssIdentifier(input)).toBe(expected));

  test.each(HOSTILE.filter((v) => v !== ''))('%j is one <ident-token> that decodes back (css-tree)', (value) => {
    const tokens = cssTokens(cssIdentifier(value));
    expect(tokens).toHaveLength(1);
    expect(tokens[0][0]).toBe(tokenTypes.Ident);
    expect(ident.decode(tokens[0][1])).toBe(value.replaceAll('\u0000', '\ufffd'));
  });
});

describe('font-family names', () => {
  // CSS Fonts 4 §4.2: generic families are keywords; other names are strings or identifier sequences.
  test.each([
    ['sans-serif', 'sans-serif'],
    ['Georgia', 'Georgia'],
    ['DM Sans', '"DM Sans"'],
    ['inherit', '"inherit"'], // a CSS-wide keyword must be quoted to name a family (CSS Fonts 4 §4.2)
    ['X; } body {', '"X; } body {"'],
  ])('%j → %s', (name, expected) => expect(cssFamilyName(name)).toBe(expected));
});

describe('escapeHtml: the OWASP XSS Prevention Cheat Sheet rule 1 characters', () => {
  test.each([
    ['&', '&amp;'],
    ['<', '&lt;'],
    ['>', '&gt;'],
    ['"', '&quot;'],
    ["'", '&#39;'],
    ['{{{note}}}', '{{{note}}}'],
  ])('%j → %s', (input, expected) => expect(escapeHtml(input)).toBe(expected));

  test.each(HOSTILE.concat(['<img src=x onerror=alert(1)>', '"><svg onload=alert(1)>', "' onmouseover='x"]).filter((v) => !v.includes('\u0000')))(
    '%j reads back as the same text and attribute under the HTML parsing algorithm (parse5)',
    (value) => {
      const fragment = parseFragment(`<p title="${escapeHtml(value)}">${escapeHtml(value)}</p><p title='${escapeHtml(value)}'></p>`);
      const [first, second] = fragment.childNodes as unknown as { attrs: { value: string }[]; childNodes: { value?: string }[] }[];
      expect(fragment.childNodes).toHaveLength(2);
      expect(first.attrs[0].value).toBe(value.replace(/\r\n?/g, '\n'));
      expect(first.childNodes.map((n) => n.value ?? '').join('')).toBe(value.replace(/\r\n?/g, '\n'));
      expect(second.attrs[0].value).toBe(value);
      expect(serialize(fragment)).not.toMatch(/<(img|svg|script)/);
    },
  );
});

describe('escapeXml: XML 1.0 §2.4 character data and §3.1 attribute values', () => {
  test.each([
    ['&<>"\'', '&amp;&lt;&gt;&quot;&apos;'],
    ['a\u0000b\u0008c', 'a\ufffdb\ufffdc'], // not in the Char production (§2.2): replaced, never escaped
    ['tab\tline\n', 'tab\tline\n'],
  ])('%j → %j', (input, expected) => expect(escapeXml(input)).toBe(expected));
});

describe('the value rules', () => {
  test.each([
    ['Source Serif 4', true],
    ['Bricolage Grotesque', true],
    ["Caslon's Old Face", true],
    ['Noto Sans JP 日本', true],
    ['St. Ives', true],
    ['Evil\nFont', false],
    ['Evil } body {', false],
    ['X</style><script>', false],
    ['X"; src: url(https://attacker.example/)', false],
    ['a;b', false],
    ['\\61 x', false],
  ])('typeface family %j accepted: %s', (value, ok) => expect(typefaceFamily.safeParse(value).success).toBe(ok));

  test.each([['-apple-system', true], ['system-ui', true], ['Helvetica Neue', true], ['x}y', false], ['a\nb', false]])('fallback %j accepted: %s', (value, ok) =>
    expect(fallbackFamily.safeParse(value).success).toBe(ok),
  );

  test('a stored hostile family is cleaned to letters, digits, spaces, hyphens, apostrophes and full stops', () => {
    expect(cleanTypefaceFamily('X"; } body { background: url(https://a.example/) }\n</style>')).toBe('X body background url https a.example style');
    expect(cleanTypefaceFamily('"}{')).toBe('Unnamed typeface');
  });

  test.each([
    ['{{{note}}}', true], // harmless once escaped; refused only for characters that can break a line or hide text
    ['<img src=x onerror=alert(1)>', true],
    ['Two\nlines', false],
    ['Bidi \u202e override', false],
    ['  Trimmed  ', true],
  ])('display name %j accepted: %s', (value, ok) => expect(displayName('colour', 80).safeParse(value).success).toBe(ok));

  test('notes keep line breaks and refuse other controls', () => {
    expect(noteText('note', 100).safeParse('one\r\ntwo\tthree').success).toBe(true);
    expect(noteText('note', 100).safeParse('bell\u0007').success).toBe(false);
  });

  test.each([
    ['https://example.org/x', true],
    ['http://example.org', true],
    ['javascript:alert(1)', false],
    ['data:text/html,<script>', false],
    ['https://x.org/"onmouseover="', false],
    ['//evil.example', false],
  ])('web address %j accepted: %s', (value, ok) => expect(webAddress.safeParse(value).success).toBe(ok));

  test('a shelf reference is an asset id; an outside address is refused with a clear message', () => {
    expect(assetRef.safeParse('0b8a2f4e-4c1d-4d53-9a53-1f2e3d4c5b6a').success).toBe(true);
    const outside = assetRef.safeParse('https://attacker.example/cat.png');
    expect(outside.success).toBe(false);
    expect(outside.error?.issues[0].message).toMatch(/asset shelf; outside addresses are not accepted/);
  });
});
