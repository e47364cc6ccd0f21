// The server's better-auth instance, configured from astro:env.
import { betterAuth } from 'better-auth';
import { AUTH_SECRET, AUTH_SIGN_IN_LIMIT, DATABASE_URL, SITE_URL } from 'astro:env/server';
import { authOptions } from './auth-options';

export const auth = betterAuth(
  authOptions({ databaseUrl: DATABASE_URL, siteUrl: SITE_URL, secret: AUTH_SECRET, signInLimit: AUTH_SIGN_IN_LIMIT }),
);

export type AuthSession = typeof auth.$Infer.Session;
