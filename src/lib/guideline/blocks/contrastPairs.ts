// Text-on-ground pairs with their WCAG 2.2 contrast ratio and verdicts.
import * as z from 'zod';
import { refIdSchema } from '../ids';
import { defineBlock, distinctList, text } from './define';

export const contrastPairSchema = z.strictObject({
  foreground: refIdSchema('colour'),
  background: refIdSchema('colour'),
});
export type ContrastPair = z.output<typeof contrastPairSchema>;

export const contrastPairsBlock = defineBlock({
  type: 'contrastPairs',
  label: 'Contrast pairs',
  description: 'Colour pairs checked against the WCAG 2.2 contrast levels.',
  group: 'colour',
  fields: {
    pairs: distinctList(contrastPairSchema, 48, 'pairs').default(() => []),
    note: text(500),
  },
  starter: { pairs: '$suggested' },
});
export const contrastPairsSchema = contrastPairsBlock.schema;
export type ContrastPairsAttrs = ReturnType<typeof contrastPairsSchema.parse>;
