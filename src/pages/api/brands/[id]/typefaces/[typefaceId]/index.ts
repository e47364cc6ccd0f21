import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { deleteTypeface, updateTypeface } from '@/lib/identity/identity.server';
import { updateTypefaceBody } from '@/lib/identity/schemas';

/** Change a typeface's role, fallback stack or weights, or confirm its licence for web embedding. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, updateTypefaceBody);
  return json({ typeface: await updateTypeface(caller, brand, idParam(params.typefaceId, 'That typeface'), body) });
});

/** Remove a typeface and its file. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteTypeface(caller, brand, idParam(params.typefaceId, 'That typeface'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
