// Brands and their people: creation, renaming, deletion, members and pending invitations.
import { createHash, randomBytes } from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { Brand, BrandFormerSlug, BrandMember, Invitation, Studio, StudioMember } from '@db/models';
import { siteCache } from '@/lib/publishing/site-cache';
import { storage } from '@/lib/storage/index.server';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import type { BrandRole } from '@/lib/auth/roles';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { firstFreeSlug, slugify } from './slug';

export interface BrandSummary {
  id: string;
  name: string;
  slug: string;
}

export const summary = (b: Brand): BrandSummary => ({ id: b.id, name: b.name, slug: b.slug });

const INVITATION_DAYS = 14;

/** A slug not used by any brand yet, derived from the name. */
async function freeSlug(name: string, t: Transaction): Promise<string> {
  const base = slugify(name);
  const near = { slug: { [Op.or]: [base, { [Op.like]: `${base}-%` }] } };
  const [rows, former] = await Promise.all([
    Brand.findAll({ where: near, attributes: ['slug'], transaction: t }),
    // An address a brand used before still redirects to it, so it is not free for another brand.
    BrandFormerSlug.findAll({ where: near, attributes: ['slug'], transaction: t }),
  ]);
  return firstFreeSlug(base, new Set([...rows, ...former].map((r) => r.slug)));
}

/** The studio a new brand goes into: the one asked for, else the caller's first, else a new one of theirs. */
async function studioFor(caller: Caller, studioId: string | undefined, t: Transaction): Promise<Studio> {
  if (studioId) {
    const membership = await StudioMember.findOne({ where: { studioId, userId: caller.id }, transaction: t });
    if (!membership) throw new ApiError(404, 'not_found', 'That studio was not found.');
    return (await Studio.findByPk(studioId, { transaction: t }))!;
  }
  const first = await StudioMember.findOne({ where: { userId: caller.id }, order: [['createdAt', 'ASC']], transaction: t });
  if (first) return (await Studio.findByPk(first.studioId, { transaction: t }))!;
  const studio = await Studio.create({ name: `${caller.name || caller.email}'s studio` }, { transaction: t });
  await StudioMember.create({ studioId: studio.id, userId: caller.id, role: 'admin' }, { transaction: t });
  await audit({ actorId: caller.id, action: 'studio.create', targetType: 'studio', targetId: studio.id, studioId: studio.id }, t);
  return studio;
}

/** Create a brand; its creator becomes its owner. */
export async function createBrand(caller: Caller, name: string, studioId?: string): Promise<Brand> {
  return sequelize.transaction(async (t) => {
    const studio = await studioFor(caller, studioId, t);
    // Serialise slug choice so two brands of the same name cannot race for one slug.
    await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key: 'brand-slug' }, transaction: t });
    const brand = await Brand.create({ studioId: studio.id, name, slug: await freeSlug(name, t), createdById: caller.id }, { transaction: t });
    await BrandMember.create({ brandId: brand.id, userId: caller.id, role: 'owner' }, { transaction: t });
    await audit({ actorId: caller.id, action: 'brand.create', targetType: 'brand', targetId: brand.id, brandId: brand.id, studioId: studio.id, details: { name } }, t);
    return brand;
  });
}

/**
 * Rename a brand or change its public slug (a taken slug is a 409). The old slug is kept as a former address that
 * redirects, so published links and bookmarks keep working; a brand may take back one of its own former addresses.
 */
export async function updateBrand(caller: Caller, brand: Brand, changes: { name?: string; slug?: string }): Promise<Brand> {
  return sequelize.transaction(async (t) => {
    if (changes.slug && changes.slug !== brand.slug) {
      await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', { replacements: { key: 'brand-slug' }, transaction: t });
      const taken = await Brand.findOne({ where: { slug: changes.slug }, transaction: t });
      const former = await BrandFormerSlug.findByPk(changes.slug, { transaction: t });
      if (taken || (former && former.brandId !== brand.id)) throw new ApiError(409, 'slug_taken', `The address "${changes.slug}" is already used by another brand.`);
      if (former) await former.destroy({ transaction: t });
      await BrandFormerSlug.upsert({ slug: brand.slug, brandId: brand.id }, { transaction: t });
    }
    const before = { name: brand.name, slug: brand.slug };
    await brand.update(changes, { transaction: t });
    siteCache.forget();
    await audit({ actorId: caller.id, action: 'brand.update', targetType: 'brand', targetId: brand.id, brandId: brand.id, studioId: brand.studioId, details: { before, after: changes } }, t);
    return brand;
  });
}

/** Delete a brand and everything it holds, its stored files too; the audit rows stay, with the brand reference cleared. */
export async function deleteBrand(caller: Caller, brand: Brand): Promise<void> {
  await sequelize.transaction(async (t) => {
    await audit({ actorId: caller.id, action: 'brand.delete', targetType: 'brand', targetId: brand.id, studioId: brand.studioId, details: { name: brand.name, slug: brand.slug } }, t);
    await brand.destroy({ transaction: t });
  });
  siteCache.forget();
  // Every key of a brand lives under its id (newKey, renditionKey): originals, renditions, version copies, PDFs, boards.
  await storage.deleteBrandFiles(brand.id);
}

export interface MemberView {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: BrandRole;
  addedAt: string;
}

export interface InvitationView {
  id: string;
  email: string;
  role: BrandRole;
  expiresAt: string;
  createdAt: string;
}

/** The brand's members (with names from the user table) and its pending invitations. */
export async function listMembers(brand: Brand): Promise<{ members: MemberView[]; invitations: InvitationView[] }> {
  const members = await sequelize.query<{ id: string; user_id: string; name: string; email: string; role: BrandRole; created_at: Date }>(
    `SELECT m.id, m.user_id, u.name, u.email, m.role, m.created_at
       FROM brand_members m JOIN "user" u ON u.id = m.user_id
      WHERE m.brand_id = :brandId
      ORDER BY array_position(ARRAY['owner','editor','reviewer','partner','viewer']::text[], m.role::text), u.name`,
    { replacements: { brandId: brand.id }, type: QueryTypes.SELECT },
  );
  const invitations = await Invitation.findAll({
    where: { brandId: brand.id, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['createdAt', 'DESC']],
  });
  return {
    members: members.map((m) => ({ id: m.id, userId: m.user_id, name: m.name, email: m.email, role: m.role, addedAt: new Date(m.created_at).toISOString() })),
    invitations: invitations.map(invitationView),
  };
}

const invitationView = (i: Invitation): InvitationView => ({
  id: i.id,
  email: i.email,
  role: i.role,
  expiresAt: i.expiresAt.toISOString(),
  createdAt: i.createdAt.toISOString(),
});

async function userByEmail(email: string, t: Transaction): Promise<{ id: string; name: string; email: string } | undefined> {
  const [user] = await sequelize.query<{ id: string; name: string; email: string }>(
    'SELECT id, name, email FROM "user" WHERE lower(email) = lower(:email)',
    { replacements: { email }, type: QueryTypes.SELECT, transaction: t },
  );
  return user;
}

export interface AddMemberResult {
  invitation: InvitationView;
  token: string;
}

/**
 * Invite a person by e-mail. Everyone gets an invitation to accept, account or not, and the answer does not
 * depend on whether an account exists: nobody joins a brand without acting, and the owner learns nothing.
 */
export async function addMember(caller: Caller, brand: Brand, email: string, role: BrandRole): Promise<AddMemberResult> {
  return sequelize.transaction(async (t) => {
    const user = await userByEmail(email, t);
    // Members are listed to whoever may add people, so saying so reveals nothing new.
    const existing = user ? await BrandMember.findOne({ where: { brandId: brand.id, userId: user.id }, transaction: t }) : null;
    if (existing) throw new ApiError(409, 'already_member', `${email} is already a member of this brand (${existing.role}).`);
    const pending = await Invitation.findOne({
      where: { brandId: brand.id, email, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction: t,
    });
    if (pending) throw new ApiError(409, 'already_invited', `${email} has already been invited (${pending.role}).`);
    const token = randomBytes(32).toString('base64url');
    const invitation = await Invitation.create(
      {
        brandId: brand.id,
        email,
        role,
        tokenHash: hashToken(token),
        invitedById: caller.id,
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
        acceptedAt: null,
        revokedAt: null,
      },
      { transaction: t },
    );
    await audit({ actorId: caller.id, action: 'member.invite', targetType: 'invitation', targetId: invitation.id, brandId: brand.id, studioId: brand.studioId, details: { email, role } }, t);
    return { invitation: invitationView(invitation), token };
  });
}

/** SHA-256 of a token: only the hash is stored, so a database leak does not leak working links. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

async function memberOf(brand: Brand, memberId: string, t: Transaction): Promise<BrandMember> {
  const member = await BrandMember.findOne({ where: { id: memberId, brandId: brand.id }, transaction: t, lock: t.LOCK.UPDATE });
  if (!member) throw new ApiError(404, 'not_found', 'That member was not found on this brand.');
  return member;
}

/** Refuse to leave a brand without an owner. */
async function keepAnOwner(brand: Brand, member: BrandMember, t: Transaction): Promise<void> {
  if (member.role !== 'owner') return;
  // Lock the owners so two concurrent demotions cannot both pass the count.
  const owners = await BrandMember.findAll({ where: { brandId: brand.id, role: 'owner' }, transaction: t, lock: t.LOCK.UPDATE });
  if (owners.length <= 1) {
    throw new ApiError(409, 'last_owner', 'A brand needs at least one owner: make someone else an owner first.');
  }
}

/** Change a member's role. */
export async function updateMember(caller: Caller, brand: Brand, memberId: string, role: BrandRole): Promise<BrandMember> {
  return sequelize.transaction(async (t) => {
    const member = await memberOf(brand, memberId, t);
    if (member.role === role) return member;
    if (role !== 'owner') await keepAnOwner(brand, member, t);
    const before = member.role;
    await member.update({ role }, { transaction: t });
    siteCache.forget();
    await audit({ actorId: caller.id, action: 'member.role', targetType: 'member', targetId: member.id, brandId: brand.id, studioId: brand.studioId, details: { userId: member.userId, before, after: role } }, t);
    return member;
  });
}

/** Remove a member from the brand. */
export async function removeMember(caller: Caller, brand: Brand, memberId: string): Promise<void> {
  await sequelize.transaction(async (t) => {
    const member = await memberOf(brand, memberId, t);
    await keepAnOwner(brand, member, t);
    await member.destroy({ transaction: t });
    siteCache.forget();
    await audit({ actorId: caller.id, action: 'member.remove', targetType: 'member', targetId: member.id, brandId: brand.id, studioId: brand.studioId, details: { userId: member.userId, role: member.role } }, t);
  });
}
