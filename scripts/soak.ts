// `npm run soak`: the scaled layout under load and faults, on loopback only, from nothing. It builds when the build in
// PLUMBLINE_OUT_DIR (default dist-soak/) is missing or older than the sources, starts a throwaway PostgreSQL cluster on
// a free port, the S3-compatible fake and the mail catcher in a temporary folder (never the demo's .data/), starts
// the layout of `npm run start:scaled` (scripts/lib/scaled.ts) and makes a brand with a built version and a share link
// through the API. Then, one line per result:
//   1. 200 share-link visitors for 30 s through the front port (goal: 0 errors, non-2xx counted as errors);
//   2. kill -9 one web process under that load (goal: 0 errors before, during and after; the supervisor starts it
//      again and the front port takes it back);
//   3. kill -9 the worker mid-build (goal: the version turns ready once the supervisor has started the worker again);
//   4. two editors saving the same draft from the same revision, 50 rounds (goal: one wins, the other gets 409, and
//      after the loser reloads and saves again both edits are in the draft — no update lost).
// Every process it started is stopped and the cluster and folder removed, also on failure or Ctrl-C; exit 1 when a
// goal fails. Bounded: SOAK_SECONDS (default 30) of load, SOAK_ROUNDS (default 50) rounds, SOAK_LIMIT_SECONDS
// (default 600) for the whole run.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import pg from 'pg';
import { listCaptured } from '@/lib/mail/captured';
import { startFakeSmtp, type FakeSmtp } from '@/lib/mail/fake-smtp';
import { startFakeS3, type FakeS3 } from '@/lib/storage/fake-s3';
import { killHard } from './lib/kill-tree';
import { ensureDebianPackages, MACHINE_PACKAGES, POSTGRESQL } from './lib/debian';
import { dropCluster, freePort, startCluster } from './lib/postgres';
import { buildAppInBackground, outDir, prepareDatabase } from './lib/prepare';
import { startScaledLayout, type ScaledLayout, type ScaledProcess } from './lib/scaled';
import { projectRoot } from './lib/settings';

const seconds = (name: string, fallback: number, max: number) => {
  const n = Number(process.env[name] ?? fallback);
  if (!Number.isInteger(n) || n < 1 || n > max) {
    console.error(`${name}=${process.env[name]} is not a whole number of 1 to ${max}.`);
    process.exit(2);
  }
  return n;
};
const LOAD_SECONDS = seconds('SOAK_SECONDS', 30, 600);
const ROUNDS = seconds('SOAK_ROUNDS', 50, 1000);
const LIMIT_SECONDS = seconds('SOAK_LIMIT_SECONDS', 600, 3600);
const VISITORS = 200;
const WARM_UP_SECONDS = 5;
const WEB_PROCESSES = 2;

const began = Date.now();
const since = (t: number) => ((Date.now() - t) / 1000).toFixed(1);
const note = (line: string) => console.log(`  · ${line}`);
const results: { ok: boolean; line: string }[] = [];
function result(n: number, ok: boolean, line: string) {
  results.push({ ok, line });
  console.log(`${ok ? 'PASS' : 'FAIL'} ${n}. ${line}`);
}

// ---- what this run started, to stop and remove afterwards (nothing else is touched) ----
const dir = mkdtempSync(join(tmpdir(), 'plumbline-soak-'));
let clusterDir: string | undefined;
let layout: ScaledLayout | undefined;
let s3: FakeS3 | undefined;
let smtp: FakeSmtp | undefined;
let cleaning: Promise<void> | undefined;
const cleanUp = () =>
  (cleaning ??= (async () => {
    await layout?.stop().catch(() => undefined);
    await s3?.close().catch(() => undefined);
    await smtp?.close().catch(() => undefined);
    if (clusterDir) dropCluster(clusterDir);
    rmSync(dir, { recursive: true, force: true });
  })());
const abort = (why: string, code: number) => {
  console.error(`\nsoak stopped: ${why}`);
  void cleanUp().finally(() => process.exit(code));
};
process.on('SIGINT', () => abort('interrupted', 130));
process.on('SIGTERM', () => abort('terminated', 143));
setTimeout(() => abort(`over its limit of ${LIMIT_SECONDS} s (SOAK_LIMIT_SECONDS)`, 1), LIMIT_SECONDS * 1000).unref();

/** The newest modification under `paths` (files and folders, recursively), in ms. */
function newest(paths: string[]): number {
  let latest = 0;
  for (const path of paths) {
    if (!existsSync(path)) continue;
    const stat = statSync(path);
    latest = Math.max(latest, stat.mtimeMs);
    if (stat.isDirectory()) for (const entry of readdirSync(path, { recursive: true, encoding: 'utf8' })) latest = Math.max(latest, statSync(join(path, entry)).mtimeMs);
  }
  return latest;
}

/** One person's cookie jar against the front port; JSON in and out, with the site's Origin as a browser sends it. */
class Person {
  readonly cookies = new Map<string, string>();
  constructor(private readonly site: string) {}

  cookie = () => [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- a script reading the answers it asked for
  async request(method: string, path: string, body?: unknown): Promise<{ status: number; body: any; headers: Headers }> {
    const headers: Record<string, string> = { origin: this.site };
    if (this.cookies.size) headers.cookie = this.cookie();
    if (body !== undefined) headers['content-type'] = 'application/json';
    const res = await fetch(this.site + path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      if (pair.slice(i + 1) === '' || /max-age=0/i.test(c)) this.cookies.delete(pair.slice(0, i));
      else this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : undefined;
    } catch {
      // not JSON
    }
    return { status: res.status, body: parsed, headers: res.headers };
  }

  /** The request, which must answer `status`; its body. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- a script reading the answers it asked for
  async must(status: number, method: string, path: string, body?: unknown): Promise<any> {
    const r = await this.request(method, path, body);
    if (r.status !== status) throw new Error(`${method} ${path} answered ${r.status} (wanted ${status}): ${JSON.stringify(r.body).slice(0, 300)}`);
    return r.body;
  }
}

interface Load {
  requests: number;
  rps: number;
  p99: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  statuses: Record<string, number>;
  failedAt: number[];
}

/** `connections` visitors asking `url` for `duration` s (autocannon in a worker thread). */
function visitors(url: string, headers: Record<string, string>, connections: number, duration: number): Promise<Load> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(join(import.meta.dirname, 'lib', 'soak-load.mjs'), { workerData: { url, headers, connections, duration } });
    worker.once('message', (m: Load & { error?: string }) => (m.error ? reject(new Error(m.error)) : resolve(m)));
    worker.once('error', reject);
  });
}

const figures = (l: Load) => `${l.requests} requests, ${l.rps.toFixed(0)} req/s, p99 ${l.p99} ms`;
/** The figures depend on what else the machine does: the 1-minute load average beside the number of cores. */
const machine = () => `machine load ${loadavg()[0].toFixed(1)} on ${availableParallelism()} cores`;
const failures = (l: Load) => l.errors + l.non2xx;
/** When the errors came, in seconds from the start of the load. */
const when = (l: Load, from: number) => `first at ${((Math.min(...l.failedAt) - from) / 1000).toFixed(1)} s, last at ${((Math.max(...l.failedAt) - from) / 1000).toFixed(1)} s`;
/** What the errors were: connection errors (of which timeouts) and each answer outside 2xx. */
const notOk = (l: Load) =>
  [`${l.errors} connection errors (${l.timeouts} timeouts over 10 s)`, ...Object.entries(l.statuses).filter(([s]) => !s.startsWith('2')).map(([s, n]) => `${n}× HTTP ${s}`)].join(', ');

interface VersionView {
  number: number;
  state: 'building' | 'ready' | 'failed';
  buildError: string | null;
  buildSteps: { id: string; label: string; state: string }[];
}

async function version(person: Person, brandId: string, number: number): Promise<VersionView> {
  const { versions } = await person.must(200, 'GET', `/api/brands/${brandId}/versions`);
  const found = (versions as VersionView[]).find((v) => v.number === number);
  if (!found) throw new Error(`version ${number} is not listed`);
  return found;
}

async function until<T>(what: string, limitMs: number, everyMs: number, look: () => Promise<T | null | undefined | false>): Promise<T> {
  const end = Date.now() + limitMs;
  for (;;) {
    const found = await look();
    if (found) return found;
    if (Date.now() > end) throw new Error(`${what}: not within ${limitMs / 1000} s`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** `work`, or a clear failure after `limitMs`. */
function within<T>(work: Promise<T>, limitMs: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, fail) => (timer = setTimeout(() => fail(new Error(`${what}: not within ${limitMs / 1000} s`)), limitMs)));
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

const paragraph = (id: string, text: string) => ({ type: 'paragraph', attrs: { id }, content: [{ type: 'text', text }] });

async function main(): Promise<void> {
  console.log('Plumbline soak: the scaled layout under load and faults (loopback only)\n');
  try {
    ensureDebianPackages(MACHINE_PACKAGES);
  } catch (err) {
    if (!POSTGRESQL.present()) throw err;
    console.warn(`${(err as Error).message}\n`);
  }

  process.env.PLUMBLINE_OUT_DIR ??= join(projectRoot, 'dist-soak');
  // As `npm run start:scaled` does: the object-store SDK's notice about future Node versions is not this run's news.
  if (Number(process.versions.node.split('.')[0]) < 22) process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true';
  const entry = join(outDir(), 'server', 'entry.mjs');
  const sources = ['src', 'db', 'public', 'templates', 'astro.config.mjs', 'package-lock.json'].map((p) => join(projectRoot, p));
  const stale = !existsSync(entry) || newest(sources) > statSync(entry).mtimeMs;
  if (stale) note(`building into ${outDir()} (missing or older than the sources)`);
  const built = stale ? buildAppInBackground() : Promise.resolve();
  built.catch(() => undefined);

  const t0 = Date.now();
  // A folder of its own: the cluster's owner (postgres, when we are root) must be able to reach it.
  clusterDir = mkdtempSync(join(tmpdir(), 'plumbline-soak-pg-'));
  const cluster = startCluster(clusterDir, await freePort(), { throwaway: true });
  s3 = await startFakeS3({ dir: join(dir, 's3'), bucket: 'plumbline-soak' });
  smtp = await startFakeSmtp({ dir: join(dir, 'mail') });
  const frontPort = await freePort();
  const site = `http://127.0.0.1:${frontPort}`;
  const secret = randomBytes(32).toString('base64url');
  const server = {
    databaseUrl: cluster.url,
    siteUrl: site,
    secret,
    signInLimit: 10_000,
    filesDir: join(dir, 'files'),
    storage: { driver: 's3' as const, ...s3.settings },
    mail: { smtpHost: smtp.host, smtpPort: smtp.port, captureDir: smtp.dir },
  };
  await prepareDatabase(server, { filesDir: server.filesDir, storage: server.storage, seed: false });
  await built;
  layout = await startScaledLayout({ webCount: WEB_PROCESSES, server, front: { host: '127.0.0.1', port: frontPort }, logsDir: join(dir, 'logs'), say: note });
  const webs = layout.processes.filter((p) => p.role === 'web');
  const worker = layout.processes.find((p) => p.role === 'worker')!;
  note(`cluster, store, ${WEB_PROCESSES} web processes and a worker up in ${since(t0)} s; front port ${site}`);

  // ---- a brand with a built version, a share link, and two editors ----
  const t1 = Date.now();
  const db = new pg.Client({ connectionString: cluster.url });
  await db.connect();
  const person = async (label: string) => {
    const p = new Person(site);
    const email = `soak-${label}-${Date.now()}@soak.example`;
    await p.must(200, 'POST', '/api/auth/sign-up/email', { email, password: 'soak-password-long-enough', name: `Soak ${label}` });
    // The soak proves addresses in its own database, as the mailed link would (that link has its own tests).
    await db.query('UPDATE "user" SET "emailVerified" = true WHERE email = $1', [email]);
    return { p, email };
  };
  const { p: owner } = await person('owner');
  const { p: editor, email: editorEmail } = await person('editor');
  await db.end();
  const { brand } = await owner.must(201, 'POST', '/api/brands', { name: 'Soak Test Harbour' });
  const api = `/api/brands/${brand.id}`;
  for (const [name, value] of [['Harbour Ink', '#1f2d3d'], ['Sail White', '#f6f4ee']]) await owner.must(201, 'POST', `${api}/colors`, { name, value });
  const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'intro', title: 'Soak', eyebrow: '', intro: '' } }, paragraph('p0', 'A guideline page for the visitors of the soak.')] };
  await owner.must(200, 'PUT', `${api}/guideline`, { baseRevision: 0, doc });
  await owner.must(201, 'POST', `${api}/versions`, { note: 'Soak: first version' });
  const v1 = await until('version 1 built', 180_000, 250, async () => ((await version(owner, brand.id, 1)).state !== 'building' ? version(owner, brand.id, 1) : null));
  if (v1.state !== 'ready') throw new Error(`version 1 did not build: ${v1.buildError}`);
  const { shareLink } = await owner.must(201, 'POST', `${api}/share-links`, { label: 'Soak visitors' });
  const visitor = new Person(site);
  const opened = await visitor.request('GET', new URL(shareLink.url).pathname);
  if (opened.status !== 303 || !opened.headers.get('location')) throw new Error(`opening the share link answered ${opened.status}`);
  const page = new URL(opened.headers.get('location')!, site).toString();
  const first = await fetch(page, { headers: { cookie: visitor.cookie() } });
  if (first.status !== 200) throw new Error(`the share link's page answered ${first.status}`);
  await first.arrayBuffer();
  // The second editor joins through the invitation the owner mails (read from the mail catcher).
  await owner.must(201, 'POST', `${api}/members`, { email: editorEmail, role: 'editor' });
  const mail = await until('the invitation mail', 20_000, 100, async () => listCaptured(smtp!.dir, { to: editorEmail, limit: 1 })[0]);
  const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
  if (!token) throw new Error('the invitation mail carries no /invite/ link');
  await editor.must(200, 'POST', `/api/invitations/${token}/accept`, {});
  note(`brand, version 1 (built), share link and a second editor ready in ${since(t1)} s`);

  // ---- 1. share-link visitors ----
  // A warm-up first, as load tests commonly do (connections opened, code compiled, pools filled); shown, not judged.
  const warm = await visitors(page, { cookie: visitor.cookie() }, VISITORS, WARM_UP_SECONDS);
  note(`warm-up, ${VISITORS} visitors for ${WARM_UP_SECONDS} s (not judged): ${figures(warm)}, ${failures(warm)} errors${failures(warm) ? ` [${notOk(warm)}]` : ''}`);
  const steadyFrom = Date.now();
  const steady = await visitors(page, { cookie: visitor.cookie() }, VISITORS, LOAD_SECONDS);
  result(
    1,
    failures(steady) === 0,
    `${VISITORS} share-link visitors for ${LOAD_SECONDS} s through the front port: ${figures(steady)}, ${failures(steady)} errors (goal 0); ${machine()}${failures(steady) ? ` [${notOk(steady)}; ${when(steady, steadyFrom)}]` : ''}`,
  );

  // ---- 2. kill -9 one web process under that load ----
  const victim: ScaledProcess = webs[0];
  const faultSeconds = Math.max(12, Math.min(LOAD_SECONDS, 20));
  const during = visitors(page, { cookie: visitor.cookie() }, VISITORS, faultSeconds);
  during.catch(() => undefined); // awaited below; a step that fails first must not leave it unhandled
  await new Promise((r) => setTimeout(r, 4000));
  const killedAt = Date.now();
  await killHard(victim.child);
  await within(layout.running(victim), 90_000, 'the supervisor starting the killed web process again');
  const restartedAt = Date.now();
  const backAt = await until('the killed web process back in the rotation', 60_000, 50, async () =>
    layout!.front.rotation().find((t) => t.port === victim.port)?.inRotation ? Date.now() : null,
  );
  const faulted = await during;
  const before = faulted.failedAt.filter((t) => t < killedAt).length;
  const inFault = faulted.failedAt.filter((t) => t >= killedAt && t <= backAt).length;
  const after = faulted.failedAt.filter((t) => t > backAt).length;
  const health = await (await fetch(`http://127.0.0.1:${victim.port}/api/health`)).json();
  result(
    2,
    failures(faulted) === 0 && health.status === 'ok',
    `kill -9 web process ${victim.n} of ${WEB_PROCESSES} under ${VISITORS} visitors (${faultSeconds} s): ${figures(faulted)}; errors before ${before}, during ${inFault}, after ${after} (goal 0); ` +
      `started again by the supervisor ${((restartedAt - killedAt) / 1000).toFixed(1)} s and back in rotation ${((backAt - killedAt) / 1000).toFixed(1)} s after the kill; ${machine()}${failures(faulted) ? ` [${notOk(faulted)}]` : ''}`,
  );

  // ---- 3. kill -9 the worker mid-build ----
  await owner.must(201, 'POST', `${api}/versions`, { note: 'Soak: the worker is killed while this builds' });
  const running = await until('version 2 building with a step running', 120_000, 50, async () => {
    const v = await version(owner, brand.id, 2);
    if (v.state !== 'building') throw new Error(`version 2 left building (${v.state}) before the worker could be killed`);
    return v.buildSteps.find((s) => s.state === 'running');
  });
  const workerKilledAt = Date.now();
  await killHard(worker.child);
  const stillBuilding = (await version(owner, brand.id, 2)).state === 'building';
  await within(layout.running(worker), 90_000, 'the supervisor starting the killed worker again');
  const workerBackAt = Date.now();
  const v2 = await until('version 2 built after the worker was killed', 180_000, 250, async () => {
    const v = await version(owner, brand.id, 2);
    return v.state === 'building' ? null : v;
  });
  const readyAt = Date.now();
  const served = v2.state === 'ready' ? (await owner.request('GET', `/b/${brand.slug}/v/2`)).status : 0;
  result(
    3,
    stillBuilding && v2.state === 'ready' && served === 200,
    `kill -9 the worker during the build step "${running.label}": the version stayed building (${stillBuilding ? 'yes' : 'NO'}); worker started again in ${((workerBackAt - workerKilledAt) / 1000).toFixed(1)} s; ` +
      `version 2 ${v2.state} ${((readyAt - workerKilledAt) / 1000).toFixed(1)} s after the kill, its page answers ${served} (goal ready, 200)${v2.buildError ? ` [${v2.buildError}]` : ''}`,
  );

  // ---- 4. two editors saving the same draft ----
  const counts = { sameBase: 0, oneWinner: 0, conflicts: 0, other: 0, retriedOk: 0, lost: 0 };
  const t4 = Date.now();
  const editors = [
    { who: 'owner', p: owner, mark: 'o' },
    { who: 'editor', p: editor, mark: 'e' },
  ];
  for (let round = 1; round <= ROUNDS; round++) {
    const drafts = await Promise.all(editors.map((e) => e.p.must(200, 'GET', `${api}/guideline`)));
    if (drafts[0].revision === drafts[1].revision) counts.sameBase++;
    const withEdit = (d: { doc: { content: unknown[] } }, e: (typeof editors)[number]) => ({
      ...d.doc,
      content: [...d.doc.content, paragraph(`${e.mark}${round}`, `Round ${round}: a line added by the ${e.who}.`)],
    });
    const saves = await Promise.all(editors.map((e, i) => e.p.request('PUT', `${api}/guideline`, { baseRevision: drafts[i].revision, doc: withEdit(drafts[i], e) })));
    const won = saves.filter((s) => s.status === 200).length;
    const lostRace = saves.filter((s) => s.status === 409 && s.body?.error?.code === 'conflict').length;
    counts.conflicts += lostRace;
    counts.other += saves.length - won - lostRace;
    if (won === 1 && lostRace === 1) counts.oneWinner++;
    // The loser reloads and saves its edit again on top of the winner's.
    for (const [i, save] of saves.entries()) {
      if (save.status !== 409) continue;
      const fresh = await editors[i].p.must(200, 'GET', `${api}/guideline`);
      const again = await editors[i].p.request('PUT', `${api}/guideline`, { baseRevision: fresh.revision, doc: withEdit(fresh, editors[i]) });
      if (again.status === 200) counts.retriedOk++;
    }
    const ids = new Set(((await owner.must(200, 'GET', `${api}/guideline`)).doc.content as { attrs?: { id?: string } }[]).map((n) => n.attrs?.id));
    for (const e of editors) if (!ids.has(`${e.mark}${round}`)) counts.lost++;
  }
  const final = new Set(((await owner.must(200, 'GET', `${api}/guideline`)).doc.content as { attrs?: { id?: string } }[]).map((n) => n.attrs?.id));
  const missingAtEnd = editors.flatMap((e) => Array.from({ length: ROUNDS }, (_, r) => `${e.mark}${r + 1}`)).filter((id) => !final.has(id)).length;
  result(
    4,
    counts.sameBase === ROUNDS && counts.oneWinner === ROUNDS && counts.other === 0 && counts.retriedOk === counts.conflicts && counts.lost === 0 && missingAtEnd === 0,
    `two editors saving the same draft from the same revision, ${ROUNDS} rounds in ${since(t4)} s: ${counts.oneWinner} rounds with exactly one winner, ${counts.conflicts} conflict answers (409), ` +
      `${counts.retriedOk} saved after reloading, ${counts.other} other answers, ${counts.lost + missingAtEnd} edits lost (goal: one winner every round, 0 lost)`,
  );
}

let code = 0;
try {
  await main();
  code = results.every((r) => r.ok) && results.length === 4 ? 0 : 1;
} catch (err) {
  console.error(`\nsoak could not go on: ${(err as Error).stack ?? err}`);
  code = 1;
}
console.log(`\n${results.filter((r) => r.ok).length} of 4 goals met in ${since(began)} s${code ? ' — FAILED' : ''}`);
await cleanUp();
process.exit(code);
