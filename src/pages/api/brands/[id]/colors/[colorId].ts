import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { deleteColor, updateColor } from '@/lib/identity/identity.server';
import { updateColorBody } from '@/lib/identity/schemas';

/** Rename a colour, change its value, role, print values or spot reference. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, updateColorBody);
  return json({ color: await updateColor(caller, brand, idParam(params.colorId, 'That colour'), body) });
});

/** Remove a colour from the palette. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteColor(caller, brand, idParam(params.colorId, 'That colour'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
