// Request bodies of the mood-board routes.
import { z } from 'zod';
import { isCleanNote, isOneLine, NOTE_MESSAGE, ONE_LINE_MESSAGE, typefaceFamily } from '@/lib/safe/values';

const caption = z.string().max(500, { error: 'A caption may hold 500 characters.' }).refine(isCleanNote, NOTE_MESSAGE);
export const newItemSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('swatch'), name: z.string().trim().min(1, { error: 'Name the swatch.' }).max(80).refine(isOneLine, ONE_LINE_MESSAGE), value: z.string().min(1).max(200).refine(isOneLine, ONE_LINE_MESSAGE), caption: caption.optional() }),
  z.strictObject({ kind: z.literal('type'), family: typefaceFamily, sample: z.string().trim().min(1, { error: 'Give a line of sample text.' }).max(300).refine(isOneLine, ONE_LINE_MESSAGE), caption: caption.optional() }),
  z.strictObject({ kind: z.literal('note'), caption: z.string().trim().min(1, { error: 'A note needs some text.' }).max(500).refine(isCleanNote, NOTE_MESSAGE) }),
]);
export const createBoardBody = z.strictObject({
  title: z.string().trim().min(1, { error: 'Give the board a title.' }).max(160).refine(isOneLine, ONE_LINE_MESSAGE),
  intro: z.string().max(2000).refine(isCleanNote, NOTE_MESSAGE).optional(),
  items: z.array(newItemSchema).max(60).optional(),
});
export const updateBoardBody = z.strictObject({ title: z.string().trim().min(1).max(160).refine(isOneLine, ONE_LINE_MESSAGE).optional(), intro: z.string().max(2000).refine(isCleanNote, NOTE_MESSAGE).optional() });
export const sendBoardBody = z.strictObject({
  contactName: z.string().trim().min(1, { error: 'Give the contact’s name.' }).max(120).refine(isOneLine, ONE_LINE_MESSAGE),
  contactEmail: z.email({ error: 'Enter a valid e-mail address for the contact.' }).max(320),
  message: z.string().max(2000).refine(isCleanNote, NOTE_MESSAGE).optional(),
});
export const decisionBody = z.strictObject({
  name: z.string().trim().min(1, { error: 'Tell us your name, so the designer knows who decided.' }).max(120).refine(isOneLine, ONE_LINE_MESSAGE),
  outcome: z.enum(['approved', 'changes_requested'], { error: 'Choose “approve this direction” or “needs changes”.' }),
  comment: z.string().max(4000, { error: 'The comment may hold 4,000 characters.' }).refine(isCleanNote, NOTE_MESSAGE).optional(),
  items: z
    .array(z.strictObject({ id: z.uuid(), verdict: z.enum(['keep', 'drop'], { error: 'Mark each piece keep or drop.' }), comment: z.string().max(1000).refine(isCleanNote, NOTE_MESSAGE).optional() }))
    .max(60),
});
export const imageCaption = z.strictObject({ caption: caption.optional() });
