import { endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';
import { openRouteSet } from '@/lib/palette-routes/routes.server';

/** The routes as the client sees them; the e-mailed link is the only key. */
export const GET = endpoint(async ({ params }) => json({ set: await openRouteSet(tokenParam(params.token, 'This palette link')) }));

export const ALL = methodNotAllowed;
