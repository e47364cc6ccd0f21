// Once per run: a throwaway PostgreSQL cluster on a free loopback port, the schema and demo, the built
// server on a free port. Everything is removed afterwards, also when tests fail.
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { buildAppInBackground, prepareDatabase, startServer } from '../../scripts/lib/prepare';
import { ensureDebianPackages, MACHINE_PACKAGES, POSTGRESQL } from '../../scripts/lib/debian';
import { dropCluster, freePort, startCluster } from '../../scripts/lib/postgres';
import { startFakeSmtp, type FakeSmtp } from '@/lib/mail/fake-smtp';
import { localPaymentKeys, startFakePayments, type FakePayments } from '../../scripts/lib/fake-payments';

let server: ChildProcess | undefined;
let clusterDir: string | undefined;
let smtp: FakeSmtp | undefined;
let payments: FakePayments | undefined;

export async function setup(project: TestProject): Promise<void> {
  // The same packages as `npm start`, in one apt run: PostgreSQL, the browser the browser tests and PDFs use, Ghostscript.
  // As root they are installed. Otherwise the missing ones are named with the command: without PostgreSQL the run
  // stops here; without chromium the browser and PDF tests fail with that same advice (they never skip).
  try {
    ensureDebianPackages(MACHINE_PACKAGES);
  } catch (err) {
    if (!POSTGRESQL.present()) throw err;
    console.warn(`\n${(err as Error).message}\n`);
  }
  // The suite builds into its own folder, so it never disturbs a running `npm start`.
  process.env.PLUMBLINE_OUT_DIR ??= join(process.cwd(), 'dist-test');
  // The build runs beside the cluster, the schema and the demo; the server waits for both.
  const built = process.env.PLUMBLINE_TEST_SKIP_BUILD === '1' ? Promise.resolve() : buildAppInBackground();
  // Until it is awaited below, a failed build must not count as an unhandled rejection.
  built.catch(() => undefined);
  clusterDir = mkdtempSync(join(tmpdir(), 'plumbline-test-'));
  const cluster = startCluster(clusterDir, await freePort(), { throwaway: true });
  const port = await freePort();
  const siteUrl = `http://127.0.0.1:${port}`;
  const secret = 'test-secret-that-is-long-enough-for-better-auth';
  // A generous sign-in limit: the suite signs in many people from one address; the limiter has its own test.
  const signInLimit = 10_000;
  const filesDir = join(clusterDir, 'files');
  await prepareDatabase({ databaseUrl: cluster.url, siteUrl, secret, signInLimit }, { filesDir });
  // The local fake SMTP server keeps every message the app sends as JSON in mailDir (src/lib/mail/fake-smtp.ts).
  smtp = await startFakeSmtp({ dir: join(clusterDir, 'mail') });
  const mail = { smtpHost: smtp.host, smtpPort: smtp.port, captureDir: smtp.dir };
  // Likewise for mail: one owner sends hundreds of invitations across the role matrix; the limit has its own test.
  const mailSendLimit = 1_000_000;
  // The local fake of the payment provider, its webhooks signed for this server (scripts/lib/fake-payments.ts).
  payments = await startFakePayments({ ...localPaymentKeys(), webhookUrl: `${siteUrl}/api/payments/webhook` });
  await built;
  server = await startServer({ host: '127.0.0.1', port, databaseUrl: cluster.url, siteUrl, secret, signInLimit, mailSendLimit, filesDir, mail, payments: payments.settings }, { quiet: true });
  project.provide('baseUrl', siteUrl);
  project.provide('databaseUrl', cluster.url);
  project.provide('mailDir', smtp.dir);
  project.provide('filesDir', filesDir);
  project.provide('clusterDir', clusterDir);
  project.provide('payments', { url: payments.url, webhookSecret: payments.settings.STRIPE_WEBHOOK_SECRET, secretKey: payments.settings.STRIPE_SECRET_KEY });
}

export async function teardown(): Promise<void> {
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server!.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    if (server.exitCode === null) server.kill('SIGKILL');
  }
  await smtp?.close();
  await payments?.close();
  if (clusterDir) dropCluster(clusterDir);
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
    mailDir: string;
    /** The built server's FILES_DIR. */
    filesDir: string;
    /** The throwaway cluster's folder (pgdata, socket, kept passwords). */
    clusterDir: string;
    /** The local payment fake: its address (API base and checkout pages), webhook signing secret and API key. */
    payments: { url: string; webhookSecret: string; secretKey: string };
  }
}
