// One throwaway PostgreSQL and one built server for the benchmarks that need them, started on first use.
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { buildApp, prepareDatabase, startServer } from '../../scripts/lib/prepare';
import { dropCluster, freePort, startCluster } from '../../scripts/lib/postgres';

export interface BenchServer {
  baseUrl: string;
  databaseUrl: string;
  /** The server's FILES_DIR (local-disk storage). */
  filesDir: string;
  /** A signed-in cookie of a fresh designer who owns a fresh brand. */
  signUp(label: string): Promise<string>;
}

let started: Promise<BenchServer> | null = null;
let child: ChildProcess | undefined;
let dir: string | undefined;

/** The benchmark server (built into dist-bench/), started once per `npm run bench`. */
export function benchServer(): Promise<BenchServer> {
  started ??= (async () => {
    process.env.PLUMBLINE_OUT_DIR ??= join(process.cwd(), 'dist-bench');
    dir = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
    const cluster = startCluster(dir, await freePort());
    const port = await freePort();
    const baseUrl = `http://127.0.0.1:${port}`;
    const settings = { databaseUrl: cluster.url, siteUrl: baseUrl, secret: 'bench-secret-long-enough-for-better-auth', signInLimit: 10_000 };
    await prepareDatabase(settings, { filesDir: join(dir, 'files') });
    if (process.env.PLUMBLINE_SKIP_BUILD !== '1') buildApp(); // reuse the build in PLUMBLINE_OUT_DIR
    child = await startServer({ host: '127.0.0.1', port, ...settings, filesDir: join(dir, 'files') }, { quiet: true });
    return {
      baseUrl,
      databaseUrl: cluster.url,
      filesDir: join(dir, 'files'),
      async signUp(label: string) {
        const email = `${label}-${Date.now()}@bench.example`;
        const r = await fetch(`${baseUrl}/api/auth/sign-up/email`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', origin: baseUrl },
          body: JSON.stringify({ email, password: 'bench-password-1', name: label }),
        });
        // The bench server sends no mail: the address is proven in the database, as the mailed link would.
        const db = new pg.Client({ connectionString: cluster.url });
        await db.connect();
        await db.query('UPDATE "user" SET "emailVerified" = true WHERE email = $1', [email]);
        await db.end();
        return r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      },
    };
  })();
  return started;
}

/** Stop the server and remove its cluster (called once at the end of the run). */
export async function stopBenchServer(): Promise<void> {
  if (child && child.exitCode === null) {
    child.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 1500));
    if (child.exitCode === null) child.kill('SIGKILL');
  }
  if (dir) dropCluster(dir);
}

/** JSON API call with the origin header our server checks. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- bench helper: callers read what they asked for
export async function call(server: BenchServer, cookie: string, method: string, path: string, body?: unknown): Promise<any> {
  const r = await fetch(server.baseUrl + path, {
    method,
    headers: { origin: server.baseUrl, cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await r.text();
  if (!r.ok) throw new Error(`${method} ${path} → ${r.status}: ${text.slice(0, 200)}`);
  return text ? JSON.parse(text) : null;
}

export const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
