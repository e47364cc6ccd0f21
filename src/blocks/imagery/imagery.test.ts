// The imagery block: images come from the brand's own shelf, never from an outside address.
import { readFileSync } from 'node:fs';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, test } from 'vitest';
import { blockRefs, storedAttrs } from '@/blocks';
import { parseBlockAttrs, validateGuideline, type GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { GuidelineDocument } from '@/components/guideline/GuidelineDocument';
import { imageryBlock, OUTSIDE_IMAGE_PLACEHOLDER } from './definition';

const doc = (...content: unknown[]) => ({ type: 'doc', content });
const item = (src: string) => ({ src, alt: '', verdict: 'do', caption: '' });
const firstError = (input: unknown) => {
  const result = validateGuideline(input);
  return result.ok ? null : result.error;
};

describe('image sources', () => {
  test('an image source that is a script address', () => {
    const error = firstError(doc({ type: 'imagery', attrs: { id: 'i', items: [item('javascript:alert(1)')] } }));
    expect(error?.path).toBe('content.0.attrs.items.0.src');
    expect(error?.message).toMatch(/asset shelf; outside addresses are not accepted/);
  });

  test('an image source that is an outside address', () => {
    const error = firstError(doc({ type: 'imagery', attrs: { id: 'i', items: [item('https://attacker.example/x.png')] } }));
    expect(error?.path).toBe('content.0.attrs.items.0.src');
    expect(error?.message).toMatch(/outside addresses are not accepted/);
  });

  test('an outside address kept in an old draft becomes a placeholder before anything reads it', () => {
    const attrs = { id: 'i', items: [item('https://attacker.example/x.png'), item('photo-to-come-1')] };
    expect(storedAttrs('imagery', attrs)).toEqual({ ...attrs, items: [item(OUTSIDE_IMAGE_PLACEHOLDER), item('photo-to-come-1')] });
  });
});

describe('declared references', () => {
  test('every image source is an image reference, with its place in the block', () => {
    const refs = blockRefs('imagery', { items: [item('photo-to-come-1'), item('a-2')] });
    expect(refs).toEqual([
      { kind: 'image', value: 'photo-to-come-1', path: ['items', 0, 'src'] },
      { kind: 'image', value: 'a-2', path: ['items', 1, 'src'] },
    ]);
  });
});

describe('photographs picked from the shelf', () => {
  const photoId = '6f1c2a9e-3b4d-4e5f-8a7b-9c0d1e2f3a4b';
  const photo = {
    id: photoId,
    name: 'Morning pour',
    kind: 'photo',
    format: 'jpeg',
    url: '/b/larchmere/v/3/files/' + photoId,
    renditions: '/b/larchmere/v/3/files/' + photoId,
    width: 3000,
    height: 2000,
    alt: 'A white cup on a wooden counter in morning light.',
    caption: 'Morning light, one cup.',
    focus: { x: 0.55, y: 0.5 },
  };
  const identity = { ...(JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity), assets: [photo] };
  const render = (attrs: Record<string, unknown>) =>
    renderToStaticMarkup(createElement(GuidelineDocument, { doc: doc({ type: 'imagery', attrs: { id: 'i', ...attrs } }) as unknown as GuidelineDoc, identity, mode: 'site' }));

  test('the picker’s choice is stored as the photograph’s asset id, and is an image reference of the block', () => {
    const result = validateGuideline(doc({ type: 'imagery', attrs: { id: 'i', items: [item(photoId)], aspect: '3:2' } }));
    expect(result.ok).toBe(true);
    expect(blockRefs('imagery', { items: [item(photoId)] })).toEqual([{ kind: 'image', value: photoId, path: ['items', 0, 'src'] }]);
  });

  test('a draft saved before the aspect ratio existed still reads, as 4:3', () => {
    const old = { id: 'i', items: [item(photoId)], columns: 2 };
    expect(parseBlockAttrs(imageryBlock, storedAttrs('imagery', old))).toEqual({ ...old, aspect: '4:3' });
  });

  test('a version serves srcset renditions by width, never wider than the crop, with sizes, lazy loading and a size', () => {
    const html = render({ items: [item(photoId)], columns: 3, aspect: '4:3' });
    // 3000 × 2000 cut to 4:3 is 2667 px wide: every standard width fits (HTML srcset width descriptors; photo.ts).
    const srcset = /srcSet="([^"]+)"|srcset="([^"]+)"/.exec(html)!;
    const candidates = (srcset[1] ?? srcset[2]).split(', ').map((c) => c.replace(/&amp;/g, '&'));
    expect(candidates).toEqual([480, 960, 1600, 2400].map((w) => `/b/larchmere/v/3/files/${photoId}?w=${w}&aspect=4x3 ${w}w`));
    expect(html).toContain('sizes="(min-width: 952px) 306px, (min-width: 640px) 33vw, 100vw"');
    expect(html).toContain('loading="lazy"');
    expect(html).toContain('width="2400" height="1800"');
    // No alt text of its own: the photograph's from the shelf (WCAG 2.2 SC 1.1.1), and its caption.
    expect(html).toContain(`alt="${photo.alt}"`);
    expect(html).toContain(photo.caption);
  });

  test('the block’s own alt text wins over the shelf’s', () => {
    expect(render({ items: [{ ...item(photoId), alt: 'Steam over a cup.' }] })).toContain('alt="Steam over a cup."');
  });
});
