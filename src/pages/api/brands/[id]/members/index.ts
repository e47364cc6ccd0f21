import { authorizeBrand } from '@/lib/auth/access.server';
import { addMember, listMembers } from '@/lib/brands/brands.server';
import { addMemberBody } from '@/lib/brands/schemas';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { mailInvitation } from '@/lib/invitations/invitations.server';
import { allowMessage } from '@/lib/mail/send-limit.server';

/** The brand's members and pending invitations. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'members.read');
  return json(await listMembers(brand));
});

/** Invite someone by e-mail; they join when they accept. The answer is the same whether or not they have an account. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'members.manage');
  const body = await readJson(request, addMemberBody);
  await allowMessage(caller.id);
  const result = await addMember(caller, brand, body.email, body.role);
  // The invitation is saved either way; a failed e-mail is reported so the owner can resend it.
  const mail = await mailInvitation(brand, caller, result.invitation, result.token);
  return json({ invitation: result.invitation, mailed: mail.sent, ...(mail.problem ? { mailProblem: mail.problem } : {}) }, 201);
});

export const ALL = methodNotAllowed;
