// Reading what the local fake SMTP server kept (src/lib/mail/fake-smtp.ts), from the test process.
import { inject } from 'vitest';
import { listCaptured, type CapturedMail } from '@/lib/mail/captured';

/** Every message to `address`, newest first. The app awaits the SMTP reply, so a message exists once its request returned. */
export const mailTo = (address: string): CapturedMail[] => listCaptured(inject('mailDir'), { to: address });

/** Wait (10 s at most) until `address` has more than `count` messages: mail sent by a queue job, e.g. publish notices. */
export async function waitForMail(address: string, count: number): Promise<CapturedMail[]> {
  for (let i = 0; i < 100; i++) {
    const mails = mailTo(address);
    if (mails.length > count) return mails;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no new e-mail reached ${address} within 10 s`);
}

/** The newest message to `address`, or a clear failure. */
export function lastMailTo(address: string): CapturedMail {
  // Only the newest is read: the role matrix sends the same people hundreds of invitations.
  const [mail] = listCaptured(inject('mailDir'), { to: address, limit: 1 });
  if (!mail) throw new Error(`no e-mail was captured for ${address}`);
  return mail;
}

/** The first link in a message's plain text under `path` (e.g. "/invite/"), and the token after it. */
export function linkIn(mail: CapturedMail, path: string): { url: string; token: string } {
  const m = mail.text.match(new RegExp(`https?://[^\\s]+${path.replace(/\//g, '\\/')}([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${path} link in "${mail.subject}"`);
  return { url: m[0], token: m[1] };
}
