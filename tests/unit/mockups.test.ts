// Mock-ups filled from the identity: template sizes against the paper standards, the logo never below its minimum
// size and its clear space free of other content, text sizes from the type scale, refusals that name the sizes.
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import type { Identity } from '@/lib/identity/types';
import { composeMockup, contains, itemBox, overlaps, type MockupLayout, type MockupSources } from '@/lib/mockups/compose';
import { MOCKUP_TEMPLATES, mockupTemplate, trimSize } from '@/lib/mockups/templates';
import { BLEED_MM, cropMarkLines, pageSvg } from '@/lib/mockups/svg';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const sources: MockupSources = { logo: (logo, file) => logo.files[file] ?? null, photos: [] };
const layoutOf = (key: string, who: Identity = identity): MockupLayout => {
  const composed = composeMockup(mockupTemplate(key)!, who, sources);
  if (!composed.ok) throw new Error(composed.refusals.map((r) => r.message).join(' '));
  return composed.layout;
};

describe('template sizes', () => {
  // Trim sizes in mm (print) or px (screen), each from the source named in the row.
  test.each([
    { key: 'letterhead-a4', width: 210, height: 297, source: 'ISO 216: A4 is 210 × 297 mm' },
    { key: 'editorial-spread', width: 210, height: 297, source: 'ISO 216: A4 is 210 × 297 mm' },
    { key: 'sign', width: 594, height: 420, source: 'ISO 216: A2 is 420 × 594 mm (landscape here)' },
    { key: 'envelope-dl', width: 220, height: 110, source: 'ISO 269: DL is 110 × 220 mm' },
    { key: 'letterhead-letter', width: 215.9, height: 279.4, source: 'ANSI/ASME Y14.1 size A: 8.5 × 11 in, 1 in = 25.4 mm' },
    { key: 'business-card', width: 85, height: 55, source: 'common practice in Europe: 85 × 55 mm' },
    { key: 'social-post', width: 1080, height: 1080, source: 'common practice: a square post of 1080 px' },
    { key: 'social-story', width: 1080, height: 1920, source: 'common practice: a 9:16 story of 1080 × 1920 px' },
  ])('$key is $width × $height ($source)', ({ key, width, height }) => {
    const size = trimSize(mockupTemplate(key)!);
    expect(size.width).toBeCloseTo(width, 6);
    expect(size.height).toBeCloseTo(height, 6);
  });

  test('there are the pieces the trade expects: stationery, social, a three-page editorial and a sign', () => {
    expect(MOCKUP_TEMPLATES.map((t) => t.key)).toEqual(['business-card', 'letterhead-a4', 'letterhead-letter', 'envelope-dl', 'social-post', 'social-story', 'editorial-spread', 'sign']);
    expect(mockupTemplate('business-card')!.pages.map((p) => p.name)).toEqual(['Front', 'Back']);
    expect(mockupTemplate('editorial-spread')!.pages).toHaveLength(3);
  });
});

describe.each(MOCKUP_TEMPLATES.map((t) => ({ key: t.key })))('the logo on $key', ({ key }) => {
  const layout = layoutOf(key);
  const logos = layout.pages.flatMap((page) => page.items.flatMap((it) => (it.kind === 'logo' ? [{ page, it }] : [])));

  test('is placed, never below its minimum size (print mm, or screen px × the density)', () => {
    expect(logos.length).toBeGreaterThan(0);
    for (const { it } of logos) {
      const minimum = layout.unit === 'mm' ? it.logo.minimumSize.printMm : it.logo.minimumSize.screenPx * layout.template.density;
      expect(it.minimumWidth).toBe(minimum);
      expect(it.drawn.width).toBeGreaterThanOrEqual(minimum);
    }
  });

  test('keeps its clear space: the drawn logo sits inside it by the margin, the box is on the page and free of other content', () => {
    const page = { x: 0, y: 0, ...layout.trim };
    for (const { page: p, it } of logos) {
      const scale = it.drawn.width / it.logo.bounds.width;
      const margin = it.logo.clearSpace.unitSize * it.logo.clearSpace.multiple * scale;
      // Clear space = drawn bounds grown by multiple × unit on every side (the logo's own rule).
      expect(it.drawn.x - it.clearSpace.x).toBeCloseTo(margin, 6);
      expect(it.clearSpace.y + it.clearSpace.height - (it.drawn.y + it.drawn.height)).toBeCloseTo(margin, 6);
      expect(contains(page, it.clearSpace)).toBe(true);
      for (const other of p.items) {
        if (other === it) continue;
        const ground = other.kind === 'fill' && other.role === 'panel' && contains(other.box, it.clearSpace);
        if (!ground) expect(overlaps(itemBox(other), it.clearSpace), `${other.kind} enters the clear space`).toBe(false);
      }
    }
  });
});

describe('refusals', () => {
  // A logo whose fine details need 60 mm in print cannot sit in the card's 42 × 20 mm logo area.
  const fussy: Identity = {
    ...identity,
    logos: identity.logos.map((l) => ({ ...l, minimumSize: { ...l.minimumSize, printMm: 60, screenPx: 500 } })),
  };

  test('a card too small for the minimum size refuses, naming the available and the needed size', () => {
    const composed = composeMockup(mockupTemplate('business-card')!, fussy, sources);
    expect(composed.ok).toBe(false);
    if (composed.ok) return;
    const front = composed.refusals.find((r) => r.page === 'Front')!;
    const logo = fussy.logos[0];
    // Needed = the clear-space box at the scale where the drawn width equals the minimum.
    const scale = 60 / logo.bounds.width;
    expect(front.available).toEqual({ width: 42, height: 20 });
    expect(front.needed.width).toBeCloseTo(logo.clearSpace.box.width * scale, 6);
    expect(front.needed.height).toBeCloseTo(logo.clearSpace.box.height * scale, 6);
    expect(front.message).toContain('42 × 20 mm');
    expect(front.message).toContain(`${Math.round(logo.clearSpace.box.width * scale * 10) / 10} × ${Math.round(logo.clearSpace.box.height * scale * 10) / 10} mm`);
    expect(front.message).toContain('minimum width of 60 mm');
  });

  test('the sign, large enough, still composes with the same logo', () => {
    expect(composeMockup(mockupTemplate('sign')!, fussy, sources).ok).toBe(true);
  });

  test('a screen piece refuses in image pixels at its density', () => {
    const composed = composeMockup(mockupTemplate('social-post')!, fussy, sources);
    expect(composed.ok).toBe(false);
    if (!composed.ok) expect(composed.refusals[0].message).toContain('1350 px (500 CSS px at 2.7× density)');
  });
});

describe('type from the scale', () => {
  test('letter body text is the scale body step read at 0.8 on paper: 12 pt × 0.8 = 9.6 pt = 3.387 mm (1 pt = 1/72 in)', () => {
    const body = layoutOf('letterhead-a4').pages[0].items.find((it) => it.kind === 'text' && it.text.startsWith('Dear'));
    expect(body && body.kind === 'text' && body.fontSize).toBeCloseTo((9.6 * 25.4) / 72, 6);
  });

  test('a post headline is the step in CSS px times the density: 25 px × 2.7 = 67.5 px', () => {
    const headline = layoutOf('social-post').pages[0].items.find((it) => it.kind === 'text');
    expect(headline && headline.kind === 'text' && headline.fontSize).toBeCloseTo(67.5, 6);
  });

  test('text keeps 4.5:1 on its ground (WCAG 2.2 SC 1.4.3): white asked for on a light primary becomes the text colour', () => {
    const light: Identity = { ...identity, colors: identity.colors.map((c) => (c.role === 'primary' ? { ...c, hex: '#f2d16b' } : c)) };
    const onDark = layoutOf('sign').pages[0].items.find((it) => it.kind === 'text');
    const onLight = layoutOf('sign', light).pages[0].items.find((it) => it.kind === 'text');
    expect(onDark && onDark.kind === 'text' && onDark.hex).toBe('#ffffff');
    expect(onLight && onLight.kind === 'text' && onLight.hex).toBe('#1f1a17');
  });
});

describe('print geometry and escaping', () => {
  test('crop marks lie in the bleed, outside the trim, on the trim lines', () => {
    const trim = { width: 85, height: 55 };
    const lines = cropMarkLines(trim);
    expect(lines).toHaveLength(8);
    for (const [x1, y1, x2, y2] of lines) {
      for (const [x, y] of [[x1, y1], [x2, y2]]) {
        const inside = x > 0 && x < trim.width && y > 0 && y < trim.height;
        expect(inside).toBe(false);
        expect(x >= -BLEED_MM && x <= trim.width + BLEED_MM && y >= -BLEED_MM && y <= trim.height + BLEED_MM).toBe(true);
        // On the trim lines, and at least 1 mm clear of the trimmed piece along them.
        expect([0, trim.width].includes(x) || [0, trim.height].includes(y)).toBe(true);
      }
    }
  });

  test('a hostile brand name is escaped in the SVG', () => {
    const hostile: Identity = { ...identity, brand: { ...identity.brand, name: '</div><script>alert(1)</script>' } };
    const layout = layoutOf('letterhead-a4', hostile);
    const svg = pageSvg(layout, layout.pages[0]);
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&lt;script&gt;');
  });
});
