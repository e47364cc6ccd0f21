// A boxed remark: a neutral note or a caution the reader must not miss.
import * as z from 'zod';
import { defineBlock, text } from '@/blocks/define';

export const CALLOUT_TONES = ['note', 'caution'] as const;

export const calloutBlock = defineBlock({
  type: 'callout',
  order: 20,
  label: 'Remark box',
  description: 'A note or a caution set apart from the running text.',
  group: 'structure',
  fields: {
    tone: z.enum(CALLOUT_TONES, { error: 'The tone must be "note" or "caution".' }).default('note'),
    title: text(120),
    text: text(4000),
  },
});
export const calloutSchema = calloutBlock.schema;
export type CalloutAttrs = ReturnType<typeof calloutSchema.parse>;

export default calloutBlock;
