// Tiptap node of the typography block: attributes come from its schema, the view from TypographyView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { typographyBlock } from '@/lib/guideline/blocks/typography';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { TypographyView } from './TypographyView';

export const TypographyNode = Node.create({
  name: typographyBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(typographyBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${typographyBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': typographyBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(TypographyView),
});
