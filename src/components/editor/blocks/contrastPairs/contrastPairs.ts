// Tiptap node of the contrastPairs block: attributes come from its schema, the view from ContrastPairsView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { contrastPairsBlock } from '@/lib/guideline/blocks/contrastPairs';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { ContrastPairsView } from './ContrastPairsView';

export const ContrastPairsNode = Node.create({
  name: contrastPairsBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(contrastPairsBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${contrastPairsBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': contrastPairsBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(ContrastPairsView),
});
