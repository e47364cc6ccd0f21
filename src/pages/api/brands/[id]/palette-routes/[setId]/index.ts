import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { deleteRouteSet, routeSetView, updateRouteSet } from '@/lib/palette-routes/routes.server';
import { updateRouteSetBody } from '@/lib/palette-routes/schemas';

const setId = (id: string | undefined) => idParam(id, 'That set of palette routes');

export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ set: await routeSetView(brand, setId(params.setId)) });
});

/** Rename the set, change its introduction or replace its routes (refused once the client has chosen). */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ set: await updateRouteSet(caller, brand, setId(params.setId), await readJson(request, updateRouteSetBody)) });
});

/** Delete a set with its routes (the audit trail keeps the record). */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteRouteSet(caller, brand, setId(params.setId));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
