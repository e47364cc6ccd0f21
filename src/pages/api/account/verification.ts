import { z } from 'zod';
import { auth } from '@/lib/auth/auth.server';
import { isVerified, requireCaller } from '@/lib/auth/access.server';
import { ApiError, endpoint, json, methodNotAllowed, readJson } from '@/lib/http/api';
import { safeNext } from '@/lib/http/redirect';
import { log } from '@/lib/log.server';
import { allowVerificationResend } from '@/lib/mail/send-limit.server';

const resendBody = z.strictObject({
  /** Where the link lands once opened: a path on this site (e.g. the invitation being accepted). */
  next: z.string().max(500).optional(),
});

/** Whether the signed-in account has proven its address. */
export const GET = endpoint(async ({ locals }) => {
  const caller = requireCaller(locals);
  return json({ email: caller.email, verified: await isVerified(locals) });
});

/** Mail a new link that proves the address; limited per account. */
export const POST = endpoint(async ({ locals, request }) => {
  const caller = requireCaller(locals);
  const body = await readJson(request, resendBody);
  if (await isVerified(locals)) throw new ApiError(409, 'already_verified', `${caller.email} is already confirmed.`);
  await allowVerificationResend(caller.id);
  try {
    await auth.api.sendVerificationEmail({ body: { email: caller.email, callbackURL: safeNext(body.next) }, headers: request.headers });
  } catch (err) {
    log.error({ err }, 'auth: a new address link could not be made');
    throw new ApiError(502, 'mail_failed', 'The link could not be sent just now. Try again in a minute.');
  }
  return json({ sent: true, email: caller.email });
});

export const ALL = methodNotAllowed;
