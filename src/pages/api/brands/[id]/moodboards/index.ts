import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, idParam, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { directionStatus } from '@/lib/moodboards';
import { createBoard, listBoards } from '@/lib/moodboards/moodboards.server';
import { createBoardBody } from '@/lib/moodboards/schemas';

/** The brand's mood boards and whether a direction is approved. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  return json({ boards: await listBoards(brand), direction: await directionStatus(brand.id) });
});

/** Start a board, optionally with swatches, type samples and notes. */
export const POST = endpoint(async ({ locals, params, request }) => {
  const { caller, brand } = await authorizeBrand(locals, idParam(params.id), 'draft.edit');
  return json({ board: await createBoard(caller, brand, await readJson(request, createBoardBody)) }, 201);
});

export const ALL = methodNotAllowed;
