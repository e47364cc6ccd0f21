import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { isFollowing, setFollowing } from '@/lib/notices/follow.server';

/** Whether the caller follows the brand (followers are e-mailed when a version is published). */
export const GET = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'brand.read');
  return json({ following: await isFollowing(brand, caller.id) });
});

/** Follow the brand. */
export const PUT = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'brand.read');
  return json(await setFollowing(caller, brand, true));
});

/** Stop following the brand. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'brand.read');
  return json(await setFollowing(caller, brand, false));
});

export const ALL = methodNotAllowed;
