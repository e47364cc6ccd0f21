// The brand's typefaces by role, a specimen, and the type scale set in the real fonts.
import * as z from 'zod';
import { TYPEFACE_ROLES } from '@/lib/identity/types';
import { defineBlock, distinctList, text } from '@/blocks/define';

// A pangram shows every letter of the alphabet (common practice for type specimens); each brand sets its own line.
export const SPECIMEN_DEFAULT = 'Sphinx of black quartz, judge my vow.';

export const typographyBlock = defineBlock({
  type: 'typography',
  order: 90,
  label: 'Typography',
  description: 'Typefaces by role, a specimen and the type scale.',
  group: 'type',
  fields: {
    roles: distinctList(z.enum(TYPEFACE_ROLES, { error: `A role must be one of ${TYPEFACE_ROLES.join(', ')}.` }), TYPEFACE_ROLES.length, 'roles').default(
      () => [...TYPEFACE_ROLES],
    ),
    showSpecimen: z.boolean({ error: 'showSpecimen must be true or false.' }).default(true),
    specimenText: text(300, SPECIMEN_DEFAULT),
    showScale: z.boolean({ error: 'showScale must be true or false.' }).default(true),
  },
  refs: { roles: 'typeface' },
});
export const typographySchema = typographyBlock.schema;
export type TypographyAttrs = ReturnType<typeof typographySchema.parse>;

export default typographyBlock;
