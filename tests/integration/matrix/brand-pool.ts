// Fixture brands built ahead, a few at a time, while the matrix runs its other cases.
import { makeBrand, type Cast, type Fixture } from '../fixtures';

export interface BrandPool {
  /** The next brand of its own, waiting for it if it is still being built; built on demand past `count`. */
  take(): Promise<Fixture>;
  /** Start no more builds and wait for the ones under way. */
  close(): Promise<void>;
}

/** `count` fresh brands (each exactly as makeBrand() makes it), at most `concurrency` built at once. */
export function brandPool(cast: Cast, count: number, concurrency: number): BrandPool {
  let running = 0;
  let closed = false;
  const waiting: (() => void)[] = [];
  const acquire = () => (running < concurrency ? (running++, Promise.resolve()) : new Promise<void>((r) => waiting.push(r)));
  // A freed slot goes straight to the next waiter, so no more than `concurrency` builds ever run.
  const release = () => (waiting.length ? waiting.shift()!() : running--);
  const build = async (i: number): Promise<Fixture> => {
    await acquire();
    try {
      if (closed) throw new Error('the brand pool was closed');
      return await makeBrand(cast, `Matrix Brand ${i + 1}`);
    } finally {
      release();
    }
  };
  const builds = Array.from({ length: count }, (_, i) => build(i));
  // A failed build fails the case that takes it; until then it is not an unhandled rejection.
  for (const b of builds) b.catch(() => undefined);
  let next = 0;
  return {
    take: () => (next < builds.length ? builds[next++] : build(next++)),
    async close() {
      closed = true;
      await Promise.allSettled(builds);
    },
  };
}
