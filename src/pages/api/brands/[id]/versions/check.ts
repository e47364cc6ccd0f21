import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed } from '@/lib/http/api';
import { preflightBrand } from '@/lib/publishing/preflight.server';

/** The check before publishing: template text left in, stand-in images, missing alt text, contrast, licences, files. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'version.publish');
  return json({ findings: await preflightBrand(brand) });
});

export const ALL = methodNotAllowed;
