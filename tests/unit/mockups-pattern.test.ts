// The pattern in the mock-ups: which settings a piece draws (the brand's approved shelf pattern, else a default cut
// from the mark), how a tile's CSS px become template units (CSS Values and Units 4: 96 px = 1 in = 25.4 mm), and the
// SVG the page and the server draw. Ink contrast by the WCAG 2.2 contrast ratio.
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import type { Identity } from '@/lib/identity/types';
import { contrastRatio } from '@/lib/color/contrast';
import { composeMockup, requireLayout, type MockupSources, type PlacedItem } from '@/lib/mockups/compose';
import { DEFAULT_MOCKUP_PATTERN, mockupPattern, pagePatternFill } from '@/lib/mockups/pattern';
import { pageSvg } from '@/lib/mockups/svg';
import { mockupTemplate } from '@/lib/mockups/templates';
import { patternLayout } from '@/lib/pattern/layout';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const shelf = (id: string, pattern: Record<string, unknown> | null) => ({ id, name: id, kind: 'pattern', format: 'svg', url: `/api/assets/${id}/file?format=original`, pattern });
const stored = { logoId: 'l-primary', layout: 'scatter', scale: 30, spacing: 1, rotation: 10, seed: 7, groundColorId: 'c-filter-paper', inkColorId: 'c-roast-umber', opacity: 0.6 };
const patterns = (items: PlacedItem[]) => items.filter((it): it is Extract<PlacedItem, { kind: 'pattern' }> => it.kind === 'pattern');

describe('which pattern a piece draws', () => {
  test('without a shelf pattern: the default cut from the mark, on the field the pieces had before (the secondary colour)', () => {
    const p = mockupPattern(identity);
    expect(p.assetId).toBeNull();
    expect(p.settings).toMatchObject({ ...DEFAULT_MOCKUP_PATTERN, logoId: 'l-cone', groundColorId: 'c-larch-green' });
    expect(p.hex).toBe('#3f5a45');
  });

  test('the default ink is the palette colour with the highest WCAG 2.2 contrast ratio on that ground', () => {
    const ink = identity.colors.find((c) => c.id === mockupPattern(identity).settings!.inkColorId)!;
    for (const other of identity.colors.filter((c) => ['primary', 'text', 'background'].includes(c.role ?? ''))) {
      expect(contrastRatio(ink.hex, '#3f5a45')).toBeGreaterThanOrEqual(contrastRatio(other.hex, '#3f5a45'));
    }
  });

  test('an approved shelf pattern wins, with its own settings and ground', () => {
    const p = mockupPattern({ ...identity, assets: [shelf('a-pattern', stored)] });
    expect(p).toMatchObject({ assetId: 'a-pattern', hex: '#ffffff', settings: { layout: 'scatter', seed: 7, logoId: 'l-primary' } });
  });

  test('a shelf pattern that no longer draws (its mark or a colour left the identity, or unreadable settings) is passed over', () => {
    const gone = { ...stored, logoId: 'l-removed' };
    const p = mockupPattern({ ...identity, assets: [shelf('a-gone', gone), shelf('a-broken', { layout: 'zigzag' }), shelf('a-colour', { ...stored, inkColorId: 'c-removed' })] });
    expect(p.assetId).toBeNull();
    expect(p.settings?.logoId).toBe('l-cone');
  });

  test('a brand without logos gets a plain field', () => {
    expect(mockupPattern({ ...identity, logos: [] })).toMatchObject({ settings: null, assetId: null, hex: '#3f5a45' });
  });
});

describe('the pattern placed on a piece', () => {
  const tile = { kind: 'tile' as const, href: 'data:image/svg+xml;base64,AAAA', width: 84, height: 42 };
  const sources: MockupSources = { logo: (l, f) => l.files[f] ?? null, photos: [], pattern: () => tile };

  test('paper: a tile CSS px is 25.4 / 96 mm (CSS Values 4), drawn at 10 SVG units per mm', () => {
    const layout = requireLayout(composeMockup(mockupTemplate('business-card')!, identity, sources));
    const [field] = patterns(layout.pages[0].items);
    expect(field.unitsPerPx).toBeCloseTo(25.4 / 96, 9);
    const svg = pageSvg(layout, layout.pages[0]);
    expect(svg).toContain(`patternTransform="translate(620 0) scale(${Math.round((254 / 96) * 100) / 100})"`);
    expect(svg).toContain('width="84" height="42" href="data:image/svg+xml;base64,AAAA"');
    expect(svg).toMatch(/<rect [^>]*fill="url\(#mockup-business-card-front-0\)"/);
  });

  test('screen: a tile CSS px is the piece’s density in image px', () => {
    const layout = requireLayout(composeMockup(mockupTemplate('social-story')!, identity, sources));
    const [field] = patterns(layout.pages[0].items);
    expect(field.unitsPerPx).toBe(mockupTemplate('social-story')!.density);
  });

  test('with bleed, the pattern field runs into the bleed on the edges it touches, the repeat still starting at the trim corner', () => {
    const layout = requireLayout(composeMockup(mockupTemplate('business-card')!, identity, sources));
    const svg = pageSvg(layout, layout.pages[0], { bleed: true });
    // The card's pattern column [62, 0, 23, 55] mm touches the top, right and bottom edges: 3 mm more on each.
    expect(svg).toContain('<rect x="620" y="-30" width="260" height="610" fill="url(#mockup-business-card-front-0)"/>');
  });

  test('no drawing offered: the plain ground, no <pattern>', () => {
    const layout = requireLayout(composeMockup(mockupTemplate('business-card')!, identity, { ...sources, pattern: undefined }));
    expect(pageSvg(layout, layout.pages[0])).not.toContain('<pattern');
  });

  test('a hostile tile address is escaped; ids keep only safe characters', () => {
    const layout = requireLayout(composeMockup(mockupTemplate('business-card')!, identity, { ...sources, pattern: () => ({ ...tile, href: '"/><script>x</script>' }) }));
    const svg = pageSvg(layout, layout.pages[0], { idSuffix: '"><b' });
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&quot;/&gt;&lt;script&gt;');
    expect(svg).toContain('id="mockup-business-card-front-b-0"');
  });
});

describe('the page’s own drawing', () => {
  test('the mark’s one-colour file at every placement of the generator’s layout, tinted with the ink', () => {
    const p = mockupPattern(identity);
    const fill = pagePatternFill(identity, p)!;
    expect(fill.kind).toBe('marks');
    if (fill.kind !== 'marks') return;
    expect(fill.href).toBe('/fixtures/larchmere/l-cone-black.svg');
    expect(fill.layout).toEqual(patternLayout(p.settings!, 1));
    const layout = requireLayout(composeMockup(mockupTemplate('letterhead-a4')!, identity, { logo: (l, f) => l.files[f] ?? null, photos: [], pattern: (pp) => pagePatternFill(identity, pp) }));
    const svg = pageSvg(layout, layout.pages[0]);
    expect(svg.match(/l-cone-black\.svg/g)).toHaveLength(fill.layout.placements.length);
    expect(svg).toContain(`flood-color="${fill.ink}"`);
  });
});

describe('a palette of one colour', () => {
  test('has no ink to set on its only colour: a plain field, not marks invisible on themselves', () => {
    const one = { ...identity, colors: identity.colors.filter((c) => c.id === 'c-roast-umber') };
    expect(mockupPattern(one)).toMatchObject({ settings: null, hex: '#4a2e22' });
  });
});
