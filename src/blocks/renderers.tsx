// Block type → its published renderer (each folder's Render.tsx); attributes always pass through the block's schema first.
import type { ComponentType } from 'react';
import type { Identity } from '@/lib/identity/types';
import type { RenderMode } from '@/components/guideline/parts';
import { blockDefinition, blockFolder, storedAttrs } from './index';

type Renderer = ComponentType<{ attrs: never; identity: Identity; mode: RenderMode; editing?: boolean; uid: string }>;

const found = import.meta.glob<{ Render?: Renderer }>('./*/Render.tsx', { eager: true });

/** Renderers of the blocks that draw from the identity (a section's Render.tsx holds the header the document draws). */
const BLOCK_RENDERERS: ReadonlyMap<string, Renderer> = new Map(
  Object.entries(found).flatMap(([path, { Render }]) => (Render ? [[blockFolder(path), Render] as const] : [])),
);

/** One identity block, its attributes parsed through its schema; unreadable settings show a quiet notice. */
export function BlockRenderer({ type, attrs, identity, mode, editing }: { type: string; attrs: unknown; identity: Identity; mode: RenderMode; editing?: boolean }) {
  const def = blockDefinition(type);
  const Renderer = BLOCK_RENDERERS.get(type);
  const parsed = def?.schema.safeParse(storedAttrs(type, attrs ?? {}));
  if (!def || !Renderer || !parsed?.success) {
    return <p className="rounded-lg border border-dashed border-rule-strong px-4 py-3 text-sm text-ink-soft">This block’s settings could not be read, so it is left out.</p>;
  }
  const id = (parsed.data as { id: string }).id;
  return <Renderer attrs={parsed.data as never} identity={identity} mode={mode} editing={editing} uid={`pl-${id}`} />;
}
