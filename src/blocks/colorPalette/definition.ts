// Chosen colours with every value a reader may need to copy, for screen and for print.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

export const colorPaletteBlock = defineBlock({
  type: 'colorPalette',
  order: 70,
  label: 'Colour palette',
  description: 'Colour swatches with HEX, RGB, HSL, OKLCH, Lab and print values.',
  group: 'colour',
  fields: {
    colorIds: distinctList(refIdSchema('colour'), 48, 'colours').default(() => []),
    /** Show CMYK and spot references (with the print caution). */
    showPrint: z.boolean({ error: 'showPrint must be true or false.' }).default(true),
    note: text(500),
  },
  refs: { colorIds: 'colour' },
  starter: { colorIds: ['$all'] },
});
export const colorPaletteSchema = colorPaletteBlock.schema;
export type ColorPaletteAttrs = ReturnType<typeof colorPaletteSchema.parse>;

export default colorPaletteBlock;
