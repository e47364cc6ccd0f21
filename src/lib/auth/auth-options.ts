// better-auth's options in one place, shared by the server and by the scripts that run its migrations.
import type { BetterAuthOptions } from 'better-auth';
import pg from 'pg';

export interface AuthSettings {
  databaseUrl: string;
  siteUrl: string;
  secret: string;
  /** Sign-in and sign-up attempts allowed per client address per minute. */
  signInLimit: number;
  /** Mails the link that proves an address (the server passes our mail module; scripts that only migrate or seed do not). */
  sendVerificationEmail?: (to: { email: string; name: string }, url: string) => Promise<void>;
  /** Told when an idle connection is dropped (the server logs it; scripts that only migrate or seed end first). */
  onPoolError?: (err: Error) => void;
  /** Where better-auth's own messages go (the server's logger); its coloured console lines otherwise. */
  log?: NonNullable<BetterAuthOptions['logger']>['log'];
}

/** The header our auth route fills from the socket address, so the limiter keys on the real client. */
export const CLIENT_IP_HEADER = 'x-plumbline-client-ip';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 128;

/** How long a link that proves an address works. */
export const VERIFICATION_HOURS = 24;

/** better-auth options: e-mail and password, sessions and rate limits in PostgreSQL, one origin. */
export function authOptions(settings: AuthSettings): BetterAuthOptions {
  const secure = settings.siteUrl.startsWith('https://');
  const pool = new pg.Pool({ connectionString: settings.databaseUrl, max: 5 });
  // An idle connection the database dropped is an 'error' event on the pool: unheard, it would end the process. The
  // pool discards that connection by itself and the next query opens another, so there is nothing more to do here.
  pool.on('error', () => undefined);
  // An idle connection dropped by the server (restart, shutdown) must not take the process down.
  pool.on('error', (err) => settings.onPoolError?.(err));
  return {
    appName: 'Plumbline',
    baseURL: settings.siteUrl,
    basePath: '/api/auth',
    secret: settings.secret,
    trustedOrigins: [settings.siteUrl],
    database: pool,
    ...(settings.log ? { logger: { log: settings.log } } : {}),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: PASSWORD_MIN,
      maxPasswordLength: PASSWORD_MAX,
      autoSignIn: true,
    },
    // An account proves its address by the link mailed at sign-up; until then src/lib/auth/access.server.ts keeps it
    // out of every brand, invitation and mailbox. Signing in still works, so the app can say what to do next.
    emailVerification: {
      sendOnSignUp: true,
      autoSignInAfterVerification: true,
      expiresIn: VERIFICATION_HOURS * 3600,
      ...(settings.sendVerificationEmail
        ? { sendVerificationEmail: ({ user, url }) => settings.sendVerificationEmail!({ email: user.email, name: user.name }, url) }
        : {}),
    },
    // Resending goes through our own limited route (/api/account/verification), never better-auth's open one.
    disabledPaths: ['/send-verification-email'],
    // No cookie cache (a signed-out cookie would work until it runs out): sessions are kept in memory by change
    // notices instead (src/lib/auth/sessions.server.ts), so signing out ends the session in every process within a second.
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24, cookieCache: { enabled: false } },
    rateLimit: {
      enabled: true,
      storage: 'database',
      window: 60,
      max: 300,
      customRules: {
        '/sign-in/email': { window: 60, max: settings.signInLimit },
        '/sign-up/email': { window: 60, max: settings.signInLimit },
      },
    },
    advanced: {
      useSecureCookies: secure,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure },
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
      // Always on, whatever NODE_ENV or TEST say: better-auth would otherwise relax them under a test runner.
      disableOriginCheck: false,
      disableCSRFCheck: false,
    },
    telemetry: { enabled: false },
  };
}
