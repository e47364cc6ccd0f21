// A reader's name for a top-level block, used wherever a block is referred to in words (review lists, the margin).
import { blockDefinition } from '@/blocks';

export interface LabelledBlock {
  type: string;
  attrs?: { id?: string; title?: string } | null;
  content?: { text?: string; content?: { text?: string }[] }[];
}

/** A section's title, a block's label, or the first words of its text. */
export function blockLabel(b: LabelledBlock): string {
  if (b.type === 'sectionHeading') return `Section: ${b.attrs?.title || 'untitled'}`;
  const def = blockDefinition(b.type);
  if (def) return def.label;
  const words = (b.content ?? []).map((n) => n.text ?? (n.content ?? []).map((m) => m.text ?? '').join('')).join(' ').trim();
  return words ? `“${words.slice(0, 40)}${words.length > 40 ? '…' : ''}”` : 'Text';
}

/** The label of each block in a document by its id; blocks in a section also name the section they sit in. */
export function blockLabels(doc: { content?: unknown[] } | null | undefined): Map<string, string> {
  const labels = new Map<string, string>();
  let section: string | null = null;
  for (const node of (doc?.content ?? []) as LabelledBlock[]) {
    if (node.type === 'sectionHeading') section = node.attrs?.title || null;
    const id = node.attrs?.id;
    if (!id) continue;
    const own = blockLabel(node);
    labels.set(id, node.type !== 'sectionHeading' && section ? `${own} in “${section}”` : own);
  }
  return labels;
}
