import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { deleteLogo, updateLogo } from '@/lib/identity/identity.server';
import { updateLogoBody } from '@/lib/identity/schemas';

/** Change a logo's name, variant, clear-space unit and multiple, thinnest stroke or minimum sizes. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, updateLogoBody);
  return json({ logo: await updateLogo(caller, brand, idParam(params.logoId, 'That logo'), body) });
});

/** Remove a logo and its file. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteLogo(caller, brand, idParam(params.logoId, 'That logo'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
