// The pattern block: drafts saved before layouts keep what they showed, and the page draws the generator's own tile.
import { readFileSync } from 'node:fs';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, test } from 'vitest';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { patternLayout } from '@/lib/pattern/layout';
import { GuidelineDocument } from '@/components/guideline/GuidelineDocument';
import { attrsFromPatternSettings, blockPatternSettings, patternBlock } from './definition';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const mark = identity.logos[0];
const render = (attrs: Record<string, unknown>) =>
  renderToStaticMarkup(createElement(GuidelineDocument, { doc: { type: 'doc', content: [{ type: 'pattern', attrs: { id: 'p', ...attrs } }] } as unknown as GuidelineDoc, identity, mode: 'site' }));

describe('the pattern block', () => {
  test('a draft from before layouts: a row shift of 0 was a grid, any other shift a brick', () => {
    expect(patternBlock.fromStored({ id: 'p', offset: 0 })).toMatchObject({ layout: 'grid' });
    expect(patternBlock.fromStored({ id: 'p', offset: 0.5 })).toMatchObject({ layout: 'brick' });
    expect(patternBlock.fromStored({ id: 'p', layout: 'scatter', offset: 0 })).toMatchObject({ layout: 'scatter' });
  });

  test('the block asks the generator for the same settings as the export (ground and ink by palette id)', () => {
    const attrs = patternBlock.schema.parse({ id: 'p', logoId: mark.id, layout: 'half-drop', backgroundColorId: 'c-filter-paper', markColorId: 'c-espresso' });
    expect(blockPatternSettings(attrs)).toMatchObject({ logoId: mark.id, layout: 'half-drop', groundColorId: 'c-filter-paper', inkColorId: 'c-espresso' });
    expect(blockPatternSettings(patternBlock.schema.parse({ id: 'p' }))).toBeNull();
  });

  test('a shelf pattern’s settings round-trip into the block, held to the block’s limits', () => {
    const stored = { logoId: mark.id, layout: 'scatter', scale: 200, spacing: 0, rotation: -30, seed: 99, groundColorId: 'c-filter-paper', inkColorId: 'c-espresso', opacity: 0.5 };
    const attrs = attrsFromPatternSettings(stored)!;
    expect(attrs).toMatchObject({ layout: 'scatter', scale: 160, spacing: 0.25, rotation: -30, seed: 99, backgroundColorId: 'c-filter-paper', markColorId: 'c-espresso' });
    expect(patternBlock.schema.safeParse({ id: 'p', ...attrs }).success).toBe(true);
    expect(attrsFromPatternSettings({ logoId: 'x', layout: 'zigzag' })).toBeNull();
  });

  test('the page draws every placement of the tile, the copies across its edges included', () => {
    const attrs = { logoId: mark.id, layout: 'brick', scale: 30, spacing: 1, rotation: 15 };
    const html = render(attrs);
    const settings = blockPatternSettings(patternBlock.schema.parse({ id: 'p', ...attrs }))!;
    const tile = patternLayout(settings, mark.canvas.width / mark.canvas.height);
    expect(html.match(/<image /g)).toHaveLength(tile.placements.length);
    expect(html).toContain(`width="${tile.width}" height="${tile.height}" patternUnits="userSpaceOnUse"`);
    expect(html).toContain(mark.files.black);
  });
});
