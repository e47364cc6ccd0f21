// Request bodies of the review and comment routes.
import { z } from 'zod';
import { isCleanNote, NOTE_MESSAGE } from '@/lib/safe/values';
import { blockIdSchema } from '@/lib/guideline/ids';

export const requestReviewBody = z.strictObject({ message: z.string().max(2000).refine(isCleanNote, NOTE_MESSAGE).optional(), reviewerIds: z.array(z.string().min(1).max(100)).min(1).max(50).optional() });
export const decideReviewBody = z.strictObject({
  outcome: z.enum(['approved', 'changes_requested'], { error: 'Choose “approve” or “request changes”.' }),
  note: z.string().max(4000).refine(isCleanNote, NOTE_MESSAGE).optional(),
});
export const addCommentBody = z.strictObject({
  blockId: blockIdSchema.optional(),
  parentId: z.uuid().optional(),
  reviewId: z.uuid().optional(),
  body: z.string().trim().min(1, { error: 'Write the comment first.' }).max(4000, { error: 'A comment may hold 4,000 characters.' }).refine(isCleanNote, NOTE_MESSAGE),
});
export const resolveCommentBody = z.strictObject({ resolved: z.boolean() });
