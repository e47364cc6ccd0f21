import { authorizeBrand } from '@/lib/auth/access.server';
import { listBriefs, questionnaireTemplates, sendBrief } from '@/lib/briefs/briefs.server';
import { sendBriefBody } from '@/lib/briefs/schemas';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { allowMessage } from '@/lib/mail/send-limit.server';

/** The brand's briefs and the questionnaires one can be made from. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const templates = questionnaireTemplates().map((q) => ({ id: q.id, title: q.title, intro: q.intro, questions: q.sections.reduce((n, s) => n + s.questions.length, 0) }));
  return json({ briefs: await listBriefs(brand), templates });
});

/** Send a questionnaire to a client contact; they answer through the e-mailed link, without an account. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, sendBriefBody);
  await allowMessage(caller.id);
  const { brief, mail } = await sendBrief(caller, brand, body);
  return json({ brief, mailed: mail.sent, ...(mail.problem ? { mailProblem: mail.problem } : {}) }, 201);
});

export const ALL = methodNotAllowed;
