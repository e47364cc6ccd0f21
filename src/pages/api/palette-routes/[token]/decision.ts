import { endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';
import { decideRouteSet } from '@/lib/palette-routes/routes.server';
import { routeDecisionBody } from '@/lib/palette-routes/schemas';

/** The client's answer, once per link: a chosen route, or comments on the routes and the set. */
export const POST = endpoint(async ({ params, request }) => {
  const token = tokenParam(params.token, 'This palette link');
  return json({ set: await decideRouteSet(token, await readJson(request, routeDecisionBody)) });
});

export const ALL = methodNotAllowed;
