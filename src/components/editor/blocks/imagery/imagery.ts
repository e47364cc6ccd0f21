// Tiptap node of the imagery block: attributes come from its schema, the view from ImageryView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { imageryBlock } from '@/lib/guideline/blocks/imagery';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { ImageryView } from './ImageryView';

export const ImageryNode = Node.create({
  name: imageryBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(imageryBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${imageryBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': imageryBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(ImageryView),
});
