import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { reorder } from '@/lib/identity/identity.server';
import { reorderBody } from '@/lib/identity/schemas';

/** Put the palette in a new order: every colour id of the brand, once each. */
export const PUT = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const { ids } = await readJson(request, reorderBody);
  await reorder(caller, brand, 'color', ids);
  return json({ ids });
});

export const ALL = methodNotAllowed;
