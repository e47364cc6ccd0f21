// What the insert menu offers: rich text first, then the registry's blocks by group, each with its starting content.
import { blocksByGroup } from '@/blocks';
import { newBlockId } from '@/lib/guideline/ids';
import { starterAttrs } from '@/lib/guideline/templates';
import type { Identity } from '@/lib/identity/types';

export interface InsertItem {
  key: string;
  label: string;
  description: string;
  group: string;
  /** ProseMirror JSON of the new top-level node. */
  content: (identity: Identity) => Record<string, unknown>;
}

const para = () => ({ type: 'paragraph' });
const TEXT_ITEMS: InsertItem[] = [
  { key: 'paragraph', label: 'Paragraph', description: 'Running text.', group: 'Text', content: () => ({ type: 'paragraph', attrs: { id: newBlockId() } }) },
  ...([2, 3, 4] as const).map((level) => ({
    key: `heading${level}`,
    label: ['Large heading', 'Medium heading', 'Small heading'][level - 2],
    description: `A heading inside a section (level ${level}).`,
    group: 'Text',
    content: () => ({ type: 'heading', attrs: { id: newBlockId(), level } }),
  })),
  { key: 'bulletList', label: 'Bulleted list', description: 'Points in no particular order.', group: 'Text', content: () => ({ type: 'bulletList', attrs: { id: newBlockId() }, content: [{ type: 'listItem', content: [para()] }] }) },
  { key: 'orderedList', label: 'Numbered list', description: 'Steps in order.', group: 'Text', content: () => ({ type: 'orderedList', attrs: { id: newBlockId() }, content: [{ type: 'listItem', content: [para()] }] }) },
  { key: 'blockquote', label: 'Quotation', description: 'Words set apart, such as a brand line.', group: 'Text', content: () => ({ type: 'blockquote', attrs: { id: newBlockId() }, content: [para()] }) },
];

/** Every entry of the insert menu, in display order. */
export function insertItems(): InsertItem[] {
  const blocks = blocksByGroup().flatMap(({ label, blocks }) =>
    blocks.map((b) => ({
      key: b.type,
      label: b.label,
      description: b.description,
      group: label,
      content: (identity: Identity) => ({ type: b.type, attrs: { ...b.defaults, ...starterAttrs(b, identity), id: newBlockId() } }),
    })),
  );
  const [structure, ...rest] = blocks.reduce<InsertItem[][]>((groups, item) => {
    const last = groups[groups.length - 1];
    if (last && last[0].group === item.group) last.push(item);
    else groups.push([item]);
    return groups;
  }, []);
  return [...(structure ?? []), ...TEXT_ITEMS, ...rest.flat()];
}

/** Items whose label, description or group contain every word of the query. */
export function filterItems(items: InsertItem[], query: string): InsertItem[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return items;
  return items.filter((item) => {
    const hay = `${item.label} ${item.description} ${item.group}`.toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}
