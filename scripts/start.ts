// `npm start`: Debian packages (installed if missing), PostgreSQL, migrations, demo, build, serve, a readiness list.
import { join, relative } from 'node:path';
import pg from 'pg';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { CHROMIUM, CHROMIUM_PATH, ensureDebianPackages, GHOSTSCRIPT, MACHINE_PACKAGES, POSTGRESQL } from './lib/debian';
import { publishDemo } from './lib/demo-publish';
import { startMail } from './lib/mail-setup';
import { paymentsLine, startPayments } from './lib/payments-setup';
import { buildApp, prepareDatabase, startServer } from './lib/prepare';
import { startCluster } from './lib/postgres';
import { checkBrowser, checkDatabase, checkMail, checkStorage, formatChecks } from './lib/readiness';
import { startFakeS3 } from '@/lib/storage/fake-s3';
import { openStorage } from '@/lib/storage/open.server';
import type { StorageSettings } from '@/lib/storage/settings';
import { authSecret, dataDir, demoEnabled, fakeS3Port, filesDir, host, pgPort, port, s3Settings, siteUrl, storageChoice } from './lib/settings';

const started = Date.now();
const step = (what: string) => console.log(`\n▸ ${what}`);
const demo = demoEnabled();

// One apt run for everything missing (as root); otherwise the missing packages and the command are named.
step('Debian packages: postgresql, chromium, ghostscript');
const externalDb = Boolean(process.env.DATABASE_URL);
try {
  const installed = ensureDebianPackages(externalDb ? [CHROMIUM, GHOSTSCRIPT] : MACHINE_PACKAGES);
  if (installed.length === 0) console.log('  all present');
} catch (err) {
  // Without PostgreSQL nothing can start; without chromium or ghostscript the rest still can, and the list below says so.
  if (!externalDb && !POSTGRESQL.present()) {
    console.error(`\n${(err as Error).message}\n`);
    process.exit(1);
  }
  console.warn(`  ${(err as Error).message.replace(/\n/g, '\n  ')}`);
}

step(`PostgreSQL on 127.0.0.1:${pgPort} (data in ${join(dataDir, 'postgres')})`);
const databaseUrl = process.env.DATABASE_URL ?? startCluster(join(dataDir, 'postgres'), pgPort).url;
const secret = authSecret();
const signInLimit = Number(process.env.AUTH_SIGN_IN_LIMIT ?? 5);

// Stored files: local disk by default; STORAGE=s3 uses S3_ENDPOINT, or without one a local fake kept under .data/s3.
let choice: ReturnType<typeof storageChoice>;
try {
  choice = storageChoice();
} catch (err) {
  console.error(`\n${(err as Error).message}\n`);
  process.exit(1);
}
let storageSettings: StorageSettings;
if (choice.driver === 'local') {
  storageSettings = { driver: 'local', filesDir };
} else if (choice.fakeS3) {
  step(`Local S3-compatible store (data in ${join(dataDir, 's3')})`);
  const fake = await startFakeS3({ dir: join(dataDir, 's3'), bucket: s3Settings().bucket, port: fakeS3Port });
  storageSettings = { driver: 's3', ...fake.settings };
  console.log(`  s3 at ${fake.settings.endpoint}, bucket ${fake.settings.bucket}`);
} else {
  storageSettings = { driver: 's3', ...s3Settings() };
  step(`S3-compatible store at ${storageSettings.endpoint}, bucket ${storageSettings.bucket}`);
}
if (choice.driver === 's3' && Number(process.versions.node.split('.')[0]) < 22) {
  // The SDK warns in seven lines from every process; one line here says the same once.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true';
  console.log(`  (the AWS SDK's releases after the first week of January 2027 need Node 22; the pinned one runs on Node ${process.versions.node})`);
}
const storage = openStorage(storageSettings);

step(demo ? 'Migrations and demo data' : 'Migrations (PLUMBLINE_DEMO=0: no demo data)');
const { migrations } = await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir, storage: storageSettings, seed: demo });
console.log(migrations.length ? `  applied ${migrations.length} migration(s)` : '  schema up to date');

if (process.env.PLUMBLINE_SKIP_BUILD !== '1') {
  step('Building the app');
  buildApp();
}

const mail = await startMail();
// Payments: the real service with STRIPE_SECRET_KEY, otherwise the local test service (no money moves).
const payments = await startPayments(siteUrl);
console.log(paymentsLine(payments));

step('Starting the server');
const serverLog = join(dataDir, 'logs', 'server.log');
const server = await startServer({ host, port, databaseUrl, siteUrl, secret, signInLimit, filesDir, storage: storageSettings, mail, payments: payments.settings }, { logFile: serverLog });
let shareUrl: string | null = null;
if (demo) {
  try {
    shareUrl = await publishDemo(siteUrl, dataDir);
    // The demo review anchors its comments to the published draft's blocks: seed again now that they exist.
    await prepareDatabase({ databaseUrl, siteUrl, secret, signInLimit }, { filesDir, storage: storageSettings });
  } catch (err) {
    console.warn(`  (the demo version could not be published: ${(err as Error).message})`);
  }
}

step('Readiness');
const checks = await Promise.all([checkDatabase(databaseUrl), checkBrowser(CHROMIUM_PATH), checkMail(mail, siteUrl), checkStorage(storage, storageSettings.driver)]);
console.log(formatChecks(checks));

/** Demo people left in the database by an earlier start with the demo on. */
async function leftoverDemoPeople(): Promise<number> {
  const client = new pg.Client({ connectionString: databaseUrl });
  try {
    await client.connect();
    const { rows } = await client.query<{ n: string }>('SELECT count(*) AS n FROM "user" WHERE email = ANY($1)', [DEMO_PEOPLE.map((p) => p.email)]);
    return Number(rows[0].n);
  } catch {
    return 0;
  } finally {
    await client.end().catch(() => {});
  }
}

const width = Math.max(...DEMO_PEOPLE.map((p) => p.email.length));
const failed = checks.filter((c) => !c.ok).map((c) => c.part);
const people = demo
  ? `DEMO ACCOUNTS, for trying Plumbline only. They share one published password (${DEMO_PASSWORD}), so anyone who
reads this can sign in as them: keep no real work in them, and start with PLUMBLINE_DEMO=0 for real use.
${DEMO_PEOPLE.map((p) => `  ${p.email.padEnd(width)}  ${p.says}`).join('\n')}

${shareUrl ? `Demo share link (no account needed): ${shareUrl}\n` : ''}`
  : `No demo accounts (PLUMBLINE_DEMO=0): sign up at ${siteUrl}/sign-up.\n${
      (await leftoverDemoPeople()) > 0
        ? `Caution: demo accounts from an earlier start are still in this database, with the shared demo password.\n`
        : ''
    }`;
console.log(`
Plumbline is running at ${siteUrl}   (ready in ${((Date.now() - started) / 1000).toFixed(1)} s)${
  failed.length ? `\nNot working: ${failed.join(', ')} (see the readiness list above for what to do).` : ''
}

${people}
The server's log (JSON lines, one per request, with its request id): \`tail -f ${relative(process.cwd(), serverLog)}\`
Ctrl-C stops the server; \`npm run db:stop\` stops PostgreSQL.
`);

const stop = () => server.kill('SIGTERM');
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
server.on('exit', (code) => process.exit(code ?? 0));
