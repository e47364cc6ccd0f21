// Tiptap node of the pattern block: attributes come from its schema, the view from PatternView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { patternBlock } from '@/lib/guideline/blocks/pattern';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { PatternView } from './PatternView';

export const PatternNode = Node.create({
  name: patternBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(patternBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${patternBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': patternBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(PatternView),
});
