// How much mail one account may cause: a PostgreSQL-backed count per account, so it holds across processes.
import { MAIL_SEND_LIMIT } from 'astro:env/server';
import { ApiError } from '@/lib/http/api';
import { consumeAttempt } from '@/lib/publishing/rate-limit.server';

/** The window MAIL_SEND_LIMIT counts in. */
export const MAIL_WINDOW_SECONDS = 3600;

/** New address links an account may ask for, and in how long (on top of the account's mail limit). */
export const VERIFY_RESEND_MAX = 3;
export const VERIFY_RESEND_WINDOW_SECONDS = 15 * 60;

const tooMany = (message: string) => new ApiError(429, 'too_many_messages', message);

/**
 * Count one mail-sending action (an invitation, a resend, a brief, a board, a review request) against the account;
 * a 429 `too_many_messages` once MAIL_SEND_LIMIT fell in the last hour. Called before anything is saved.
 */
export async function allowMessage(userId: string, limit = MAIL_SEND_LIMIT): Promise<void> {
  if (!(await consumeAttempt(`mail:${userId}`, limit, MAIL_WINDOW_SECONDS))) {
    throw tooMany(`This account has sent ${limit} e-mails in the last hour, the most allowed. Nothing was sent or saved; try again later.`);
  }
}

/** A new address link: at most VERIFY_RESEND_MAX per quarter hour, and it counts as mail too. */
export async function allowVerificationResend(userId: string): Promise<void> {
  if (!(await consumeAttempt(`verify-resend:${userId}`, VERIFY_RESEND_MAX, VERIFY_RESEND_WINDOW_SECONDS))) {
    throw tooMany(`A new link was sent ${VERIFY_RESEND_MAX} times in the last ${VERIFY_RESEND_WINDOW_SECONDS / 60} minutes. Check your inbox (and spam folder), or try again later.`);
  }
  await allowMessage(userId);
}
