import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { loadIdentity, tokensInput } from '@/lib/identity/identity.server';
import { tokenFile, TOKEN_FORMATS } from '@/lib/tokens';

const query = z.strictObject({ format: z.enum(TOKEN_FORMATS as [string, ...string[]], { error: `Choose a format: ${TOKEN_FORMATS.join(', ')}.` }).default('dtcg') });

/** The identity as design tokens, downloaded as a file named after the brand. */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const { format } = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  const file = tokenFile(format as (typeof TOKEN_FORMATS)[number], tokensInput(await loadIdentity(brand)));
  return new Response(file.body, {
    headers: { 'content-type': file.contentType, 'content-disposition': `attachment; filename="${file.filename}"`, 'cache-control': 'no-store' },
  });
});

export const ALL = methodNotAllowed;
