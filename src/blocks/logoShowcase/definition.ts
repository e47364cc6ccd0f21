// Chosen logo variants, each on light, dark and brand-colour grounds.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

/** Which file of the logo sits on the dark and brand grounds. */
export const ON_DARK_FILES = ['white', 'reversed', 'original'] as const;

export const logoShowcaseBlock = defineBlock({
  type: 'logoShowcase',
  order: 30,
  label: 'Logo on grounds',
  description: 'Logo variants shown on light, dark and brand-colour backgrounds.',
  group: 'logo',
  fields: {
    logoIds: distinctList(refIdSchema('logo'), 12, 'logos').default(() => []),
    /** The brand ground; null takes the identity's primary colour. */
    brandColorId: refIdSchema('colour').nullable().default(null),
    onDark: z.enum(ON_DARK_FILES, { error: 'onDark must be "white", "reversed" or "original".' }).default('white'),
    caption: text(500),
  },
  refs: { logoIds: 'logo', brandColorId: 'colour' },
  starter: { logoIds: ['$all'], brandColorId: '$primary' },
});
export const logoShowcaseSchema = logoShowcaseBlock.schema;
export type LogoShowcaseAttrs = ReturnType<typeof logoShowcaseSchema.parse>;

export default logoShowcaseBlock;
