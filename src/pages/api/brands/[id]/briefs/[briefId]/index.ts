import { authorizeBrand } from '@/lib/auth/access.server';
import { briefDetail, withdrawBrief } from '@/lib/briefs/briefs.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';

/** One brief with its questions and the client's answers so far. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json(await briefDetail(brand, idParam(params.briefId, 'That brief')));
});

/** Withdraw a brief that is not submitted yet: the link stops working, saved answers stay. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ brief: await withdrawBrief(caller, brand, idParam(params.briefId, 'That brief')) });
});

export const ALL = methodNotAllowed;
