import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { loadIdentity } from '@/lib/identity/identity.server';

/** The brand's identity with every computed value: colours, logos, typefaces, type scale. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ identity: await loadIdentity(brand) });
});

export const ALL = methodNotAllowed;
