import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { ApiError, endpoint, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { loadIdentity, tokensInput } from '@/lib/identity/identity.server';
import { builtTokens } from '@/lib/publishing/tokens-route.server';
import { findVersion } from '@/lib/publishing/versions.server';
import { tokenFile, TOKEN_FORMATS } from '@/lib/tokens';

const query = z.strictObject({
  format: z.enum(TOKEN_FORMATS as [string, ...string[]], { error: `Choose a format: ${TOKEN_FORMATS.join(', ')}.` }).default('dtcg'),
  version: z.coerce.number({ error: 'Give a version number.' }).int().positive().optional(),
});

/** The identity as design tokens (the working copy, or ?version=N as built when it was published), as a file named after the brand. */
export const GET = endpoint(async ({ locals, params, url, request }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const { format, version: number } = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  if (number !== undefined) {
    const version = await findVersion(brand.id, number);
    if (!version) throw new ApiError(404, 'not_found', `Version ${number} was not found.`);
    const built = builtTokens(request, version, format as (typeof TOKEN_FORMATS)[number], brand.slug);
    if (!built) throw new ApiError(409, 'not_built', `Version ${number} is ${version.state === 'failed' ? 'not built: its build failed' : 'still being built'}; its tokens are ready once it is.`);
    return built;
  }
  const file = tokenFile(format as (typeof TOKEN_FORMATS)[number], tokensInput(await loadIdentity(brand)));
  return new Response(file.body, {
    headers: { 'content-type': file.contentType, 'content-disposition': `attachment; filename="${file.filename}"`, 'cache-control': 'no-store' },
  });
});

export const ALL = methodNotAllowed;
