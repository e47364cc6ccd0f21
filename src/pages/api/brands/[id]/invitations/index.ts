import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { pendingInvitations } from '@/lib/invitations/invitations.server';

/** Invitations not yet accepted or withdrawn (lapsed ones too, so they can be sent again). */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'members.read');
  return json({ invitations: await pendingInvitations(brand) });
});

export const ALL = methodNotAllowed;
