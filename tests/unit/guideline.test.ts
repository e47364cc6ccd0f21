// Guideline blocks: schemas, the document validator, templates and the published renderer.
import { readFileSync } from 'node:fs';
import { renderToStaticMarkup } from 'react-dom/server';
import { createElement } from 'react';
import Color from 'colorjs.io';
import { wcagContrast } from 'culori';
import { parse as parseHtml } from 'parse5';
import { describe, expect, test } from 'vitest';
import { PRINT_CAUTION } from '@/lib/cautions';
import { BLOCKS, blockDefinition, blocksByGroup } from '@/blocks';
import { GUIDELINE_LIMITS, guidelineDocSchema, validateGuideline, type GuidelineDoc } from '@/lib/guideline/document';
import { decideRestore, draftKey, readDraft, writeDraft } from '@/lib/guideline/draft';
import { isSafeHref, safeAssetUrl } from '@/lib/guideline/links';
import { outline, slugify, summarize } from '@/lib/guideline/outline';
import { instantiateTemplate, starterAttrs, suggestedPairs, TemplateError } from '@/lib/guideline/templates';
import type { Identity } from '@/lib/identity/types';
import { GuidelineDocument } from '@/components/guideline/GuidelineDocument';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const essentials = JSON.parse(readFileSync('templates/guidelines/essentials.json', 'utf8'));
const brandBook = JSON.parse(readFileSync('templates/guidelines/brand-book.json', 'utf8'));

const doc = (...content: unknown[]) => ({ type: 'doc', content });
const para = (id: string, text: string, marks?: unknown[]) => ({ type: 'paragraph', attrs: { id }, content: [{ type: 'text', text, ...(marks ? { marks } : {}) }] });
const render = (d: unknown, mode: 'site' | 'print' = 'site', id: Identity = identity) =>
  renderToStaticMarkup(createElement(GuidelineDocument, { doc: d as GuidelineDoc, identity: id, mode }));
const expectError = (input: unknown, path: string, message: RegExp) => {
  const result = validateGuideline(input);
  expect(result.ok).toBe(false);
  if (!result.ok) {
    expect(result.error.path).toBe(path);
    expect(result.error.message).toMatch(message);
  }
};

describe('block registry', () => {
  test('every block has a label of our own, a group and a schema that accepts its defaults', () => {
    expect(BLOCKS.length).toBeGreaterThanOrEqual(12);
    for (const block of BLOCKS) {
      expect(block.label.length).toBeGreaterThan(2);
      expect(blocksByGroup().some((g) => g.blocks.some((b) => b.type === block.type))).toBe(true);
      expect(block.schema.safeParse({ id: 'x1', ...block.defaults }).success).toBe(true);
    }
  });

  test.each(BLOCKS.map((b) => [b.type, b] as const))('%s: defaults → JSON → parse gives the same attributes', (_type, block) => {
    const attrs = { id: 'block-1', ...block.defaults };
    const json = JSON.parse(JSON.stringify(attrs));
    expect(block.schema.parse(json)).toEqual(attrs);
    const result = validateGuideline(doc({ type: block.type, attrs: json }));
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.doc.content[0]).toEqual({ type: block.type, attrs });
  });

  test('rich text nodes round-trip: headings 2–4, lists, quotes, bold, italic and safe links', () => {
    const rich = doc(
      { type: 'heading', attrs: { id: 'h', level: 3 }, content: [{ type: 'text', text: 'Title' }] },
      para('p', 'bold', [{ type: 'bold' }, { type: 'italic' }]),
      { type: 'paragraph', attrs: { id: 'l' }, content: [{ type: 'text', text: 'site', marks: [{ type: 'link', attrs: { href: 'https://example.org/a?b=c', target: '_blank', rel: 'noopener noreferrer nofollow', class: null, title: null } }] }, { type: 'hardBreak' }, { type: 'text', text: 'mail', marks: [{ type: 'link', attrs: { href: 'mailto:studio@example.org' } }] }] },
      { type: 'bulletList', attrs: { id: 'ul' }, content: [{ type: 'listItem', content: [{ type: 'paragraph', attrs: { id: null } }, { type: 'orderedList', attrs: { start: 3, type: null }, content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] }] }] },
      { type: 'blockquote', attrs: { id: 'q' }, content: [{ type: 'paragraph' }] },
      { type: 'paragraph', attrs: { id: 'empty' } },
    );
    const result = validateGuideline(JSON.parse(JSON.stringify(rich)));
    expect(result).toEqual({ ok: true, doc: rich });
    expect(guidelineDocSchema.safeParse(rich).success).toBe(true);
  });
});

describe('validateGuideline rejects bad documents and names the first bad path', () => {
  test('an unknown block type, by name', () => expectError(doc(para('a', 'x'), { type: 'sparkleBox', attrs: { id: 'b' } }), 'content.1.type', /Unknown block type "sparkleBox"/));
  test('a bad attribute value', () => expectError(doc(para('a', 'x'), { type: 'colorPalette', attrs: { id: 'b', colorIds: [42] } }), 'content.1.attrs.colorIds.0', /colour id/));
  test('an attribute the block does not have', () => expectError(doc({ type: 'misuse', attrs: { id: 'b', glitter: true } }), 'content.0.attrs.glitter', /Unknown attribute "glitter"/));
  test('a javascript: link', () =>
    expectError(doc(para('a', 'click', [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }])), 'content.0.content.0.marks.0.attrs.href', /http:\/\/, https:\/\/ or mailto:/));
  test('a link with a hidden scheme behind whitespace', () =>
    expectError(doc(para('a', 'click', [{ type: 'link', attrs: { href: ' https://x.org\njavascript:alert(1)' } }])), 'content.0.content.0.marks.0.attrs.href', /http/));
  test('a mark other than bold, italic or link', () => expectError(doc(para('a', 'x', [{ type: 'underline' }])), 'content.0.content.0.marks.0.type', /bold, italic or a link/));
  test('an identity block nested in a list', () =>
    expectError(doc({ type: 'bulletList', attrs: { id: 'l' }, content: [{ type: 'listItem', content: [{ type: 'colorPalette', attrs: { id: 'c' } }] }] }), 'content.0.content.0.content.0.type', /Only paragraphs, headings, lists and quotes/));
  test('a block without an id, and a repeated id', () => {
    expectError(doc({ type: 'paragraph' }), 'content.0.attrs.id', /needs an id/);
    expectError(doc(para('same', 'a'), para('same', 'b')), 'content.1.attrs.id', /used twice/);
  });
  test('a heading level outside 2–4', () => expectError(doc({ type: 'heading', attrs: { id: 'h', level: 1 } }), 'content.0.attrs.level', /2, 3 or 4/));
  test('a string over its cap', () => expectError(doc({ type: 'sectionHeading', attrs: { id: 's', title: 'x'.repeat(201) } }), 'content.0.attrs.title', /At most 200/));
  test('a document over 2 MB', () => {
    const big = doc(...Array.from({ length: 250 }, (_, i) => para(`p${i}`, 'é'.repeat(5000))));
    expectError(big, '', /limit is 2 MB/);
  });
  test('a document nested deeper than 12 levels', () => {
    let node: Record<string, unknown> = { type: 'paragraph' };
    for (let i = 0; i < 14; i++) node = { type: 'blockquote', content: [node] };
    (node as { attrs?: unknown }).attrs = { id: 'deep' };
    const result = validateGuideline(doc(node));
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.error.message).toMatch(`deeper than ${GUIDELINE_LIMITS.maxDepth}`);
      expect(result.error.path.split('.content.').length - 1).toBe(GUIDELINE_LIMITS.maxDepth);
    }
  });
  test('more than 2,000 top-level blocks', () => expectError(doc(...Array.from({ length: 2001 }, (_, i) => para(`p${i}`, 'x'))), 'content', /at most 2000 blocks/));
  test('not a doc at all', () => {
    expectError(null, '', /must be an object/);
    expectError({ type: 'page', content: [] }, 'type', /type "doc"/);
    expectError(doc('text'), 'content.0', /Expected a block/);
  });
});

describe('links and asset addresses', () => {
  // Common practice (OWASP XSS prevention): allow-list the schemes, refuse everything else.
  test.each([
    ['https://example.org', true],
    ['http://example.org/x', true],
    ['mailto:hello@example.org', true],
    ['javascript:alert(1)', false],
    ['JaVaScRiPt:alert(1)', false],
    ['data:text/html,<script>', false],
    ['//evil.example', false],
    ['https://x.org/"onmouseover="', false],
    ['vbscript:msgbox', false],
  ])('%s → %s', (href, ok) => expect(isSafeHref(href)).toBe(ok));
  test('asset addresses: same-site paths only', () => {
    expect(safeAssetUrl('/files/logo.svg')).toBe('/files/logo.svg');
    expect(safeAssetUrl('https://cdn.example/logo.svg')).toBeNull(); // files come from our own site only
    expect(safeAssetUrl('//cdn.example/logo.svg')).toBeNull();
    expect(safeAssetUrl('javascript:alert(1)')).toBeNull();
  });
});

describe('templates', () => {
  test.each([
    ['essentials', essentials],
    ['brand-book', brandBook],
  ])('%s instantiates against the demo identity and validates', (_name, template) => {
    const a = instantiateTemplate(template, identity);
    const b = instantiateTemplate(template, identity);
    expect(validateGuideline(a).ok).toBe(true);
    const ids = a.content.map((n) => (n.attrs as { id: string }).id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids.some((id) => b.content.some((n) => (n.attrs as { id: string }).id === id))).toBe(false);
    expect(JSON.stringify(a)).not.toContain('"$');
    const palette = a.content.find((n) => n.type === 'colorPalette');
    expect((palette!.attrs as { colorIds: string[] }).colorIds).toEqual(identity.colors.map((c) => c.id));
    const clear = a.content.find((n) => n.type === 'clearSpace');
    expect((clear!.attrs as { logoId: string }).logoId).toBe('l-primary');
  });

  test('essentials covers logo, clear space, minimum size, misuse, colour, contrast, type and imagery', () => {
    const types = new Set(instantiateTemplate(essentials, identity).content.map((n) => n.type));
    for (const t of ['logoShowcase', 'clearSpace', 'minimumSize', 'misuse', 'colorPalette', 'contrastPairs', 'typography', 'imagery', 'sectionHeading']) expect(types.has(t as never)).toBe(true);
  });

  test('the brand book adds story, voice, pattern, applications and downloads', () => {
    const d = instantiateTemplate(brandBook, identity);
    const titles = outline(d).map((e) => e.title);
    for (const t of ['Our story', 'Voice and tone', 'Pattern', 'Applications', 'Downloads']) expect(titles).toContain(t);
    const pattern = d.content.find((n) => n.type === 'pattern')!.attrs as { logoId: string; markColorId: string };
    expect(pattern.logoId).toBe('l-cone');
    expect(pattern.markColorId).toBe('c-roast-umber');
  });

  test('an identity with no logos or colours leaves the references empty, still valid', () => {
    const bare = { ...identity, colors: [], logos: [] };
    const d = instantiateTemplate(brandBook, bare);
    expect(validateGuideline(d).ok).toBe(true);
    expect((d.content.find((n) => n.type === 'clearSpace')!.attrs as { logoId: unknown }).logoId).toBeNull();
    expect((d.content.find((n) => n.type === 'contrastPairs')!.attrs as { pairs: unknown[] }).pairs).toEqual([]);
  });

  test('an unknown placeholder is named with its path', () => {
    const bad = { name: 'x', description: '', doc: { type: 'doc', content: [{ type: 'clearSpace', attrs: { logoId: '$favourite' } }] } };
    expect(() => instantiateTemplate(bad, identity)).toThrow(TemplateError);
    expect(() => instantiateTemplate(bad, identity)).toThrow(/doc\.content\.0\.attrs\.logoId: Unknown logo placeholder "\$favourite"/);
  });

  test('suggested pairs start with text on the background and never pair a colour with itself', () => {
    const pairs = suggestedPairs(identity);
    expect(pairs[0]).toEqual({ foreground: 'c-espresso', background: 'c-filter-paper' });
    expect(pairs.every((p) => p.foreground !== p.background)).toBe(true);
    // Beyond text on ground, every suggestion reaches WCAG 2.2 AA for body text (SC 1.4.3: 4.5:1), measured with
    // culori's wcagContrast (a general-purpose reference library), not our own contrastRatio.
    const hex = (id: string) => identity.colors.find((c) => c.id === id)!.hex;
    for (const p of pairs.slice(1)) expect(wcagContrast(hex(p.foreground), hex(p.background)), `${p.foreground} on ${p.background}`).toBeGreaterThanOrEqual(4.5);
    expect(pairs.length).toBeGreaterThan(1);
    expect(starterAttrs(blockDefinition('colorPalette')!, identity).colorIds).toHaveLength(identity.colors.length);
  });
});

describe('outline and summaries', () => {
  test('anchors are readable and unique', () => {
    const d = doc(
      { type: 'sectionHeading', attrs: { id: 'a', title: 'Colour & Type' } },
      { type: 'sectionHeading', attrs: { id: 'b', title: 'Colour & Type' } },
      { type: 'sectionHeading', attrs: { id: 'c', title: 'Café crème' } },
      { type: 'sectionHeading', attrs: { id: 'd', title: '!!!' } },
    );
    expect(outline(d as never).map((e) => e.anchor)).toEqual(['colour-type', 'colour-type-2', 'cafe-creme', 'section']);
    expect(slugify('  Logo — Clear Space ')).toBe('logo-clear-space');
  });
  test('a summary counts blocks, words and sections', () => {
    const s = summarize(doc({ type: 'sectionHeading', attrs: { id: 'a', title: 'Logo' } }, para('p', 'three little words')) as never);
    expect(s).toMatchObject({ blocks: 2, sections: ['Logo'], words: 4 });
    expect(s.text).toBe('2 blocks, 4 words, 1 section: Logo');
  });
});

describe('drafts kept in the browser', () => {
  const memory = () => {
    const m = new Map<string, string>();
    return { getItem: (k: string) => m.get(k) ?? null, setItem: (k: string, v: string) => void m.set(k, v), removeItem: (k: string) => void m.delete(k), m };
  };
  const saved = doc(para('a', 'saved')) as GuidelineDoc;
  const typed = doc(para('a', 'saved and more')) as GuidelineDoc;
  test('keyed by brand, read back only when valid', () => {
    const s = memory();
    expect(draftKey('b1')).toBe('plumbline:draft:b1');
    writeDraft(s, 'b1', { baseRevision: 3, doc: typed, savedAt: 1 });
    expect(readDraft(s, 'b1')?.doc).toEqual(typed);
    s.setItem(draftKey('b2'), JSON.stringify({ baseRevision: 1, savedAt: 1, doc: { type: 'doc', content: [{ type: 'nope' }] } }));
    expect(readDraft(s, 'b2')).toBeNull();
  });
  test('same base revision → restore; older base → conflict; identical → nothing', () => {
    const draft = { baseRevision: 3, doc: typed, savedAt: 1 };
    expect(decideRestore(draft, { revision: 3, doc: saved }).kind).toBe('restore');
    expect(decideRestore(draft, { revision: 5, doc: saved }).kind).toBe('conflict');
    expect(decideRestore({ ...draft, doc: saved }, { revision: 5, doc: saved }).kind).toBe('none');
    expect(decideRestore(null, { revision: 5, doc: saved }).kind).toBe('none');
  });
  test('a blank page kept by the browser never competes with a saved template', () => {
    // The editor normalises an empty document to one empty paragraph (ProseMirror's schema needs a block: from memory).
    const blank = { baseRevision: 0, doc: { type: 'doc', content: [{ type: 'paragraph' }] } as GuidelineDoc, savedAt: 1 };
    expect(decideRestore(blank, { revision: 1, doc: saved }).kind).toBe('none');
    const nothing = { baseRevision: 0, doc: { type: 'doc', content: [] } as unknown as GuidelineDoc, savedAt: 1 };
    expect(decideRestore(nothing, { revision: 1, doc: saved }).kind).toBe('none');
  });
});

describe('published renderer', () => {
  const book = instantiateTemplate(brandBook, identity);
  const html = render(book);

  test('every section title of the template appears in its own <section> with a link to it (read back with parse5)', () => {
    type El = { nodeName: string; value?: string; attrs?: { name: string; value: string }[]; childNodes?: El[] };
    const all = (n: El): El[] => [n, ...(n.childNodes ?? []).flatMap(all)];
    // A heading's own words, leaving out the "#" link it carries.
    const text = (n: El): string => (n.nodeName === '#text' ? n.value! : n.nodeName === 'a' ? '' : (n.childNodes ?? []).map(text).join(''));
    const attr = (n: El, name: string) => n.attrs?.find((a) => a.name === name)?.value;
    const nodes = all(parseHtml(html) as unknown as El);
    const links = new Set(nodes.filter((n) => n.nodeName === 'a').map((n) => attr(n, 'href')));
    // The titles as typed in templates/guidelines/brand-book.json, not as our outline() reads them.
    const titles = (brandBook.doc.content as { type: string; attrs: { title: string } }[]).filter((n) => n.type === 'sectionHeading').map((n) => n.attrs.title);
    expect(titles.length).toBeGreaterThan(10);
    for (const title of titles) {
      const section = nodes.find((n) => n.nodeName === 'section' && all(n).some((h) => /^h[1-3]$/.test(h.nodeName) && text(h).trim() === title));
      expect(section, title).toBeDefined();
      expect(attr(section!, 'id'), title).toMatch(/^[a-z0-9-]+$/);
      expect(links.has(`#${attr(section!, 'id')}`), title).toBe(true);
    }
  });

  test('the palette shows HEX, RGB, OKLCH and CMYK as colorjs.io and the plain formula give them', () => {
    const round = (v: number, places: number) => Math.round(v * 10 ** places) / 10 ** places;
    for (const color of identity.colors) {
      // colorjs.io (a general-purpose reference library) reads the value as typed, in any CSS notation.
      const hex = new Color(color.value).to('srgb').toString({ format: 'hex', collapse: false });
      const srgb = new Color(hex).coords.map(Number);
      const [l, c, h] = new Color(hex).to('oklch').coords.map((x) => Number(x ?? 0));
      expect(html).toContain(`>${hex}<`);
      expect(html).toContain(`>rgb(${srgb.map((v) => Math.round(v * 255)).join(' ')})<`);
      expect(html).toContain(`>oklch(${round(l * 100, 2)}% ${round(c, 4)} ${round(c, 4) === 0 ? 0 : round(h, 2)})<`);
      // Plain RGB→CMYK (common practice): K = 1 − max(R, G, B), C = (1 − R − K) / (1 − K), … in percent to 0.1.
      const k = 1 - Math.max(...srgb);
      const plain = k >= 1 ? [0, 0, 0, 100] : [...srgb.map((v) => round(((1 - v - k) / (1 - k)) * 100, 1)), round(k * 100, 1)];
      const [cc, mm, yy, kk] = color.cmykOverride ?? plain;
      expect(html).toContain(`>C ${cc} M ${mm} Y ${yy} K ${kk}<`);
    }
    expect(html).toContain(PRINT_CAUTION.slice(0, 40));
  });

  test('copy buttons are plain buttons carrying the value; print leaves them out', () => {
    expect(html).toContain('data-copy="#767676"');
    expect(render(book, 'print')).not.toContain('data-copy=');
  });

  test('a colour removed from the identity renders a gentle placeholder, not a crash', () => {
    const out = render(doc({ type: 'colorPalette', attrs: { id: 'p', colorIds: ['c-roast-umber', 'c-gone'] } }, { type: 'clearSpace', attrs: { id: 'c', logoId: 'l-gone' } }));
    expect(out).toContain('data-missing="colour"');
    expect(out).toContain('This colour was removed from the identity.');
    expect(out).toContain('This logo was removed from the identity.');
    expect(out).toContain('#4a2e22');
  });

  test('logo previews offer light, dark and brand grounds; misuse tiles come from the real file', () => {
    expect(html).toContain('data-ground="light"');
    expect(html).toContain('data-ground="dark"');
    expect(html).toContain('data-ground="brand"');
    for (const kind of ['stretched', 'rotated', 'recoloured', 'outlined', 'dropShadow', 'busyBackground', 'lowContrast']) expect(html).toContain(`data-misuse="${kind}"`);
    expect(html).toContain('href="/fixtures/larchmere/l-primary.svg"');
    expect(html).toContain('Don’t');
  });

  test('clear space draws the identity box and bounds; minimum size renders at screenPx', () => {
    const logo = identity.logos[0];
    const { box } = logo.clearSpace;
    expect(html).toContain(`<rect x="${box.x}" y="${box.y}" width="${box.width}" height="${box.height}"`);
    expect(html).toContain(`width:${logo.minimumSize.screenPx}px`);
    expect(html).toContain(`${logo.minimumSize.printMm} mm`);
    expect(render(book, 'print')).toContain(`width:${logo.minimumSize.printMm}mm`);
  });

  test('the page wears the brand: its fonts and colours as CSS custom properties', () => {
    expect(html).toContain('--brand-heading-font:&quot;DM Sans&quot;, system-ui, sans-serif');
    expect(html).toContain('--brand-body-font:&quot;Source Serif 4&quot;, Georgia, serif');
    expect(html).toContain('--brand-primary:#4a2e22');
  });

  test('hostile text stays text: no <script>, no javascript: in the output', () => {
    const hostile = doc(
      { type: 'sectionHeading', attrs: { id: 's', title: '<script>alert(1)</script>', intro: '"><img src=x onerror=alert(1)>' } },
      para('p', '<script>alert(2)</script>', [{ type: 'link', attrs: { href: 'javascript:alert(3)' } }]),
      { type: 'callout', attrs: { id: 'c', tone: 'caution', text: '</aside><script>alert(4)</script>' } },
      { type: 'imagery', attrs: { id: 'i', items: [{ src: 'javascript:alert(5)', alt: '"onload="x', verdict: 'dont', caption: '<b>x</b>' }] } },
    );
    const badLogo = { ...identity, logos: identity.logos.map((l) => ({ ...l, files: { ...l.files, original: 'javascript:alert(6)', white: 'javascript:alert(6)' } })) };
    const out = render(hostile, 'site', badLogo) + render(book, 'site', badLogo);
    expect(out).not.toMatch(/<script/i);
    expect(out).not.toMatch(/javascript:/i);
    expect(out).not.toMatch(/<img src="x"/);
    expect(out).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
  });

  test('attributes that do not fit their schema are left out with a notice', () => {
    const out = render(doc({ type: 'colorPalette', attrs: { id: 'p', colorIds: 'all' } }));
    expect(out).toContain('could not be read');
  });

  test('blockDefinition knows every registry type and nothing else', () => {
    expect(blockDefinition('colorPalette')?.label).toBe('Colour palette');
    expect(blockDefinition('paragraph')).toBeUndefined();
  });
});
