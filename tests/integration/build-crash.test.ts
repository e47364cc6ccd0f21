// Crash safety of the build, with real processes: a server of its own (on a database of its own, so no other
// process works its queue) is killed with SIGKILL while it prints a version's PDFs; the version stays `building`
// with no manifest, and the restarted server builds it to `ready` with every manifest key in storage. A server
// without Chromium fails the build with that reason; the previous version keeps serving; a retry on a server that
// has Chromium makes it ready.
import type { ChildProcess } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { asSuperuser } from '../support/db';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { freePort } from '../../scripts/lib/postgres';
import { descendants, killHard } from '../../scripts/lib/kill-tree';
import { prepareDatabase, startServer } from '../../scripts/lib/prepare';
import { Client } from '../support/client';
import { waitForBuild } from '../support/publish';

const secret = 'test-secret-that-is-long-enough-for-better-auth';
const dbName = `crash_${randomUUID().slice(0, 8)}`;
const filesDir = join(mkdtempSync(join(tmpdir(), 'plumbline-crash-')), 'files');
let databaseUrl: string;
let db: pg.Client;
let port: number;
let site: string;
let server: ChildProcess | undefined;
let owner: Client;
let brandId: string;
let slug: string;

const start = (settings: Record<string, string> = {}) =>
  startServer({ host: '127.0.0.1', port, databaseUrl, siteUrl: site, secret, signInLimit: 10_000, filesDir, mail: { smtpHost: '127.0.0.1', smtpPort: 9 }, settings }, { quiet: true });

async function stop(child: ChildProcess | undefined): Promise<void> {
  if (!child || child.exitCode !== null) return;
  const tree = descendants(child.pid!);
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  child.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
  if (child.exitCode === null) await killHard(child);
  // Whatever the stopped server left of its browser goes too.
  for (const pid of tree) {
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      // already gone
    }
  }
}

const versionRow = async (number: number) =>
  (await db.query('SELECT id, state, manifest, build_steps, build_error FROM guideline_versions WHERE brand_id = $1 AND number = $2', [brandId, number])).rows[0];

/** Every manifest entry of a ready version is a stored object with the recorded size and hash. */
async function expectStored(manifest: { entries: Record<string, { key: string; hash: string; size: number }> }) {
  const entries = Object.values(manifest.entries);
  expect(entries.length).toBeGreaterThan(0);
  for (const entry of entries) {
    const bytes = await readFile(join(filesDir, entry.key));
    expect(bytes.byteLength).toBe(entry.size);
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(entry.hash);
  }
}

beforeAll(async () => {
  await asSuperuser(`CREATE DATABASE ${dbName} OWNER ${new URL(inject('databaseUrl')).username}`);
  const url = new URL(inject('databaseUrl'));
  url.pathname = `/${dbName}`;
  databaseUrl = url.toString();
  port = await freePort();
  site = `http://127.0.0.1:${port}`;
  await prepareDatabase({ databaseUrl, siteUrl: site, secret, signInLimit: 10_000 }, { filesDir });
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  server = await start();
  owner = new Client(site);
  expect((await owner.post('/api/auth/sign-in/email', { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD })).status).toBe(200);
  const brand = (await owner.post('/api/brands', { name: 'Crash Test Mill' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  await owner.post(`/api/brands/${brandId}/colors`, { name: 'Flour', value: '#f3ead8' });
  const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 's1', title: 'Colour', eyebrow: '', intro: '' } }] };
  expect((await owner.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: 0, doc })).status).toBe(200);
}, 180_000);

afterAll(async () => {
  await stop(server);
  await db?.end();
  await asSuperuser(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
});

describe('a build killed mid-way', () => {
  test('SIGKILL while printing leaves the version building with no manifest; the restarted server builds it to ready', async () => {
    expect((await owner.post(`/api/brands/${brandId}/versions`, { note: 'Killed mid-build' })).status).toBe(201);
    // Wait until the build is printing its PDFs (the tokens are written by then), then kill the process outright.
    let row;
    for (let i = 0; i < 1200; i++) {
      row = await versionRow(1);
      if (row.build_steps.some((s: { id: string; state: string }) => s.id === 'pdf' && s.state === 'running')) break;
      expect(row.state).toBe('building');
      await new Promise((r) => setTimeout(r, 25));
    }
    expect(row.build_steps.find((s: { id: string }) => s.id === 'pdf').state).toBe('running');
    await killHard(server!);

    row = await versionRow(1);
    expect(row.state).toBe('building'); // never ready with files missing
    expect(row.manifest).toBeNull();

    server = await start();
    expect((await owner.post('/api/auth/sign-in/email', { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD })).status).toBe(200);
    const built = await waitForBuild(owner, brandId, 1, 120_000);
    expect(built.state).toBe('ready');
    row = await versionRow(1);
    await expectStored(row.manifest);
    // The build lock went with the killed process's connection: none is held now.
    const locks = await db.query(`SELECT count(*)::int AS n FROM pg_locks l JOIN pg_database d ON d.oid = l.database WHERE l.locktype = 'advisory' AND l.granted AND d.datname = current_database()`);
    expect(locks.rows[0].n).toBe(0);
    const tokens = await owner.get(`/b/${slug}/tokens?format=css`);
    expect(tokens.status).toBe(200);
    expect(tokens.headers.get('etag')).toBe(`"${row.manifest.entries['tokens?format=css'].hash.slice(0, 32)}"`);
  }, 240_000);

  test('without Chromium the build fails naming it, version 1 keeps serving, and a retry with Chromium makes it ready', async () => {
    await stop(server);
    server = await start({ CHROMIUM_PATH: '/nonexistent/chromium' });
    const { revision } = (await owner.get(`/api/brands/${brandId}/guideline`)).body;
    const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 's1', title: 'Colour and type', eyebrow: '', intro: '' } }] };
    expect((await owner.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: revision, doc })).status).toBe(200);
    expect((await owner.post(`/api/brands/${brandId}/versions`, { note: 'No printer here' })).status).toBe(201);
    const failed = await waitForBuild(owner, brandId, 2, 60_000);
    expect(failed.state).toBe('failed');
    expect(failed.buildError).toMatch(/^Print-ready PDFs: .*Chromium/);
    expect(failed.buildSteps.find((s) => s.id === 'pdf')?.state).toBe('failed');
    expect((await versionRow(2)).manifest).toBeNull();
    // "Latest" is still version 1.
    const v1 = await versionRow(1);
    const latest = await owner.get(`/b/${slug}/tokens?format=css`);
    expect(latest.headers.get('etag')).toBe(`"${v1.manifest.entries['tokens?format=css'].hash.slice(0, 32)}"`);
    // Its PDF address says why, as JSON for a script.
    const pdf = await owner.request('GET', `/b/${slug}/v/2/guideline.pdf?size=a4`, undefined, { accept: 'application/json' });
    expect(pdf.status).toBe(503);
    expect(pdf.body).toMatchObject({ state: 'failed', printerMissing: true });

    await stop(server);
    server = await start();
    expect((await owner.post('/api/auth/sign-in/email', { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD })).status).toBe(200);
    const retried = await owner.post(`/api/brands/${brandId}/versions/2/build`);
    expect(retried.status).toBe(202);
    expect(retried.body.version.state).toBe('building');
    expect((await waitForBuild(owner, brandId, 2, 120_000)).state).toBe('ready');
    await expectStored((await versionRow(2)).manifest);
  }, 240_000);
});
