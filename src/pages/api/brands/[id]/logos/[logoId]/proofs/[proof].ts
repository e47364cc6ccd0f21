import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { ApiError, endpoint, fileResponse, idParam, methodNotAllowed, parseWith } from '@/lib/http/api';
import { logoProofImage } from '@/lib/identity/proofs.server';
import { LIGHT_PARTS } from '@/lib/identity/types';
import { PROOF_KINDS, type ProofKind } from '@/lib/logo/tones';

const query = z.strictObject({
  download: z.enum(['1']).optional(),
  lightParts: z.enum(LIGHT_PARTS, { error: `lightParts is one of: ${LIGHT_PARTS.join(', ')}.` }).optional(),
});

/** One proof of a logo as a PNG: black-on-white, white-on-black, greyscale, or the three on one sheet (light parts as the logo says, or as `lightParts` asks). */
export const GET = endpoint(async ({ locals, params, url }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const q = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  const kind = params.proof as ProofKind;
  if (!PROOF_KINDS.includes(kind)) throw new ApiError(404, 'not_found', `There is no proof called that; ask for one of ${PROOF_KINDS.join(', ')}.`);
  const file = await logoProofImage(brand, idParam(params.logoId, 'That logo'), kind, q.lightParts);
  return fileResponse(file.body, 'image/png', file.filename, { inline: q.download !== '1' });
});

export const ALL = methodNotAllowed;
