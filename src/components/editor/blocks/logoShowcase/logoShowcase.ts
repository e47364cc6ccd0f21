// Tiptap node of the logoShowcase block: attributes come from its schema, the view from LogoShowcaseView.
import { mergeAttributes, Node } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { logoShowcaseBlock } from '@/lib/guideline/blocks/logoShowcase';
import { BLOCK_NODE_SPEC, blockAttributes } from '@/components/editor/blocks/attributes';
import { LogoShowcaseView } from './LogoShowcaseView';

export const LogoShowcaseNode = Node.create({
  name: logoShowcaseBlock.type,
  ...BLOCK_NODE_SPEC,
  addAttributes: () => blockAttributes(logoShowcaseBlock.defaults),
  parseHTML: () => [{ tag: `div[data-block="${logoShowcaseBlock.type}"]` }],
  renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': logoShowcaseBlock.type })],
  addNodeView: () => ReactNodeViewRenderer(LogoShowcaseView),
});
