// Stored objects kept in memory by storage key, for published reads. Keys are content-addressed (a built file's key
// names its hash), so what is kept is never stale and needs no notices; only its total size is bounded.

/** A size-bounded memory of byte buffers, least recently used first out; concurrent misses share one lookup. */
export class ByteMemory {
  private readonly kept = new Map<string, Buffer>();
  private readonly pending = new Map<string, Promise<Buffer | null>>();
  private used = 0;

  constructor(readonly maxBytes: number) {}

  /** Bytes held now. */
  get size(): number {
    return this.used;
  }

  /** The kept bytes under `key` now, or undefined. */
  peek(key: string): Buffer | undefined {
    const hit = this.kept.get(key);
    if (hit) {
      // Most recently used goes to the end of the map's order.
      this.kept.delete(key);
      this.kept.set(key, hit);
    }
    return hit;
  }

  /** The kept bytes under `key`, or the lookup's (kept when they fit; null is never kept). */
  remember(key: string, lookup: () => Promise<Buffer | null>): Promise<Buffer | null> {
    const hit = this.peek(key);
    if (hit) return Promise.resolve(hit);
    const running = this.pending.get(key);
    if (running) return running;
    const found = lookup().then(
      (bytes) => {
        this.pending.delete(key);
        if (bytes) this.keep(key, bytes);
        return bytes;
      },
      (err: unknown) => {
        this.pending.delete(key);
        throw err;
      },
    );
    this.pending.set(key, found);
    return found;
  }

  private keep(key: string, bytes: Buffer): void {
    if (bytes.length > this.maxBytes) return;
    const before = this.kept.get(key);
    if (before) {
      this.kept.delete(key);
      this.used -= before.length;
    }
    while (this.used + bytes.length > this.maxBytes) {
      const [oldest, old] = this.kept.entries().next().value!;
      this.kept.delete(oldest);
      this.used -= old.length;
    }
    this.kept.set(key, bytes);
    this.used += bytes.length;
  }
}
