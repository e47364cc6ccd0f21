// The supervisor of the scaled layout (scripts/lib/scaled.ts) with real processes on a database of their own: a web
// process killed with SIGKILL while visitors keep asking through the front port is started again on its own port and
// rejoins the rotation, and no visitor's GET fails meanwhile — the front port takes the dead process out and repeats
// the requests it had cut (RFC 9110 §9.2.1/§9.2.2: safe methods may be repeated; common practice for load balancers).
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { asSuperuser } from '../support/db';
import { freePort } from '../../scripts/lib/postgres';
import { prepareDatabase } from '../../scripts/lib/prepare';
import { startScaledLayout, type ScaledLayout } from '../../scripts/lib/scaled';

const secret = 'test-secret-that-is-long-enough-for-better-auth';
const dbName = `restart_${randomUUID().slice(0, 8)}`;
const dir = mkdtempSync(join(tmpdir(), 'plumbline-restart-'));
let layout: ScaledLayout | undefined;
let site: string;
const said: string[] = [];

beforeAll(async () => {
  await asSuperuser(`CREATE DATABASE ${dbName} OWNER ${new URL(inject('databaseUrl')).username}`);
  const url = new URL(inject('databaseUrl'));
  url.pathname = `/${dbName}`;
  const frontPort = await freePort();
  site = `http://127.0.0.1:${frontPort}`;
  const server = { databaseUrl: url.toString(), siteUrl: site, secret, signInLimit: 10_000, filesDir: join(dir, 'files'), mail: { smtpHost: '127.0.0.1', smtpPort: 9 } };
  await prepareDatabase(server, { filesDir: server.filesDir, seed: false });
  layout = await startScaledLayout({ webCount: 2, server, front: { host: '127.0.0.1', port: frontPort }, logsDir: join(dir, 'logs'), say: (line) => said.push(line) });
}, 180_000);

afterAll(async () => {
  await layout?.stop();
  await asSuperuser(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
  rmSync(dir, { recursive: true, force: true });
});

describe('the supervisor and the front port when a web process dies', () => {
  test('kill -9 one web process under requests: every GET answers 200, the process is started again on its port and rejoins the rotation', async () => {
    const victim = layout!.processes.find((p) => p.role === 'web')!;
    const killedPid = victim.child.pid;
    const statuses: number[] = [];
    let asking = true;
    // Eight visitors asking one after another, for as long as the fault lasts.
    const visitors = Array.from({ length: 8 }, async () => {
      while (asking) {
        const res = await fetch(`${site}/api/health`);
        await res.arrayBuffer();
        statuses.push(res.status);
      }
    });
    await new Promise((r) => setTimeout(r, 500));
    const exited = new Promise((r) => victim.child.once('exit', r));
    victim.child.kill('SIGKILL');
    await exited;
    await layout!.running(victim);
    for (let i = 0; i < 200 && !layout!.front.rotation().find((t) => t.port === victim.port)!.inRotation; i++) await new Promise((r) => setTimeout(r, 100));
    await new Promise((r) => setTimeout(r, 500));
    asking = false;
    await Promise.all(visitors);

    expect(victim.child.pid).not.toBe(killedPid);
    expect(victim.restarts).toBe(1);
    expect(layout!.front.rotation().every((t) => t.inRotation)).toBe(true);
    expect(await (await fetch(`http://127.0.0.1:${victim.port}/api/health`)).json()).toMatchObject({ status: 'ok', process: { role: 'web' } });
    expect(statuses.length).toBeGreaterThan(8);
    expect(statuses.filter((s) => s !== 200)).toEqual([]);
    expect(said.some((l) => l.includes(`port ${victim.port} stopped (SIGKILL)`))).toBe(true);
  }, 120_000);
});
