import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { createRouteSet, listRouteSets } from '@/lib/palette-routes/routes.server';
import { createRouteSetBody } from '@/lib/palette-routes/schemas';

/** The brand's sets of palette routes, each route with its contrast results. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ sets: await listRouteSets(brand) });
});

/** Prepare two to four candidate palettes to offer the client. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ set: await createRouteSet(caller, brand, await readJson(request, createRouteSetBody)) }, 201);
});

export const ALL = methodNotAllowed;
