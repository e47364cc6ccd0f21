// The check before publishing, on the real starter templates and the demo identity fixture. Contrast thresholds are
// WCAG 2.2 SC 1.4.3 (AA, 4.5:1) and SC 1.4.6 (AAA, 7:1); ratios come from the WCAG 2.2 formula (src/lib/color).
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { instantiateTemplate, templateInstructions } from '@/lib/guideline/templates';
import { validateGuideline, type GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { preflight, type ShelfEntry } from '@/lib/publishing/preflight';
import { withDemoCopy } from '../../scripts/lib/demo-copy';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const brandBook = JSON.parse(readFileSync('templates/guidelines/brand-book.json', 'utf8'));
const essentials = JSON.parse(readFileSync('templates/guidelines/essentials.json', 'utf8'));
const instructions = [...templateInstructions(brandBook), ...templateInstructions(essentials)];
const licensed: Identity = { ...identity, typefaces: identity.typefaces.map((f) => ({ ...f, licence: { ...f.licence, confirmed: true } })) };
const noShelf = new Map<string, ShelfEntry>();
const codes = (doc: GuidelineDoc, id: Identity = licensed, shelf = noShelf) => preflight({ doc, identity: id, shelf, instructions }).map((f) => f.code);

const block = (type: string, attrs: Record<string, unknown>) => ({ type, attrs: { id: `${type}-1`, ...attrs } });
const doc = (...content: unknown[]) => ({ type: 'doc', content }) as GuidelineDoc;

describe('templates mark their instructions', () => {
  test('the brand book marks its story, values, motto and imagery instructions', () => {
    expect(instructions.some((t) => t.startsWith('Write two or three short paragraphs'))).toBe(true);
    expect(instructions.some((t) => t.startsWith('A value in a few words'))).toBe(true);
    expect(instructions.filter((t) => t.startsWith('Replace these frames'))).toHaveLength(2);
  });
  test('the marker never reaches a brand’s draft', () => {
    const started = instantiateTemplate(brandBook, identity);
    expect(JSON.stringify(started)).not.toContain('"instruction"');
  });
});

describe('what the check finds', () => {
  test('a fresh brand book: template text and stand-in images without alt text', () => {
    const found = codes(instantiateTemplate(brandBook, identity));
    expect(found).toContain('template_text');
    expect(found).toContain('image_placeholder');
    expect(found).toContain('missing_alt');
  });
  test('the demo’s own copy leaves no template text and no stand-in images', () => {
    const filled = withDemoCopy(instantiateTemplate(brandBook, identity) as never) as GuidelineDoc;
    expect(validateGuideline(filled).ok).toBe(true);
    const found = codes(filled);
    expect(found).not.toContain('template_text');
    expect(found).not.toContain('image_placeholder');
  });
  test('fonts whose web licence is not confirmed are listed once each', () => {
    // The fixture's two faces (DM Sans, Source Serif 4) with their licences not yet confirmed.
    const unconfirmed: Identity = { ...identity, typefaces: identity.typefaces.map((f) => ({ ...f, licence: { ...f.licence, confirmed: false } })) };
    const found = preflight({ doc: doc(), identity: unconfirmed, shelf: noShelf, instructions }).filter((f) => f.code === 'font_unlicensed');
    expect(found.map((f) => f.where)).toEqual(['Typeface DM Sans', 'Typeface Source Serif 4']);
    expect(codes(doc(), licensed)).not.toContain('font_unlicensed');
  });
  test('contrast below the claimed level: #777777 on white is 4.48:1 — under AA; #595959 on white is 7.00:1 — AAA (WebAIM contrast checker worked values, from memory)', () => {
    const grey = { ...identity.colors[0], id: 'grey', name: 'Grey', value: '#777777' };
    const dark = { ...identity.colors[0], id: 'dark', name: 'Dark', value: '#595959' };
    const white = { ...identity.colors[0], id: 'white', name: 'White', value: '#ffffff' };
    const id: Identity = { ...licensed, colors: [grey, dark, white] };
    expect(codes(doc(block('contrastPairs', { pairs: [{ foreground: 'grey', background: 'white' }], claim: 'AA' })), id)).toEqual(['contrast_below_claim']);
    expect(codes(doc(block('contrastPairs', { pairs: [{ foreground: 'dark', background: 'white' }], claim: 'AA' })), id)).toEqual([]);
    expect(codes(doc(block('contrastPairs', { pairs: [{ foreground: 'dark', background: 'white' }], claim: 'AAA' })), id)).toEqual([]);
    const message = preflight({ doc: doc(block('contrastPairs', { pairs: [{ foreground: 'grey', background: 'white' }] })), identity: id, shelf: noShelf, instructions })[0].message;
    expect(message).toContain('4.48:1');
  });
  test('files on the shelf: draft and retired files are named; approved ones pass', () => {
    const shelf = new Map<string, ShelfEntry>([
      ['a1', { name: 'Lockup', state: 'approved' }],
      ['a2', { name: 'Old mark', state: 'retired' }],
      ['a3', { name: 'Sketch', state: 'draft' }],
    ]);
    expect(codes(doc(block('downloads', { assetIds: ['a1'] })), licensed, shelf)).toEqual([]);
    expect(codes(doc(block('downloads', { assetIds: ['a2', 'a3'] })), licensed, shelf)).toEqual(['file_retired', 'file_not_approved']);
    expect(codes(doc(block('imagery', { items: [{ src: 'a1', alt: 'The roastery at dawn', verdict: 'do', caption: '' }] })), licensed, shelf)).toEqual([]);
    expect(codes(doc(block('imagery', { items: [{ src: 'a3', alt: '', verdict: 'do', caption: '' }] })), licensed, shelf)).toEqual(['file_not_approved', 'missing_alt']);
  });
});
