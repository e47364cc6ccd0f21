import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, methodNotAllowed } from '@/lib/http/api';
import { revokeShareLink } from '@/lib/publishing/share-links.server';

/** Revoke a share link: anyone holding it gets a clear "no longer works" page from now on. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'shareLink.manage');
  await revokeShareLink(caller, brand, idParam(params.linkId, 'That share link'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
