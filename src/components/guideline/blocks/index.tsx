// Block type → its published renderer; attributes always pass through the block's schema first.
import type { ComponentType } from 'react';
import { blockDefinition, storedAttrs, type BlockType } from '@/lib/guideline/blocks';
import type { Identity } from '@/lib/identity/types';
import type { RenderMode } from '@/components/guideline/parts';
import { CalloutBlock } from './Callout';
import { ClearSpaceBlock } from './ClearSpace';
import { ColorPaletteBlock } from './ColorPalette';
import { ContrastPairsBlock } from './ContrastPairs';
import { DownloadsBlock } from './Downloads';
import { ImageryBlock } from './Imagery';
import { LogoShowcaseBlock } from './LogoShowcase';
import { MinimumSizeBlock } from './MinimumSize';
import { MisuseBlock } from './Misuse';
import { PatternBlock } from './Pattern';
import { TypographyBlock } from './Typography';

type Renderer = ComponentType<{ attrs: never; identity: Identity; mode: RenderMode; editing?: boolean; uid: string }>;

/** Renderers of the blocks that draw from the identity (sections are drawn by the document itself). */
export const BLOCK_RENDERERS: Record<Exclude<BlockType, 'sectionHeading'>, Renderer> = {
  callout: CalloutBlock as Renderer,
  logoShowcase: LogoShowcaseBlock as Renderer,
  clearSpace: ClearSpaceBlock as Renderer,
  minimumSize: MinimumSizeBlock as Renderer,
  misuse: MisuseBlock as Renderer,
  colorPalette: ColorPaletteBlock as Renderer,
  contrastPairs: ContrastPairsBlock as Renderer,
  typography: TypographyBlock as Renderer,
  imagery: ImageryBlock as Renderer,
  pattern: PatternBlock as Renderer,
  downloads: DownloadsBlock as Renderer,
};

/** One identity block, its attributes parsed through its schema; unreadable settings show a quiet notice. */
export function BlockRenderer({ type, attrs, identity, mode, editing }: { type: string; attrs: unknown; identity: Identity; mode: RenderMode; editing?: boolean }) {
  const def = blockDefinition(type);
  const Renderer = BLOCK_RENDERERS[type as keyof typeof BLOCK_RENDERERS];
  const parsed = def?.schema.safeParse(storedAttrs(type, attrs ?? {}));
  if (!def || !Renderer || !parsed?.success) {
    return <p className="rounded-lg border border-dashed border-rule-strong px-4 py-3 text-sm text-ink-soft">This block’s settings could not be read, so it is left out.</p>;
  }
  const id = (parsed.data as { id: string }).id;
  return <Renderer attrs={parsed.data as never} identity={identity} mode={mode} editing={editing} uid={`pl-${id}`} />;
}
