// The captured-mail viewer's one access rule, for its page and its API alike: while the local catcher is in use,
// a signed-in person whose address is proven reads the messages sent to that address, as a real mailbox would,
// and nothing else. Senders do not see what they sent: the links in it (invitations, briefs, boards) are the
// recipient's keys.
import { isVerified, requireCaller, unverifiedError } from '@/lib/auth/access.server';
import { ApiError } from '@/lib/http/api';
import { listCaptured, type CapturedMail } from './captured';
import { captureDir } from './mail.server';

/** Whether the local catcher is in use (the viewer exists only then). */
export const sentMailAvailable = () => captureDir() !== null;

/** The messages the caller may read, newest first (at most `limit`); 404 with a real relay, 401 anonymous, 403 unproven. */
export async function visibleMail(locals: App.Locals, limit = 200): Promise<{ address: string; messages: CapturedMail[] }> {
  const dir = captureDir();
  if (!dir) throw new ApiError(404, 'not_found', 'This server sends real e-mail; there is no local mail catcher to read.');
  const caller = requireCaller(locals);
  if (!(await isVerified(locals))) throw unverifiedError(caller.email);
  return { address: caller.email, messages: listCaptured(dir, { to: caller.email, limit }) };
}
