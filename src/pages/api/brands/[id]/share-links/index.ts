import { z } from 'zod';
import { isOneLine, ONE_LINE_MESSAGE } from '@/lib/safe/values';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { createShareLink, listShareLinks } from '@/lib/publishing/share-links.server';

const createBody = z.strictObject({
  label: z.string().trim().max(120).refine(isOneLine, ONE_LINE_MESSAGE).optional(),
  expiresAt: z.iso.datetime({ offset: true, error: 'Give the expiry as an ISO date and time, e.g. 2027-01-31T18:00:00Z.' }).optional(),
  password: z.string().min(6, 'A link password needs at least 6 characters.').max(200).optional(),
  allowDownloads: z.boolean().optional(),
  allowPresentation: z.boolean().optional(),
  version: z.number().int().min(1).optional(),
});

/** The brand's share links with their state and last use (owners only). */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'shareLink.manage');
  return json({ shareLinks: await listShareLinks(brand) });
});

/** Make a share link; its URL (with the token) is shown once, in this answer. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'shareLink.manage');
  const body = await readJson(request, createBody);
  return json({ shareLink: await createShareLink(caller, brand, body) }, 201);
});

export const ALL = methodNotAllowed;
