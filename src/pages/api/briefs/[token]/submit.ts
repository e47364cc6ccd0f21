import { submitBrief } from '@/lib/briefs/briefs.server';
import { submitBriefBody } from '@/lib/briefs/schemas';
import { endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';

/** Send the answers to the designer; every required question must be answered first. */
export const POST = endpoint(async ({ params, request }) => {
  const token = tokenParam(params.token, 'This questionnaire link');
  await readJson(request, submitBriefBody);
  return json(await submitBrief(token));
});

export const ALL = methodNotAllowed;
