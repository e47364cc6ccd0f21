// The contrast pairs block: WCAG 2.2 verdicts on the published page, and its colour references.
import { readFileSync } from 'node:fs';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { wcagContrast } from 'culori';
import { describe, expect, test } from 'vitest';
import { blockRefs } from '@/blocks';
import { CONTRAST_CAUTION } from '@/lib/cautions';
import { colorValues } from '@/lib/color';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { starterAttrs } from '@/lib/guideline/templates';
import type { Identity } from '@/lib/identity/types';
import { GuidelineDocument } from '@/components/guideline/GuidelineDocument';
import { contrastPairsBlock } from './definition';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const doc = (...content: unknown[]) => ({ type: 'doc', content }) as unknown as GuidelineDoc;
const render = (d: GuidelineDoc, id: Identity = identity) => renderToStaticMarkup(createElement(GuidelineDocument, { doc: d, identity: id, mode: 'site' }));

describe('contrast pairs on the published page', () => {
  test('contrast pairs show WCAG 2.2 verdicts', () => {
    const d = doc({ type: 'contrastPairs', attrs: { id: 'cp', pairs: [{ foreground: 'c-steam-grey', background: 'c-filter-paper' }, { foreground: 'c-espresso', background: 'c-filter-paper' }] } });
    const out = render(d);
    // #767676 on #ffffff is 4.54:1: passes AA (4.5:1) and AA large, fails AAA (7:1). WCAG 2.2 SC 1.4.3 / 1.4.6 thresholds;
    // the 4.54:1 figure is the common practice worked example for this grey (from memory), confirmed with culori.
    expect(wcagContrast('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    const grey = out.slice(out.indexOf('data-pair="c-steam-grey/c-filter-paper"'), out.indexOf('data-pair="c-espresso/c-filter-paper"'));
    expect(grey).toContain('4.54:1');
    expect(grey).toContain('data-level="aa" data-pass="yes"');
    expect(grey).toContain('data-level="aaLarge" data-pass="yes"');
    expect(grey).toContain('data-level="aaa" data-pass="no"');
    expect(grey).toContain('data-level="aaaLarge" data-pass="yes"');
    // SC 1.4.11 non-text contrast: 3:1.
    expect(grey).toContain('data-level="nonText" data-pass="yes"');
    expect(out).toContain(CONTRAST_CAUTION.slice(0, 40));
  });

  test('a near miss never reads as a pass: 4.478:1 is shown as 4.47, not rounded up', () => {
    // #777777 on #ffffff is 4.478…:1, just under AA 4.5:1 (from memory; recomputed with the WCAG 2.2 formula).
    const sameGrey = { ...identity, colors: [...identity.colors, { ...identity.colors[3], id: 'c-777', name: 'Grey 777', ...colorValues('#777777') }] };
    const out = render(doc({ type: 'contrastPairs', attrs: { id: 'cp', pairs: [{ foreground: 'c-777', background: 'c-filter-paper' }] } }), sameGrey);
    expect(out).toContain('4.47:1');
    expect(out).toContain('data-level="aa" data-pass="no"');
  });
});

describe('declared references', () => {
  test('both sides of every pair are colour references', () => {
    const refs = blockRefs('contrastPairs', { pairs: [{ foreground: 'c-espresso', background: 'c-filter-paper' }] });
    expect(refs).toEqual([
      { kind: 'colour', value: 'c-espresso', path: ['pairs', 0, 'foreground'] },
      { kind: 'colour', value: 'c-filter-paper', path: ['pairs', 0, 'background'] },
    ]);
  });

  test('a new block starts with suggested pairs that reach WCAG 2.2 AA (SC 1.4.3, 4.5:1) beyond text on ground', () => {
    const { pairs } = starterAttrs(contrastPairsBlock, identity) as { pairs: { foreground: string; background: string }[] };
    // The fixture's text colour on its background comes first (the starter's "$suggested" placeholder).
    expect(pairs[0]).toEqual({ foreground: 'c-espresso', background: 'c-filter-paper' });
    // Measured with culori's wcagContrast (a general-purpose reference library), not our own contrastRatio.
    const hex = (id: string) => identity.colors.find((c) => c.id === id)!.hex;
    expect(pairs.length).toBeGreaterThan(1);
    for (const p of pairs.slice(1)) expect(wcagContrast(hex(p.foreground), hex(p.background)), `${p.foreground} on ${p.background}`).toBeGreaterThanOrEqual(4.5);
  });
});
