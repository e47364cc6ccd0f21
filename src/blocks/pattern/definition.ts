// A repeat built from the brand mark; the defaults stay quiet (sparse, small, faint) so it supports, not shouts.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock } from '@/blocks/define';

const num = (what: string, min: number, max: number, fallback: number) =>
  z.number({ error: `${what} must be a number.` }).min(min, { error: `${what} must be at least ${min}.` }).max(max, { error: `${what} must be at most ${max}.` }).default(fallback);

export const patternBlock = defineBlock({
  type: 'pattern',
  order: 110,
  label: 'Pattern',
  description: 'A repeat of the brand mark with spacing, size, angle and colours.',
  group: 'imagery',
  fields: {
    logoId: refIdSchema('logo').nullable().default(null),
    /** Height of one mark in CSS px. */
    scale: num('scale', 8, 160, 20),
    /** Gap between marks as a multiple of the mark's height. */
    spacing: num('spacing', 0.25, 8, 3),
    rotation: num('rotation', -180, 180, 0),
    /** Shift of every other row, as a fraction of one repeat (0.5 = brick). */
    offset: num('offset', 0, 1, 0.5),
    opacity: num('opacity', 0.05, 1, 0.18),
    backgroundColorId: refIdSchema('colour').nullable().default(null),
    markColorId: refIdSchema('colour').nullable().default(null),
    height: num('height', 80, 600, 220),
  },
  refs: { logoId: 'logo', backgroundColorId: 'colour', markColorId: 'colour' },
  starter: { logoId: '$mark', backgroundColorId: '$background', markColorId: '$primary' },
});
export const patternSchema = patternBlock.schema;
export type PatternAttrs = ReturnType<typeof patternSchema.parse>;

export default patternBlock;
