// Who may read the shelf of a brand: a member whose role allows downloads, or a share link for that brand that allows them.
import { Asset, Brand } from '@db/models';
import { authorizeBrand, type Caller } from '@/lib/auth/access.server';
import { can } from '@/lib/auth/policy';
import type { BrandRole } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { ApiError } from '@/lib/http/api';

export interface AssetReader {
  brand: Brand;
  /** The signed-in member, or null when the reader holds a share link. */
  caller: Caller | null;
  role: BrandRole | null;
  /** The share link used, for the download log. */
  shareLinkId: string | null;
  /** Partners and share links see approved assets only; drafts and retired assets do not exist for them. */
  approvedOnly: boolean;
}

/** A member with asset.download (via the policy), or a download-enabled share grant for this brand; 401/403/404 otherwise. */
export async function authorizeAssetRead(locals: App.Locals, brandId: string): Promise<AssetReader> {
  const grant = locals.shareGrant?.brandId === brandId ? locals.shareGrant : null;
  if (locals.user) {
    try {
      const { caller, brand, role } = await authorizeBrand(locals, brandId, 'asset.download');
      return { brand, caller, role, shareLinkId: null, approvedOnly: !can(role, 'asset.readDraft') };
    } catch (err) {
      // Signed in but not on this brand (or not yet verified): a share link for it still counts.
      if (!(grant && err instanceof AppError && (err.status === 404 || err.code === 'email_unverified'))) throw err;
    }
  }
  if (!grant) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  if (!grant.allowDownloads) throw new ApiError(403, 'downloads_not_allowed', 'This share link lets you read the guidelines but not download files. Ask the brand’s owner for a link that allows downloads.');
  const brand = await Brand.findByPk(brandId);
  if (!brand) throw new ApiError(404, 'not_found', 'That brand was not found.');
  return { brand, caller: null, role: null, shareLinkId: grant.linkId, approvedOnly: true };
}

/** The brand an asset belongs to, or null when no asset has that id (the first step before deciding who may read it). */
export async function brandOfAsset(assetId: string): Promise<string | null> {
  const found = await Asset.findByPk(assetId, { attributes: ['id', 'brandId'] });
  return found?.brandId ?? null;
}
