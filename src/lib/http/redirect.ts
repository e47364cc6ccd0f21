// Safe "next" targets after sign-in: only paths on our own site.

/** The path to return to, or the dashboard when `next` is missing or points elsewhere. */
export function safeNext(next: string | null | undefined, fallback = '/app'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  return next;
}
