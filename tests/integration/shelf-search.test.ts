// The shelf's search and filters (words, tag, kind, state, format, rights, expiry) against a hand-worked table, hostile
// query strings refused with the JSON error shape, and the expiry job run on a fixed clock. Dates are ISO 8601 calendar
// dates (YYYY-MM-DD, ISO 8601-1:2019 §5.2.2.1), counted in UTC.
import sharp from 'sharp';
import yauzl from 'yauzl';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import type { Sequelize } from 'sequelize';
import { connect } from '@db/models';
import { runAssetExpiry } from '@/lib/assets/expiry.server';
import { Client } from '../support/client';
import { waitForBuild } from '../support/publish';
import { closeDb, sql } from '../support/db';
import { makeBrand, makeCast, type Cast, type Fixture } from './fixtures';

let cast: Cast;
let brand: Fixture;
const ids: Record<string, string> = {};
const shelf = () => `/api/brands/${brand.brandId}/assets`;
const today = new Date().toISOString().slice(0, 10);
const shift = (days: number) => new Date(Date.parse(`${today}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

const svg = (fill: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 50"><rect x="10" y="10" width="80" height="30" fill="${fill}"/></svg>`;
const png = (r: number) => sharp({ create: { width: 40, height: 30, channels: 3, background: { r, g: 90, b: 120 } } }).png().toBuffer();

async function put(label: string, file: { name: string; bytes: string | Uint8Array; type: string }, patch: Record<string, unknown>) {
  const up = await cast.clients.owner.upload(shelf(), file.name, file.bytes, file.type);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  ids[label] = up.body.assets[0].id;
  const r = await cast.clients.owner.patch(`${shelf()}/${ids[label]}`, patch);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
}

beforeAll(async () => {
  cast = await makeCast();
  brand = await makeBrand(cast, 'Quay Search Brand');
  // The fixture brand holds one approved asset of its own, without rights or expiry: it is part of the table as F.
  ids.F = brand.assetId;
  // Invented demo data; the expectations below are worked out by hand from this table.
  await put('A', { name: 'harbour-mark-navy.svg', bytes: svg('#1d2a44'), type: 'image/svg+xml' }, { name: 'Harbour mark navy', tags: ['primary', 'print'], rights: 'Owned outright by the client.', state: 'approved' });
  await put('B', { name: 'harbour-mark-white.svg', bytes: svg('#f4f1ea'), type: 'image/svg+xml' }, { name: 'Harbour mark white', tags: ['reverse'], expiresOn: shift(20), state: 'approved' });
  await put('C', { name: 'dock.png', bytes: await png(10), type: 'image/png' }, { name: 'Dock photo', tags: ['print'], rights: 'Licensed for web use until renewal.', credit: 'Photo: Ada Pier', expiresOn: shift(-3) });
  await put('D', { name: 'crate.svg', bytes: svg('#c8553d'), type: 'image/svg+xml' }, { name: 'Crate pattern', expiresOn: shift(60) });
  await put('E', { name: 'signage.png', bytes: await png(200), type: 'image/png' }, { name: 'Signage photo', tags: ['outdoor'], credit: 'Studio archive', expiresOn: shift(5), state: 'approved' });
});
afterAll(closeDb);

/** The text of a zip's first entry. */
function firstEntryText(zip: Buffer): Promise<string> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(zip, { lazyEntries: true }, (err, archive) => {
      if (err || !archive) return reject(err);
      archive.once('entry', (entry: yauzl.Entry) => {
        archive.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
        });
      });
      archive.readEntry();
    });
  });
}

/** The labels of the assets a query returns, sorted. */
async function found(query: string, who: 'owner' | 'partner' = 'owner'): Promise<string[]> {
  const r = await cast.clients[who].get(`${shelf()}?${query}`);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  const back = new Map(Object.entries(ids).map(([k, v]) => [v, k]));
  return (r.body.assets as { id: string }[]).map((a) => back.get(a.id) ?? `?${a.id}`).sort();
}

describe('filters combine as worked out by hand', () => {
  // Table: A navy (approved, svg, tags primary+print, rights), B white (approved, svg, expires in 20 days),
  // C dock (draft, png, tag print, rights + credit "Ada Pier", expired 3 days ago), D crate (draft, svg, expires in 60 days),
  // E signage (approved, png, credit, expires in 5 days), F the fixture's approved SVG (nothing set).
  test.each([
    ['', ['A', 'B', 'C', 'D', 'E', 'F']],
    ['q=harbour', ['A', 'B']],
    ['q=harb', ['A', 'B']], // a word's beginning matches
    ['q=Navy+HARBOUR', ['A']], // every word must match, in any case
    ['q=ada', ['C']], // the credit line
    ['q=licensed', ['C']], // the rights text
    ['q=print', ['A', 'C']], // tags
    ['q=photo&state=draft', ['C']],
    ['tag=print&format=png', ['C']],
    ['kind=logo&rights=with', ['A']],
    ['rights=without', ['B', 'D', 'E', 'F']],
    ['expiry=expired', ['C']], // the expiry day is in the past (today counts as expired)
    ['expiry=expiring', ['B', 'E']], // default window: 30 days
    ['expiry=expiring&days=10', ['E']],
    ['expiry=expiring&days=90&format=svg', ['B', 'D']],
    ['expiry=none', ['A', 'F']],
    ['state=approved&expiry=expiring', ['B', 'E']],
    ['q=%27%3B+DROP+TABLE+assets%3B+--', []], // SQL in the words is just words (bound values)
    ['q=%26%7C!%3A*', ['A', 'B', 'C', 'D', 'E', 'F']], // text-search operators only: no words, no narrowing
  ])('%s', async (query, expected) => {
    expect(await found(query)).toEqual(expected);
  });

  test('partners see approved assets only, whatever they ask for', async () => {
    expect(await found('q=harbour&state=draft', 'partner')).toEqual([]);
    expect(await found('expiry=expired', 'partner')).toEqual([]);
    expect(await found('q=photo', 'partner')).toEqual(['E']);
  });

  test('each asset carries its rights, credit and expiry', async () => {
    const r = await cast.clients.partner.get(`${shelf()}/${ids.E}`);
    expect(r.body.asset).toMatchObject({ credit: 'Studio archive', rights: null, expiresOn: shift(5), expiry: 'expiring' });
  });
});

describe('hostile query strings are answered 400 with the JSON error shape', () => {
  test.each([
    'state=published',
    'expiry=soon',
    'expiry=expiring&days=abc',
    'expiry=expiring&days=0',
    'expiry=expiring&days=99999',
    'expiry=expiring&days=1.5',
    'days=5', // a window without "expiring"
    `q=${'a'.repeat(101)}`,
    'q=line%0Abreak',
    'q=%3Cscript%3E%00',
    'format=exe',
    'rights=maybe',
    'kind=logo&sort=name', // unknown parameter
    'tag=' + encodeURIComponent('a\u202Eb'), // a bidirectional override is not one clean line
  ])('%s', async (query) => {
    const r = await cast.clients.owner.get(`${shelf()}?${query}`);
    expect(r.status).toBe(400);
    expect(r.body).toMatchObject({ error: { code: 'invalid_input', message: expect.stringMatching(/^The query is not valid: /) } });
  });

  test('rights, credit and expiry dates are checked on the way in, and nothing saved is lost', async () => {
    const path = `${shelf()}/${ids.A}`;
    for (const body of [{ expiresOn: '2026-02-30' }, { expiresOn: '31/12/2026' }, { expiresOn: '1999-12-31' }, { credit: 'x'.repeat(201) }, { rights: 'y'.repeat(4001) }, { credit: 'two\nlines' }]) {
      const r = await cast.clients.owner.patch(path, body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(r.body.error.code).toBe('invalid_input');
    }
    // An approved asset cannot be given a day already past (it would be retired at once).
    const past = await cast.clients.owner.patch(path, { expiresOn: shift(-1) });
    expect(past.status).toBe(422);
    expect(past.body.error.code).toBe('expired');
    const [row] = await sql('SELECT rights, credit, expires_on::text AS expires_on, state FROM assets WHERE id = $1', [ids.A]);
    expect(row).toEqual({ rights: 'Owned outright by the client.', credit: null, expires_on: null, state: 'approved' });
  });
});

describe('share-link visitors see rights beside the download', () => {
  test('rights, credit and expiry are shown escaped, with the caution that the licence decides', async () => {
    const owner = cast.clients.owner;
    const hostile = 'Web only. <img src=x onerror=alert(1)> & "print" needs a new licence.';
    expect((await owner.patch(`${shelf()}/${ids.E}`, { rights: hostile })).status).toBe(200);
    const published = await owner.post(`/api/brands/${brand.brandId}/versions`, { note: 'With rights' });
    expect(published.status).toBe(201);
    expect((await waitForBuild(owner, brand.brandId, published.body.version.number)).state).toBe('ready');
    const { url } = (await owner.post(`/api/brands/${brand.brandId}/share-links`, { allowDownloads: true })).body.shareLink;
    const visitor = new Client();
    expect((await visitor.get(new URL(url).pathname)).status).toBe(303);
    const slug = (await owner.get(`/api/brands/${brand.brandId}`)).body.brand.slug;
    const page = await visitor.get(`/b/${slug}/downloads`);
    expect(page.status).toBe(200);
    const html = String(page.body);
    const block = html.slice(html.indexOf(`data-asset-rights="${ids.E}"`), html.indexOf('</dl>', html.indexOf(`data-asset-rights="${ids.E}"`)));
    // OWASP XSS Prevention, rule 1: text in HTML is entity-encoded.
    expect(block).toContain('Web only. &lt;img src=x onerror=alert(1)&gt; &amp; &quot;print&quot; needs a new licence.');
    expect(block).toContain('Studio archive');
    expect(html).not.toContain('<img src=x');
    expect(html).toContain('not legal advice');
    expect(html).not.toContain('Dock photo'); // a draft never reaches the site
  });

  test('a bundle’s USAGE.txt lists rights and credits with the caution', async () => {
    const res = await fetch(`${inject('baseUrl')}/api/brands/${brand.brandId}/bundles`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie: cast.clients.partner.cookieHeader(), origin: inject('baseUrl') },
      body: JSON.stringify({ assetIds: [ids.E, ids.A] }),
    });
    expect(res.status).toBe(200);
    const zip = Buffer.from(await res.arrayBuffer());
    // USAGE.txt is the first entry, stored with deflate; read it with yauzl as the bundle tests do.
    const usage = await firstEntryText(zip);
    expect(usage).toContain('RIGHTS AND CREDITS');
    expect(usage).toContain('Usage rights: Owned outright by the client.');
    expect(usage).toContain('Credit: Studio archive');
    expect(usage).toContain(`Expires on ${shift(5)}`);
    expect(usage).toContain('not legal advice');
  });
});

describe('the expiry job on a fixed clock', () => {
  let db: Sequelize;
  const sent: { to: string; notice: string; asset: string; retired: boolean }[] = [];
  const deps = {
    send: async (to: string, template: string, data: Record<string, unknown>) => {
      expect(template).toBe('asset-expiry');
      sent.push({ to, notice: data.ahead ? 'ahead' : 'due', asset: String(data.assetName), retired: data.retired === true });
      return { sent: true };
    },
    link: (path: string) => `https://plumbline.test${path}`,
  };
  // A day far from the real one, so the server's own hourly run never touches these assets.
  const EXPIRES = '2031-03-10';
  const run = async (instant: string) => {
    const outcome = await runAssetExpiry(new Date(instant), deps);
    return { retired: outcome.retired.filter((id) => id === ids.G || id === ids.H), notices: outcome.notices.filter((n) => n.assetId === ids.G || n.assetId === ids.H) };
  };

  beforeAll(async () => {
    db = connect(inject('databaseUrl'));
    // G approved, H a draft, both expiring on the same future day.
    await put('G', { name: 'ferry.svg', bytes: svg('#2f6f8f'), type: 'image/svg+xml' }, { name: 'Ferry mark', expiresOn: EXPIRES, state: 'approved' });
    await put('H', { name: 'tram.svg', bytes: svg('#8f2f6f'), type: 'image/svg+xml' }, { name: 'Tram sketch', expiresOn: EXPIRES });
  });
  afterAll(() => db.close());

  test('told seven days before, then retired and told on the day, each once; audited once', async () => {
    // 8 days before (2031-03-02): nothing yet.
    expect(await run('2031-03-02T12:00:00Z')).toEqual({ retired: [], notices: [] });
    // 7 days before, just after midnight UTC: the notice ahead, for both (the draft too: its owners may mean to approve it).
    const ahead = await run('2031-03-03T00:00:01Z');
    expect(ahead.retired).toEqual([]);
    expect(ahead.notices.map((n) => n.notice).sort()).toEqual(['ahead', 'ahead']);
    // Later the same week: not again.
    expect(await run('2031-03-03T18:00:00Z')).toEqual({ retired: [], notices: [] });
    expect(await run('2031-03-09T23:59:59Z')).toEqual({ retired: [], notices: [] });
    // The expiry day: the approved one is retired, both owners' notices go out.
    const due = await run('2031-03-10T00:00:00Z');
    expect(due.retired).toEqual([ids.G]);
    expect(due.notices.map((n) => n.notice)).toEqual(['due', 'due']);
    // Later that day and the day after: nothing more.
    expect(await run('2031-03-10T09:00:00Z')).toEqual({ retired: [], notices: [] });
    expect(await run('2031-03-11T09:00:00Z')).toEqual({ retired: [], notices: [] });

    const owner = cast.emails.owner;
    const order = (m: { notice: string; asset: string }) => `${m.notice === 'ahead' ? 0 : 1}${m.asset}`;
    const mine = sent.filter((m) => m.asset === 'Ferry mark' || m.asset === 'Tram sketch').sort((a, b) => order(a).localeCompare(order(b)));
    expect(mine).toEqual([
      { to: owner, notice: 'ahead', asset: 'Ferry mark', retired: false },
      { to: owner, notice: 'ahead', asset: 'Tram sketch', retired: false },
      { to: owner, notice: 'due', asset: 'Ferry mark', retired: true },
      { to: owner, notice: 'due', asset: 'Tram sketch', retired: false },
    ]);
    const states = await sql('SELECT id, state FROM assets WHERE id = ANY($1) ORDER BY name', [[ids.G, ids.H]]);
    expect(states).toEqual([{ id: ids.G, state: 'retired' }, { id: ids.H, state: 'draft' }]);
    const audits = await sql(`SELECT actor_id, details FROM audit_events WHERE action = 'asset.expire' AND target_id = $1`, [ids.G]);
    expect(audits).toHaveLength(1);
    expect(audits[0]).toMatchObject({ actor_id: null, details: { expiresOn: EXPIRES, retiredOn: EXPIRES, before: 'approved' } });
    const notices = await sql('SELECT notice, expires_on::text AS day, recipients FROM asset_expiry_notices WHERE asset_id = $1 ORDER BY notice', [ids.G]);
    expect(notices).toEqual([{ notice: 'ahead', day: EXPIRES, recipients: 1 }, { notice: 'due', day: EXPIRES, recipients: 1 }]);
  });

  test('the server schedules the job hourly with pg-boss and has run it once at start', async () => {
    await expect.poll(async () => (await sql(`SELECT cron, timezone FROM pgboss.schedule WHERE name = 'asset-expiry'`)), { timeout: 20_000 }).toEqual([{ cron: '7 * * * *', timezone: 'UTC' }]);
    await expect.poll(async () => (await sql(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'asset-expiry' AND state = 'completed'`))[0].n, { timeout: 20_000 }).toBeGreaterThan(0);
  });

  test('a retired asset is gone from the partner’s shelf and cannot be approved again until its date moves', async () => {
    expect((await cast.clients.partner.get(`${shelf()}/${ids.G}`)).status).toBe(404);
    // The real today is long before 2031, so moving it back to approved is allowed again: the check is against today.
    const again = await cast.clients.owner.patch(`${shelf()}/${ids.G}`, { state: 'approved' });
    expect(again.status).toBe(200);
  });
});
