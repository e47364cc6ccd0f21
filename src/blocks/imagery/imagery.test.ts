// The imagery block: images come from the brand's own shelf, never from an outside address.
import { describe, expect, test } from 'vitest';
import { blockRefs, storedAttrs } from '@/blocks';
import { validateGuideline } from '@/lib/guideline/document';
import { OUTSIDE_IMAGE_PLACEHOLDER } from './definition';

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
