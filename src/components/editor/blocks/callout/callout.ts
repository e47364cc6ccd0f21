// Tiptap node of the callout block: attributes come from its schema, the view from CalloutView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { calloutBlock } from '@/lib/guideline/blocks/callout';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { CalloutView } from './CalloutView';

export const CalloutNode = Node.create({
  name: calloutBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(calloutBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${calloutBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': calloutBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(CalloutView),
});
