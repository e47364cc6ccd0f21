// What reading the session from the database on every request costs (sign-out is then honoured at once in every
// process), measured in one run against the same requests without a session:
// - the published page read by a member (a session lookup per request) vs through a share link (none);
// - GET /api/health with the member's session cookie vs without.
// Both pages come from the same notice-kept memory of brand, role and version, so the difference is the session.
import autocannon from 'autocannon';
import { benchServer, call } from './support/server';

async function load(url: string, headers: Record<string, string>) {
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
  await load(page, { cookie }); // warm up
  const member = await load(page, { cookie });
  const visitor = await load(page, { cookie: shareCookie });
  console.log(line('published page, member (session read per request)', member));
  console.log(line('published page, share link (no session)', visitor));
  console.log(`ratio member / share link: ${(member.rps / visitor.rps).toFixed(2)}`);

  const health = `${server.baseUrl}/api/health`;
  const signed = await load(health, { cookie });
  const anonymous = await load(health, {});
  console.log(line('health with a session cookie', signed));
  console.log(line('health without', anonymous));
  console.log(`ratio with / without: ${(signed.rps / anonymous.rps).toFixed(2)}`);
}
