// The one job queue (pg-boss on our PostgreSQL) for everything that runs after a request: version builds, their
// PDFs and publish notices. Any process may send; a process that works the queues (the web process today, unless
// QUEUE_WORKER is off; a worker process of its own later) registers every job kind once through startWorker().
import { DATABASE_URL, QUEUE_WORKER } from 'astro:env/server';
import PgBoss from 'pg-boss';
import { log } from '@/lib/log.server';

export interface JobKind<Data extends object> {
  /** The queue's name in pg-boss. */
  name: string;
  /** pg-boss retries a throw this many times (after retryDelay seconds); the handler sees the attempt as retryCount. */
  retryLimit: number;
  retryDelay: number;
  /** A job still active after this long (a killed process) is failed by pg-boss and retried. */
  expireInSeconds: number;
  run(data: Data, job: { id: string; retryCount: number; retryLimit: number }): Promise<void>;
}

// A registered kind has its data type erased: pg-boss hands back whatever was sent under that name.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const kinds = new Map<string, JobKind<any>>();
/** Run once when a worker starts, after its queues are worked (e.g. re-queue builds a killed process left). */
const onStart: (() => Promise<void>)[] = [];

/** Declare a job kind; the module that owns the work calls this at import time. */
export function defineJob<Data extends object>(kind: JobKind<Data>): JobKind<Data> {
  kinds.set(kind.name, kind);
  return kind;
}

/** Work to do each time a worker starts (idempotent: several processes may start at once). */
export function onWorkerStart(task: () => Promise<void>): void {
  onStart.push(task);
}

let boss: Promise<PgBoss> | null = null;

/** pg-boss on our database, started once per process (sending needs no worker). */
export function queue(): Promise<PgBoss> {
  boss ??= (async () => {
    const b = new PgBoss({ connectionString: DATABASE_URL, schema: 'pgboss', max: 4 });
    b.on('error', (err) => log.error({ err }, 'queue: error'));
    await b.start();
    for (const kind of kinds.values()) {
      await b.createQueue(kind.name, { name: kind.name, retryLimit: kind.retryLimit, retryDelay: kind.retryDelay, expireInSeconds: kind.expireInSeconds });
    }
    return b;
  })().catch((err) => {
    boss = null;
    throw err;
  });
  return boss;
}

/** Queue one job of a kind; `db` sends inside a caller's transaction, so the job exists only if it commits. */
export async function sendJob<Data extends object>(kind: JobKind<Data>, data: Data, opts: { db?: PgBoss.Db; singletonKey?: string; priority?: number } = {}): Promise<string | null> {
  return (await queue()).send(kind.name, data, { retryLimit: kind.retryLimit, retryDelay: kind.retryDelay, expireInSeconds: kind.expireInSeconds, ...opts });
}

let working: Promise<void> | null = null;

/** Work every declared queue in this process, one job at a time per kind, then run the start-up tasks. */
export function startWorker(): Promise<void> {
  if (!QUEUE_WORKER) return Promise.resolve();
  working ??= (async () => {
    const b = await queue();
    for (const kind of kinds.values()) {
      await b.work<object>(kind.name, { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true }, async ([job]) => {
        await kind.run(job.data, { id: job.id, retryCount: job.retryCount, retryLimit: job.retryLimit });
      });
    }
    for (const task of onStart) await task().catch((err) => log.error({ err }, 'queue: start-up task failed'));
    log.info({ queues: [...kinds.keys()] }, 'queue: worker started');
  })().catch((err) => {
    working = null;
    log.error({ err }, 'queue: worker did not start');
  });
  return working;
}

/** Stop working (tests and a graceful shutdown); jobs in flight finish first. */
export async function stopQueue(): Promise<void> {
  const b = boss;
  boss = null;
  working = null;
  if (b) await (await b).stop({ graceful: true, wait: true });
}
