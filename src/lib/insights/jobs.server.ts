// The insights work on the shared queue: writing the recorder's batches, and deleting past days' salts.
import { log } from '@/lib/log.server';
import { defineJob, onWorkerStart, queue, sendJob, type JobKind } from '@/lib/queue.server';
import { insightBatchSchema, utcDay, type InsightBatch } from './rows';
import { dropPastSalts } from './salts.server';
import { writeInsights } from './writer';

export const insightsWriteJob: JobKind<InsightBatch> = defineJob({
  name: 'insights-write',
  retryLimit: 3,
  retryDelay: 10,
  expireInSeconds: 5 * 60,
  run: async (data) => {
    const parsed = insightBatchSchema.safeParse(data);
    // A malformed batch cannot become right by retrying: note it and let it go.
    if (!parsed.success) return void log.warn({ issues: parsed.error.issues.slice(0, 3) }, 'insights: batch refused');
    await writeInsights(parsed.data.rows);
  },
});

/** Minute 2 of every hour (UTC): a past day's salt lives at most an hour into the next day. */
export const INSIGHT_SALT_CLEANUP_CRON = '2 * * * *';

export const insightSaltCleanupJob: JobKind<object> = defineJob({
  name: 'insights-salt-cleanup',
  retryLimit: 2,
  retryDelay: 60,
  expireInSeconds: 5 * 60,
  run: async () => {
    const dropped = await dropPastSalts(utcDay(new Date()));
    if (dropped) log.info({ dropped }, 'insights: past salts deleted');
  },
});

onWorkerStart(async () => {
  const boss = await queue();
  await boss.schedule(insightSaltCleanupJob.name, INSIGHT_SALT_CLEANUP_CRON, {}, { tz: 'UTC' });
  await sendJob(insightSaltCleanupJob, {}, { singletonKey: 'start' });
});
