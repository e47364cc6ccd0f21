import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, methodNotAllowed } from '@/lib/http/api';
import { revokeInvitation } from '@/lib/invitations/invitations.server';

/** Withdraw an invitation; its link then says so. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'members.manage');
  await revokeInvitation(caller, brand, idParam(params.invitationId, 'That invitation'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
