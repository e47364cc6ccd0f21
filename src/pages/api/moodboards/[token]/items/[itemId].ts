import { endpoint, fileResponse, idParam, methodNotAllowed } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';
import { boardImageByToken } from '@/lib/moodboards/moodboards.server';

/** An image piece of the board, for the client's link. */
export const GET = endpoint(async ({ params }) => {
  const itemId = idParam(params.itemId, 'That piece');
  const { body, contentType } = await boardImageByToken(tokenParam(params.token, 'This mood-board link'), itemId);
  return fileResponse(body, contentType, `board-${itemId}`, { inline: true });
});

export const ALL = methodNotAllowed;
