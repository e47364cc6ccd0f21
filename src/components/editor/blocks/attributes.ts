// Tiptap attribute specs generated from a block's schema defaults, each kept in its own data-* attribute as JSON.
import type { Attributes } from '@tiptap/core';

const kebab = (key: string) => key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);

/** The node options every guideline block shares: a top-level, draggable, atomic block. */
export const BLOCK_NODE_SPEC = {
  group: 'guidelineBlock',
  atom: true,
  draggable: true,
  selectable: true,
  isolating: true,
} as const;

/** id (data-block-id) plus one data-* attribute per field, JSON-encoded so lists and nulls survive copy and paste. */
export function blockAttributes(defaults: Record<string, unknown>): Attributes {
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
