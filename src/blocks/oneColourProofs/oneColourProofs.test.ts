// The one-colour block: its one declared reference, and a greyscale made of WCAG 2.2 relative luminance.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, test } from 'vitest';
import { blockRefs } from '@/blocks';
import { validateGuideline } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';
import { Render } from './Render';

describe('one-colour block', () => {
  test('the chosen logos are its declared references; an unknown attribute is refused', () => {
    expect(blockRefs('oneColourProofs', { logoIds: ['l-primary'] })).toEqual([{ kind: 'logo', value: 'l-primary', path: ['logoIds', 0] }]);
    const result = validateGuideline({ type: 'doc', content: [{ type: 'oneColourProofs', attrs: { id: 'b', logoIds: [], tint: 'red' } }] });
    expect(result.ok).toBe(false);
  });

  test('greyscale is the WCAG 2.2 luminance weights (0.2126, 0.7152, 0.0722) applied in linear light', () => {
    const logo = { id: 'l-primary', name: 'Mark', canvas: { width: 100, height: 50 }, format: 'svg', files: { original: '/b/x/v/1/files/l-primary', black: '/b/x/v/1/files/l-primary~black', white: '/b/x/v/1/files/l-primary~white' } };
    const identity = { logos: [logo], colors: [], typefaces: [] } as unknown as Identity;
    const html = renderToStaticMarkup(createElement(Render, { attrs: { id: 'b', logoIds: ['l-primary'], caption: '' } as never, identity, mode: 'site', uid: 'pl-b' }));
    expect(html).toContain('color-interpolation-filters="linearRGB"');
    expect(html).toContain('values="0.2126 0.7152 0.0722 0 0 0.2126 0.7152 0.0722 0 0 0.2126 0.7152 0.0722 0 0 0 0 0 1 0"');
    expect(html).toContain('data-proof="black"');
    expect(html).toContain('data-proof="white"');
  });
});
