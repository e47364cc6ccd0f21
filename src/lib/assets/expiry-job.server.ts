// The expiry job on the shared queue: hourly through pg-boss's schedule, and once each time a worker starts.
import { defineJob, onWorkerStart, queue, sendJob, type JobKind } from '@/lib/queue.server';
import { sendTemplate, siteLink } from '@/lib/mail/mail.server';
import { runAssetExpiry } from './expiry.server';

/** Minute 7 of every hour (cron syntax, UTC): a missed hour is caught up by the next, as expiry is by calendar day. */
export const ASSET_EXPIRY_CRON = '7 * * * *';

export const assetExpiryJob: JobKind<object> = {
  name: 'asset-expiry',
  retryLimit: 2,
  retryDelay: 60,
  expireInSeconds: 15 * 60,
  run: async (): Promise<void> => {
    await runAssetExpiry(new Date(), { send: sendTemplate, link: siteLink });
  },
};

defineJob(assetExpiryJob);

// Each worker schedules the job hourly (one schedule per name in pg-boss, so several workers agree) and runs it once now.
onWorkerStart(async () => {
  const boss = await queue();
  await boss.schedule(assetExpiryJob.name, ASSET_EXPIRY_CRON, {}, { tz: 'UTC' });
  await sendJob(assetExpiryJob, {}, { singletonKey: 'start' });
});
