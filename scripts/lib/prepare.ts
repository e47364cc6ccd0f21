// One path from nothing to a ready database: cluster, schema, demo. Used by `npm start` and the tests.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdirSync, openSync } from 'node:fs';
import { connect } from '@db/models';
import { migrateAll } from '@db/migrate';
import { seedDemo } from '@db/seeders/demo';
import type { AuthSettings } from '@/lib/auth/auth-options';
import { storageEnv, type StorageSettings } from '@/lib/storage/settings';
import { dirname, join } from 'node:path';
import { projectRoot } from './settings';

/** Where the build goes (PLUMBLINE_OUT_DIR, default dist/). */
export const outDir = () => process.env.PLUMBLINE_OUT_DIR ?? join(projectRoot, 'dist');

/**
 * Run migrations and seed the demo against `settings.databaseUrl`; the demo's files go to `storage` when given,
 * otherwise to local disk under `filesDir`.
 */
export async function prepareDatabase(
  settings: AuthSettings,
  opts: { filesDir: string; storage?: StorageSettings; seed?: boolean },
): Promise<{ migrations: string[] }> {
  const sequelize = connect(settings.databaseUrl);
  try {
    const migrations = await migrateAll(sequelize, settings);
    // The driver is loaded only when asked for: the object-store SDK stays out of the tests' global set-up.
    const files = opts.storage ? (await import('@/lib/storage/open.server')).openStorage(opts.storage) : opts.filesDir;
    if (opts.seed !== false) await seedDemo(sequelize, settings, files);
    return { migrations };
  } finally {
    await sequelize.close();
  }
}

const buildArgs = ['node_modules/astro/astro.js', 'build', '--silent'];
const buildOptions = () => ({
  cwd: projectRoot,
  stdio: 'inherit' as const,
  env: { ...process.env, NODE_ENV: 'production', ASTRO_TELEMETRY_DISABLED: '1' },
});

/** Build the Astro server bundle into outDir(). */
export function buildApp(): void {
  const result = spawnSync(process.execPath, buildArgs, buildOptions());
  if (result.status !== 0) throw new Error('astro build failed; see the output above.');
}

/** buildApp() in a child process of its own, so the caller can prepare the database meanwhile. */
export function buildAppInBackground(): Promise<void> {
  const child = spawn(process.execPath, buildArgs, buildOptions());
  return new Promise((done, fail) => {
    child.once('error', fail);
    child.once('exit', (code) => (code === 0 ? done() : fail(new Error('astro build failed; see the output above.'))));
  });
}

export interface ServerEnv {
  host: string;
  port: number;
  databaseUrl: string;
  siteUrl: string;
  secret: string;
  signInLimit?: number;
  /** Proxies whose X-Forwarded-For is believed (TRUSTED_PROXIES); none when unset. */
  trustedProxies?: string;
  /** E-mails one account may send per hour (MAIL_SEND_LIMIT). */
  mailSendLimit?: number;
  filesDir?: string;
  /** Where stored files live (STORAGE, FILES_DIR, S3_*); left out, local disk under `filesDir`. */
  storage?: StorageSettings;
  /** E-mail: the SMTP relay and, when the local fake keeps the messages, its folder (src/lib/mail). */
  mail?: { smtpHost: string; smtpPort: number; from?: string; captureDir?: string };
  /** Payments (STRIPE_*): the local fake's settings or real keys; left out, payments are not set up. */
  payments?: { STRIPE_SECRET_KEY: string; STRIPE_WEBHOOK_SECRET: string; STRIPE_API_BASE?: string } | null;
  /** Further settings from the astro:env schema by name (e.g. RENDITION_RATE_LIMIT for a test with small limits). */
  settings?: Record<string, string>;
}

/** Start the built server (scripts/serve.mjs over outDir()) and resolve once it answers HTTP. */
export async function startServer(env: ServerEnv, opts: { quiet?: boolean; pipeLog?: boolean; logFile?: string } = {}): Promise<ChildProcess> {
  // logFile: the JSON log lines (stdout) are appended to a file, so a person's terminal keeps only what is for them.
  const logFd = opts.logFile ? (mkdirSync(dirname(opts.logFile), { recursive: true }), openSync(opts.logFile, 'a')) : null;
  const child = spawn(process.execPath, [join(projectRoot, 'scripts', 'serve.mjs'), outDir()], {
    cwd: projectRoot,
    // pipeLog: the log lines (stdout) are kept on child.stdout for a test to read.
    stdio: logFd !== null ? ['ignore', logFd, 'inherit'] : opts.pipeLog ? ['ignore', 'pipe', 'inherit'] : opts.quiet ? ['ignore', 'ignore', 'inherit'] : 'inherit',
    env: {
      ...process.env,
      // The built server runs as production whatever the caller's environment (vitest sets NODE_ENV=test).
      NODE_ENV: 'production',
      HOST: env.host,
      PORT: String(env.port),
      DATABASE_URL: env.databaseUrl,
      SITE_URL: env.siteUrl,
      AUTH_SECRET: env.secret,
      ...(env.signInLimit ? { AUTH_SIGN_IN_LIMIT: String(env.signInLimit) } : {}),
      ...(env.trustedProxies ? { TRUSTED_PROXIES: env.trustedProxies } : {}),
      ...(env.mailSendLimit ? { MAIL_SEND_LIMIT: String(env.mailSendLimit) } : {}),
      // The catcher's folder comes from `mail` below or not at all, never from the caller's environment.
      MAIL_CAPTURE_DIR: undefined,
      ...(env.filesDir ? { FILES_DIR: env.filesDir } : {}),
      // The store comes from `storage` or is local disk, never from the caller's environment.
      STORAGE: undefined,
      S3_ENDPOINT: undefined,
      S3_BUCKET: undefined,
      S3_REGION: undefined,
      S3_ACCESS_KEY_ID: undefined,
      S3_SECRET_ACCESS_KEY: undefined,
      S3_FORCE_PATH_STYLE: undefined,
      ...(env.storage ? storageEnv(env.storage) : {}),
      // Payment keys come from `payments` or not at all: a test run never reaches a real account by accident.
      STRIPE_SECRET_KEY: undefined,
      STRIPE_WEBHOOK_SECRET: undefined,
      STRIPE_API_BASE: undefined,
      ...(env.payments ?? {}),
      ...(env.mail
        ? {
            SMTP_HOST: env.mail.smtpHost,
            SMTP_PORT: String(env.mail.smtpPort),
            ...(env.mail.from ? { MAIL_FROM: env.mail.from } : {}),
            ...(env.mail.captureDir ? { MAIL_CAPTURE_DIR: env.mail.captureDir } : {}),
          }
        : {}),
      ...env.settings,
    },
  });
  const url = `http://${env.host}:${env.port}/`;
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error(`the server exited early (code ${child.exitCode})`);
    try {
      await fetch(url, { redirect: 'manual' });
      return child;
    } catch {
      await new Promise((r) => setTimeout(r, 100));
    }
  }
  child.kill();
  throw new Error(`the server did not answer on ${url} within 30 s`);
}
