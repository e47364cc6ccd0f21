// The brand in application: mock-ups of our own templates (templates/mockups) filled from the identity.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { MOCKUP_KEYS } from '@/lib/mockups/templates';
import { defineBlock, distinctList, text } from '@/blocks/define';

const templateKey = z.string({ error: 'Expected a mock-up template name.' }).refine((k) => MOCKUP_KEYS.includes(k), { error: `Choose mock-ups from: ${MOCKUP_KEYS.join(', ')}.` });

/** What a new block shows: six pieces a client holds or scrolls past. */
export const STARTER_MOCKUPS = ['business-card', 'letterhead-a4', 'envelope-dl', 'social-post', 'editorial-spread', 'sign'];

export const applicationsBlock = defineBlock({
  type: 'applications',
  order: 115,
  label: 'Applications',
  description: 'Mock-ups of stationery, social posts, an editorial and a sign, filled from the identity.',
  group: 'imagery',
  fields: {
    templates: distinctList(templateKey, 12, 'mock-ups').default(STARTER_MOCKUPS),
    /** The logo the pieces carry (the mark stands in where a template asks for it); null = the primary logo. */
    logoId: refIdSchema('logo').nullable().default(null),
    /** Shelf photographs, in the order the templates use them; none = tinted panels. */
    photoIds: distinctList(refIdSchema('asset'), 4, 'photographs').default([]),
    note: text(500),
  },
  refs: { logoId: 'logo', photoIds: 'image' },
  starter: { logoId: '$primary' },
});
export const applicationsSchema = applicationsBlock.schema;
export type ApplicationsAttrs = ReturnType<typeof applicationsSchema.parse>;

export default applicationsBlock;
