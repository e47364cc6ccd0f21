// The print edition's pure parts: which requests the PDF renderer lets Chromium make, and the page rules'
// CSS strings, read back with css-tree (a general-purpose CSS parser following CSS Syntax Module Level 3).
import { readFileSync } from 'node:fs';
import { parse, walk, string as cssStringCodec, type CssNode } from 'css-tree';
import * as fontkit from 'fontkit';
import { describe, expect, test } from 'vitest';
import { fontFaceCss } from '@/lib/guideline/identity';
import type { IdentityTypeface } from '@/lib/identity/types';
import { staticInstance } from '@/lib/type/font-instance.server';
import { cssString, printPageRules } from '@/lib/publishing/print-css';
import { printRequestAllowed } from '@/lib/publishing/print-requests';

const PRINT = 'http://127.0.0.1:4321/b/larchmere/v/3/print?size=a4';

// OWASP Server-Side Request Forgery Prevention Cheat Sheet, "allow list" approach: the renderer may reach only the
// print edition's own origin and paths; loopback on other ports, link-local metadata, other schemes are refused.
describe('printRequestAllowed (OWASP SSRF Prevention Cheat Sheet: allow list of origin and paths)', () => {
  test.each([
    ['the print page itself', PRINT, 'GET', true],
    ['a file of the same version', 'http://127.0.0.1:4321/b/larchmere/v/3/files/abc?variant=white&on=%23112233', 'GET', true],
    ['our built stylesheet and fonts', 'http://127.0.0.1:4321/_astro/print.Bx1.css', 'GET', true],
    ['a data: URL (reaches no address; what it loads is asked again)', 'data:image/svg+xml,%3Csvg%2F%3E', 'GET', true],
    ['another version of the same brand', 'http://127.0.0.1:4321/b/larchmere/v/2/files/abc', 'GET', false],
    ['another brand', 'http://127.0.0.1:4321/b/other/v/3/files/abc', 'GET', false],
    ['our API', 'http://127.0.0.1:4321/api/brands', 'GET', false],
    ['a path climbing out with dot segments', 'http://127.0.0.1:4321/b/larchmere/v/3/../../../../api/brands', 'GET', false],
    ['a path climbing out with encoded dots', 'http://127.0.0.1:4321/b/larchmere/v/3/%2e%2e/%2e%2e/api', 'GET', false],
    ['a POST to an allowed path', 'http://127.0.0.1:4321/b/larchmere/v/3/files/abc', 'POST', false],
    ['loopback on another port', 'http://127.0.0.1:5432/b/larchmere/v/3/files/abc', 'GET', false],
    ['localhost by name', 'http://localhost:4321/b/larchmere/v/3/files/abc', 'GET', false],
    ['IPv6 loopback', 'http://[::1]:4321/b/larchmere/v/3/files/abc', 'GET', false],
    ['cloud metadata (link-local)', 'http://169.254.169.254/latest/meta-data/', 'GET', false],
    ['an outside host', 'https://images.example.com/photo.jpg', 'GET', false],
    ['credentials in the address', 'http://user:pw@127.0.0.1:4321/b/larchmere/v/3/files/abc', 'GET', false],
    ['a local file', 'file:///etc/passwd', 'GET', false],
    ['a WebSocket', 'ws://127.0.0.1:4321/b/larchmere/v/3/files/abc', 'GET', false],
    ['not a URL', 'javascript:alert(1)', 'GET', false],
  ])('%s', (_label, url, method, allowed) => {
    expect(printRequestAllowed(url, method, PRINT)).toBe(allowed);
  });

  test('a print address outside a version path allows nothing but data:', () => {
    expect(printRequestAllowed('http://127.0.0.1:4321/_astro/x.css', 'GET', 'http://127.0.0.1:4321/app')).toBe(false);
  });
});

/** Every string literal and every url() in a stylesheet, as css-tree reads them. */
function readBack(css: string) {
  const strings: string[] = [];
  const urls: string[] = [];
  const atRules: string[] = [];
  walk(parse(css), (node: CssNode) => {
    if (node.type === 'String') strings.push(node.value);
    if (node.type === 'Url') urls.push(node.value);
    if (node.type === 'Atrule') atRules.push(node.name);
  });
  return { strings, urls, atRules };
}

describe('cssString (CSS Syntax Module Level 3, §4.3.5 strings and §4.3.7 escapes)', () => {
  test.each([
    ['plain words', 'Colour and type'],
    ['quotes and backslashes', 'The "house" \\ style'],
    ['a newline that would end the string and start a declaration', 'Logo\n;background:url(http://127.0.0.1:9/x)'],
    ['a closing style tag', 'Type</style><img src=x>'],
    ['braces that would end the rule', 'a } @import url(http://127.0.0.1:9/x); b {'],
    ['letters beyond ASCII', 'Café Ørsted — “Typografi” 東京'],
    ['control characters', 'tab\there\u0000nul\u001f'],
  ])('%s reads back as the same text and nothing else', (_label, value) => {
    const literal = cssString(value);
    expect(literal).not.toMatch(/[\n\r<>]/);
    // css-tree's own decoder is the reference (U+0000 decodes to U+FFFD per §4.3.7).
    expect(cssStringCodec.decode(literal)).toBe(value.replaceAll('\u0000', '\ufffd'));
  });

  test('a hostile section title stays one string in one @page rule: no url(), no @import', () => {
    const title = 'Logo"\n;} @import url(http://127.0.0.1:9/a); @page x { @top-left { content: url(http://127.0.0.1:9/b) }';
    const css = printPageRules({ size: 'a4', brandName: 'Brand</style>', edition: 'Version 1', sections: [{ pageName: 'section-1', title }] });
    const { strings, urls, atRules } = readBack(css);
    expect(urls).toEqual([]);
    expect(atRules).not.toContain('import');
    expect(strings).toContain(title);
    expect(strings).toContain('Brand</style>');
    expect(css).not.toContain('</style>');
  });

  test('A4 and Letter are the CSS page sizes of CSS Paged Media Level 3 §7.2', () => {
    expect(printPageRules({ size: 'a4', brandName: 'B', edition: 'E', sections: [] })).toMatch(/size: A4;/);
    expect(printPageRules({ size: 'letter', brandName: 'B', edition: 'E', sections: [] })).toMatch(/size: letter;/);
  });

  test('a page name that is not a plain identifier gets no rule', () => {
    const css = printPageRules({ size: 'a4', brandName: 'B', edition: 'E', sections: [{ pageName: 'x{}', title: 'T' }] });
    expect(css).not.toContain('x{}');
  });
});

// Chromium writes a variable font into a PDF only as Type 3 glyph procedures, so the print edition serves static
// instances. Read back with fontkit: OpenType spec — no 'fvar' table means a static font; OS/2 usWeightClass names the
// weight; the 'wght' axis changes advance widths.
describe('static instances of a variable font for print (OpenType 1.9: fvar, OS/2 usWeightClass)', () => {
  const variable = readFileSync('node_modules/@fontsource-variable/fraunces/files/fraunces-latin-wght-normal.woff2');
  const open = (bytes: Buffer) => fontkit.create(bytes) as fontkit.Font;

  test('each weight becomes a static TrueType at that weight, with every character of the original', async () => {
    const source = open(variable);
    expect(Object.keys(source.variationAxes)).toContain('wght');
    const [regular, bold] = await Promise.all([400, 700].map((w) => staticInstance(variable, w).then(open)));
    for (const [face, weight] of [[regular, 400], [bold, 700]] as const) {
      expect(Object.keys(face.variationAxes ?? {})).toEqual([]);
      expect(face['OS/2'].usWeightClass).toBe(weight);
      expect(face.characterSet.length).toBe(source.characterSet.length);
    }
    const advance = (face: fontkit.Font) => face.glyphForCodePoint(0x48).advanceWidth; // "H"
    expect(advance(bold)).toBeGreaterThan(advance(regular));
  });

  const face = (isVariable: boolean, min: number, max: number) =>
    ({ family: 'Brand "Sans"', fileUrl: '/b/x/v/1/files/f1', metrics: { format: 'WOFF2', isVariable, weight: { min, default: min, max } } }) as unknown as IdentityTypeface;

  test('print rules ask for one static face per weight in the range; the site keeps the variable file', () => {
    const print = fontFaceCss([face(true, 300, 600)], { print: true });
    expect(print.match(/@font-face/g)).toHaveLength(3);
    for (const w of [400, 500, 600]) expect(print).toContain(`url("/b/x/v/1/files/f1?weight=${w}") format("truetype"); font-weight: ${w};`);
    expect(print).not.toContain('"Brand "Sans""');
    expect(fontFaceCss([face(true, 300, 600)])).toContain('url("/b/x/v/1/files/f1") format("woff2"); font-weight: 300 600;');
    expect(fontFaceCss([face(false, 700, 700)], { print: true })).toContain('font-weight: 700 700;');
  });
});
