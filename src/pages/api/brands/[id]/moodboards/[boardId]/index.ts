import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { boardView, deleteBoard, updateBoard } from '@/lib/moodboards/moodboards.server';
import { updateBoardBody } from '@/lib/moodboards/schemas';

const board = (id: string | undefined) => idParam(id, 'That mood board');

export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ board: await boardView(brand, board(params.boardId)) });
});

/** Rename a board or change its introduction. */
export const PATCH = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ board: await updateBoard(caller, brand, board(params.boardId), await readJson(request, updateBoardBody)) });
});

/** Delete a board with its pieces and decisions (the audit trail keeps the record). */
export const DELETE = endpoint(async ({ locals, params }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  await deleteBoard(caller, brand, board(params.boardId));
  return new Response(null, { status: 204 });
});

export const ALL = methodNotAllowed;
