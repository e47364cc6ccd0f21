import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { adoptSwatches } from '@/lib/moodboards/moodboards.server';

/** Add an approved board's kept swatches to the identity's palette; colours already there are skipped. */
export const POST = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json(await adoptSwatches(caller, brand, idParam(params.boardId, 'That mood board')));
});

export const ALL = methodNotAllowed;
