// Tiptap node of the minimumSize block: attributes come from its schema, the view from MinimumSizeView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { minimumSizeBlock } from '@/lib/guideline/blocks/minimumSize';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { MinimumSizeView } from './MinimumSizeView';

export const MinimumSizeNode = Node.create({
  name: minimumSizeBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(minimumSizeBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${minimumSizeBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': minimumSizeBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(MinimumSizeView),
});
