// Tiptap node of the sectionHeading block: attributes come from its schema, the view from SectionHeadingView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { sectionHeadingBlock } from '@/lib/guideline/blocks/sectionHeading';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { SectionHeadingView } from './SectionHeadingView';

export const SectionHeadingNode = Node.create({
  name: sectionHeadingBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(sectionHeadingBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${sectionHeadingBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': sectionHeadingBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(SectionHeadingView),
});
