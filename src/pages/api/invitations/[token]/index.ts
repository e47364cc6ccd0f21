import { ApiError, endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { lookupInvitation } from '@/lib/invitations/invitations.server';
import { tokenParam } from '@/lib/invitations/params';

/** What the link holder may know: brand, role, invited address, and whether the link still works. No sign-in needed. */
export const GET = endpoint(async ({ params }) => {
  const found = await lookupInvitation(tokenParam(params.token, 'This invitation link'));
  if (!found) throw new ApiError(404, 'not_found', 'This invitation link is not valid. Check that the whole link was copied.');
  return json({ invitation: found });
});

export const ALL = methodNotAllowed;
