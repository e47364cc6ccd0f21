import { z } from 'zod';
import { authorizeBrand } from '@/lib/auth/access.server';
import { GUIDELINE_LIMITS } from '@/lib/guideline/document';
import { readDraft, saveDraft } from '@/lib/guideline/draft.server';
import { ApiError, endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';

const saveBody = z.strictObject({ baseRevision: z.number().int().min(0), doc: z.unknown() });

/** The working draft: `{revision, doc}`. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json(await readDraft(brand));
});

/** Save the draft against the revision it was edited from; a stale revision is a 409 with the current one. */
export const PUT = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  if (Number(request.headers.get('content-length') ?? 0) > GUIDELINE_LIMITS.maxBytes + 1024) {
    throw new ApiError(413, 'too_large', `A guideline document can be at most ${GUIDELINE_LIMITS.maxBytes / 1024 / 1024} MB.`);
  }
  const body = await readJson(request, saveBody, GUIDELINE_LIMITS.maxBytes + 1024);
  return json(await saveDraft(caller, brand, body.baseRevision, body.doc));
});

export const ALL = methodNotAllowed;
