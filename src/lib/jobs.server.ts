// Every kind of queued work, registered by importing its module, and the worker that runs them in this process.
import '@/lib/publishing/build/run.server';
import '@/lib/notices/publish.server';
import '@/lib/assets/expiry-job.server';
import '@/lib/insights/jobs.server';
import { startWorker } from '@/lib/queue.server';

/** Start working the queues here (once per process; a no-op when QUEUE_WORKER is off). */
export const startJobs = (): Promise<void> => startWorker();
