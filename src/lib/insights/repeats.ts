// Which reads count: a repeat of the same read by the same visitor within a short window counts once (a reload, a
// double click, a browser asking again: common practice for page-view counts). It also keeps one visitor hammering an
// address from costing the site a record per request. Pure: the clock is the caller's.

/** Remembers reads for `windowMs`; past `limit` remembered reads it starts afresh (a repeat may then count twice). */
export class RepeatFilter {
  private seen = new Map<string, number>();

  constructor(
    readonly windowMs: number,
    private readonly limit: number,
  ) {}

  /** Whether `key` was let through less than windowMs before `now`; if not, it is let through and remembered. */
  repeats(key: string, now: number): boolean {
    const last = this.seen.get(key);
    if (last !== undefined && now - last < this.windowMs) return true;
    if (this.seen.size >= this.limit) this.seen = new Map();
    this.seen.set(key, now);
    return false;
  }

  forget(): void {
    this.seen = new Map();
  }
}
