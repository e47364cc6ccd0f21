// Wrong uses of the logo, each generated from the real file, so readers see the very mistake.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

export const MISUSE_KINDS = ['stretched', 'rotated', 'recoloured', 'outlined', 'dropShadow', 'busyBackground', 'lowContrast'] as const;
export type MisuseKind = (typeof MISUSE_KINDS)[number];

/** The caption under each tile, in our own words. */
export const MISUSE_LABELS: Record<MisuseKind, string> = {
  stretched: 'Don’t stretch or squash it',
  rotated: 'Don’t tilt it',
  recoloured: 'Don’t change its colours',
  outlined: 'Don’t draw it as an outline',
  dropShadow: 'Don’t add shadows or effects',
  busyBackground: 'Don’t place it on a busy background',
  lowContrast: 'Don’t place it where it fades away',
};

export const misuseBlock = defineBlock({
  type: 'misuse',
  order: 60,
  label: 'Logo don’ts',
  description: 'Tiles that show wrong uses, made from the real logo.',
  group: 'logo',
  fields: {
    logoId: refIdSchema('logo').nullable().default(null),
    tiles: distinctList(z.enum(MISUSE_KINDS, { error: `A tile must be one of ${MISUSE_KINDS.join(', ')}.` }), MISUSE_KINDS.length, 'tiles').default(
      () => [...MISUSE_KINDS],
    ),
    note: text(500),
  },
  refs: { logoId: 'logo' },
  starter: { logoId: '$primary' },
});
export const misuseSchema = misuseBlock.schema;
export type MisuseAttrs = ReturnType<typeof misuseSchema.parse>;

export default misuseBlock;
