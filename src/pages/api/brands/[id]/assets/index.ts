import { authorizeAssetRead } from '@/lib/assets/access.server';
import { listAssets, uploadAssets } from '@/lib/assets/assets.server';
import { MAX_ASSET_BYTES, MAX_FILES_PER_UPLOAD } from '@/lib/assets/kinds';
import { assetListQuerySchema, queryObject, uploadFieldsSchema } from '@/lib/assets/schemas';
import { authorizeBrand } from '@/lib/auth/access.server';
import { ApiError, endpoint, formFields, idParam, json, methodNotAllowed, parseWith, readForm } from '@/lib/http/api';

/** The brand's shelf as the caller may see it (partners and share links: approved only); filters state, tag, kind. */
export const GET = endpoint(async ({ locals, params, url }) => {
  const reader = await authorizeAssetRead(locals, idParam(params.id));
  const filters = parseWith(assetListQuerySchema, queryObject(url), 'query');
  return json({ assets: await listAssets(reader, filters), approvedOnly: reader.approvedOnly });
});

/** A file over the per-file limit, refused the moment it passes it (the whole request with it). */
function assetTooLarge(filename: string): ApiError {
  const message = `“${filename}” is larger than ${MAX_ASSET_BYTES / 1024 / 1024} MB, the most one file can be.`;
  return new ApiError(400, 'too_large', message, undefined, { rejected: [{ filename, code: 'too_large', message }] });
}

/** Upload one or more files (field "file", repeated); each is accepted or refused with its reason. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'asset.upload');
  // The whole request may hold several files; each file's own limit is checked as it is read.
  const form = await readForm(request, MAX_FILES_PER_UPLOAD * MAX_ASSET_BYTES, { maxFileBytes: MAX_ASSET_BYTES, fileTooLarge: assetTooLarge });
  const files = form.getAll('file').filter((f): f is File => f instanceof File);
  if (!files.length) throw new ApiError(400, 'missing_file', 'Attach one or more files in the "file" field.');
  if (files.length > MAX_FILES_PER_UPLOAD) throw new ApiError(400, 'too_many_files', `Upload at most ${MAX_FILES_PER_UPLOAD} files at once.`);
  const fields = parseWith(uploadFieldsSchema, formFields(form), 'form');
  const outcome = await uploadAssets(caller, brand, files, fields.kind);
  if (!outcome.assets.length) {
    const first = outcome.rejected[0];
    throw new ApiError(400, outcome.rejected.length === 1 ? first.code : 'all_rejected', outcome.rejected.length === 1 ? first.message : 'None of the files could be accepted; see each file’s reason.', undefined, { rejected: outcome.rejected });
  }
  return json(outcome, outcome.assets.every((a) => a.duplicate) ? 200 : 201);
});

export const ALL = methodNotAllowed;
