// The contents of a guideline: one entry per section heading, with the anchor the published site uses.
import { plainText } from './richText';

export interface OutlineEntry {
  /** The section's anchor on the published page (unique within the document). */
  anchor: string;
  blockId: string;
  title: string;
  eyebrow: string;
}

/** A readable, URL-safe anchor from a title. */
export function slugify(title: string): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return slug || 'section';
}

type AnyNode = { type: string; attrs?: object | null; content?: unknown };

/** Section entries in document order; anchors repeat-proofed with -2, -3… */
export function outline(doc: { content?: AnyNode[] } | null | undefined): OutlineEntry[] {
  const used = new Map<string, number>();
  const entries: OutlineEntry[] = [];
  for (const node of doc?.content ?? []) {
    if (node?.type !== 'sectionHeading') continue;
    const attrs = (node.attrs ?? {}) as Record<string, unknown>;
    const title = typeof attrs.title === 'string' ? attrs.title : '';
    const base = slugify(title);
    const n = (used.get(base) ?? 0) + 1;
    used.set(base, n);
    entries.push({
      anchor: n === 1 ? base : `${base}-${n}`,
      blockId: typeof attrs.id === 'string' ? attrs.id : '',
      title,
      eyebrow: typeof attrs.eyebrow === 'string' ? attrs.eyebrow : '',
    });
  }
  return entries;
}

export interface DocSummary {
  blocks: number;
  sections: string[];
  words: number;
  /** One line for a person choosing between two versions. */
  text: string;
}

/** Counts blocks, sections and words, for the conflict dialog. */
export function summarize(doc: { content?: AnyNode[] } | null | undefined): DocSummary {
  const content = doc?.content ?? [];
  const sections = outline(doc).map((e) => e.title || 'Untitled section');
  let words = 0;
  for (const node of content) {
    const attrs = (node.attrs ?? {}) as Record<string, unknown>;
    const own = [plainText(node as never), ...['title', 'intro', 'text', 'caption', 'note'].map((k) => (typeof attrs[k] === 'string' ? attrs[k] : ''))].join(' ');
    words += own.split(/\s+/).filter(Boolean).length;
  }
  const list = sections.length ? `: ${sections.slice(0, 6).join(', ')}${sections.length > 6 ? '…' : ''}` : '';
  const text = `${content.length} block${content.length === 1 ? '' : 's'}, ${words} word${words === 1 ? '' : 's'}, ${sections.length} section${sections.length === 1 ? '' : 's'}${list}`;
  return { blocks: content.length, sections, words, text };
}
