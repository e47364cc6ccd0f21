// Signed-in sessions, read from better-auth's table once and then kept in memory until a change notice says the
// session or its account changed (src/lib/live): signing out, revoking sessions, changing the password with "sign
// out elsewhere" and deleting an account delete session rows, and the database announces each deletion, so every
// process refuses the session within a second. Measured in bench/live.bench.ts: reading the session on every
// request made a member's published page about a quarter as fast as a share-link visitor's.
import { noticeBoard } from '@/lib/live/notices.server';
import { auth, type AuthSession } from './auth.server';

/**
 * A kept session is read again after this long, so better-auth still extends an active session's expiry (it does
 * so on a read once a day, `updateAge`). Changes never wait for it: they arrive as notices.
 */
const READ_AGAIN_AFTER_MS = 10 * 60_000;

interface KeptSession {
  found: AuthSession | null;
  readAt: number;
}

const sessions = noticeBoard.memory<KeptSession>('sessions', ['session', 'user'], {
  concerns: (notice, kept) => !kept.found || (notice.kind === 'session' ? kept.found.session.id === notice.id : kept.found.user.id === notice.id),
  // An unknown or forged cookie is not kept: it would only crowd out real sessions.
  keepIf: (kept) => kept.found !== null,
});

const usable = (kept: KeptSession, now: number) => kept.found !== null && now - kept.readAt < READ_AGAIN_AFTER_MS && new Date(kept.found.session.expiresAt).getTime() > now;

/** The session and account behind the request's session cookie `cookieValue`, or null. */
export async function sessionFor(cookieValue: string, headers: Headers): Promise<AuthSession | null> {
  const read = async (): Promise<KeptSession> => ({ found: await auth.api.getSession({ headers }), readAt: Date.now() });
  const kept = await sessions.remember(cookieValue, read);
  if (kept.found === null || usable(kept, Date.now())) return kept.found;
  // Old or past its expiry: ask the table again.
  sessions.drop(cookieValue);
  return (await sessions.remember(cookieValue, read)).found;
}

/** Every session cookie a Cookie header carries, name and value: all that better-auth reads to find the session. */
export const sessionKey = (cookie: string) => [...cookie.matchAll(/(?:^|;)\s*([^=;\s]*session_token)=([^;]*)/g)].map((m) => `${m[1]}=${m[2]}`).join('; ') || null;

/**
 * The kept session behind `cookieValue` without waiting: the session (or null for a kept refusal) when this process
 * holds a usable answer, undefined when it must be read (sessionFor). For the fast path of published reads.
 */
export function keptSession(cookieValue: string): AuthSession | null | undefined {
  const kept = sessions.get(cookieValue);
  return kept && usable(kept, Date.now()) ? kept.found : undefined;
}

/** This process ends its memory of a session at once when the person signs out here (the notice follows). */
export const forgetSession = (cookieValue: string): void => sessions.drop(cookieValue);
