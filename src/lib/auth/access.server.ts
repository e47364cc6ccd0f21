// Resolves a caller's role on a brand and asks the policy; routes call this before touching a brand.
// It is also the one place that keeps an account whose address is not yet proven out of every brand.
import { QueryTypes } from 'sequelize';
import { Brand, BrandMember } from '@db/models';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
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

/** The answer for an account that has not yet proven its address. */
export const unverifiedError = (email: string) =>
  new ApiError(403, 'email_unverified', `Confirm your e-mail address first: open the link we sent to ${email}, or ask for a new one on your dashboard (/app).`);

/**
 * Whether the signed-in person has proven their address. A kept session is dropped as soon as its account changes
 * (sessions.server.ts), so a link opened in another browser counts within a second.
 */
export async function isVerified(locals: App.Locals): Promise<boolean> {
  return !!locals.user?.emailVerified;
}

/** The signed-in caller with a proven address; 401 when anonymous, 403 `email_unverified` otherwise. */
export async function requireVerifiedCaller(locals: App.Locals): Promise<Caller> {
  const caller = requireCaller(locals);
  if (!(await isVerified(locals))) throw unverifiedError(caller.email);
  return caller;
}

/** A caller's role on a brand: their brand membership, or none; an account with an unproven address holds none. */
export async function roleOn(userId: string, brand: Brand): Promise<BrandRole | null> {
  const [member] = await sequelize.query<{ role: BrandRole }>(
    `SELECT m.role FROM brand_members m JOIN "user" u ON u.id = m.user_id
      WHERE m.brand_id = :brandId AND m.user_id = :userId AND u."emailVerified"`,
    { replacements: { brandId: brand.id, userId }, type: QueryTypes.SELECT },
  );
  return member?.role ?? null;
}

/** Load a brand and check the caller may take `action` on it; 401, 403 or 404 in our error shape otherwise. */
export async function authorizeBrand(
  locals: App.Locals,
  brandId: string,
  action: BrandAction,
): Promise<{ caller: Caller; brand: Brand; role: BrandRole }> {
  if (!locals.user) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  // Before the brand is looked up, so an unproven account learns nothing about which brands exist.
  const caller = await requireVerifiedCaller(locals);
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
