// Insights through the built server: reads and the page's events go through the recorder, the queue and the job into
// site_insights, and come back out of the owner's report; nothing identifying is stored and "do not track" holds.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, joinBrand, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { publishAndWait } from '../support/publish';

const UA = 'PlumblineInsightsTest/1.0 (distinctive-agent-string)';
let owner: Client;
let brandId: string;
let slug: string;
let linkId: string;
let linkUrl: string;

async function visit(url: string, headers: Record<string, string> = {}): Promise<Client> {
  const client = new Client();
  const r = await client.request('GET', new URL(url).pathname, undefined, headers);
  expect(r.status).toBe(303);
  return client;
}

const get = (client: Client, path: string, headers: Record<string, string> = {}) => client.request('GET', path, undefined, { 'user-agent': UA, ...headers });
/** What sendBeacon sends: a JSON string as text/plain. */
const beacon = (client: Client, body: string, headers: Record<string, string> = {}) =>
  client.request('POST', `/b/${slug}/v/1/events`, body, { 'content-type': 'text/plain;charset=UTF-8', 'user-agent': UA, ...headers });

/** The owner's report once `ready` holds (the recorder flushes each second; the worker polls every half second). */
async function reportWhen(ready: (r: any) => boolean, range = '7d'): Promise<any> {
  const until = Date.now() + 30_000;
  for (;;) {
    const r = await owner.get(`/api/brands/${brandId}/insights?range=${range}`);
    expect(r.status).toBe(200);
    if (ready(r.body.insights)) return r.body.insights;
    if (Date.now() > until) throw new Error(`the report never showed it: ${JSON.stringify(r.body.insights)}`);
    await new Promise((res) => setTimeout(res, 300));
  }
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('insights-owner'));
  const brand = (await owner.post('/api/brands', { name: 'Insight Reading Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const saved = await owner.request('PUT', `/api/brands/${brandId}/guideline`, {
    baseRevision: 0,
    doc: { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'story', title: 'Our story', eyebrow: '', intro: '' } }] },
  });
  expect(saved.status).toBe(200);
  await publishAndWait(owner, brandId, 'For readers');
  const link = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true, label: 'Printer proofs' })).body.shareLink;
  linkId = link.id;
  linkUrl = link.url;
});
afterAll(closeDb);

describe('recording reads and events', () => {
  test('a share-link page view, a download and an empty search show up in the owner’s report', async () => {
    const visitor = await visit(linkUrl);
    const page = await get(visitor, `/b/${slug}`);
    expect(page.status).toBe(200);
    // The built page loads the section-view script from the version's own copy, deferred.
    expect(page.body).toMatch(new RegExp(`<script defer="" src="/b/${slug}/v/1/static/insights.js">`));
    expect(page.body).toContain('data-block-id="story"');
    const script = await get(visitor, `/b/${slug}/v/1/static/insights.js`);
    expect(script.status).toBe(200);
    expect(script.body).toContain('IntersectionObserver');
    expect((await get(visitor, `/b/${slug}/tokens?format=css`)).status).toBe(200);
    expect((await beacon(visitor, JSON.stringify({ kind: 'search', query: 'Pantone 9999', results: 0 }))).status).toBe(204);
    expect((await beacon(visitor, JSON.stringify({ kind: 'search', query: 'story', results: 1 }))).status).toBe(204);
    expect((await beacon(visitor, JSON.stringify({ kind: 'section', blockId: 'story' }))).status).toBe(204);

    const report = await reportWhen((r) => r.searches.length > 0 && r.downloads.length > 0 && r.sections.length > 0 && r.totals.views > 0);
    expect(report.versions).toEqual([{ number: 1, views: 1, visitors: 1 }]);
    expect(report.visitors).toContainEqual({ via: 'link', shareLinkId: linkId, label: 'Printer proofs', visitors: 1, views: 1 });
    expect(report.downloads).toContainEqual({ label: 'Design tokens', format: 'css', path: 'tokens?format=css', count: 1 });
    // Searches are kept lower-case; only those that found nothing are listed.
    expect(report.searches.map((s: any) => [s.query, s.count])).toEqual([['pantone 9999', 1]]);
    expect(report.sections).toEqual([{ versionNumber: 1, blockId: 'story', title: 'Our story', views: 1 }]);
    expect(report.timeline).toHaveLength(7);
    expect(report.timeline.at(-1)).toMatchObject({ views: 1, visitors: 1, downloads: 1 });
  });

  test('no stored row holds an address or the user agent, only a 64-digit key', async () => {
    await reportWhen((r) => r.totals.views > 0);
    const columns = await sql(`SELECT column_name FROM information_schema.columns WHERE table_name = 'site_insights'`);
    expect(columns.map((c) => c.column_name).sort()).toEqual(
      ['at', 'block_id', 'brand_id', 'day', 'embedded', 'id', 'kind', 'member', 'path', 'query', 'results', 'share_link_id', 'version_number', 'visitor_key'].sort(),
    );
    const rows = await sql(`SELECT * FROM site_insights WHERE brand_id = $1`, [brandId]);
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const text = JSON.stringify(row);
      expect(text).not.toMatch(/127\.0\.0\.1|::1|::ffff/);
      expect(text).not.toContain('distinctive-agent-string');
      expect(row.visitor_key).toMatch(/^[0-9a-f]{64}$/);
    }
    // The day's salt exists; none from before today is left for anyone to recompute a key with.
    const salts = await sql(`SELECT day::text FROM insight_salts`);
    expect(salts.length).toBeGreaterThan(0);
  });

  test('DNT: 1 and Sec-GPC: 1 record nothing, while the answers stay the same', async () => {
    const quiet = (await owner.post(`/api/brands/${brandId}/share-links`, { label: 'Quiet reader' })).body.shareLink;
    for (const header of [{ dnt: '1' }, { 'sec-gpc': '1' }] as Record<string, string>[]) {
      const visitor = await visit(quiet.url, header);
      expect((await get(visitor, `/b/${slug}`, header)).status).toBe(200);
      expect((await beacon(visitor, JSON.stringify({ kind: 'search', query: 'dnt secret', results: 0 }), header)).status).toBe(204);
    }
    // A marker from a tracked reader after them: once it is stored, the batches before it were written too.
    const marker = await visit(linkUrl);
    expect((await beacon(marker, JSON.stringify({ kind: 'search', query: 'after the quiet ones', results: 0 }))).status).toBe(204);
    await reportWhen((r) => r.searches.some((s: any) => s.query === 'after the quiet ones'));
    expect(await sql(`SELECT id FROM site_insights WHERE share_link_id = $1 OR query = 'dnt secret'`, [quiet.id])).toEqual([]);
  });
});

describe('the events address', () => {
  test('refuses bad JSON, a wrong shape, a wrong type and an oversized body with the error shape', async () => {
    const visitor = await visit(linkUrl);
    const bad = await beacon(visitor, '{"kind":"search",');
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatchObject({ code: 'malformed_json', message: expect.any(String) });
    const shape = await beacon(visitor, JSON.stringify({ kind: 'section', blockId: '<script>' }));
    expect(shape.status).toBe(400);
    expect(shape.body.error.code).toBe('invalid_input');
    const type = await visitor.request('POST', `/b/${slug}/v/1/events`, 'kind=search', { 'content-type': 'application/x-www-form-urlencoded' });
    expect(type.status).toBe(415);
    const big = await beacon(visitor, JSON.stringify({ kind: 'search', query: 'x', results: 0, pad: 'x'.repeat(9000) }));
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too_large');
  });

  test('a visitor without access gets 404, as for the page', async () => {
    const anonymous = await new Client().request('POST', `/b/${slug}/v/1/events`, JSON.stringify({ kind: 'section', blockId: 'story' }), { 'content-type': 'text/plain' });
    expect(anonymous.status).toBe(404);
    expect(anonymous.body.error.code).toBe('not_found');
    const { client: stranger } = await signUpFresh('insights-stranger');
    expect((await stranger.request('POST', `/b/${slug}/v/1/events`, JSON.stringify({ kind: 'section', blockId: 'story' }))).status).toBe(404);
    const visitor = await visit(linkUrl);
    expect((await visitor.request('POST', `/b/${slug}/v/99/events`, JSON.stringify({ kind: 'section', blockId: 'story' }))).status).toBe(404);
    expect((await visitor.request('GET', `/b/${slug}/v/1/events`)).status).toBe(405);
  });
});

describe('the report is the owner’s', () => {
  test('an editor gets 403, a stranger 404, nobody signed in 401', async () => {
    const editor = await signUpFresh('insights-editor');
    await joinBrand(owner, brandId, editor, 'editor');
    expect((await editor.client.get(`/api/brands/${brandId}/insights`)).status).toBe(403);
    expect((await editor.client.get(`/api/brands/${brandId}/insights.csv`)).status).toBe(403);
    const { client: stranger } = await signUpFresh('insights-outsider');
    expect((await stranger.get(`/api/brands/${brandId}/insights`)).status).toBe(404);
    expect((await new Client().get(`/api/brands/${brandId}/insights`)).status).toBe(401);
    expect((await owner.get(`/api/brands/${brandId}/insights?range=1y`)).body.error.code).toBe('invalid_input');
  });

  test('CSV export neutralises formulas a visitor typed into the search box (OWASP "CSV Injection")', async () => {
    const visitor = await visit(linkUrl);
    expect((await beacon(visitor, JSON.stringify({ kind: 'search', query: '=HYPERLINK("http://evil.example")', results: 0 }))).status).toBe(204);
    await reportWhen((r) => r.searches.some((s: any) => s.query.startsWith('=hyperlink')));
    const csv = await owner.get(`/api/brands/${brandId}/insights.csv?range=7d&what=searches`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(csv.headers.get('content-disposition')).toContain(`${slug}-insights-searches-7d.csv`);
    const lines = String(csv.body).split('\r\n');
    expect(lines[0]).toBe('search,times,last seen');
    expect(lines).toContainEqual(expect.stringMatching(/^"'=hyperlink\(""http:\/\/evil\.example""\)",1,/));
    expect(lines.some((l) => l.startsWith('=') || l.startsWith('"='))).toBe(false);
  });
});
