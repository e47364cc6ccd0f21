import type { APIContext } from 'astro';
import { Asset } from '../../../../../db/models/assets';
import { authorizeAssetRead } from '../../../../lib/assets/access.server';
import { assetFor, downloadFile, renditionRequester } from '../../../../lib/assets/assets.server';
import { renditionQuerySchema } from '../../../../lib/assets/kinds';
import { queryObject } from '../../../../lib/assets/schemas';
import { PRINT_CAUTION } from '../../../../lib/cautions';
import { ApiError, endpoint, fileResponse, idParam, methodNotAllowed, notFound, parseWith } from '../../../../lib/http/api';
import '../../../../lib/db.server';

/**
 * The connection's address, for the per-caller rendition rate. Astro takes X-Forwarded-For at its word, so requests
 * carrying one share a single bucket here and forged values buy nothing new.
 * INTEGRATOR: replace with the shared clientAddress() from src/lib/http/ (X-Forwarded-For trusted only from
 * TRUSTED_PROXIES) once it is on main.
 */
function connectionAddress(context: APIContext): string {
  if (context.request.headers.has('x-forwarded-for')) return 'forwarded';
  try {
    return context.clientAddress;
  } catch {
    return 'unknown';
  }
}

/** An asset's original or a rendition (?format, width, background, variant, color, preset, colorSpace); every call is logged. */
export const GET = endpoint(async (context) => {
  const { locals, params, url } = context;
  // Anonymous callers without a share link learn nothing, not even whether the asset exists.
  if (!locals.user && !locals.shareGrant) throw new ApiError(401, 'unauthenticated', 'Sign in to continue.');
  const assetId = idParam(params.assetId, 'That asset');
  const query = parseWith(renditionQuerySchema, queryObject(url), 'query');
  const found = await Asset.findByPk(assetId, { attributes: ['id', 'brandId'] });
  if (!found) throw notFound('That asset');
  const reader = await authorizeAssetRead(locals, found.brandId);
  const asset = await assetFor(reader.brand.id, assetId, reader.approvedOnly);
  const { rendition, filename, params: resolved } = await downloadFile(reader, asset, query, renditionRequester(reader, connectionAddress(context)));
  const response = fileResponse(rendition.body, rendition.mime, filename, { inline: query.download !== '1' });
  if (resolved.colorSpace === 'cmyk') response.headers.set('x-print-caution', PRINT_CAUTION);
  return response;
});

export const ALL = methodNotAllowed;
