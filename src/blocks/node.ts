// A block's Tiptap node, generated from its definition: attributes from the schema defaults, each kept in its own
// data-* attribute as JSON, and the block's settings view as the node view.
import { mergeAttributes, Node, type Attributes } from '@tiptap/core';
import { ReactNodeViewRenderer, type ReactNodeViewProps } from '@tiptap/react';
import type { ComponentType } from 'react';
import type { BlockDefinition } from './define';

const kebab = (key: string) => key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);

/** The node options every guideline block shares: a top-level, draggable, atomic block. */
const BLOCK_NODE_SPEC = {
  group: 'guidelineBlock',
  atom: true,
  draggable: true,
  selectable: true,
  isolating: true,
} as const;

/** id (data-block-id) plus one data-* attribute per field, JSON-encoded so lists and nulls survive copy and paste. */
function blockAttributes(defaults: Record<string, unknown>): Attributes {
  const attrs: Attributes = {
    id: {
      default: null,
      keepOnSplit: false,
      parseHTML: (el) => el.getAttribute('data-block-id'),
      renderHTML: (a) => (a.id ? { 'data-block-id': a.id } : {}),
    },
  };
  for (const [key, fallback] of Object.entries(defaults)) {
    const name = `data-${kebab(key)}`;
    attrs[key] = {
      default: fallback,
      parseHTML: (el) => {
        const raw = el.getAttribute(name);
        if (raw === null) return fallback;
        try {
          return JSON.parse(raw);
        } catch {
          return fallback;
        }
      },
      renderHTML: (a) => ({ [name]: JSON.stringify(a[key]) }),
    };
  }
  return attrs;
}

/** The editor node of one block: a top-level atom drawn by its settings view, stored as <div data-block="type">. */
export function blockNode(definition: BlockDefinition, Settings: ComponentType<ReactNodeViewProps>) {
  return Node.create({
    name: definition.type,
    ...BLOCK_NODE_SPEC,
    addAttributes: () => blockAttributes(definition.defaults),
    parseHTML: () => [{ tag: `div[data-block="${definition.type}"]` }],
    renderHTML: ({ HTMLAttributes }) => ['div', mergeAttributes(HTMLAttributes, { 'data-block': definition.type })],
    addNodeView: () => ReactNodeViewRenderer(Settings),
  });
}
