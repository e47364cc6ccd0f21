import { authorizeBrand } from '@/lib/auth/access.server';
import { ApiError, endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { retryBuild } from '@/lib/publishing/build/run.server';
import { versionView } from '@/lib/publishing/versions.server';

/** Build a version again after its build failed (e.g. once Chromium is installed); answers with the version. */
export const POST = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'version.publish');
  const number = Number(params.number);
  if (!Number.isInteger(number) || number < 1) throw new ApiError(404, 'not_found', 'There is no such version.');
  await retryBuild(brand.id, number);
  return json({ version: await versionView(brand, number) }, 202);
});

export const ALL = methodNotAllowed;
