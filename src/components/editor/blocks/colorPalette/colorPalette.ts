// Tiptap node of the colorPalette block: attributes come from its schema, the view from ColorPaletteView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { colorPaletteBlock } from '@/lib/guideline/blocks/colorPalette';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { ColorPaletteView } from './ColorPaletteView';

export const ColorPaletteNode = Node.create({
  name: colorPaletteBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(colorPaletteBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${colorPaletteBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': colorPaletteBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(ColorPaletteView),
});
