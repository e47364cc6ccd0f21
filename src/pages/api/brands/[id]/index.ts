import { authorizeBrand } from '@/lib/auth/access.server';
import { deleteBrand, summary, updateBrand } from '@/lib/brands/brands.server';
import { updateBrandBody } from '@/lib/brands/schemas';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** One brand, with the caller's role on it. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand, role } = await authorizeBrand(locals, idParam(params.id), 'brand.read');
  return json({ brand: { ...summary(brand), role, createdAt: brand.createdAt.toISOString(), updatedAt: brand.updatedAt.toISOString() } });
});

/** Rename a brand or change its public address. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'brand.update');
  const changes = await readJson(request, updateBrandBody);
  return json({ brand: summary(await updateBrand(caller, brand, changes)) });
});

/** Delete a brand and everything in it (owners only). */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'brand.delete');
  await deleteBrand(caller, brand);
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
