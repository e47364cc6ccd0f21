// Tiptap node of the misuse block: attributes come from its schema, the view from MisuseView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { misuseBlock } from '@/lib/guideline/blocks/misuse';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { MisuseView } from './MisuseView';

export const MisuseNode = Node.create({
  name: misuseBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(misuseBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${misuseBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': misuseBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(MisuseView),
});
