// The applications block: its stored attributes, its references, and what it draws from the identity.
import { readFileSync } from 'node:fs';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, test } from 'vitest';
import { blockRefs } from '@/blocks';
import { validateGuideline } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { withVersionUrls } from '@/lib/publishing/snapshot-urls';
import { applicationsSchema, STARTER_MOCKUPS } from './definition';
import { Render } from './Render';

const identity = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
const attrs = (extra: Record<string, unknown> = {}) => applicationsSchema.parse({ id: 'apps', ...extra });
const html = (a: ReturnType<typeof attrs>, who: Identity = identity, editing = false) =>
  renderToStaticMarkup(createElement(Render, { attrs: a, identity: who, mode: 'site', editing }));

describe('stored attributes', () => {
  test('a new block shows six pieces', () => {
    expect(attrs().templates).toEqual(STARTER_MOCKUPS);
    expect(STARTER_MOCKUPS).toHaveLength(6);
  });

  test('a template we do not have is refused with the names we do', () => {
    const result = validateGuideline({ type: 'doc', content: [{ type: 'applications', attrs: { id: 'a', templates: ['mug'] } }] });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.message).toMatch(/Choose mock-ups from: business-card/);
  });

  test('the logo and the photographs are declared references (photographs are images a version copies)', () => {
    expect(blockRefs('applications', { logoId: 'l1', photoIds: ['p1'] })).toEqual([
      { kind: 'logo', value: 'l1', path: ['logoId'] },
      { kind: 'image', value: 'p1', path: ['photoIds', 0] },
    ]);
  });
});

describe('what it draws', () => {
  test('each chosen piece is an inline drawing with its size named, one drawing per page', () => {
    const out = html(attrs({ templates: ['business-card', 'editorial-spread', 'social-post'] }));
    expect(out.match(/<figure/g)).toHaveLength(3);
    expect(out.match(/<svg /g)).toHaveLength(2 + 3 + 1);
    expect(out).toContain('85 × 55 mm');
    expect(out).toContain('1080 × 1080 px');
  });

  test('downloads: the draft route in the editor, the version’s own address on the site, none in the print edition', () => {
    const editing = html(attrs({ templates: ['business-card', 'social-post'] }), identity, true);
    expect(editing).toContain(`/api/brands/${identity.brand.id}/mockups/business-card?format=pdf`);
    expect(editing).toContain(`/api/brands/${identity.brand.id}/mockups/social-post?format=png`);
    expect(editing).not.toContain('social-post?format=pdf');
    const published = withVersionUrls(identity, 'larchmere', 3);
    const site = html(attrs({ templates: ['business-card'] }), published);
    expect(site).toContain('/b/larchmere/v/3/mockups/business-card?format=pdf');
    const print = renderToStaticMarkup(createElement(Render, { attrs: attrs(), identity: published, mode: 'print' }));
    expect(print).not.toContain('/mockups/');
  });

  test('a piece the logo cannot fit says so, with the sizes, instead of drawing', () => {
    const fussy: Identity = { ...identity, logos: identity.logos.map((l) => ({ ...l, minimumSize: { ...l.minimumSize, printMm: 60 } })) };
    const out = html(attrs({ templates: ['business-card'] }), fussy);
    expect(out).toContain('data-mockup-refused');
    expect(out).toContain('42 × 20 mm');
    expect(out).not.toContain('<svg');
  });
});
