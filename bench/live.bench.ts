// What a signed-in request pays for its session, measured in one run against the same requests without one:
// - the published page read by a member (session, role, brand and version from notice-kept memory) vs through a
//   share link (no session);
// - GET /api/health with the member's session cookie vs without.
// Sessions are kept in memory by change notices (src/lib/auth/sessions.server.ts). Reading the session table on
// every request instead (the state before) measured 343 vs 1 398 req/s on the page here: a ratio of 0.24.
import autocannon from 'autocannon';
import { benchServer, call } from './support/server';

async function load(url: string, headers: Record<string, string>) {
  await autocannon({ url, connections: 50, duration: 2, headers }); // warm up this path first
  const result = await autocannon({ url, connections: 50, duration: 6, headers });
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx };
}

const line = (what: string, r: { rps: number; p99: number; errors: number }) => `${what}: ${r.rps.toFixed(0)} req/s, p99 ${r.p99} ms (${r.errors} errors)`;

export default async function liveBench(): Promise<void> {
  const server = await benchServer();
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
}
