import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { blockIdSchema } from '@/lib/guideline/ids';
import { endpoint, idParam, json, methodNotAllowed, parseWith, readJson } from '@/lib/http/api';
import { addComment, listComments } from '@/lib/reviews/reviews.server';
import { addCommentBody } from '@/lib/reviews/schemas';

const query = z.strictObject({ open: z.enum(['1', '0']).optional(), blockId: blockIdSchema.optional() });

/** Comment threads in order; ?open=1 keeps unresolved ones, ?blockId= one block's. */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const q = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  return json({ comments: await listComments(brand, { open: q.open === '1', blockId: q.blockId }) });
});

/** Comment on a block of the draft (blockId), or reply to a thread (parentId). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.comment');
  return json({ comment: await addComment(caller, brand, await readJson(request, addCommentBody)) }, 201);
});

export const ALL = methodNotAllowed;
