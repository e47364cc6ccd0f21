// A fixed-window counter per key, in memory and bounded: enough to keep one visitor's page from flooding the recorder.

export class EventLimiter {
  private windowStart = 0;
  private counts = new Map<string, number>();

  constructor(
    private readonly limit: number,
    private readonly windowMs: number,
    private readonly maxKeys = 50_000,
  ) {}

  /** Count one event for `key`; false when the key has used up its window. */
  take(key: string, now = Date.now()): boolean {
    if (now - this.windowStart >= this.windowMs || this.counts.size >= this.maxKeys) {
      this.windowStart = now;
      this.counts.clear();
    }
    const used = (this.counts.get(key) ?? 0) + 1;
    this.counts.set(key, used);
    return used <= this.limit;
  }
}
