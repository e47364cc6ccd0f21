// `npm run start:scaled`: the layout of several machines, on this one. PostgreSQL, migrations, demo, mail catcher
// and build as `npm start` prepares them; stored files in the local S3-compatible fake (or S3_ENDPOINT); WEB_PROCESSES
// web processes (default 2) that answer people but work no jobs, one worker process that works the queue (builds,
// PDFs, renditions, mail), each on its own loopback port, and one round-robin front port (scripts/lib/scaled.ts,
// shared with `npm run soak`). A process that stops is started again on its own port.
import { join, relative } from 'node:path';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { ensureDebianPackages, MACHINE_PACKAGES } from './lib/debian';
import { publishDemo } from './lib/demo-publish';
import { startMail } from './lib/mail-setup';
import { buildApp, prepareDatabase } from './lib/prepare';
import { startCluster } from './lib/postgres';
import { startScaledLayout, type ScaledLayout } from './lib/scaled';
import { paymentsLine, startPayments } from './lib/payments-setup';
import { startFakeS3 } from '@/lib/storage/fake-s3';
import type { StorageSettings } from '@/lib/storage/settings';
import { authSecret, dataDir, demoEnabled, fakeS3Port, filesDir, host, pgPort, port, s3Settings, siteUrl, webProcesses } from './lib/settings';

const step = (what: string) => console.log(`\n▸ ${what}`);
let webCount: number;
try {
  webCount = webProcesses();
} catch (err) {
  console.error(`\n${(err as Error).message}\n`);
  process.exit(1);
}
const demo = demoEnabled();

step('Debian packages: postgresql, chromium, ghostscript');
const externalDb = Boolean(process.env.DATABASE_URL);
try {
  if (!externalDb && ensureDebianPackages(MACHINE_PACKAGES).length === 0) console.log('  all present');
} catch (err) {
  console.warn(`  ${(err as Error).message.replace(/\n/g, '\n  ')}`);
}

step(`PostgreSQL on 127.0.0.1:${pgPort}`);
const databaseUrl = process.env.DATABASE_URL ?? startCluster(join(dataDir, 'postgres'), pgPort).url;
const secret = authSecret();
const signInLimit = Number(process.env.AUTH_SIGN_IN_LIMIT ?? 5);

// Several processes share no disk in the layout this stands for: files go to an S3-compatible store.
let storage: StorageSettings;
if (process.env.S3_ENDPOINT) {
  storage = { driver: 's3', ...s3Settings() };
  step(`S3-compatible store at ${storage.endpoint}, bucket ${storage.bucket}`);
} else {
  step(`Local S3-compatible store (data in ${join(dataDir, 's3')})`);
  const fake = await startFakeS3({ dir: join(dataDir, 's3'), bucket: s3Settings().bucket, port: fakeS3Port });
  storage = { driver: 's3', ...fake.settings };
  console.log(`  s3 at ${fake.settings.endpoint}, bucket ${fake.settings.bucket}`);
}
if (Number(process.versions.node.split('.')[0]) < 22) process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true';

step(demo ? 'Migrations and demo data' : 'Migrations (PLUMBLINE_DEMO=0: no demo data)');
const { migrations } = await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir, storage, seed: demo });
console.log(migrations.length ? `  applied ${migrations.length} migration(s)` : '  schema up to date');

if (process.env.PLUMBLINE_SKIP_BUILD !== '1') {
  step('Building the app');
  buildApp();
}

const mail = await startMail();
// Payments: the real service with STRIPE_SECRET_KEY, otherwise the local test service (no money moves).
const payments = await startPayments(siteUrl);
console.log(paymentsLine(payments));

step(`Starting ${webCount} web process(es) and one worker`);
let layout: ScaledLayout;
try {
  layout = await startScaledLayout({
    webCount,
    server: { databaseUrl, siteUrl, secret, signInLimit, filesDir, storage, mail, payments: payments.settings },
    front: { host, port },
    logsDir: join(dataDir, 'logs'),
    say: (line) => console.warn(`\n  ${line}`),
  });
} catch (err) {
  console.error(`\n  ${(err as Error).message}`);
  process.exit(1);
}
const { front, processes } = layout;
const stopAll = () => void layout.stop().then(() => process.exit(0));
process.on('SIGINT', stopAll);
process.on('SIGTERM', stopAll);

let shareUrl: string | null = null;
if (demo) {
  try {
    shareUrl = await publishDemo(siteUrl, dataDir);
    await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir, storage });
  } catch (err) {
    console.warn(`  (the demo version could not be published: ${(err as Error).message})`);
  }
}

/** A path as short as it is plain: relative under the working folder, whole elsewhere. */
const shown = (path: string) => (relative(process.cwd(), path).startsWith('..') ? path : relative(process.cwd(), path));
const width = Math.max(...DEMO_PEOPLE.map((p) => p.email.length));
console.log(`
Plumbline (scaled) is running at ${siteUrl}   (front port ${front.port}, round robin over the web processes)

${processes.map((p) => `  ${p.role.padEnd(6)} 127.0.0.1:${p.port}   log: ${shown(p.logFile)}`).join('\n')}
  Each answers GET /api/health with its role; only the worker works builds, PDFs, renditions and mail.

${
  demo
    ? `DEMO ACCOUNTS, for trying Plumbline only: they share one published password (${DEMO_PASSWORD}).
${DEMO_PEOPLE.map((p) => `  ${p.email.padEnd(width)}  ${p.says}`).join('\n')}
${shareUrl ? `\nDemo share link (no account needed): ${shareUrl}\n` : ''}`
    : `No demo accounts (PLUMBLINE_DEMO=0): sign up at ${siteUrl}/sign-up.\n`
}
A process that stops is started again on its port (back-off 0.5 s doubling to 8 s); the front port leaves a web
process out while it does not answer. Ctrl-C stops every process; \`npm run db:stop\` stops PostgreSQL.
`);
