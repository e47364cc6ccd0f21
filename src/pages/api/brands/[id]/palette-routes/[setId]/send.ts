import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { allowMessage } from '@/lib/mail/send-limit.server';
import { sendRouteSet } from '@/lib/palette-routes/routes.server';
import { sendRoutesBody } from '@/lib/palette-routes/schemas';

/** E-mail the routes to a client contact, who chooses one or comments through the link. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, sendRoutesBody);
  await allowMessage(caller.id);
  const { set, mail } = await sendRouteSet(caller, brand, idParam(params.setId, 'That set of palette routes'), body);
  return json({ set, mailed: mail.sent, ...(mail.problem ? { mailProblem: mail.problem } : {}) });
});

export const ALL = methodNotAllowed;
