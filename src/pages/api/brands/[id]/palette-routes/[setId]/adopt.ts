import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { adoptChosenRoute } from '@/lib/palette-routes/routes.server';

/** "Use this route": the chosen route's colours replace the brand's palette in one step; the audit keeps the old one. */
export const POST = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ set: await adoptChosenRoute(caller, brand, idParam(params.setId, 'That set of palette routes')) });
});

export const ALL = methodNotAllowed;
