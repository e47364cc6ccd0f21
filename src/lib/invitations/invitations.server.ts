// Invitations: the e-mail with the accept link, resend and revoke, and joining by token.
import { Op, QueryTypes } from 'sequelize';
import { Brand, BrandMember, Invitation } from '@db/models';
import { audit } from '@/lib/audit.server';
import { siteCache } from '@/lib/publishing/site-cache';
import { unverifiedError, type Caller } from '@/lib/auth/access.server';
import { ROLE_LABELS, type BrandRole } from '@/lib/auth/roles';
import type { InvitationView } from '@/lib/brands/brands.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { sendTemplate, siteLink, type MailOutcome } from '@/lib/mail/mail.server';
import { hashToken, longDate, newToken } from './tokens';

export const INVITATION_DAYS = 14;

/** E-mail an invitation's accept link (`/invite/<token>`). */
export async function mailInvitation(brand: Brand, inviter: Caller, invitation: { email: string; role: BrandRole; expiresAt: string | Date }, token: string): Promise<MailOutcome> {
  return sendTemplate(
    invitation.email,
    'invitation',
    {
      brandName: brand.name,
      inviterName: inviter.name || inviter.email,
      roleLabel: ROLE_LABELS[invitation.role].label.toLowerCase(),
      roleSummary: ROLE_LABELS[invitation.role].summary.toLowerCase(),
      email: invitation.email,
      expiresOn: longDate(new Date(invitation.expiresAt)),
      link: siteLink(`/invite/${token}`),
    },
    brand.id,
  );
}

/** The brand's invitations not yet accepted or withdrawn, lapsed ones included so they can be sent again. */
export async function pendingInvitations(brand: Brand): Promise<(InvitationView & { state: 'pending' | 'expired' })[]> {
  const rows = await Invitation.findAll({ where: { brandId: brand.id, acceptedAt: null, revokedAt: null }, order: [['createdAt', 'DESC']] });
  return rows.map((i) => ({
    id: i.id,
    email: i.email,
    role: i.role,
    expiresAt: i.expiresAt.toISOString(),
    createdAt: i.createdAt.toISOString(),
    state: i.expiresAt.getTime() <= Date.now() ? 'expired' : 'pending',
  }));
}

async function pendingOf(brand: Brand, invitationId: string): Promise<Invitation> {
  const inv = await Invitation.findOne({ where: { id: invitationId, brandId: brand.id, acceptedAt: null, revokedAt: null } });
  if (!inv) throw new ApiError(404, 'not_found', 'That invitation was not found, or it was already accepted or withdrawn.');
  return inv;
}

/** A new link for a pending (or lapsed) invitation: the old link stops working, the clock starts again. */
export async function resendInvitation(caller: Caller, brand: Brand, invitationId: string): Promise<{ invitation: InvitationView; mail: MailOutcome }> {
  const inv = await pendingOf(brand, invitationId);
  const { token, hash } = newToken();
  await sequelize.transaction(async (t) => {
    await inv.update({ tokenHash: hash, expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) }, { transaction: t });
    await audit({ actorId: caller.id, action: 'member.invite.resend', targetType: 'invitation', targetId: inv.id, brandId: brand.id, studioId: brand.studioId, details: { email: inv.email } }, t);
  });
  const mail = await mailInvitation(brand, caller, inv, token);
  return { invitation: { id: inv.id, email: inv.email, role: inv.role, expiresAt: inv.expiresAt.toISOString(), createdAt: inv.createdAt.toISOString() }, mail };
}

/** Withdraw an invitation; its link then says so. */
export async function revokeInvitation(caller: Caller, brand: Brand, invitationId: string): Promise<void> {
  const inv = await pendingOf(brand, invitationId);
  await sequelize.transaction(async (t) => {
    await inv.update({ revokedAt: new Date() }, { transaction: t });
    await audit({ actorId: caller.id, action: 'member.invite.revoke', targetType: 'invitation', targetId: inv.id, brandId: brand.id, studioId: brand.studioId, details: { email: inv.email } }, t);
  });
}

export type InvitationState = 'pending' | 'accepted' | 'revoked' | 'expired';

export interface InvitationLookup {
  state: InvitationState;
  email: string;
  role: BrandRole;
  roleLabel: string;
  brand: { id: string; name: string };
  expiresAt: string;
}

const stateOf = (inv: Invitation): InvitationState =>
  inv.revokedAt ? 'revoked' : inv.acceptedAt ? 'accepted' : inv.expiresAt.getTime() <= Date.now() ? 'expired' : 'pending';

/** What a link holder may know: the brand, the role, the address it was sent to, and whether it still works. */
export async function lookupInvitation(token: string): Promise<InvitationLookup | null> {
  const inv = await Invitation.findOne({ where: { tokenHash: hashToken(token) }, include: [{ model: Brand, as: 'brand', required: true }] });
  if (!inv) return null;
  const brand = (inv as Invitation & { brand: Brand }).brand;
  return { state: stateOf(inv), email: inv.email, role: inv.role, roleLabel: ROLE_LABELS[inv.role].label, brand: { id: brand.id, name: brand.name }, expiresAt: inv.expiresAt.toISOString() };
}

export const INVITATION_PROBLEMS: Record<Exclude<InvitationState, 'pending'>, { status: number; code: string; message: string }> = {
  accepted: { status: 410, code: 'invitation_used', message: 'This invitation has already been accepted. Sign in to open the brand.' },
  revoked: { status: 410, code: 'invitation_revoked', message: 'This invitation was withdrawn by the brand’s owner. Ask them to invite you again.' },
  expired: { status: 410, code: 'invitation_expired', message: `This invitation has expired (links work for ${INVITATION_DAYS} days). Ask the brand’s owner to send a new one.` },
};

/** Join the brand with the invited role; only the person signed in with the invited, proven address may. */
export async function acceptInvitation(caller: Caller, token: string): Promise<{ brandId: string; role: BrandRole; memberId: string }> {
  return sequelize.transaction(async (t) => {
    // The account as stored now, not as the session remembers it: its address must be proven.
    const [account] = await sequelize.query<{ email: string; verified: boolean }>('SELECT email, "emailVerified" AS verified FROM "user" WHERE id = :id FOR SHARE', {
      replacements: { id: caller.id },
      type: QueryTypes.SELECT,
      transaction: t,
    });
    if (!account) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
    if (!account.verified) throw unverifiedError(account.email);
    caller = { ...caller, email: account.email };
    const inv = await Invitation.findOne({ where: { tokenHash: hashToken(token) }, transaction: t, lock: t.LOCK.UPDATE });
    if (!inv) throw new ApiError(404, 'not_found', 'This invitation link is not valid. Check that the whole link was copied.');
    const state = stateOf(inv);
    if (state !== 'pending') {
      const p = INVITATION_PROBLEMS[state];
      throw new ApiError(p.status, p.code, p.message);
    }
    if (inv.email.toLowerCase() !== caller.email.toLowerCase()) {
      throw new ApiError(403, 'wrong_account', `This invitation is for ${inv.email}, but you are signed in as ${caller.email}. Sign in with the invited address.`);
    }
    const brand = (await Brand.findByPk(inv.brandId, { transaction: t }))!;
    const existing = await BrandMember.findOne({ where: { brandId: brand.id, userId: caller.id }, transaction: t });
    const member = existing ?? (await BrandMember.create({ brandId: brand.id, userId: caller.id, role: inv.role }, { transaction: t }));
    siteCache.forget();
    await inv.update({ acceptedAt: new Date() }, { transaction: t });
    // Other open invitations of the same address to this brand are settled by joining.
    await Invitation.update({ revokedAt: new Date() }, { where: { brandId: brand.id, email: inv.email, acceptedAt: null, revokedAt: null, id: { [Op.ne]: inv.id } }, transaction: t });
    await audit({ actorId: caller.id, action: 'member.join', targetType: 'invitation', targetId: inv.id, brandId: brand.id, studioId: brand.studioId, details: { email: inv.email, role: existing?.role ?? inv.role, alreadyMember: !!existing } }, t);
    return { brandId: brand.id, role: existing?.role ?? inv.role, memberId: member.id };
  });
}
