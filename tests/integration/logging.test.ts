// The built server's log (scripts/serve.mjs over the build, stdout read back): JSON lines, one per request, every
// line written while a request is served carries the id its X-Request-Id header shows, and no secret link is logged.
import type { ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { freePort } from '../../scripts/lib/postgres';
import { startServer } from '../../scripts/lib/prepare';

let child: ChildProcess | undefined;
let site: string;
let output = '';
const lines = () => output.split('\n').filter(Boolean).map((l) => JSON.parse(l) as Record<string, unknown>);

/** The log lines of one request id, once it has a line with each message in `msgs` (5 s at most). */
async function linesOf(reqId: string, msgs = ['request']): Promise<Record<string, unknown>[]> {
  for (let i = 0; i < 100; i++) {
    const own = lines().filter((l) => l.reqId === reqId);
    if (msgs.every((m) => own.some((l) => l.msg === m))) return own;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no request line for ${reqId} in:\n${output}`);
}

beforeAll(async () => {
  // A server of its own, so its stdout can be read; its SMTP relay is a closed loopback port, so a send fails at once.
  const port = await freePort();
  site = `http://127.0.0.1:${port}`;
  child = await startServer(
    {
      host: '127.0.0.1',
      port,
      databaseUrl: inject('databaseUrl'),
      siteUrl: site,
      secret: 'test-secret-that-is-long-enough-for-better-auth',
      signInLimit: 10_000,
      filesDir: join(mkdtempSync(join(tmpdir(), 'plumbline-log-')), 'files'),
      mail: { smtpHost: '127.0.0.1', smtpPort: await freePort() },
      settings: { LOG_LEVEL: 'info' },
    },
    { pipeLog: true },
  );
  child.stdout!.setEncoding('utf8').on('data', (chunk: string) => (output += chunk));
});

afterAll(() => {
  child?.kill('SIGTERM');
});

describe('request ids', () => {
  it('a safe X-Request-Id from the caller is kept, answered back and on the request line', async () => {
    const response = await fetch(`${site}/api/brands`, { headers: { 'x-request-id': 'itest-req-00000001' } });
    expect(response.status).toBe(401);
    expect(response.headers.get('x-request-id')).toBe('itest-req-00000001');
    const [line] = await linesOf('itest-req-00000001');
    expect(line).toMatchObject({ level: 30, msg: 'request', method: 'GET', path: '/api/brands', status: 401 });
    expect(typeof line.ms).toBe('number');
  });

  it('an unsafe one is replaced by a fresh id', async () => {
    const response = await fetch(`${site}/api/brands`, { headers: { 'x-request-id': '<b>forged</b>' } });
    const id = response.headers.get('x-request-id')!;
    expect(id).not.toContain('forged');
    expect(await linesOf(id)).toHaveLength(1);
  });

  it('a line written deep inside a request (a failed e-mail) carries the id of the request that caused it', async () => {
    const email = `log-${randomUUID().slice(0, 8)}@test.example`;
    const response = await fetch(`${site}/api/auth/sign-up/email`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: site },
      body: JSON.stringify({ email, password: 'correct-horse-battery', name: 'Log Reader' }),
    });
    expect(response.status).toBe(200);
    const id = response.headers.get('x-request-id')!;
    const own = await linesOf(id, ['request', 'mail: sending failed']);
    const failed = own.find((l) => l.msg === 'mail: sending failed');
    expect(failed, JSON.stringify(own)).toMatchObject({ level: 50, template: 'verify-email' });
    expect(own.find((l) => l.msg === 'request')).toMatchObject({ method: 'POST', path: '/api/auth/sign-up/email', status: 200 });
  });
});

describe('secret links', () => {
  it('share, brief, board and invitation tokens and query strings never reach the log', async () => {
    const secret = `SECRET${randomUUID().replace(/-/g, '')}`;
    const paths = [`/s/${secret}`, `/brief/${secret}`, `/board/${secret}`, `/invite/${secret}`, `/api/briefs/${secret}`, `/api/invitations/${secret}`, `/api/moodboards/${secret}`, `/api/auth/verify-email?token=${secret}`];
    const ids: string[] = [];
    for (const path of paths) {
      const response = await fetch(site + path, { redirect: 'manual' });
      ids.push(response.headers.get('x-request-id')!);
    }
    const logged = await Promise.all(ids.map(async (id) => (await linesOf(id)).find((l) => l.msg === 'request')!.path));
    expect(logged).toEqual(['/s/:token', '/brief/:token', '/board/:token', '/invite/:token', '/api/briefs/:token', '/api/invitations/:token', '/api/moodboards/:token', '/api/auth/verify-email']);
    expect(output).not.toContain(secret);
  });
});
