import { authorizeBrand } from '@/lib/auth/access.server';
import { removeMember, updateMember } from '@/lib/brands/brands.server';
import { updateMemberBody } from '@/lib/brands/schemas';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** Change a member's role; the last owner cannot be demoted. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'members.manage');
  const { role } = await readJson(request, updateMemberBody);
  const member = await updateMember(caller, brand, idParam(params.memberId, 'That member'), role);
  return json({ member: { id: member.id, userId: member.userId, role: member.role } });
});

/** Remove a member; the last owner cannot be removed. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'members.manage');
  await removeMember(caller, brand, idParam(params.memberId, 'That member'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
