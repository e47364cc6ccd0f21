// The block registry: every guideline block the editor, the validator and the published site know.
import { BLOCK_GROUPS, type BlockDefinition, type BlockGroup } from './define';
import { sectionHeadingBlock } from './sectionHeading';
import { calloutBlock } from './callout';
import { logoShowcaseBlock } from './logoShowcase';
import { clearSpaceBlock } from './clearSpace';
import { minimumSizeBlock } from './minimumSize';
import { misuseBlock } from './misuse';
import { colorPaletteBlock } from './colorPalette';
import { contrastPairsBlock } from './contrastPairs';
import { typographyBlock } from './typography';
import { imageryBlock, withoutOutsideImages } from './imagery';
import { patternBlock } from './pattern';
import { downloadsBlock } from './downloads';

export const BLOCKS = [
  sectionHeadingBlock,
  calloutBlock,
  logoShowcaseBlock,
  clearSpaceBlock,
  minimumSizeBlock,
  misuseBlock,
  colorPaletteBlock,
  contrastPairsBlock,
  typographyBlock,
  imageryBlock,
  patternBlock,
  downloadsBlock,
] as const;

export type GuidelineBlock = (typeof BLOCKS)[number];
export type BlockType = GuidelineBlock['type'];

/** Attributes of each block type after parsing (defaults filled). */
export type BlockAttrs<T extends BlockType> = ReturnType<Extract<GuidelineBlock, { type: T }>['schema']['parse']>;

export const BLOCK_TYPES = BLOCKS.map((b) => b.type) as BlockType[];

const byType = new Map<string, BlockDefinition>(BLOCKS.map((b) => [b.type, b as unknown as BlockDefinition]));

/** The registry entry of a block type, or undefined for a type we do not know. */
export function blockDefinition(type: string): BlockDefinition | undefined {
  return byType.get(type);
}

/** Stored attributes made safe to render before parsing: outside image addresses in old drafts become placeholders. */
export function storedAttrs(type: string, attrs: unknown): unknown {
  return type === imageryBlock.type ? withoutOutsideImages(attrs) : attrs;
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
    .map((group) => ({ group, label: BLOCK_GROUPS[group], blocks: BLOCKS.filter((b) => b.group === group) as unknown as BlockDefinition[] }))
    .filter((g) => g.blocks.length > 0);
}

export { BLOCK_GROUPS, type BlockDefinition, type BlockGroup };
export * from './sectionHeading';
export * from './callout';
export * from './logoShowcase';
export * from './clearSpace';
export * from './minimumSize';
export * from './misuse';
export * from './colorPalette';
export * from './contrastPairs';
export * from './typography';
export * from './imagery';
export * from './pattern';
export * from './downloads';
