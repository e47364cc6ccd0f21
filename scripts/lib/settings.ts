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
