import { authorizeAssetRead, brandOfAsset } from '@/lib/assets/access.server';
import { assetFor, downloadFile, renditionRequester } from '@/lib/assets/assets.server';
import { renditionQuerySchema } from '@/lib/assets/kinds';
import { queryObject } from '@/lib/assets/schemas';
import { PRINT_CAUTION } from '@/lib/cautions';
import { assertShelfReleased } from '@/lib/handover/gate.server';
import { ApiError, endpoint, fileResponse, idParam, methodNotAllowed, notFound, parseWith } from '@/lib/http/api';
import { requestClientAddress } from '@/lib/http/client-address.server';
import '@/lib/db.server';

/** An asset's original or a rendition (?format, width, background, variant, color, preset, colorSpace); every call is logged. */
export const GET = endpoint(async (context) => {
  const { locals, params, url } = context;
  // Anonymous callers without a share link learn nothing, not even whether the asset exists.
  if (!locals.user && !locals.shareGrant) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  // A share link that allows no downloads answers alike for every id, existing or not.
  if (!locals.user && locals.shareGrant && !locals.shareGrant.allowDownloads) await authorizeAssetRead(locals, locals.shareGrant.brandId);
  const assetId = idParam(params.assetId, 'That asset');
  const query = parseWith(renditionQuerySchema, queryObject(url), 'query');
  const brandId = await brandOfAsset(assetId);
  if (!brandId) throw notFound('That asset');
  // An asset of a brand the caller cannot read is answered exactly like a random id: no existence leak.
  const reader = await authorizeAssetRead(locals, brandId).catch((err) => {
    throw err instanceof ApiError && (err.status === 401 || err.status === 404) ? notFound('That asset') : err;
  });
  const asset = await assetFor(reader.brand.id, assetId, reader.approvedOnly);
  // An unpaid handover invoice holds back what it releases (402 with the reason); previews and the studio's own reads pass.
  await assertShelfReleased(reader.brand.id, reader.role, { kind: asset.kind, format: query.format ?? 'original', width: query.width, preset: query.preset, colorSpace: query.colorSpace });
  const { rendition, filename, params: resolved } = await downloadFile(reader, asset, query, renditionRequester(reader, requestClientAddress(context)));
  const body = 'size' in rendition ? { stream: rendition.body, size: rendition.size } : rendition.body;
  const response = fileResponse(body, rendition.mime, filename, { inline: query.download !== '1' });
  if (resolved.colorSpace === 'cmyk') response.headers.set('x-print-caution', PRINT_CAUTION);
  return response;
});

export const ALL = methodNotAllowed;
