import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { loadIdentity, setTypeScale } from '@/lib/identity/identity.server';
import { typeScaleBody } from '@/lib/identity/schemas';

/** Set the type scale: base size, ratio, steps, line heights and the column the measure is computed for. */
export const PUT = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const settings = await readJson(request, typeScaleBody);
  await setTypeScale(caller, brand, settings);
  return json({ typeScale: (await loadIdentity(brand)).typeScale });
});

export const ALL = methodNotAllowed;
