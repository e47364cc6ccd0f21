// The clear-space diagram: the logo, its drawn bounds and the protected area from the identity.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, text } from '@/blocks/define';

export const clearSpaceBlock = defineBlock({
  type: 'clearSpace',
  order: 40,
  label: 'Clear space',
  description: 'A diagram of the space kept free around a logo.',
  group: 'logo',
  fields: {
    logoId: refIdSchema('logo').nullable().default(null),
    /** Draw the unit as a square in each corner. */
    showUnit: z.boolean({ error: 'showUnit must be true or false.' }).default(true),
    note: text(500),
  },
  refs: { logoId: 'logo' },
  starter: { logoId: '$primary' },
});
export const clearSpaceSchema = clearSpaceBlock.schema;
export type ClearSpaceAttrs = ReturnType<typeof clearSpaceSchema.parse>;

export default clearSpaceBlock;
