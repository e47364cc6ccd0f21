// Sending: one nodemailer transport from the astro:env settings; a failed send is reported, never thrown.
import nodemailer, { type Transporter } from 'nodemailer';
import { MAIL_CAPTURE_DIR, MAIL_FROM, SITE_URL, SMTP_HOST, SMTP_PASSWORD, SMTP_PORT, SMTP_USER } from 'astro:env/server';
import { log } from '@/lib/log.server';
import { renderMail, type TemplateData } from './templates';

let transport: Transporter | null | undefined;

/** The transport, or null when no SMTP host is configured. */
function transporter(): Transporter | null {
  if (transport !== undefined) return transport;
  transport = SMTP_HOST
    ? nodemailer.createTransport({
        host: SMTP_HOST,
        port: SMTP_PORT,
        secure: SMTP_PORT === 465,
        // The local fake speaks plain SMTP only; a real relay upgrades with STARTTLS.
        ignoreTLS: captureDir() !== null,
        auth: SMTP_USER ? { user: SMTP_USER, pass: SMTP_PASSWORD ?? '' } : undefined,
      })
    : null;
  return transport;
}

/** The local catcher listens on loopback; a relay anywhere else is real mail, whatever MAIL_CAPTURE_DIR says. */
const loopback = (host: string | undefined) => !!host && /^(127\.\d+\.\d+\.\d+|localhost|::1|\[::1\])$/i.test(host);

/** The local catcher's folder while it is in use (the captured-mail viewer exists only then), else null. */
export const captureDir = (): string | null => (MAIL_CAPTURE_DIR && loopback(SMTP_HOST) ? MAIL_CAPTURE_DIR : null);

/** An absolute link on the configured site. */
export const siteLink = (path: string) => new URL(path, SITE_URL).toString();

export interface MailOutcome {
  sent: boolean;
  /** Why not, in words for the person who triggered it. */
  problem?: string;
}

/** Render template `name` with `data` and send it to one person; the brand id travels in a header. */
export async function sendTemplate(to: string, name: string, data: TemplateData, brandId?: string | null): Promise<MailOutcome> {
  const t = transporter();
  if (!t) return { sent: false, problem: 'E-mail is not set up on this server (no SMTP host), so nothing was sent.' };
  const message = renderMail(name, { siteUrl: SITE_URL, ...data });
  try {
    await t.sendMail({
      from: MAIL_FROM,
      to,
      subject: message.subject,
      text: message.text,
      html: message.html,
      headers: brandId ? { 'X-Plumbline-Brand': brandId } : {},
    });
    return { sent: true };
  } catch (err) {
    log.error({ err, template: name, to }, 'mail: sending failed');
    return { sent: false, problem: 'The e-mail could not be sent just now. Everything else was saved; try sending it again later.' };
  }
}
