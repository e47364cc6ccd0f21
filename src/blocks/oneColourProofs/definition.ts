// The logo in one colour and in grey, as the published guidelines show it: black on white, white on black (the
// knockouts, so inner shapes stay open) and greyscale by WCAG 2.2 relative luminance.
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, distinctList, text } from '@/blocks/define';

export const oneColourProofsBlock = defineBlock({
  type: 'oneColourProofs',
  order: 65,
  label: 'Logo in one colour',
  description: 'Each logo in black on white, white on black and in greyscale.',
  group: 'logo',
  fields: {
    logoIds: distinctList(refIdSchema('logo'), 12, 'logos').default(() => []),
    caption: text(500),
  },
  refs: { logoIds: 'logo' },
  starter: { logoIds: ['$all'] },
});
export const oneColourProofsSchema = oneColourProofsBlock.schema;
export type OneColourProofsAttrs = ReturnType<typeof oneColourProofsSchema.parse>;

export default oneColourProofsBlock;
