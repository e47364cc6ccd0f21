import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { allowMessage } from '@/lib/mail/send-limit.server';
import { sendBoard } from '@/lib/moodboards/moodboards.server';
import { sendBoardBody } from '@/lib/moodboards/schemas';

/** E-mail the board to a client contact for a decision on direction. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  const body = await readJson(request, sendBoardBody);
  await allowMessage(caller.id);
  const { board, mail } = await sendBoard(caller, brand, idParam(params.boardId, 'That mood board'), body);
  return json({ board, mailed: mail.sent, ...(mail.problem ? { mailProblem: mail.problem } : {}) });
});

export const ALL = methodNotAllowed;
