import { requireVerifiedCaller, visibleBrands } from '@/lib/auth/access.server';
import { createBrand, summary } from '@/lib/brands/brands.server';
import { createBrandBody } from '@/lib/brands/schemas';
import { endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** Brands the caller can see, with their role on each. */
export const GET = endpoint(async ({ locals }) => {
  const caller = await requireVerifiedCaller(locals);
  const rows = await visibleBrands(caller.id);
  return json({ brands: rows.map(({ brand, role }) => ({ ...summary(brand), role, updatedAt: brand.updatedAt.toISOString() })) });
});

/** Create a brand; the caller becomes its owner. */
export const POST = endpoint(async ({ locals, request }) => {
  const caller = await requireVerifiedCaller(locals);
  const body = await readJson(request, createBrandBody);
  const brand = await createBrand(caller, body.name, body.studioId);
  return json({ brand: summary(brand) }, 201, { location: `/api/brands/${brand.id}` });
});

export const ALL = methodNotAllowed;
