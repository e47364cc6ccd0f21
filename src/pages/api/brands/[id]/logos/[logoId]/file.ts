import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, fileResponse, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { logoFile } from '@/lib/identity/identity.server';
import { LIGHT_PARTS } from '@/lib/identity/types';

const query = z.strictObject({
  variant: z.enum(['original', 'black', 'white', 'reversed', 'one-colour', 'on-dark']).default('original'),
  color: z.string().max(100).optional(),
  on: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'on must be a six-digit hex colour').optional(),
  download: z.enum(['1']).optional(),
  lightParts: z.enum(LIGHT_PARTS, { error: `lightParts is one of: ${LIGHT_PARTS.join(', ')}.` }).optional(),
});

/**
 * The logo file, or a version of it (black, white, reversed, one-colour with ?color=, on-dark); `on` is accepted and
 * no longer needed; `lightParts` draws the one-colour versions with that choice for light parts instead of the logo's.
 */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const q = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  const file = await logoFile(brand, idParam(params.logoId, 'That logo'), q.variant, q.color, q.lightParts);
  return fileResponse(file.body, file.contentType, file.filename, { inline: q.download !== '1' });
});

export const ALL = methodNotAllowed;
