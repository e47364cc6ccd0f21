import { endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { tokenParam } from '@/lib/invitations/params';
import { openBoard } from '@/lib/moodboards/moodboards.server';

/** The board as the client sees it; the e-mailed link is the only key. */
export const GET = endpoint(async ({ params }) => json({ board: await openBoard(tokenParam(params.token, 'This mood-board link')) }));

export const ALL = methodNotAllowed;
