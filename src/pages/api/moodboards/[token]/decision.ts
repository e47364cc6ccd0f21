import { endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';
import { decideBoard } from '@/lib/moodboards/moodboards.server';
import { decisionBody } from '@/lib/moodboards/schemas';

/** The client's decision: each piece keep or drop, the board approved or sent back with comments. */
export const POST = endpoint(async ({ params, request }) => {
  const token = tokenParam(params.token, 'This mood-board link');
  return json({ board: await decideBoard(token, await readJson(request, decisionBody)) });
});

export const ALL = methodNotAllowed;
