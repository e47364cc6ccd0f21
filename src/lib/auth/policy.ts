// The one place that says who may do what to a brand. Every route asks it; no screen decides alone.
import type { BrandRole } from './roles';

export const BRAND_ACTIONS = [
  'brand.read',
  'brand.update',
  'brand.delete',
  'members.read',
  'members.manage',
  'draft.read',
  'draft.edit',
  'draft.comment',
  'review.decide',
  'version.read',
  'version.publish',
  'asset.readDraft',
  'asset.upload',
  'asset.approve',
  'asset.download',
  'shareLink.manage',
  'audit.read',
  'insights.read',
  'handover.manage',
] as const;
export type BrandAction = (typeof BRAND_ACTIONS)[number];

const everyone: BrandRole[] = ['owner', 'editor', 'reviewer', 'partner', 'viewer'];
const makers: BrandRole[] = ['owner', 'editor'];

/** Which roles may take each action (PRODUCT.md "People and roles"). */
export const PERMISSIONS: Record<BrandAction, readonly BrandRole[]> = {
  'brand.read': everyone,
  'brand.update': makers,
  'brand.delete': ['owner'],
  'members.read': makers,
  'members.manage': ['owner'],
  'draft.read': ['owner', 'editor', 'reviewer'],
  'draft.edit': makers,
  'draft.comment': ['owner', 'editor', 'reviewer'],
  'review.decide': ['owner', 'reviewer'],
  'version.read': everyone,
  'version.publish': makers,
  'asset.readDraft': ['owner', 'editor', 'reviewer'],
  'asset.upload': makers,
  'asset.approve': makers,
  'asset.download': ['owner', 'editor', 'reviewer', 'partner'],
  'shareLink.manage': ['owner'],
  'audit.read': ['owner'],
  // What visitors read and download is the brand owner's business, like the download log.
  'insights.read': ['owner'],
  // The handover invoice: the designer's business with the client, so the owner's alone.
  'handover.manage': ['owner'],
};

/** Whether a brand role allows an action. */
export function can(role: BrandRole | null | undefined, action: BrandAction): boolean {
  return role != null && PERMISSIONS[action].includes(role);
}

export type Decision = { ok: true } | { ok: false; status: 401 | 403 | 404; code: string };

/**
 * The answer for a caller: anonymous → 401; no role on the brand (or no such brand) → 404 so a brand's
 * existence does not leak; a role without the right → 403.
 */
export function decide(signedIn: boolean, role: BrandRole | null, action: BrandAction): Decision {
  if (!signedIn) return { ok: false, status: 401, code: 'unauthenticated' };
  if (role == null) return { ok: false, status: 404, code: 'not_found' };
  if (!can(role, action)) return { ok: false, status: 403, code: 'forbidden' };
  return { ok: true };
}
