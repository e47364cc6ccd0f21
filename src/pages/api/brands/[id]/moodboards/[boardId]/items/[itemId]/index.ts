import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, methodNotAllowed } from '@/lib/http/api';
import { deleteItem } from '@/lib/moodboards/moodboards.server';

export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteItem(caller, brand, idParam(params.boardId, 'That mood board'), idParam(params.itemId, 'That piece'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
