import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { saveDraft, TEMPLATES, templateDoc } from '@/lib/guideline/draft.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { loadIdentity } from '@/lib/identity/identity.server';

const body = z.strictObject({
  template: z.enum(TEMPLATES, { error: `Choose a template: ${TEMPLATES.join(', ')}.` }),
  baseRevision: z.number().int().min(0),
});

/** Replace the draft with a starter template filled from the brand's identity (a normal, revisioned save). */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const { template, baseRevision } = await readJson(request, body);
  const doc = await templateDoc(template, await loadIdentity(brand));
  const { revision } = await saveDraft(caller, brand, baseRevision, doc);
  return json({ revision, doc });
});

export const ALL = methodNotAllowed;
