// The server's better-auth instance, configured from astro:env.
import { betterAuth } from 'better-auth';
import { AUTH_SECRET, AUTH_SIGN_IN_LIMIT, DATABASE_URL, SITE_URL } from 'astro:env/server';
import { log } from '@/lib/log.server';
import { sendTemplate } from '@/lib/mail/mail.server';
import { authOptions, VERIFICATION_HOURS } from './auth-options';

export const auth = betterAuth(
  authOptions({
    databaseUrl: DATABASE_URL,
    siteUrl: SITE_URL,
    secret: AUTH_SECRET,
    signInLimit: AUTH_SIGN_IN_LIMIT,
    sendVerificationEmail: async (to, url) => {
      const outcome = await sendTemplate(to.email, 'verify-email', { name: to.name, email: to.email, hours: VERIFICATION_HOURS, link: url });
      if (!outcome.sent) log.error({ to: to.email, problem: outcome.problem }, 'auth: the address link was not sent');
    },
    onPoolError: (err) => log.error({ err }, 'auth: database connection lost'),
    log: (level, message, ...args) => {
      const err = args.find((a) => a instanceof Error);
      const details = args.filter((a) => !(a instanceof Error));
      log[level]({ ...(err ? { err } : {}), ...(details.length ? { details } : {}) }, `auth: ${message}`);
    },
  }),
);

export type AuthSession = typeof auth.$Infer.Session;
