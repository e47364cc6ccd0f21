// The published version's search index: what each audience can find, queried exactly as the page's script does
// (the same index file and the options it carries).
// Sources: the colour's RGB and HSL values come from colorjs.io (a general-purpose colour library, independent of the
// culori code that computes the page's values); the plain CMYK is the naive RGB→CMYK formula worked by hand below
// (common practice: K = 1 − max(R′,G′,B′), C = (1 − R′ − K)/(1 − K)…); the search engine is MiniSearch.
// The brand, its names and its spot reference are invented for this test.
import Color from 'colorjs.io';
import { describe, expect, test } from 'vitest';
import { colorValues } from '@/lib/color/values';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity, IdentityColor, IdentityLogo, IdentityTypeface } from '@/lib/identity/types';
import { loadSearchIndex, searchDocuments, searchDocumentSchema, searchIndexJson, SEARCH_AUDIENCES, type SearchAudience } from '@/lib/publishing/search';

const colour = (id: string, name: string, hex: string, extra: Partial<IdentityColor> = {}): IdentityColor =>
  ({ id, name, value: hex, role: null, ...colorValues(hex), cmykIcc: [0, 0, 0, 0], cmykOverride: null, spot: null, position: 0, ...extra }) as IdentityColor;

const logo = (id: string, name: string, variant: IdentityLogo['variant']): IdentityLogo => ({
  id,
  name,
  variant,
  format: 'svg',
  canvas: { x: 0, y: 0, width: 100, height: 40 },
  bounds: { x: 0, y: 0, width: 100, height: 40 },
  clearSpace: { unitSize: 10, unitLabel: 'cap height', multiple: 1, box: { x: 0, y: 0, width: 100, height: 40 } },
  minimumSize: { thinnestStroke: 1, suggested: { screenPx: 80, printMm: 20 }, screenPx: 80, printMm: 20 },
  files: { original: `/b/t/v/1/files/${id}`, black: '', white: '', reversed: '' },
  position: 0,
});

const face = (id: string, family: string, role: IdentityTypeface['role'], confirmed: boolean): IdentityTypeface =>
  ({ id, role, family, source: 'shipped', shippedKey: null, fallback: ['Georgia', 'serif'], weights: [400, 700], metrics: {}, licence: { confirmed, confirmedAt: null, note: null, shippedLicence: null }, fileUrl: '' }) as unknown as IdentityTypeface;

const NAVY = '#1d2a44';
const identity: Identity = {
  brand: { id: '00000000-0000-4000-8000-000000000001', name: 'Quillfield Ferries', slug: 'quillfield' },
  colors: [colour('c-navy', 'Harbour navy', NAVY, { spot: 'Swatch 2767 C', role: 'primary', cmykIcc: [80, 60, 20, 55] }), colour('c-gull', 'Gull white', '#f7f5ef'), colour('c-buoy', 'Buoy orange', '#e8602c')],
  logos: [logo('l-main', 'Quillfield wordmark', 'primary'), logo('l-knot', 'Rope knot mark', 'mark')],
  typefaces: [face('t-head', 'Harbour Grotesk', 'heading', true), face('t-body', 'Tidewater Serif', 'body', false)],
  typeScale: { steps: [] } as unknown as Identity['typeScale'],
  assets: [{ id: 'a-deck', name: 'Timetable poster template', kind: 'template', format: 'indd', url: '/b/t/v/1/files/a-deck' }],
};

const doc = {
  type: 'doc',
  content: [
    { type: 'sectionHeading', attrs: { id: 's-colour', title: 'Colour', eyebrow: 'Palette', intro: 'Sea, sky and signal.' } },
    { type: 'paragraph', attrs: { id: 'p-1' }, content: [{ type: 'text', text: 'Navy carries every crossing timetable.' }] },
    { type: 'colorPalette', attrs: { id: 'b-palette', colorIds: ['c-navy', 'c-gull'], showPrint: true, note: '' } },
    { type: 'sectionHeading', attrs: { id: 's-logo', title: 'Logo', eyebrow: '', intro: '' } },
    { type: 'logoShowcase', attrs: { id: 'b-logos', logoIds: ['l-main', 'l-knot'], brandColorId: null, onDark: 'white', caption: '' } },
    { type: 'sectionHeading', attrs: { id: 's-type', title: 'Type', eyebrow: '', intro: '' } },
    { type: 'typography', attrs: { id: 'b-type', roles: ['heading', 'body'] } },
    { type: 'downloads', attrs: { id: 'b-files', title: 'Files to download', assetIds: [], note: '' } },
  ],
} as unknown as GuidelineDoc;

const indexFor = (audience: SearchAudience) => loadSearchIndex(searchIndexJson(searchDocuments(doc, identity, audience)));
const member = indexFor({ who: 'member', downloads: true });
const top = (index: ReturnType<typeof indexFor>, query: string) => index.search(query)[0];

describe('colours are found by every notation the page prints', () => {
  const reference = new Color(NAVY);
  const [r, g, b] = reference.to('srgb').coords.map((v) => Math.round((v ?? 0) * 255));
  const [h, s, l] = reference.to('hsl').coords.map((v) => v ?? 0);
  const round1 = (v: number) => Math.round(v * 10) / 10;

  test.each([
    ['hex with #', NAVY],
    ['hex without #', NAVY.slice(1)],
    ['hex in capitals', NAVY.toUpperCase()],
    ['hex being typed (prefix)', '#1d2a'],
    ['the name', 'navy'],
    // colorjs.io: sRGB 29 42 68
    ['RGB as CSS writes it (colorjs.io)', `rgb(${r} ${g} ${b})`],
    ['RGB with commas (colorjs.io)', `${r}, ${g}, ${b}`],
    // colorjs.io: hsl(220 40.2% 19%)
    ['HSL (colorjs.io)', `hsl(${Math.round(h)} ${round1(s)}% ${round1(l)}%)`],
    // Hand-worked plain formula: R′=29/255, G′=42/255, B′=68/255; K = 1 − 68/255 = 73.3 %, C = (68−29)/68 = 57.4 %,
    // M = (68−42)/68 = 38.2 %, Y = 0 (common practice formula).
    ['plain CMYK as printers write it', 'C 57.4 M 38.2 Y 0 K 73.3'],
    ['plain CMYK run together', 'C57.4 M38.2 Y0 K73.3'],
    ['the press estimate the page shows', 'C 80 M 60 Y 20 K 55'],
    ['the spot reference', 'Swatch 2767 C'],
    ['the spot reference run together', '2767C'],
  ])('%s: %s', (_, query) => {
    const hit = top(member, query);
    expect(hit?.kind).toBe('colour');
    expect(hit?.title).toBe('Harbour navy');
    expect(hit?.swatch).toBe(NAVY);
    expect(hit?.blockId).toBe('b-palette');
  });

  test('the reference values agree with what the page prints (colorjs.io)', () => {
    expect([r, g, b]).toEqual([29, 42, 68]);
    expect(colorValues(NAVY).hsl.css).toBe(`hsl(${Math.round(h)} ${round1(s)}% ${round1(l)}%)`);
  });

  test('a colour the page does not show is not in the index', () => {
    expect(member.search('Buoy orange')).toEqual([]);
    expect(member.search('e8602c')).toEqual([]);
  });

  test('without print values the block shows no CMYK or spot, and the index has none', () => {
    const screenOnly = { ...doc, content: doc.content.map((n) => (n.type === 'colorPalette' ? { ...n, attrs: { ...n.attrs, showPrint: false } } : n)) } as GuidelineDoc;
    const index = loadSearchIndex(searchIndexJson(searchDocuments(screenOnly, identity, { who: 'member', downloads: true })));
    expect(index.search('2767C')).toEqual([]);
    expect(top(index, NAVY)?.title).toBe('Harbour navy');
  });
});

describe('logos, typefaces, sections and text', () => {
  test.each([
    ['Quillfield wordmark', 'l-main'],
    ['rope knot', 'l-knot'],
    ['wordm', 'l-main'],
  ])('the logo "%s" is found by its name', (query, _id) => {
    const hit = top(member, query);
    expect(hit?.kind).toBe('logo');
    expect(hit?.blockId).toBe('b-logos');
  });

  test('a typeface by its family, a section by its eyebrow, a paragraph by a word', () => {
    expect(top(member, 'Tidewater')).toMatchObject({ kind: 'typeface', blockId: 'b-type', section: 'Type' });
    expect(top(member, 'palette')).toMatchObject({ kind: 'section', blockId: 's-colour' });
    expect(member.search('timetable').map((h) => h.blockId)).toContain('p-1');
  });
});

describe('each audience finds only what its page shows', () => {
  test('a link without downloads gets no file documents; with downloads it does', () => {
    const withFiles = indexFor({ who: 'link', downloads: true });
    const without = indexFor({ who: 'link', downloads: false });
    expect(top(withFiles, 'timetable poster')).toMatchObject({ kind: 'file', blockId: 'b-files' });
    expect(without.search('timetable poster')).toEqual([]);
    expect(searchDocuments(doc, identity, { who: 'link', downloads: false }).filter((d) => d.kind === 'file')).toEqual([]);
    // The block itself (its title) is on every page, so everyone finds it.
    expect(top(without, 'files to download')).toMatchObject({ kind: 'block', title: 'Files to download', blockId: 'b-files' });
  });

  test('editor notes (a face without a confirmed licence) are in the editor indexes only', () => {
    for (const audience of SEARCH_AUDIENCES) {
      const notes = searchDocuments(doc, identity, audience).filter((d) => d.kind === 'note');
      expect(notes.map((n) => n.title), JSON.stringify(audience)).toEqual(audience.who === 'editor' ? ['Tidewater Serif: no web licence confirmed'] : []);
    }
    expect(top(indexFor({ who: 'editor', downloads: false }), 'licence')?.kind).toBe('note');
    expect(member.search('licence')).toEqual([]);
  });
});

describe('the documents are checked before they are written', () => {
  test('every document passes the shared schema, and a hostile name stays one line of text', () => {
    const hostile: Identity = { ...identity, colors: [colour('c-navy', 'Navy <script>alert(1)</script>\u2028', NAVY)] };
    const docs = searchDocuments(doc, hostile, { who: 'link', downloads: false });
    for (const d of docs) expect(searchDocumentSchema.safeParse(d).success).toBe(true);
    const navy = docs.find((d) => d.kind === 'colour')!;
    // Text only: the page sets it with textContent, so the markup is shown as characters, never run.
    expect(navy.title).toBe('Navy <script>alert(1)</script>');
  });

  test('a swatch is only ever a checked hex', () => {
    expect(searchDocumentSchema.safeParse({ ...searchDocuments(doc, identity, { who: 'member', downloads: false })[0], swatch: 'red;background:url(x)' }).success).toBe(false);
  });
});
