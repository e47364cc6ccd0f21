// Recording what published sites are read. Called on the hot path of every published read: it must return at once
// and never throw (the recorder buffers in memory and hands batches to the queue).
import type { SiteRead } from './contract';

/** Note one read; returns at once. (Stub until the insights recorder lands: it records nothing.) */
export function recordRead(read: SiteRead): void {
  void read;
}
