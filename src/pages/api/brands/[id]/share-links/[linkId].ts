import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { revokeShareLink, setLinkPresentation } from '@/lib/publishing/share-links.server';

const changeBody = z.strictObject({
  allowPresentation: z.boolean({ error: 'allowPresentation must be true or false.' }),
});

/** Let a link open the reveal presentation, or stop it (the one setting of a link that may change after it is made). */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'shareLink.manage');
  const body = await readJson(request, changeBody);
  return json({ shareLink: await setLinkPresentation(caller, brand, idParam(params.linkId, 'That share link'), body.allowPresentation) });
});

/** Revoke a share link: anyone holding it gets a clear "no longer works" page from now on. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'shareLink.manage');
  await revokeShareLink(caller, brand, idParam(params.linkId, 'That share link'));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
