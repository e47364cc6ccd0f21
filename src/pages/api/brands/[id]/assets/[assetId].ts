import { authorizeAssetRead } from '@/lib/assets/access.server';
import { assetFor, assetView, deleteAsset, updateAsset } from '@/lib/assets/assets.server';
import { assetPatchSchema } from '@/lib/assets/schemas';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

/** One asset; drafts and retired assets are 404 for partners and share links. */
export const GET = endpoint(async ({ locals, params }) => {
  const reader = await authorizeAssetRead(locals, idParam(params.id));
  const asset = await assetFor(reader.brand.id, idParam(params.assetId, 'That asset'), reader.approvedOnly);
  return json({ asset: assetView(asset) });
});

/** Change state (draft → approved → retired, retired → approved, any → draft), tags, description, usage notes or name. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'asset.approve');
  const body = await readJson(request, assetPatchSchema);
  return json({ asset: await updateAsset(caller, brand, idParam(params.assetId, 'That asset'), body) });
});

/** Remove an asset, its file and every rendition made from it. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'asset.upload');
  await deleteAsset(caller, brand, idParam(params.assetId, 'That asset'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
