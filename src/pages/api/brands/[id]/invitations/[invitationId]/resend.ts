import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { resendInvitation } from '@/lib/invitations/invitations.server';
import { allowMessage } from '@/lib/mail/send-limit.server';

/** A fresh link by e-mail; the earlier link stops working and the 14 days start again. */
export const POST = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'members.manage');
  await allowMessage(caller.id);
  const { invitation, mail } = await resendInvitation(caller, brand, idParam(params.invitationId, 'That invitation'));
  return json({ invitation, mailed: mail.sent, ...(mail.problem ? { mailProblem: mail.problem } : {}) });
});

export const ALL = methodNotAllowed;
