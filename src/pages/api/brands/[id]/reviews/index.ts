import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { allowMessage } from '@/lib/mail/send-limit.server';
import { listReviews, requestReview } from '@/lib/reviews/reviews.server';
import { requestReviewBody } from '@/lib/reviews/schemas';

/** Review requests, the latest decision and the number of open comment threads. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json(await listReviews(brand));
});

/** Ask the brand's reviewers (or the ones named) to review the current draft; each gets an e-mail. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, requestReviewBody);
  await allowMessage(caller.id);
  return json(await requestReview(caller, brand, body), 201);
});

export const ALL = methodNotAllowed;
