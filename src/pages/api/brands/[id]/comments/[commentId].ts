import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { resolveComment } from '@/lib/reviews/reviews.server';
import { resolveCommentBody } from '@/lib/reviews/schemas';

/** Resolve a thread, or open it again. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.comment');
  const { resolved } = await readJson(request, resolveCommentBody);
  return json({ comment: await resolveComment(caller, brand, idParam(params.commentId, 'That comment'), resolved) });
});

export const ALL = methodNotAllowed;
