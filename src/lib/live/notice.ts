// Change notices between processes: what one says (a kind of row and its id, sent by database triggers on one
// channel) and the memories they keep current. Pure: the PostgreSQL side is in notices.server.ts.
import { z } from 'zod';

/** The one channel; the triggers of db/migrations/20261202135000-add-change-notices.ts (and later ones) send on it. */
export const CHANGE_CHANNEL = 'plumbline_changes';

export const NOTICE_KINDS = ['link', 'member', 'brand', 'version', 'user', 'session', 'handover'] as const;
export type NoticeKind = (typeof NOTICE_KINDS)[number];

/** A payload as received: hostile until this accepted it (anyone with database access may NOTIFY). */
export const changeNoticeSchema = z.strictObject({
  kind: z.enum(NOTICE_KINDS),
  id: z.string().min(1).max(100).regex(/^[\w-]+$/),
});
export type ChangeNotice = z.infer<typeof changeNoticeSchema>;

/** A notice read from a raw payload, or null when it is not one of ours. */
export function readNotice(payload: string | undefined): ChangeNotice | null {
  if (!payload || payload.length > 1000) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(payload);
  } catch {
    return null;
  }
  const notice = changeNoticeSchema.safeParse(parsed);
  return notice.success ? notice.data : null;
}

/** Milliseconds to wait before reconnecting attempt `n` (0-based): doubling from 100 ms, at most 5 s. */
export const reconnectDelay = (attempt: number): number => Math.min(5000, 100 * 2 ** Math.min(attempt, 10));

/**
 * How long a confirmation that the notice connection is current stays good. A memory answers only while the last
 * confirmed round trip was sent within this window, so a silently dead connection can make a process late by
 * less than a second, never more.
 */
export const CURRENT_FOR_MS = 750;

/** One process's notice-kept memories and whether notices are reaching it. */
export class NoticeBoard {
  private readonly memories = new Set<NoticeKeptMemory<unknown>>();
  /** When the last round trip that proves every earlier notice arrived was sent (ms since epoch), or null. */
  private currentAsOf: number | null = null;

  constructor(private readonly now: () => number = Date.now) {}

  /** Memories answer only while notices demonstrably reach this process. */
  get current(): boolean {
    return this.currentAsOf !== null && this.now() - this.currentAsOf < CURRENT_FOR_MS;
  }

  /** A round trip sent at `sentAt` came back on the listening connection: notices sent before it have arrived. */
  confirm(sentAt: number): void {
    if (this.currentAsOf === null || sentAt > this.currentAsOf) this.currentAsOf = sentAt;
  }

  /** The listening connection was (re)established: whatever was kept may have missed notices, so it all goes once. */
  resume(sentAt: number): void {
    this.forgetAll();
    this.currentAsOf = sentAt;
  }

  /** The connection was lost: memories stop answering until it is back. */
  lost(): void {
    this.currentAsOf = null;
    this.forgetAll();
  }

  hear(notice: ChangeNotice): void {
    for (const memory of this.memories) if (memory.kinds.includes(notice.kind)) memory.heard(notice);
  }

  forgetAll(): void {
    for (const memory of this.memories) memory.forget();
  }

  /** A memory of lookups that a notice of `kinds` makes stale: all of them, or those `options.concerns` names. */
  memory<V>(name: string, kinds: readonly NoticeKind[], options: MemoryOptions<V> = {}): NoticeKeptMemory<V> {
    const memory = new NoticeKeptMemory<V>(name, kinds, this, options);
    this.memories.add(memory as NoticeKeptMemory<unknown>);
    return memory;
  }
}

export interface MemoryOptions<V> {
  /** At most this many entries, the oldest going first (default 10 000). */
  maxEntries?: number;
  /** Which kept values a notice makes stale; without it, every one. */
  concerns?: (notice: ChangeNotice, value: V) => boolean;
  /** Whether a looked-up value is worth keeping (e.g. not an unknown token); without it, every one. */
  keepIf?: (value: V) => boolean;
}

/** Lookups kept until a notice of one of its kinds says they may have changed; never trusted without notices. */
export class NoticeKeptMemory<V> {
  private readonly entries = new Map<string, V>();
  /** Counts notices heard, so a lookup that was running while one arrived is not kept. */
  private generation = 0;
  private readonly maxEntries: number;

  constructor(
    readonly name: string,
    readonly kinds: readonly NoticeKind[],
    private readonly board: NoticeBoard,
    private readonly options: MemoryOptions<V>,
  ) {
    this.maxEntries = options.maxEntries ?? 10_000;
  }

  get size(): number {
    return this.entries.size;
  }

  /** The kept value under `key`, or undefined (also whenever notices are not reaching this process). */
  get(key: string): V | undefined {
    return this.board.current ? this.entries.get(key) : undefined;
  }

  /** The kept value, or the lookup's, kept for next time unless a notice arrived meanwhile. */
  async remember(key: string, lookup: () => Promise<V>): Promise<V> {
    const hit = this.get(key);
    if (hit !== undefined) return hit;
    const since = this.generation;
    const value = await lookup();
    if (since === this.generation && this.board.current && (this.options.keepIf?.(value) ?? true)) {
      if (this.entries.size >= this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
      this.entries.set(key, value);
    }
    return value;
  }

  /** A notice of one of its kinds: drop what it concerns. */
  heard(notice: ChangeNotice): void {
    this.generation++;
    const concerns = this.options.concerns;
    if (!concerns) return this.entries.clear();
    for (const [key, value] of this.entries) if (concerns(notice, value)) this.entries.delete(key);
  }

  /** Drop one entry (e.g. a session this process just ended). */
  drop(key: string): void {
    this.generation++;
    this.entries.delete(key);
  }

  forget(): void {
    this.entries.clear();
    this.generation++;
  }
}
