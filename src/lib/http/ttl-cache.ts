// A small in-process cache whose entries live for a fixed number of milliseconds.

export class TtlCache<V> {
  private readonly entries = new Map<string, { value: V; until: number }>();

  constructor(
    private readonly ttlMs: number,
    private readonly maxEntries = 10_000,
  ) {}

  /** The live value under `key`, or undefined. */
  get(key: string): V | undefined {
    const hit = this.entries.get(key);
    if (!hit) return undefined;
    if (hit.until < Date.now()) {
      this.entries.delete(key);
      return undefined;
    }
    return hit.value;
  }

  /** Forget everything (e.g. after a revocation). */
  clear(): void {
    this.entries.clear();
  }

  set(key: string, value: V): void {
    if (this.entries.size >= this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
    this.entries.set(key, { value, until: Date.now() + this.ttlMs });
  }
}
