import { authorizeBrand } from '@/lib/auth/access.server';
import { endpoint, fileResponse, idParam, methodNotAllowed } from '@/lib/http/api';
import { boardImage } from '@/lib/moodboards/moodboards.server';

/** An image piece's bytes, for the designer's view of the board. */
export const GET = endpoint(async ({ locals, params }) => {
  const { brand } = await authorizeBrand(locals, idParam(params.id), 'draft.read');
  const itemId = idParam(params.itemId, 'That piece');
  const { body, contentType } = await boardImage(brand, idParam(params.boardId, 'That mood board'), itemId);
  return fileResponse(body, contentType, `board-${itemId}`, { inline: true });
});

export const ALL = methodNotAllowed;
