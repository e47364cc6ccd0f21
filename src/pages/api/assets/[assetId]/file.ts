import { Asset } from '../../../../../db/models/assets';
import { authorizeAssetRead } from '../../../../lib/assets/access.server';
import { assetFor, downloadFile } from '../../../../lib/assets/assets.server';
import { renditionQuerySchema } from '../../../../lib/assets/kinds';
import { queryObject } from '../../../../lib/assets/schemas';
import { PRINT_CAUTION } from '../../../../lib/cautions';
import { ApiError, endpoint, fileResponse, idParam, methodNotAllowed, notFound, parseWith } from '../../../../lib/http/api';
import '../../../../lib/db.server';

/** An asset's original or a rendition (?format, width, background, variant, color, preset, colorSpace); every call is logged. */
export const GET = endpoint(async ({ locals, params, url }) => {
  // Anonymous callers without a share link learn nothing, not even whether the asset exists.
  if (!locals.user && !locals.shareGrant) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  const assetId = idParam(params.assetId, 'That asset');
  const query = parseWith(renditionQuerySchema, queryObject(url), 'query');
  const found = await Asset.findByPk(assetId, { attributes: ['id', 'brandId'] });
  if (!found) throw notFound('That asset');
  const reader = await authorizeAssetRead(locals, found.brandId);
  const asset = await assetFor(reader.brand.id, assetId, reader.approvedOnly);
  const { rendition, filename, params: resolved } = await downloadFile(reader, asset, query);
  const response = fileResponse(rendition.body, rendition.mime, filename, { inline: query.download !== '1' });
  if (resolved.colorSpace === 'cmyk') response.headers.set('x-print-caution', PRINT_CAUTION);
  return response;
});

export const ALL = methodNotAllowed;
