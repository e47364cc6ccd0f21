// Share links: a random token in the URL (only its hash is stored), optional expiry, password and downloads.
import { createHmac, randomBytes, scrypt as scryptCb, timingSafeEqual } from 'node:crypto';
import { promisify } from 'node:util';
import { AUTH_SECRET, SITE_URL } from 'astro:env/server';
import { Brand, GuidelineVersion, ShareLink } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { hashToken } from '@/lib/brands/brands.server';
import { sequelize } from '@/lib/db.server';
import { ApiError } from '@/lib/http/api';
import { shareGrants } from './grant-cache';
import type { LinkState, ShareLinkView } from './views';

export type { LinkState, ShareLinkView } from './views';

const scrypt = promisify(scryptCb) as (password: string, salt: Buffer, keylen: number) => Promise<Buffer>;

export const SHARE_COOKIE = 'plumbline_share';
/** Password attempts allowed per link and address in a quarter of an hour. */
export const PASSWORD_ATTEMPTS = 5;
export const PASSWORD_WINDOW_SECONDS = 15 * 60;

export const linkState = (l: ShareLink, now = new Date()): LinkState =>
  l.revokedAt ? 'revoked' : l.expiresAt && l.expiresAt <= now ? 'expired' : 'active';

const view = (l: ShareLink): ShareLinkView => ({
  id: l.id,
  label: l.label,
  version: l.versionNumber,
  allowDownloads: l.allowDownloads,
  allowPresentation: l.allowPresentation,
  hasPassword: l.passwordHash !== null,
  expiresAt: l.expiresAt?.toISOString() ?? null,
  revokedAt: l.revokedAt?.toISOString() ?? null,
  lastUsedAt: l.lastUsedAt?.toISOString() ?? null,
  useCount: l.useCount,
  state: linkState(l),
  createdAt: l.createdAt.toISOString(),
});

async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const hash = await scrypt(password, salt, 32);
  return `scrypt$${salt.toString('base64url')}$${hash.toString('base64url')}`;
}

/** Whether a password matches a stored scrypt hash, in constant time. */
export async function passwordMatches(password: string, stored: string): Promise<boolean> {
  const [, salt, hash] = stored.split('$');
  const candidate = await scrypt(password, Buffer.from(salt, 'base64url'), 32);
  return timingSafeEqual(candidate, Buffer.from(hash, 'base64url'));
}

export async function createShareLink(
  caller: Caller,
  brand: Brand,
  body: { expiresAt?: string; password?: string; allowDownloads?: boolean; allowPresentation?: boolean; version?: number; label?: string },
): Promise<ShareLinkView> {
  if (body.expiresAt && new Date(body.expiresAt) <= new Date()) throw new ApiError(400, 'invalid_input', 'The expiry date is in the past.', { path: 'expiresAt' });
  if (body.version !== undefined && !(await GuidelineVersion.findOne({ where: { brandId: brand.id, number: body.version } }))) {
    throw new ApiError(400, 'invalid_input', `Version ${body.version} has not been published.`, { path: 'version' });
  }
  // 192 random bits: far past guessing, and only its SHA-256 is kept.
  const token = randomBytes(24).toString('base64url');
  const link = await sequelize.transaction(async (t) => {
    const row = await ShareLink.create(
      {
        brandId: brand.id,
        tokenHash: hashToken(token),
        label: body.label ?? null,
        versionNumber: body.version ?? null,
        allowDownloads: body.allowDownloads ?? false,
        allowPresentation: body.allowPresentation ?? false,
        passwordHash: body.password ? await hashPassword(body.password) : null,
        expiresAt: body.expiresAt ? new Date(body.expiresAt) : null,
        revokedAt: null,
        lastUsedAt: null,
        createdById: caller.id,
      },
      { transaction: t },
    );
    await audit({ actorId: caller.id, action: 'shareLink.create', targetType: 'shareLink', targetId: row.id, brandId: brand.id, studioId: brand.studioId, details: { allowDownloads: row.allowDownloads, allowPresentation: row.allowPresentation, expiresAt: body.expiresAt ?? null, version: row.versionNumber, password: !!body.password } }, t);
    return row;
  });
  return { ...view(link), url: `${SITE_URL}/s/${token}` };
}

export async function listShareLinks(brand: Brand): Promise<ShareLinkView[]> {
  return (await ShareLink.findAll({ where: { brandId: brand.id }, order: [['createdAt', 'DESC']] })).map(view);
}

export async function revokeShareLink(caller: Caller, brand: Brand, linkId: string): Promise<void> {
  const link = await ShareLink.findOne({ where: { id: linkId, brandId: brand.id } });
  if (!link) throw new ApiError(404, 'not_found', 'That share link was not found.');
  if (link.revokedAt) return;
  await sequelize.transaction(async (t) => {
    await link.update({ revokedAt: new Date() }, { transaction: t });
    shareGrants.forget();
    await audit({ actorId: caller.id, action: 'shareLink.revoke', targetType: 'shareLink', targetId: link.id, brandId: brand.id, studioId: brand.studioId, details: {} }, t);
  });
}

/** Let a link open the presentation, or stop it; the link's holders see the change at once. */
export async function setLinkPresentation(caller: Caller, brand: Brand, linkId: string, allowPresentation: boolean): Promise<ShareLinkView> {
  const link = await ShareLink.findOne({ where: { id: linkId, brandId: brand.id } });
  if (!link) throw new ApiError(404, 'not_found', 'That share link was not found.');
  if (link.allowPresentation === allowPresentation) return view(link);
  await sequelize.transaction(async (t) => {
    await link.update({ allowPresentation }, { transaction: t });
    shareGrants.forget();
    await audit({ actorId: caller.id, action: 'shareLink.update', targetType: 'shareLink', targetId: link.id, brandId: brand.id, studioId: brand.studioId, details: { allowPresentation } }, t);
  });
  return view(link);
}

/** The link a token opens, or null when no link has that token. */
export const linkForToken = (token: string) => (/^[A-Za-z0-9_-]{20,100}$/.test(token) ? ShareLink.findOne({ where: { tokenHash: hashToken(token) } }) : null);

/** The brand a link opens (links are deleted with their brand, so it is always there). */
export const brandOfLink = async (link: ShareLink): Promise<Brand> => (await Brand.findByPk(link.brandId))!;

/** The cookie value for an opened link: the token plus a signature proving any password was given. */
export const shareCookieValue = (token: string) => `${token}.${createHmac('sha256', AUTH_SECRET).update(`share:${token}`).digest('base64url')}`;

/** Cookie values whose signature was checked, with their token: an HMAC per request costs more than the rest of a read. */
const verifiedCookies = new Map<string, string>();

/** The token inside a share cookie whose signature is ours, or null. */
export function tokenFromCookie(value: string | undefined): string | null {
  if (!value) return null;
  const verified = verifiedCookies.get(value);
  if (verified) return verified;
  const [token, sig] = value.split('.');
  if (!token || !sig) return null;
  const expected = shareCookieValue(token).split('.')[1];
  if (expected.length !== sig.length || !timingSafeEqual(Buffer.from(expected), Buffer.from(sig))) return null;
  // Only values we signed are kept, so a flood of forged cookies cannot fill it; it starts over when full.
  if (verifiedCookies.size >= 10_000) verifiedCookies.clear();
  verifiedCookies.set(value, token);
  return token;
}

/**
 * The grant a share cookie's value carries now, or null: kept by token until a change notice about a link or a
 * brand (so a revocation reaches every process within a second); the kept grant carries its link's expiry, since
 * no notice marks the moment a link expires. Used by the middleware and the fast path alike.
 */
export async function shareGrantFor(cookieValue: string | undefined): Promise<App.Locals['shareGrant']> {
  const token = tokenFromCookie(cookieValue);
  if (!token) return null;
  const kept = await shareGrants.remember(token, async () => {
    const link = await linkForToken(token);
    if (!link || linkState(link) !== 'active') return { grant: null, expiresAt: null };
    const grant = { brandId: link.brandId, linkId: link.id, allowDownloads: link.allowDownloads, allowPresentation: link.allowPresentation, version: link.versionNumber };
    return { grant, expiresAt: link.expiresAt?.getTime() ?? null };
  });
  return kept.expiresAt !== null && kept.expiresAt <= Date.now() ? null : kept.grant;
}

/** The kept grant for a share cookie's value without waiting: the grant or null, or undefined when it must be looked up (shareGrantFor). */
export function keptShareGrant(cookieValue: string | undefined): App.Locals['shareGrant'] | undefined {
  const token = tokenFromCookie(cookieValue);
  if (!token) return null;
  const kept = shareGrants.get(token);
  if (!kept) return undefined;
  return kept.expiresAt !== null && kept.expiresAt <= Date.now() ? null : kept.grant;
}

/** Count a visit through a link. */
export async function recordUse(link: ShareLink): Promise<void> {
  await ShareLink.increment('useCount', { where: { id: link.id } });
  await ShareLink.update({ lastUsedAt: new Date() }, { where: { id: link.id } });
}
