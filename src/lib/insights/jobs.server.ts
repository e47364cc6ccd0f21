// The insights work on the shared queue: writing the recorder's batches, and deleting past days' salts.
import { SiteInsight } from '@db/models';
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

/** Days a record is kept: a year and a month, past the 12-month range. */
export const INSIGHT_RETENTION_DAYS = 400;

/** Minute 2 of every hour (UTC): a past day's salt lives at most an hour into the next day. */
export const INSIGHT_SALT_CLEANUP_CRON = '2 * * * *';

export const insightSaltCleanupJob: JobKind<object> = defineJob({
  name: 'insights-salt-cleanup',
  retryLimit: 2,
  retryDelay: 60,
  expireInSeconds: 5 * 60,
  run: async () => {
    const dropped = await dropPastSalts(utcDay(new Date()));
    // Records older than the longest range shown (12 months) and a margin serve nobody: they go too.
    const [, expired] = await SiteInsight.sequelize!.query(`DELETE FROM site_insights WHERE at < now() - make_interval(days => :days)`, { replacements: { days: INSIGHT_RETENTION_DAYS } });
    if (dropped || (expired as { rowCount?: number })?.rowCount) log.info({ dropped, expired: (expired as { rowCount?: number })?.rowCount ?? 0 }, 'insights: past salts and old records deleted');
  },
});

onWorkerStart(async () => {
  const boss = await queue();
  await boss.schedule(insightSaltCleanupJob.name, INSIGHT_SALT_CLEANUP_CRON, {}, { tz: 'UTC' });
  await sendJob(insightSaltCleanupJob, {}, { singletonKey: 'start' });
});
