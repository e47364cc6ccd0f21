// Resolves a caller's role on a brand and asks the policy; routes call this before touching a brand.
import { Brand, BrandMember } from '../../../db/models';
import '../db.server';
import { ApiError } from '../http/api';
import { decide, type BrandAction } from './policy';
import type { BrandRole } from './roles';

export interface Caller {
  id: string;
  email: string;
  name: string;
}

/** The signed-in caller or a 401. */
export function requireCaller(locals: App.Locals): Caller {
  if (!locals.user) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  return { id: locals.user.id, email: locals.user.email, name: locals.user.name };
}

/** A caller's role on a brand: their brand membership, or none. */
export async function roleOn(userId: string, brand: Brand): Promise<BrandRole | null> {
  const member = await BrandMember.findOne({ where: { brandId: brand.id, userId }, attributes: ['role'] });
  return member?.role ?? null;
}

/** Load a brand and check the caller may take `action` on it; 401, 403 or 404 in our error shape otherwise. */
export async function authorizeBrand(
  locals: App.Locals,
  brandId: string,
  action: BrandAction,
): Promise<{ caller: Caller; brand: Brand; role: BrandRole }> {
  if (!locals.user) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  const caller = requireCaller(locals);
  const brand = await Brand.findByPk(brandId);
  const role = brand ? await roleOn(caller.id, brand) : null;
  const verdict = decide(true, role, action);
  if (!verdict.ok) {
    if (verdict.status === 404) throw new ApiError(404, 'not_found', 'That brand was not found.');
    throw new ApiError(403, 'forbidden', `Your role on this brand (${role}) does not allow this.`);
  }
  return { caller, brand: brand!, role: role! };
}

/** Every brand the user can see, with their role on each. */
export async function visibleBrands(userId: string): Promise<{ brand: Brand; role: BrandRole }[]> {
  const memberships = await BrandMember.findAll({
    where: { userId },
    include: [{ model: Brand, as: 'brand', required: true }],
    order: [[{ model: Brand, as: 'brand' }, 'name', 'ASC']],
  });
  return memberships.map((m) => ({ brand: (m as BrandMember & { brand: Brand }).brand, role: m.role }));
}
