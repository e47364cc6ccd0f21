// Request bodies of the brief routes.
import { z } from 'zod';
import { isCleanNote, isOneLine, NOTE_MESSAGE, ONE_LINE_MESSAGE } from '@/lib/safe/values';

const name = z.string().trim().min(1, { error: 'Give the contact’s name.' }).max(120).refine(isOneLine, ONE_LINE_MESSAGE);
export const sendBriefBody = z.strictObject({
  template: z.string().min(1).max(60),
  contactName: name,
  contactEmail: z.email({ error: 'Enter a valid e-mail address for the contact.' }).max(320),
  message: z.string().max(2000).refine(isCleanNote, NOTE_MESSAGE).optional(),
});
/** Autosave: a partial answers object; the questionnaire's own schema checks each field. */
export const saveAnswersBody = z.strictObject({ answers: z.record(z.string(), z.unknown()) });
export const submitBriefBody = z.strictObject({});
/** Largest autosave body accepted, in bytes: more than every answer at its limit, far less than the default. */
export const MAX_ANSWERS_BYTES = 200_000;
