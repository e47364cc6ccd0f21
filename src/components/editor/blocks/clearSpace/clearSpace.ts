// Tiptap node of the clearSpace block: attributes come from its schema, the view from ClearSpaceView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { clearSpaceBlock } from '@/lib/guideline/blocks/clearSpace';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { ClearSpaceView } from './ClearSpaceView';

export const ClearSpaceNode = Node.create({
  name: clearSpaceBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(clearSpaceBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${clearSpaceBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': clearSpaceBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(ClearSpaceView),
});
