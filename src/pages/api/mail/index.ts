import { endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { visibleMail } from '@/lib/mail/sent-mail.server';

/** Mail kept by the local catcher for your proven address. 404 when real e-mail is in use. */
export const GET = endpoint(async ({ locals }) => json({ messages: (await visibleMail(locals)).messages }));

export const ALL = methodNotAllowed;
