// Text-on-ground pairs with their WCAG 2.2 contrast ratio and verdicts.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

export const CONTRAST_CLAIMS = ['AA', 'AAA'] as const;

export const contrastPairSchema = z.strictObject({
  foreground: refIdSchema('colour'),
  background: refIdSchema('colour'),
});
export type ContrastPair = z.output<typeof contrastPairSchema>;

export const contrastPairsBlock = defineBlock({
  type: 'contrastPairs',
  order: 80,
  label: 'Contrast pairs',
  description: 'Colour pairs checked against the WCAG 2.2 contrast levels.',
  group: 'colour',
  fields: {
    pairs: distinctList(contrastPairSchema, 48, 'pairs').default(() => []),
    note: text(500),
    /** The WCAG 2.2 level the brand claims for text; the check before publishing flags pairs below it. */
    claim: z.enum(CONTRAST_CLAIMS, { error: 'The level must be "AA" or "AAA".' }).default('AA'),
  },
  refs: { pairs: { foreground: 'colour', background: 'colour' } },
  starter: { pairs: '$suggested' },
});
export const contrastPairsSchema = contrastPairsBlock.schema;
export type ContrastPairsAttrs = ReturnType<typeof contrastPairsSchema.parse>;

export default contrastPairsBlock;
