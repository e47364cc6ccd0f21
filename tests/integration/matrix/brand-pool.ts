// Fixture brands built ahead, a few at a time, while the matrix runs its other cases.
import { makeBrand, type Cast, type Fixture } from '../fixtures';

/** What a brand of the pool holds: everything, or everything but the client work (makeBrand's `clientWork`). */
export interface BrandKind {
  clientWork: boolean;
}

export interface BrandPool {
  /** The next unused brand of this kind, waiting for it while it is being built; built on demand when none is left. */
  take(kind: BrandKind): Promise<Fixture>;
  /** Start no more builds and wait for the ones under way. */
  close(): Promise<void>;
}

/** One fresh brand per entry of `kinds` (in the order the cases will take them), at most `concurrency` built at once. */
export function brandPool(cast: Cast, kinds: BrandKind[], concurrency: number): BrandPool {
  let running = 0;
  let closed = false;
  const waiting: (() => void)[] = [];
  const acquire = () => (running < concurrency ? (running++, Promise.resolve()) : new Promise<void>((r) => waiting.push(r)));
  // A freed slot goes straight to the next waiter, so no more than `concurrency` builds ever run.
  const release = () => (waiting.length ? waiting.shift()!() : running--);
  let made = 0;
  const build = async (kind: BrandKind): Promise<Fixture> => {
    await acquire();
    try {
      if (closed) throw new Error('the brand pool was closed');
      return await makeBrand(cast, `Matrix Brand ${++made}`, kind);
    } finally {
      release();
    }
  };
  const builds = kinds.map((kind) => ({ kind, brand: build(kind), taken: false }));
  // A failed build fails the case that takes it; until then it is not an unhandled rejection.
  for (const b of builds) b.brand.catch(() => undefined);
  return {
    take(kind) {
      const next = builds.find((b) => !b.taken && b.kind.clientWork === kind.clientWork);
      if (!next) return build(kind);
      next.taken = true;
      return next.brand;
    },
    async close() {
      closed = true;
      await Promise.allSettled(builds.map((b) => b.brand));
    },
  };
}
