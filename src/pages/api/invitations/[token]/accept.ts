import { requireVerifiedCaller } from '@/lib/auth/access.server';
import { endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { acceptInvitation } from '@/lib/invitations/invitations.server';
import { tokenParam } from '@/lib/invitations/params';

/** Join the brand with the invited role; the caller must be signed in with the invited address, proven by its link. */
export const POST = endpoint(async ({ locals, params }) => {
  const caller = await requireVerifiedCaller(locals);
  const joined = await acceptInvitation(caller, tokenParam(params.token, 'This invitation link'));
  return json({ joined });
});

export const ALL = methodNotAllowed;
