// The reveal presentation's page, inks and slide registry, checked without a server.
import { readFileSync } from 'node:fs';
import { renderToStaticMarkup } from 'react-dom/server';
import { createElement } from 'react';
import { describe, expect, test } from 'vitest';
import { BlockRenderer } from '@/blocks/renderers';
import { deckSlides, SLIDES, type DeckContext } from '@/components/presentation/slides';
import { contrastRatio } from '@/lib/color/contrast';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { inkOn, revealPhotographs, SLIDE_PAGE } from '@/lib/presentation/material';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const emptyDoc: GuidelineDoc = { type: 'doc', content: [] };
const context = (over: Partial<DeckContext> = {}): DeckContext => ({
  identity,
  doc: emptyDoc,
  slug: 'larchmere-coffee-roasters',
  version: { number: 3, publishedAt: new Date('2026-11-20T10:00:00Z'), note: '' },
  siteAddress: 'example.test/b/larchmere-coffee-roasters',
  mode: 'site',
  ...over,
});
const keys = (ctx: DeckContext) => deckSlides(ctx).map((s) => s.key);

describe('the slide page', () => {
  // CSS Values and Units 4, §6.2 "Absolute lengths": 1in = 96px = 25.4mm.
  test('1280 × 720 CSS px is 338.67 × 190.5 mm at 96 px to the inch', () => {
    expect((SLIDE_PAGE.widthPx / 96) * 25.4).toBeCloseTo(SLIDE_PAGE.widthMm, 2);
    expect((SLIDE_PAGE.heightPx / 96) * 25.4).toBeCloseTo(SLIDE_PAGE.heightMm, 2);
  });
  // ITU-R BT.709 (HDTV) and SMPTE ST 2036-1: the 16:9 picture aspect ratio.
  test('is 16:9', () => {
    expect(SLIDE_PAGE.widthPx / SLIDE_PAGE.heightPx).toBeCloseTo(16 / 9, 10);
    expect(SLIDE_PAGE.widthMm / SLIDE_PAGE.heightMm).toBeCloseTo(16 / 9, 3);
  });
  test('the print stylesheet asks for that page, with no margin', () => {
    const css = readFileSync('src/styles/presentation.css', 'utf8');
    expect(css).toMatch(new RegExp(`@page\\s*{\\s*size:\\s*${SLIDE_PAGE.widthMm}mm ${SLIDE_PAGE.heightMm}mm;\\s*margin:\\s*0;`));
  });
});

describe('inks on slide grounds', () => {
  // WCAG 2.2 SC 1.4.3: 4.5:1 for body text. Of black and white, one always reaches it on an opaque sRGB colour
  // (from memory: the worst ground, relative luminance ≈ 0.1791, gives √(1.05 × 0.05) − 0.05 ≈ 4.58:1 either way).
  test.each(['#ffffff', '#000000', '#4a2e22', '#3f5a45', '#c85b32', '#767676', '#777777', '#808080', '#ff0000', '#0000ff', '#ffff00', '#00ff00', '#1f1a17'])(
    'text on %s reaches 4.5:1',
    (ground) => {
      expect(contrastRatio(inkOn(ground), ground)).toBeGreaterThanOrEqual(4.5);
    },
  );
  test('a value that is not a checked hex is read as white, never passed on', () => {
    expect(inkOn('red; background:url(x)')).toBe(inkOn('#ffffff'));
  });
});

describe('the slide registry', () => {
  test('a brand with logos, colours and type gets those slides in order, opening first and closing last', () => {
    expect(keys(context())).toEqual(['opening', 'logo', 'mark', 'one-colour', 'palette', 'type', 'closing']);
  });

  test('a slide without its material is left out', () => {
    const bare: Identity = { ...identity, logos: [], colors: [], typefaces: [], typeScale: { ...identity.typeScale, steps: [] } };
    expect(keys(context({ identity: bare }))).toEqual(['opening', 'closing']);
    // Only the primary logo: no separate mark slide, the one-colour slide still shows it.
    const onlyPrimary: Identity = { ...identity, logos: identity.logos.filter((l) => l.variant === 'primary') };
    expect(keys(context({ identity: onlyPrimary }))).toEqual(['opening', 'logo', 'one-colour', 'palette', 'type', 'closing']);
  });

  test('the pattern slide shows the pattern block as it renders, and only when the guidelines have one', () => {
    const attrs = { id: 'pat', logoId: 'l-cone' };
    const doc: GuidelineDoc = { type: 'doc', content: [{ type: 'pattern', attrs }] };
    const slides = deckSlides(context({ doc }));
    expect(slides.map((s) => s.key)).toContain('pattern');
    const html = renderToStaticMarkup(createElement('div', null, slides.find((s) => s.key === 'pattern')!.content));
    // The block's own output, unchanged: whatever the pattern block draws on the site is what the slide shows.
    const block = renderToStaticMarkup(createElement(BlockRenderer, { type: 'pattern', attrs, identity, mode: 'site' }));
    expect(block).toContain('<svg');
    expect(html).toContain(block);
    // A pattern block with no mark chosen draws nothing on the site, so the slide is left out.
    const unset: GuidelineDoc = { type: 'doc', content: [{ type: 'pattern', attrs: { id: 'pat', logoId: null } }] };
    expect(keys(context({ doc: unset }))).not.toContain('pattern');
  });

  test('a new slide slots in by being listed; the registry decides nothing else', () => {
    const extra = { key: 'extra', title: 'Extra', material: () => 'x', View: () => null };
    expect(deckSlides(context(), [SLIDES[0], extra, SLIDES[SLIDES.length - 1]]).map((s) => s.key)).toEqual(['opening', 'extra', 'closing']);
    expect(new Set(SLIDES.map((s) => s.key)).size).toBe(SLIDES.length);
  });

  test('one-colour logos come from the black and white versions, each painted on its known ground', () => {
    const html = renderToStaticMarkup(createElement('div', null, deckSlides(context()).find((s) => s.key === 'one-colour')!.content));
    expect(html).toContain('l-primary-black.svg?on=%23ffffff');
    expect(html).toContain('l-primary-white.svg?on=%23000000');
    expect(html).toContain('Black on white');
    expect(html).toContain('White on black');
  });
});

describe('photographs for the reveal', () => {
  const base = '/b/larchmere-coffee-roasters/v/3';
  const withAssets: Identity = {
    ...identity,
    assets: [
      { id: 'a1b2c3d4-0000-4000-8000-000000000001', name: 'Roastery', kind: 'image', format: 'jpeg', url: `${base}/files/a1b2c3d4-0000-4000-8000-000000000001` },
      { id: 'a1b2c3d4-0000-4000-8000-000000000002', name: 'Not copied', kind: 'image', format: 'jpeg', url: '/api/assets/a1b2c3d4-0000-4000-8000-000000000002/file' },
      { id: 'a1b2c3d4-0000-4000-8000-000000000003', name: 'Dont', kind: 'image', format: 'jpeg', url: `${base}/files/a1b2c3d4-0000-4000-8000-000000000003` },
    ],
  };
  const doc: GuidelineDoc = {
    type: 'doc',
    content: [
      {
        type: 'imagery',
        attrs: {
          id: 'img',
          items: [
            { src: 'a1b2c3d4-0000-4000-8000-000000000001', alt: 'Sacks of green beans', verdict: 'do', caption: '' },
            { src: 'a1b2c3d4-0000-4000-8000-000000000002', alt: 'Elsewhere', verdict: 'do', caption: '' },
            { src: 'a1b2c3d4-0000-4000-8000-000000000003', alt: 'Blurred', verdict: 'dont', caption: '' },
            { src: 'photo-to-come-1', alt: 'Placeholder', verdict: 'do', caption: '' },
          ],
        },
      },
    ],
  };
  test('only "do" images the version carries a copy of', () => {
    expect(revealPhotographs(withAssets, doc, base)).toEqual([{ url: `${base}/files/a1b2c3d4-0000-4000-8000-000000000001`, alt: 'Sacks of green beans', caption: '' }]);
    expect(keys(context({ identity: withAssets, doc }))).toContain('photographs');
    expect(keys(context({ doc }))).not.toContain('photographs');
  });
});
