// Tiptap node of the downloads block: attributes come from its schema, the view from DownloadsView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { downloadsBlock } from '@/lib/guideline/blocks/downloads';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { DownloadsView } from './DownloadsView';

export const DownloadsNode = Node.create({
  name: downloadsBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(downloadsBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${downloadsBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': downloadsBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(DownloadsView),
});
