// The layout of `npm run start:scaled`, with real processes: two web processes (PROCESS_ROLE=web, QUEUE_WORKER=false)
// and one worker (PROCESS_ROLE=worker, QUEUE_WORKER=true) on a database of their own (so no other server of the suite
// works their queue) and the local S3-compatible fake, behind the round-robin front port (scripts/lib/front-proxy.ts),
// which is also SITE_URL. Checked: health names each role; the front port alternates between the web processes and
// keeps Host/Origin so signing in through it works; a build requested through a web process waits while no worker
// runs and is made ready by the worker; a file uploaded through the front port (so by one web process) is
// downloaded byte-identical (SHA-256, FIPS 180-4, from node:crypto) through each web process.
import type { ChildProcess } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { asSuperuser } from '../support/db';
import { startFrontProxy, type FrontProxy } from '../../scripts/lib/front-proxy';
import { freePort } from '../../scripts/lib/postgres';
import { prepareDatabase, startServer } from '../../scripts/lib/prepare';
import { startFakeS3, type FakeS3 } from '@/lib/storage/fake-s3';
import type { StorageSettings } from '@/lib/storage/settings';
import { Client } from '../support/client';
import { waitForBuild } from '../support/publish';

const secret = 'test-secret-that-is-long-enough-for-better-auth';
const dbName = `scaled_${randomUUID().slice(0, 8)}`;
const dir = mkdtempSync(join(tmpdir(), 'plumbline-scaled-'));
const children: ChildProcess[] = [];
let databaseUrl: string;
let storage: StorageSettings;
let fake: FakeS3;
let front: FrontProxy;
let site: string;
let webs: string[] = [];
let worker: string | undefined;
let owner: Client;
let brandId: string;

/** One process of the layout on a free loopback port; its base URL. */
async function launch(role: 'web' | 'worker'): Promise<string> {
  const port = await freePort();
  children.push(
    await startServer(
      {
        host: '127.0.0.1',
        port,
        databaseUrl,
        siteUrl: site,
        secret,
        signInLimit: 10_000,
        filesDir: join(dir, 'files'),
        storage,
        mail: { smtpHost: '127.0.0.1', smtpPort: 9 },
        settings: { PROCESS_ROLE: role, QUEUE_WORKER: role === 'worker' ? 'true' : 'false' },
      },
      { quiet: true },
    ),
  );
  return `http://127.0.0.1:${port}`;
}

const health = async (base: string) => (await fetch(`${base}/api/health`)).json();
const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

beforeAll(async () => {
  await asSuperuser(`CREATE DATABASE ${dbName} OWNER ${new URL(inject('databaseUrl')).username}`);
  const url = new URL(inject('databaseUrl'));
  url.pathname = `/${dbName}`;
  databaseUrl = url.toString();
  const frontPort = await freePort();
  site = `http://127.0.0.1:${frontPort}`;
  fake = await startFakeS3({ dir: join(dir, 's3'), bucket: 'plumbline-scaled' });
  storage = { driver: 's3', ...fake.settings };
  await prepareDatabase({ databaseUrl, siteUrl: site, secret, signInLimit: 10_000 }, { filesDir: join(dir, 'files'), storage, seed: false });
  webs = [await launch('web'), await launch('web')];
  front = await startFrontProxy({ host: '127.0.0.1', port: frontPort, targets: webs.map((w) => Number(new URL(w).port)) });

  // Through the front port: Origin and Host are the site's, as a browser would send them.
  owner = new Client(site);
  const email = `scaled-owner-${Date.now()}@test.example`;
  expect((await owner.post('/api/auth/sign-up/email', { email, password: 'correct-horse-battery', name: 'Scaled Owner' })).status).toBe(200);
  // No mail catcher here: the address is proven directly in the database (the proof has its own tests).
  const db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  await db.query('UPDATE "user" SET "emailVerified" = true WHERE email = $1', [email]);
  await db.end();
  const made = await owner.post('/api/brands', { name: 'Scaled Layout Works' });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  brandId = made.body.brand.id;
}, 180_000);

afterAll(async () => {
  await Promise.all(
    children.map(async (child) => {
      if (child.exitCode !== null) return;
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
      if (child.exitCode === null) child.kill('SIGKILL');
    }),
  );
  await front?.close();
  await fake?.close();
  await asSuperuser(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
  rmSync(dir, { recursive: true, force: true });
});

describe('several web processes and one worker behind one port', () => {
  test('each web process reports its role and the object store; the front port takes turns between them', async () => {
    const [a, b] = await Promise.all(webs.map(health));
    expect(a).toMatchObject({ status: 'ok', process: { role: 'web' }, storage: 's3' });
    expect(b).toMatchObject({ status: 'ok', process: { role: 'web' }, storage: 's3' });
    expect(a.process.id).not.toBe(b.process.id);
    const seen = new Set<string>();
    for (let i = 0; i < 4; i++) seen.add((await health(site)).process.id);
    expect(seen).toEqual(new Set([a.process.id, b.process.id]));
  });

  test('a build requested through a web process waits for the worker, which makes it ready', async () => {
    const viaWeb = owner.via(webs[0]);
    const { revision } = (await viaWeb.get(`/api/brands/${brandId}/guideline`)).body;
    const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'intro', title: 'Welcome', eyebrow: '', intro: '' } }] };
    expect((await viaWeb.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: revision, doc })).status).toBe(200);
    const made = await viaWeb.post(`/api/brands/${brandId}/versions`, { note: 'Built by the worker' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const number = made.body.version.number as number;

    // With only web processes running, nobody works the queue: the version stays building with no step done.
    await new Promise((r) => setTimeout(r, 3000));
    const waiting = (await owner.via(webs[1]).get(`/api/brands/${brandId}/versions`)).body.versions.find((v: { number: number }) => v.number === number);
    expect(waiting.state).toBe('building');
    expect(waiting.buildSteps.every((s: { state: string }) => s.state !== 'done')).toBe(true);

    worker = await launch('worker');
    expect(await health(worker)).toMatchObject({ status: 'ok', process: { role: 'worker' }, storage: 's3' });
    const built = await waitForBuild(owner.via(webs[1]), brandId, number);
    expect(built.state, built.buildError ?? '').toBe('ready');
  }, 300_000);

  test('a file uploaded through one web process downloads byte-identical through every one', async () => {
    // A PNG drawn by sharp (the general-purpose image library): noise, so no two runs' bytes are alike by chance.
    const { default: sharp } = await import('sharp');
    const raw = Buffer.alloc(64 * 48 * 3);
    for (let i = 0; i < raw.length; i++) raw[i] = (i * 7919 + Date.now()) & 0xff;
    const png = await sharp(raw, { raw: { width: 64, height: 48, channels: 3 } }).png().toBuffer();
    // A form upload passes the origin check only through the front port (its Host is the site's), which hands it to
    // one web process; every web process then gives the same bytes back, so the other one serves it from the store.
    const up = await owner.upload(`/api/brands/${brandId}/assets`, 'noise.png', png, 'image/png');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const assetId = up.body.assets[0].id as string;
    for (const web of webs) {
      const res = await fetch(`${web}/api/assets/${assetId}/file?download=1`, { headers: { cookie: owner.cookieHeader() } });
      expect(res.status).toBe(200);
      expect(sha256(Buffer.from(await res.arrayBuffer()))).toBe(sha256(png));
    }
  });
});
