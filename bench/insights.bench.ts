// Recording reads must not slow the published page. Baseline in the same run: the same page asked with `DNT: 1`,
// which the recorder drops before doing anything; then without it, every 200 noted, batched and queued. Rounds
// alternate so drift on a shared machine falls on both sides; the rows the worker stored are counted at the end.
import autocannon from 'autocannon';
import pg from 'pg';
import { benchServer, call } from './support/server';

async function load(url: string, headers: Record<string, string>) {
  const result = await autocannon({ url, connections: 50, duration: 5, headers });
  return { rps: result.requests.average, p99: result.latency.p99, ok: result['2xx'] };
}

export default async function insightsBench(): Promise<void> {
  const server = await benchServer();
  const cookie = await server.signUp('bench-insights');
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: 'Bench Insights' })).brand;
  const base = `/api/brands/${brand.id}`;
  const content = Array.from({ length: 8 }, (_, i) => [
    { type: 'sectionHeading', attrs: { id: `s${i}`, title: `Section ${i + 1}`, eyebrow: '', intro: 'What this part covers.' } },
    { type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance for the people who apply the brand every day.' }] },
  ]).flat();
  const { revision } = await call(server, cookie, 'GET', `${base}/guideline`);
  await call(server, cookie, 'PUT', `${base}/guideline`, { baseRevision: revision, doc: { type: 'doc', content } });
  await call(server, cookie, 'POST', `${base}/versions`, { note: 'Bench' });
  while ((await call(server, cookie, 'GET', `${base}/versions`)).versions[0].state === 'building') await new Promise((r) => setTimeout(r, 100));

  const url = `${server.baseUrl}/b/${brand.slug}`;
  await load(url, { cookie, dnt: '1' }); // warm up
  const quiet = [];
  const recorded = [];
  let served = 0;
  for (let round = 0; round < 2; round++) {
    quiet.push(await load(url, { cookie, dnt: '1' }));
    const r = await load(url, { cookie });
    recorded.push(r);
    served += r.ok;
  }
  const mean = (xs: { rps: number }[]) => xs.reduce((n, x) => n + x.rps, 0) / xs.length;
  console.log(`published page, DNT: 1 (nothing recorded): ${mean(quiet).toFixed(0)} req/s, p99 ${Math.max(...quiet.map((q) => q.p99))} ms`);
  console.log(`published page, recorded: ${mean(recorded).toFixed(0)} req/s, p99 ${Math.max(...recorded.map((q) => q.p99))} ms`);
  console.log(`ratio recorded / not recorded: ${(mean(recorded) / mean(quiet)).toFixed(2)} (goal ≥ 0.9)`);

  // The queue's job writes the batches on the worker; wait for them, then compare with what was served.
  const db = new pg.Client({ connectionString: server.databaseUrl });
  await db.connect();
  const until = Date.now() + 60_000;
  let stored = 0;
  while (Date.now() < until) {
    stored = Number((await db.query(`SELECT count(*) AS n FROM site_insights WHERE brand_id = $1 AND kind = 'page'`, [brand.id])).rows[0].n);
    if (stored >= served) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  await db.end();
  console.log(`page reads stored: ${stored} of ${served} recorded 200s (the rest dropped when the buffer was full, or still queued)`);
}
