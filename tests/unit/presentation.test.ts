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
import { toneReport } from '@/lib/logo/tones';
import { inkOn, revealPhotographs, SLIDE_PAGE } from '@/lib/presentation/material';
import { wcagContrast } from 'culori';

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

  test('the In use slide draws the applications block’s pieces from the identity, each labelled, with no download links', () => {
    const doc: GuidelineDoc = { type: 'doc', content: [{ type: 'applications', attrs: { id: 'app', templates: ['business-card', 'social-post'], logoId: null } }] };
    const slide = deckSlides(context({ doc })).find((s) => s.key === 'in-use');
    expect(slide).toBeDefined();
    const html = renderToStaticMarkup(createElement('div', null, slide!.content));
    // The business card has a front and a back (two pages); the social post one.
    expect(html.match(/class="s-piece"/g)).toHaveLength(2);
    expect(html.match(/<svg[^>]*role="img"/g)!.length).toBeGreaterThanOrEqual(3);
    expect(html).not.toMatch(/download|bleed and crop/i);
    expect(keys(context())).not.toContain('in-use');
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
    expect(revealPhotographs(withAssets, doc, base)).toEqual([
      { src: `${base}/files/a1b2c3d4-0000-4000-8000-000000000001`, alt: 'Sacks of green beans', caption: '', position: '50% 50%' },
    ]);
    expect(keys(context({ identity: withAssets, doc }))).toContain('photographs');
    expect(keys(context({ doc }))).not.toContain('photographs');
  });

  // A 3000 × 2000 photograph (3:2) with its subject right of centre, as the demo's are.
  const PHOTO = { kind: 'photo', format: 'jpeg', width: 3000, height: 2000, focus: { x: 0.72, y: 0.62 } };
  const photoId = (n: number) => `b1b2c3d4-0000-4000-8000-00000000000${n}`;
  const photos = (n: number): Identity => ({
    ...identity,
    assets: Array.from({ length: n }, (_, i) => ({
      ...PHOTO,
      id: photoId(i + 1),
      name: `Photo ${i + 1}`,
      url: `${base}/files/${photoId(i + 1)}`,
      renditions: `${base}/files/${photoId(i + 1)}`,
      alt: `Shelf alt ${i + 1}`,
      caption: `Shelf caption ${i + 1}`,
    })),
  });
  const imagery = (n: number, own: { alt?: string; caption?: string } = {}): GuidelineDoc => ({
    type: 'doc',
    content: [{ type: 'imagery', attrs: { id: 'img', items: Array.from({ length: n }, (_, i) => ({ src: photoId(i + 1), alt: own.alt ?? '', caption: own.caption ?? '', verdict: 'do' })) } }],
  });

  test('alt text and caption: the block’s own words win, else the shelf’s (never an empty alt for a described photo)', () => {
    const [shelf] = revealPhotographs(photos(1), imagery(1), base);
    expect(shelf.alt).toBe('Shelf alt 1');
    expect(shelf.caption).toBe('Shelf caption 1');
    const [own] = revealPhotographs(photos(1), imagery(1, { alt: 'The block’s alt', caption: 'The block’s caption' }), base);
    expect(own.alt).toBe('The block’s alt');
    expect(own.caption).toBe('The block’s caption');
  });

  // The crop is the largest box of the aspect ratio inside the photograph, centred on the focus as far as the edges
  // allow (worked by hand); HTML's srcset width descriptors (WHATWG HTML, "srcset attributes") name each file's width,
  // and no width is larger than the crop (never enlarged).
  test.each([
    // [photographs, aspect, crop width: 3000 × 2000 cut to the aspect, widths offered]
    [1, '16x9', 3000, [480, 960, 1600, 2400]],
    [2, '4x3', 2667, [480, 960, 1600, 2400]],
    [3, '4x5', 1600, [480, 960, 1600]],
    [4, '4x5', 1600, [480, 960, 1600]],
  ] as const)('%i photograph(s): cut to %s around the focus, widths up to the crop', (n, aspect, cropWidth, widths) => {
    const shown = revealPhotographs(photos(n), imagery(n), base);
    expect(shown).toHaveLength(n);
    for (const p of shown) {
      const offered = p.srcSet!.split(', ').map((entry) => entry.split(' '));
      expect(offered.map(([, w]) => Number(w.slice(0, -1)))).toEqual(widths);
      for (const [url, w] of offered) expect(url).toMatch(new RegExp(`^${base}/files/b1b2c3d4-[0-9a-f-]+\\?w=${w.slice(0, -1)}&aspect=${aspect}$`));
      expect(p.src).toMatch(new RegExp(`aspect=${aspect}$`));
      expect(Math.max(...widths)).toBeLessThanOrEqual(cropWidth);
      // width/height attributes in the cut's own proportions, so the page does not jump while it loads.
      const [aw, ah] = aspect.split('x').map(Number);
      expect(Math.abs(p.width! / p.height! - aw / ah)).toBeLessThan(0.01);
    }
  });

  test('the slide shows each photograph with its caption and its alt text', () => {
    const slide = deckSlides(context({ identity: photos(3), doc: imagery(3) })).find((s) => s.key === 'photographs')!;
    const html = renderToStaticMarkup(createElement('div', null, slide.content));
    expect(html.match(/<img /g)).toHaveLength(3);
    expect(html).toContain('alt="Shelf alt 2"');
    expect(html).toContain('<figcaption>Shelf caption 3</figcaption>');
    expect(html).toContain('--photo-aspect:4 / 5');
    expect(html).not.toMatch(/alt=""/);
  });
});

describe('the finding when a logo leans on colour', () => {
  /** Two touching halves, left and right, as RGBA pixels. */
  const halves = (left: string, right: string) => {
    const width = 200;
    const height = 100;
    const data = new Uint8Array(width * height * 4);
    const rgb = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
    for (let y = 0; y < height; y++) {
      for (let x = 0; x < width; x++) {
        data.set([...rgb(x < width / 2 ? left : right), 255], (y * width + x) * 4);
      }
    }
    return toneReport({ data, width, height, channels: 4 });
  };
  // Roast Umber #4a2e22 against Kiln Ember #c85b32: under 3:1 by culori's wcagContrast (WCAG 2.x contrast ratio).
  const leaning = halves('#4a2e22', '#c85b32');
  const reading = halves('#1f1a17', '#ffffff');

  test('the worked pair is under 3:1 by culori, so the tone check flags it', () => {
    expect(wcagContrast('#4a2e22', '#c85b32')).toBeLessThan(3);
    expect(leaning.dependsOnColour).toBe(true);
    expect(leaning.collapses[0].contrast).toBeCloseTo(wcagContrast('#4a2e22', '#c85b32'), 6);
    expect(reading.dependsOnColour).toBe(false);
  });

  test('a slide after the one-colour slide, naming the parts by their palette names and their ratio against 3:1', () => {
    const ctx = context({ tones: { 'l-cone': leaning, 'l-primary': reading } });
    expect(keys(ctx)).toEqual(['opening', 'logo', 'mark', 'one-colour', 'without-colour', 'palette', 'type', 'closing']);
    const html = renderToStaticMarkup(createElement('div', null, deckSlides(ctx).find((s) => s.key === 'without-colour')!.content));
    const ratio = (Math.floor(wcagContrast('#4a2e22', '#c85b32') * 100) / 100).toFixed(2);
    expect(html).toContain(`<strong>Roast Umber</strong> and <strong>Kiln Ember</strong> touch at <strong>${ratio}:1</strong>`);
    expect(html).toContain('3:1');
    expect(html).toContain('SC 1.4.11');
    // Only the logo that leans on colour is shown, in colour and in grey (luminance weights of WCAG 2.2).
    expect(html).toContain('Larch cone mark in grey');
    expect(html).not.toContain('Larchmere wordmark with cone in grey');
    expect(html).toContain('0.2126 0.7152 0.0722 0 0');
  });

  test('no slide when every logo reads in grey, or when there is no tone check', () => {
    expect(keys(context({ tones: { 'l-cone': reading, 'l-primary': reading } }))).not.toContain('without-colour');
    expect(keys(context())).not.toContain('without-colour');
  });
});
