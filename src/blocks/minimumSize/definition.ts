// The smallest a logo may appear: drawn at its screen minimum, with the print minimum beside it.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, text } from '@/blocks/define';

export const minimumSizeBlock = defineBlock({
  type: 'minimumSize',
  order: 50,
  label: 'Minimum size',
  description: 'A logo at the smallest size allowed on screen and in print.',
  group: 'logo',
  fields: {
    logoId: refIdSchema('logo').nullable().default(null),
    showPrint: z.boolean({ error: 'showPrint must be true or false.' }).default(true),
    note: text(500),
  },
  refs: { logoId: 'logo' },
  starter: { logoId: '$primary' },
});
export const minimumSizeSchema = minimumSizeBlock.schema;
export type MinimumSizeAttrs = ReturnType<typeof minimumSizeSchema.parse>;

export default minimumSizeBlock;
