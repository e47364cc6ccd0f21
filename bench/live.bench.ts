// What a signed-in request pays for its session, measured in one run against the same requests without one:
// - the published page read by a member (session, role, brand and version from notice-kept memory) vs through a
//   share link (no session);
// - GET /api/health with the member's session cookie vs without.
// Sessions are kept in memory by change notices (src/lib/auth/sessions.server.ts). Reading the session table on
// every request instead (the state before) measured 343 vs 1 398 req/s on the page here: a ratio of 0.24.
// Health runs one `SELECT 1` per request by design, so its own figure is 1 transaction per request.
// Beside the rates (which a busy machine moves a lot), the database transactions each request caused, read from
// pg_stat_database: a figure the machine's load does not move.
import autocannon from 'autocannon';
import pg from 'pg';
import { benchServer, call } from './support/server';

let db: pg.Client;
/**
 * Transactions committed or rolled back so far, once every server connection has reported: PostgreSQL 15 backends
 * report their counts at most once a second while busy and within 10 s once idle (PGSTAT_IDLE_INTERVAL, from memory
 * of pgstat.c), so this waits 11 s first.
 */
async function transactions(): Promise<number> {
  await new Promise((r) => setTimeout(r, 11_000));
  return Number((await db.query('SELECT xact_commit + xact_rollback AS n FROM pg_stat_database WHERE datname = current_database()')).rows[0].n);
}

async function load(url: string, headers: Record<string, string>) {
  await autocannon({ url, connections: 50, duration: 2, headers }); // warm up this path first
  const before = await transactions();
  const result = await autocannon({ url, connections: 50, duration: 6, headers });
  // Our own reads of the statistics count as well; at thousands of requests they do not show.
  const caused = (await transactions()) - before;
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx, db: caused / result.requests.total };
}

const line = (what: string, r: { rps: number; p99: number; errors: number; db: number }) =>
  `${what}: ${r.rps.toFixed(0)} req/s, p99 ${r.p99} ms, ${r.db.toFixed(2)} database transactions per request (${r.errors} errors)`;

export default async function liveBench(): Promise<void> {
  const server = await benchServer();
  db = new pg.Client({ connectionString: server.databaseUrl });
  await db.connect();
  const cookie = await server.signUp('bench-live');
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: 'Bench Live' })).brand as { id: string; slug: string };
  const base = `/api/brands/${brand.id}`;
  const { revision } = await call(server, cookie, 'GET', `${base}/guideline`);
  const content = [{ type: 'sectionHeading', attrs: { id: 's1', title: 'Welcome', eyebrow: '', intro: 'What this guide is for.' } }];
  await call(server, cookie, 'PUT', `${base}/guideline`, { baseRevision: revision, doc: { type: 'doc', content } });
  await call(server, cookie, 'POST', `${base}/versions`, { note: 'Bench' });
  const { url } = (await call(server, cookie, 'POST', `${base}/share-links`, { label: 'Bench' })).shareLink;
  const opened = await fetch(url, { redirect: 'manual' });
  const shareCookie = opened.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');

  const page = `${server.baseUrl}/b/${brand.slug}`;
  const member = await load(page, { cookie });
  const visitor = await load(page, { cookie: shareCookie });
  console.log(line('published page, member (session from memory)', member));
  console.log(line('published page, share link (no session)', visitor));
  console.log(`ratio member / share link: ${(member.rps / visitor.rps).toFixed(2)}`);

  const health = `${server.baseUrl}/api/health`;
  const signed = await load(health, { cookie });
  const anonymous = await load(health, {});
  console.log(line('health with a session cookie', signed));
  console.log(line('health without', anonymous));
  console.log(`ratio with / without: ${(signed.rps / anonymous.rps).toFixed(2)}`);
  await db.end();
}
