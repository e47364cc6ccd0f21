import { openBrief, saveAnswers } from '@/lib/briefs/briefs.server';
import { MAX_ANSWERS_BYTES, saveAnswersBody } from '@/lib/briefs/schemas';
import { endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';

/** The questionnaire and the answers saved so far; the link is the only key (no account). */
export const GET = endpoint(async ({ params }) => {
  return json({ brief: await openBrief(tokenParam(params.token, 'This questionnaire link')) });
});

/** Autosave: merge the answers given into the saved ones. */
export const PUT = endpoint(async ({ params, request }) => {
  const token = tokenParam(params.token, 'This questionnaire link');
  const { answers } = await readJson(request, saveAnswersBody, MAX_ANSWERS_BYTES);
  return json(await saveAnswers(token, answers));
});

export const ALL = methodNotAllowed;
