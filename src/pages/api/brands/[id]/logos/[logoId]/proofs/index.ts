import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { logoProofs } from '@/lib/identity/proofs.server';

/** The one-colour proofs of a logo: its colours, their greys, the touching pairs too close in grey, and the proof images. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ proofs: await logoProofs(brand, idParam(params.logoId, 'That logo')) });
});

export const ALL = methodNotAllowed;
