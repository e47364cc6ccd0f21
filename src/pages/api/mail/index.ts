import { requireCaller } from '../../../lib/auth/access.server';
import { endpoint, json, methodNotAllowed } from '../../../lib/http/api';
import { visibleMail } from '../../../lib/mail/sent-mail.server';

/** Mail kept by the local fake: messages to you, and about brands you own. 404 when real e-mail is in use. */
export const GET = endpoint(async ({ locals }) => json({ messages: await visibleMail(requireCaller(locals)) }));

export const ALL = methodNotAllowed;
