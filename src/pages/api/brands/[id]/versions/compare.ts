import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, parseWith } from '@/lib/http/api';
import { versionChanges } from '@/lib/publishing/versions.server';

const query = z.strictObject({
  from: z.coerce.number().int().min(1),
  to: z.union([z.literal('draft'), z.coerce.number().int().min(1)]),
});

/** What changed between two versions, or from a version to the working draft (?to=draft). */
export const GET = endpoint(async ({ locals, params, url }) => {
  const q = parseWith(query, Object.fromEntries(url.searchParams), 'query');
  const { brand } = await authorizeBrand(locals, idParam(params.id), q.to === 'draft' ? 'draft.read' : 'version.read');
  return json(await versionChanges(brand, q.from, q.to));
});

export const ALL = methodNotAllowed;
