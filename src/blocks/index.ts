// The block registry: every folder under src/blocks with a definition.ts is a block the editor, the validator and the
// published site know. Collected by Vite at build time, so adding a block touches its own folder only.
import { BLOCK_GROUPS, type BlockDefinition, type BlockGroup, type RefKind, type RefSpec } from './define';

const found = import.meta.glob<BlockDefinition>('./*/definition.ts', { eager: true, import: 'default' });

/** The folder a registry module sits in ("./colorPalette/definition.ts" → "colorPalette"). */
export const blockFolder = (path: string) => path.split('/')[1];

/** Every block, in registry order (the insert menu's order within a group). */
export const BLOCKS: readonly BlockDefinition[] = Object.entries(found)
  .map(([path, def]) => {
    // The folder name is the stored type name, so a block is found where its JSON says it is.
    if (def.type !== blockFolder(path)) throw new Error(`The block in ${path} is typed "${def.type}"; its folder must carry the same name.`);
    return def;
  })
  .sort((a, b) => a.order - b.order);

const byType = new Map<string, BlockDefinition>(BLOCKS.map((b) => [b.type, b]));

/** The registry entry of a block type, or undefined for a type we do not know. */
export function blockDefinition(type: string): BlockDefinition | undefined {
  return byType.get(type);
}

/** Stored attributes made safe to render before parsing (see each definition's fromStored). */
export function storedAttrs(type: string, attrs: unknown): unknown {
  const def = byType.get(type);
  return def ? def.fromStored(attrs) : attrs;
}

/** A stored document with every block's attributes passed through storedAttrs (what a published version keeps). */
export function withStoredAttrs<D extends { content: unknown[] }>(doc: D): D {
  return {
    ...doc,
    content: doc.content.map((node) => {
      const n = node as { type?: unknown; attrs?: unknown };
      return typeof n?.type === 'string' && n.attrs !== undefined ? { ...n, attrs: storedAttrs(n.type, n.attrs) } : node;
    }),
  };
}

/** The registry grouped for the insert menu, in group order. */
export function blocksByGroup(): { group: BlockGroup; label: string; blocks: BlockDefinition[] }[] {
  return (Object.keys(BLOCK_GROUPS) as BlockGroup[])
    .map((group) => ({ group, label: BLOCK_GROUPS[group], blocks: BLOCKS.filter((b) => b.group === group) }))
    .filter((g) => g.blocks.length > 0);
}

/** One value a block points at, with where it sits in the block's attributes. */
export interface BlockRef {
  kind: RefKind;
  value: string;
  /** Attribute path, e.g. ["pairs", 0, "foreground"]. */
  path: (string | number)[];
}

function collect(spec: RefSpec, value: unknown, path: (string | number)[], out: BlockRef[]) {
  if (Array.isArray(value)) value.forEach((item, i) => collect(spec, item, [...path, i], out));
  else if (typeof spec === 'string') {
    if (typeof value === 'string') out.push({ kind: spec, value, path });
  } else if (value && typeof value === 'object') {
    for (const [key, kind] of Object.entries(spec)) collect(kind, (value as Record<string, unknown>)[key], [...path, key], out);
  }
}

/** The references a block's attributes hold, read from its definition's declarations (none for an unknown type). */
export function blockRefs(type: string, attrs: unknown): BlockRef[] {
  const def = byType.get(type);
  const out: BlockRef[] = [];
  if (!def || !attrs || typeof attrs !== 'object') return out;
  for (const [key, spec] of Object.entries(def.refs)) collect(spec, (attrs as Record<string, unknown>)[key], [key], out);
  return out;
}

/** Distinct values of one kind that a document's top-level blocks point at, in document order. */
export function documentRefs(doc: { content?: unknown[] }, kind: RefKind): string[] {
  const values = new Set<string>();
  for (const node of doc.content ?? []) {
    const n = node as { type?: unknown; attrs?: unknown };
    if (typeof n?.type !== 'string') continue;
    for (const ref of blockRefs(n.type, n.attrs)) if (ref.kind === kind) values.add(ref.value);
  }
  return [...values];
}

export { BLOCK_GROUPS, type BlockDefinition, type BlockGroup, type RefKind, type RefSpec };
