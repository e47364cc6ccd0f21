// The logo don'ts block: only the tiles we draw, each made from the chosen logo.
import { describe, expect, test } from 'vitest';
import { blockRefs } from '@/blocks';
import { validateGuideline } from '@/lib/guideline/document';

describe('misuse tiles', () => {
  test('a misuse tile we do not draw is refused with its path', () => {
    const result = validateGuideline({ type: 'doc', content: [{ type: 'misuse', attrs: { id: 'b', tiles: ['stretched', 'melted'] } }] });
    expect(result.ok ? null : result.error.path).toBe('content.0.attrs.tiles.1');
    expect(result.ok ? '' : result.error.message).toMatch(/tile must be one of/);
  });

  test('the chosen logo is its one declared reference', () => {
    expect(blockRefs('misuse', { logoId: 'l-primary', tiles: ['stretched'] })).toEqual([{ kind: 'logo', value: 'l-primary', path: ['logoId'] }]);
    expect(blockRefs('misuse', { logoId: null })).toEqual([]);
  });
});
