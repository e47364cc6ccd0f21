import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { createColor } from '@/lib/identity/identity.server';
import { createColorBody } from '@/lib/identity/schemas';

/** Add a colour to the palette; every notation is computed from the value typed. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, createColorBody);
  return json({ color: await createColor(caller, brand, body) }, 201);
});

export const ALL = methodNotAllowed;
