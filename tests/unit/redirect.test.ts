// The "next" target after sign-in: only a same-site path survives. Payloads from the OWASP Unvalidated
// Redirects and Forwards Cheat Sheet (protocol-relative, backslash, encoded and whitespace tricks) and WHATWG URL
// parsing rules (tabs and newlines are stripped, `\` reads as `/` in special schemes).
import { describe, expect, test } from 'vitest';
import { safeNext } from '@/lib/http/redirect';

// What URLSearchParams hands the page: one layer of percent-decoding already done.
const param = (raw: string) => new URLSearchParams(`next=${raw}`).get('next');

describe('safeNext (OWASP Unvalidated Redirects and Forwards Cheat Sheet: allow-list same-site paths only)', () => {
  test.each([
    ['/%09/evil.example', 'tab stripped by the URL parser → //evil.example (WHATWG URL)'],
    ['/%0a/evil.example', 'newline stripped by the URL parser'],
    ['/%0d/evil.example', 'carriage return stripped by the URL parser'],
    ['//evil.example', 'protocol-relative URL'],
    ['/\\evil.example', 'backslash read as slash (WHATWG URL, special schemes)'],
    ['/%5Cevil.example', 'encoded backslash'],
    ['/%2F/evil.example', 'encoded slash after the first'],
    ['%2f%2fevil.example', 'both slashes encoded'],
    ['/%252F/evil.example', 'double-encoded slash'],
    ['/%25252F/evil.example', 'triple-encoded slash'],
    ['javascript:alert(1)', 'javascript: scheme'],
    ['JaVaScRiPt%3Aalert(1)', 'javascript: scheme, mixed case and encoded'],
    ['https://evil.example/app', 'absolute URL elsewhere'],
    ['http:evil.example', 'scheme without slashes'],
    ['/./%2Fevil.example', 'dot segment before an encoded slash'],
    ['/.//evil.example', 'dot segment that normalises to //'],
    ['%20/app', 'leading space'],
    ['/app%00', 'NUL character'],
    ['data:text/html,<script>alert(1)</script>', 'data: scheme'],
    ['/%', 'malformed percent-encoding'],
    ['', 'empty'],
  ])('%s → dashboard (%s)', (raw) => {
    expect(safeNext(param(raw))).toBe('/app');
  });

  test.each([
    ['/app', '/app'],
    ['/b/larchmere/v/2', '/b/larchmere/v/2'],
    ['%2Fb%2Flarchmere', '/b/larchmere'], // one layer, as encodeURIComponent(pathname) sends it
    ['/app/brands/1%3Ftab%3Dassets', '/app/brands/1?tab=assets'],
    ['/b/x/../y', '/b/y'],
  ])('%s stays on the site as %s', (raw, expected) => {
    expect(safeNext(param(raw))).toBe(expected);
  });

  test('missing → dashboard', () => {
    expect(safeNext(null)).toBe('/app');
    expect(safeNext(undefined)).toBe('/app');
  });
});
