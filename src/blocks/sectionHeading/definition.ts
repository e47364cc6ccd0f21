// A section of the guidelines: the site's contents and the editor's outline are built from these.
import { defineBlock, text } from '@/blocks/define';

export const sectionHeadingBlock = defineBlock({
  type: 'sectionHeading',
  order: 10,
  label: 'Section',
  description: 'Starts a new chapter with a title; it appears in the contents.',
  group: 'structure',
  fields: {
    title: text(200, 'New section'),
    eyebrow: text(80),
    intro: text(1000),
  },
});
export const sectionHeadingSchema = sectionHeadingBlock.schema;
export type SectionHeadingAttrs = ReturnType<typeof sectionHeadingSchema.parse>;

export default sectionHeadingBlock;
