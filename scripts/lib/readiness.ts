// Before "running": each part of Plumbline tried for real, one line each, and what to do for a part that failed.
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import nodemailer from 'nodemailer';
import pg from 'pg';
import puppeteer from 'puppeteer-core';
import type { FileStorage } from '@/lib/storage/storage';

export interface Check {
  part: string;
  ok: boolean;
  /** What was found (ok) or what went wrong (not ok). */
  detail: string;
  /** For a failed part: what to do about it. */
  fix?: string;
}

const firstLine = (err: unknown) => String((err as Error)?.message ?? err).split('\n')[0].slice(0, 200);

function withTimeout<T>(work: Promise<T>, ms: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout;
  const late = new Promise<never>((_, fail) => (timer = setTimeout(() => fail(new Error(`${what} did not answer within ${ms / 1000} s`)), ms)));
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

/** The database answers a query with the application's own credentials. */
export async function checkDatabase(databaseUrl: string): Promise<Check> {
  const client = new pg.Client({ connectionString: databaseUrl, connectionTimeoutMillis: 5000 });
  try {
    await client.connect();
    const { rows } = await client.query<{ v: string }>("SELECT current_setting('server_version') AS v");
    const url = new URL(databaseUrl);
    return { part: 'database', ok: true, detail: `PostgreSQL ${rows[0].v} on ${url.hostname}:${url.port}, signed in with a password` };
  } catch (err) {
    return { part: 'database', ok: false, detail: firstLine(err), fix: 'check DATABASE_URL, or `npm run db:stop` and start again' };
  } finally {
    await client.end().catch(() => {});
  }
}

/** Chromium starts headless and prints a tiny page to PDF, as the PDF export will. */
export async function checkBrowser(executablePath: string): Promise<Check> {
  const part = 'browser for PDFs';
  if (!existsSync(executablePath)) {
    return {
      part,
      ok: false,
      detail: `Chromium is not installed (${executablePath} is missing); every PDF will fail until it is`,
      fix: 'run `npm start` once as root (it installs Debian\'s "chromium"), or `sudo apt-get install -y --no-install-recommends chromium`, or set CHROMIUM_PATH',
    };
  }
  const started = Date.now();
  let browser;
  try {
    browser = await withTimeout(
      puppeteer.launch({ executablePath, headless: true, args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-dev-shm-usage'] }),
      30_000,
      'Chromium',
    );
    const page = await browser.newPage();
    await page.setContent('<p>Plumbline print check</p>');
    const pdf = Buffer.from(await page.pdf({ format: 'A4' }));
    if (pdf.subarray(0, 5).toString() !== '%PDF-') throw new Error('the test print was not a PDF');
    const version = (await browser.version()).replace(/^(Headless)?Chrome\//, 'Chromium ');
    return { part, ok: true, detail: `${version} printed a test page (${pdf.length} bytes, ${((Date.now() - started) / 1000).toFixed(1)} s)` };
  } catch (err) {
    return { part, ok: false, detail: `Chromium at ${executablePath} could not print: ${firstLine(err)}`, fix: 'reinstall Debian\'s "chromium" (`apt-get install --reinstall chromium`) or set CHROMIUM_PATH' };
  } finally {
    await browser?.close().catch(() => {});
  }
}

/** The SMTP server (local catcher or a relay) accepts a connection. */
export async function checkMail(mail: { smtpHost: string; smtpPort: number; captureDir?: string }, siteUrl: string): Promise<Check> {
  const transport = nodemailer.createTransport({
    host: mail.smtpHost,
    port: mail.smtpPort,
    secure: mail.smtpPort === 465,
    ...(process.env.SMTP_USER ? { auth: { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD ?? '' } } : {}),
    connectionTimeout: 8000,
  });
  const what = mail.captureDir ? `local mail catcher on ${mail.smtpHost}:${mail.smtpPort} (read at ${siteUrl}/app/mail)` : `relay ${mail.smtpHost}:${mail.smtpPort}`;
  try {
    await withTimeout(transport.verify(), 10_000, 'the SMTP server');
    return { part: 'mail', ok: true, detail: what };
  } catch (err) {
    return { part: 'mail', ok: false, detail: `${what}: ${firstLine(err)}`, fix: 'check SMTP_HOST, SMTP_PORT, SMTP_USER and SMTP_PASSWORD, or unset SMTP_HOST to use the local catcher' };
  } finally {
    transport.close();
  }
}

/** A brand id no brand has (the nil UUID), so the probe's key is one of ours and touches nobody's files. */
const PROBE_BRAND = '00000000-0000-0000-0000-000000000000';

/** The file store takes a write, gives the bytes back and deletes them, through the same driver the server uses. */
export async function checkStorage(storage: FileStorage, driver: 'local' | 's3'): Promise<Check> {
  const key = `${PROBE_BRAND}/readiness-check/${randomUUID()}.txt`;
  try {
    await withTimeout(
      (async () => {
        await storage.put(key, new TextEncoder().encode('ok'), 'text/plain');
        if ((await storage.get(key))?.toString() !== 'ok') throw new Error('a file written was not read back');
        // The whole probe prefix goes, so no empty folder is left on local disk.
        await storage.deleteBrandFiles(PROBE_BRAND);
      })(),
      10_000,
      'the file store',
    );
    return { part: 'storage', ok: true, detail: `${storage.description} (wrote, read back and removed a test file)` };
  } catch (err) {
    const fix =
      driver === 's3'
        ? 'check S3_ENDPOINT, S3_BUCKET (it must exist), S3_REGION and the key pair, or unset S3_ENDPOINT to use the local fake'
        : 'make that folder writable by this user, or set FILES_DIR';
    return { part: 'storage', ok: false, detail: `${storage.description}: ${firstLine(err)}`, fix };
  }
}

/** The readiness list as printed: one line per part, a "what to do" line under each failed one. */
export function formatChecks(checks: Check[]): string {
  const width = Math.max(...checks.map((c) => c.part.length));
  return checks
    .map((c) => `  ${c.ok ? '✓' : '✗'} ${c.part.padEnd(width)}  ${c.detail}${c.ok || !c.fix ? '' : `\n    ${' '.repeat(width)}  → ${c.fix}`}`)
    .join('\n');
}
