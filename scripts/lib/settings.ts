// Settings for the scripts that start Plumbline: environment first, then defaults under .data/.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

export const projectRoot = resolve(import.meta.dirname, '..', '..');
export const dataDir = resolve(process.env.PLUMBLINE_DATA_DIR ?? join(projectRoot, '.data'));

/** The auth secret: AUTH_SECRET if set, else one generated into .data/auth-secret on first start. */
export function authSecret(dir = dataDir): string {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  const file = join(dir, 'auth-secret');
  if (!existsSync(file)) {
    mkdirSync(dir, { recursive: true });
    writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  }
  return readFileSync(file, 'utf8').trim();
}

export const pgPort = Number(process.env.PLUMBLINE_PG_PORT ?? 54320);
export const host = process.env.HOST ?? '127.0.0.1';
export const port = Number(process.env.PORT ?? 4321);
export const siteUrl = process.env.SITE_URL ?? `http://${host}:${port}`;

/** PLUMBLINE_DEMO=0 (or false/no/off) leaves the demo studio, brands and people out; `npm start` seeds them by default. */
export const demoEnabled = (value = process.env.PLUMBLINE_DEMO): boolean => !['0', 'false', 'no', 'off'].includes((value ?? '1').trim().toLowerCase());
export const filesDir = resolve(process.env.FILES_DIR ?? join(dataDir, 'files'));

/**
 * Where stored files live: local disk under filesDir (STORAGE=local, the default), or an S3-compatible store
 * (STORAGE=s3). With STORAGE=s3 and no S3_ENDPOINT, `npm start` runs a local fake under .data/s3 (`fakeS3: true`).
 */
export function storageChoice(env: NodeJS.ProcessEnv = process.env): { driver: 'local' } | { driver: 's3'; fakeS3: boolean } {
  const driver = (env.STORAGE ?? 'local').trim().toLowerCase() || 'local';
  if (driver === 'local') return { driver };
  if (driver === 's3') return { driver, fakeS3: !env.S3_ENDPOINT };
  throw new Error(`STORAGE=${env.STORAGE} is not a storage Plumbline knows: use STORAGE=local (files under FILES_DIR) or STORAGE=s3.`);
}

/** The S3 settings named by the environment (S3_ENDPOINT, S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY, S3_FORCE_PATH_STYLE). */
export function s3Settings(env: NodeJS.ProcessEnv = process.env) {
  return {
    endpoint: env.S3_ENDPOINT || undefined,
    bucket: env.S3_BUCKET || 'plumbline-files',
    region: env.S3_REGION || 'us-east-1',
    accessKeyId: env.S3_ACCESS_KEY_ID || undefined,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY || undefined,
    forcePathStyle: !['0', 'false', 'no', 'off'].includes((env.S3_FORCE_PATH_STYLE ?? 'true').trim().toLowerCase()),
  };
}
export const fakeS3Port = Number(process.env.PLUMBLINE_S3_PORT ?? 0);

/** WEB_PROCESSES for `npm run start:scaled`: how many web processes answer behind the one port (default 2, 1–16). */
export function webProcesses(env: NodeJS.ProcessEnv = process.env): number {
  const raw = (env.WEB_PROCESSES ?? '2').trim();
  const n = Number(raw);
  if (!/^\d+$/.test(raw) || n < 1 || n > 16) throw new Error(`WEB_PROCESSES=${env.WEB_PROCESSES} is not a number of web processes: use a whole number from 1 to 16.`);
  return n;
}
