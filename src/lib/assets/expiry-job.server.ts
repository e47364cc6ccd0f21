// The expiry job's registration: hourly through pg-boss's schedule, and once when the process starts.
// Its shape is the shared queue's JobKind (name, retries, expiry, run), so it can move onto that module unchanged.
import { DATABASE_URL } from 'astro:env/server';
import PgBoss from 'pg-boss';
import { log } from '@/lib/log.server';
import { sendTemplate, siteLink } from '@/lib/mail/mail.server';
import { runAssetExpiry } from './expiry.server';

/** Minute 7 of every hour (cron syntax, UTC): a missed hour is caught up by the next, as expiry is by calendar day. */
export const ASSET_EXPIRY_CRON = '7 * * * *';

export const assetExpiryJob = {
  name: 'asset-expiry',
  retryLimit: 2,
  retryDelay: 60,
  expireInSeconds: 15 * 60,
  run: async (): Promise<void> => {
    await runAssetExpiry(new Date(), { send: sendTemplate, link: siteLink });
  },
};

let started: Promise<void> | null = null;

/** Work and schedule the expiry queue in this process, then run the job once now. Idempotent; failures are logged. */
export function startAssetExpiry(): Promise<void> {
  started ??= (async () => {
    const boss = new PgBoss({ connectionString: DATABASE_URL, schema: 'pgboss', max: 2 });
    boss.on('error', (err) => log.error({ err }, 'asset expiry: queue error'));
    await boss.start();
    const { name, retryLimit, retryDelay, expireInSeconds } = assetExpiryJob;
    await boss.createQueue(name, { name, retryLimit, retryDelay, expireInSeconds });
    await boss.work(name, { batchSize: 1, pollingIntervalSeconds: 5 }, () => assetExpiryJob.run());
    await boss.schedule(name, ASSET_EXPIRY_CRON, {}, { tz: 'UTC' });
    await boss.send(name, {}, { singletonKey: 'start', singletonSeconds: 60 });
  })().catch((err) => {
    started = null;
    log.error({ err }, 'asset expiry: the job could not start');
  });
  return started;
}
