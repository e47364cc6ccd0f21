// The block registry collected from src/blocks/*/definition.ts: order, names and declared references.
import { describe, expect, test } from 'vitest';
import * as z from 'zod';
import { BLOCKS, blocksByGroup, documentRefs } from '@/blocks';

describe('block registry', () => {
  test('blocks come in a stable order: the insert menu lists them as before the folders existed', () => {
    expect(BLOCKS.map((b) => b.type)).toEqual([
      'sectionHeading',
      'callout',
      'logoShowcase',
      'clearSpace',
      'minimumSize',
      'misuse',
      'oneColourProofs',
      'colorPalette',
      'contrastPairs',
      'typography',
      'imagery',
      'pattern',
      'applications',
      'downloads',
    ]);
    expect(new Set(BLOCKS.map((b) => b.order)).size).toBe(BLOCKS.length);
    expect(blocksByGroup().map((g) => g.label)).toEqual(['Structure', 'Logo', 'Colour', 'Type', 'Imagery and pattern', 'Files']);
  });

  test.each(BLOCKS.map((b) => [b.type, b] as const))('%s: every declared reference names one of its attributes', (_type, block) => {
    const shape = block.schema.shape as Record<string, z.ZodType>;
    for (const [key, spec] of Object.entries(block.refs)) {
      expect(shape[key], `${block.type}.${key}`).toBeDefined();
      if (typeof spec === 'object') {
        // A kind per field applies to a list of objects: each named field must exist on the list's items.
        let list = shape[key] as unknown as { unwrap?: () => unknown; element?: { shape: Record<string, unknown> } };
        while (!list.element && list.unwrap) list = list.unwrap() as typeof list;
        for (const field of Object.keys(spec)) expect(list.element?.shape[field], `${block.type}.${key}[].${field}`).toBeDefined();
      }
    }
  });
});

describe('references of a document', () => {
  const doc = {
    content: [
      { type: 'logoShowcase', attrs: { id: 'a', logoIds: ['l-primary', 'l-cone'], brandColorId: 'c-roast-umber' } },
      { type: 'pattern', attrs: { id: 'b', logoId: 'l-cone', backgroundColorId: 'c-filter-paper', markColorId: null } },
      { type: 'typography', attrs: { id: 'c', roles: ['heading', 'body'] } },
      { type: 'downloads', attrs: { id: 'd', assetIds: ['asset-1'] } },
      { type: 'paragraph', attrs: { id: 'e', logoId: 'not-a-reference' } },
    ],
  };

  test('each kind is read from the declarations, distinct and in document order', () => {
    expect(documentRefs(doc, 'logo')).toEqual(['l-primary', 'l-cone']);
    expect(documentRefs(doc, 'colour')).toEqual(['c-roast-umber', 'c-filter-paper']);
    expect(documentRefs(doc, 'typeface')).toEqual(['heading', 'body']);
    expect(documentRefs(doc, 'asset')).toEqual(['asset-1']);
    expect(documentRefs(doc, 'image')).toEqual([]);
  });
});
