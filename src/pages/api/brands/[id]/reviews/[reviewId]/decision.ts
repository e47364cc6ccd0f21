import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { decideReview } from '@/lib/reviews/reviews.server';
import { decideReviewBody } from '@/lib/reviews/schemas';

/** Approve the reviewed draft or ask for changes (with a note). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'review.decide');
  const body = await readJson(request, decideReviewBody);
  return json({ review: await decideReview(caller, brand, idParam(params.reviewId, 'That review request'), body) });
});

export const ALL = methodNotAllowed;
