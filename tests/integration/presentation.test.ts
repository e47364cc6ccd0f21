// The reveal presentation over HTTP: who may open it (members; share links only with the setting), and its PDF
// read back with pdf.js (Mozilla's reference PDF reader) and pdf-lib: one 16:9 page per slide.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { FIXTURE_SVG } from './fixtures';
import { publishAndWait } from '../support/publish';

let owner: Client;
let slug: string;
let api: (path: string) => string;
const BRAND = 'Reveal Test Ropeworks';

/** fetch, tried once more when the server closed an idle keep-alive socket just as the request went out. */
async function fetchOnce(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch {
    return fetch(url, init);
  }
}

/** Ask for a PDF until it is ready (the job runs in the background); resolves to its bytes. */
async function fetchPdf(client: Client, path: string): Promise<Uint8Array> {
  for (let polls = 0; polls < 240; polls++) {
    const r = await fetchOnce(baseUrl() + path, { headers: { accept: 'application/json', cookie: client.cookieHeader() } });
    if (r.headers.get('content-type')?.includes('application/pdf')) return new Uint8Array(await r.arrayBuffer());
    expect(r.status).toBe(202);
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('the PDF was not ready within 2 minutes');
}

/** The slides a presentation page shows, by their data-slide names. */
const slidesOf = (html: string) => [...html.matchAll(/<section[^>]*data-slide="([a-z-]+)"/g)].map((m) => m[1]);

/** A share link's visitor, with the link opened (its cookie set). */
async function visitor(body: Record<string, unknown>): Promise<{ client: Client; id: string }> {
  const made = await owner.post(api('/share-links'), body);
  expect(made.status).toBe(201);
  const client = new Client();
  expect((await client.get(new URL(made.body.shareLink.url).pathname)).status).toBe(303);
  return { client, id: made.body.shareLink.id };
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('presenter'));
  const brand = (await owner.post('/api/brands', { name: BRAND })).body.brand;
  slug = brand.slug;
  const base = `/api/brands/${brand.id}`;
  api = (path) => `${base}${path}`;
  for (const [name, value] of [['Hemp', '#c9b48a'], ['Tar', '#231f1c'], ['Sail', '#fbf8f1']]) expect((await owner.post(`${base}/colors`, { name, value })).status).toBe(201);
  const logo = (await owner.upload(`${base}/logos`, 'knot.svg', FIXTURE_SVG, 'image/svg+xml')).body.logo;
  expect((await owner.post(`${base}/typefaces`, { shipped: 'dm-sans', role: 'body' })).status).toBe(201);
  const content = [
    { type: 'sectionHeading', attrs: { id: 's0', title: 'Pattern', eyebrow: '', intro: '' } },
    { type: 'pattern', attrs: { id: 'pat', logoId: logo.id } },
  ];
  expect((await owner.request('PUT', `${base}/guideline`, { baseRevision: 0, doc: { type: 'doc', content } })).status).toBe(200);
  await publishAndWait(owner, brand.id, 'To reveal');
});
afterAll(closeDb);

describe('who may open the presentation', () => {
  test('a member opens it; each slide is a labelled region', async () => {
    const r = await owner.get(`/b/${slug}/presentation`);
    expect(r.status).toBe(200);
    const slides = slidesOf(r.body);
    // One logo (no separate mark), colours, a face and a pattern block: these slides and no others.
    expect(slides).toEqual(['opening', 'logo', 'one-colour', 'palette', 'type', 'pattern', 'closing']);
    expect(r.body).toContain(`aria-label="3 of ${slides.length}: In one colour"`);
    expect(r.body).toContain('aria-live="polite"');
    expect((await owner.get(`/b/${slug}/v/1/presentation`)).status).toBe(200);
  });

  test('nobody else without a link: sign in first', async () => {
    const r = await new Client().get(`/b/${slug}/presentation`);
    expect(r.status).toBe(302);
    expect(r.headers.get('location')).toContain('/sign-in');
  });

  test('a share link without the setting reads the site but not the presentation (403), nor its PDF', async () => {
    const { client } = await visitor({ label: 'Rigging agency' });
    expect((await client.get(`/b/${slug}`)).status).toBe(200);
    const r = await client.get(`/b/${slug}/presentation`);
    expect(r.status).toBe(403);
    expect(r.body).toContain('not part of this link');
    expect((await client.get(`/b/${slug}/presentation.pdf`)).status).toBe(403);
    expect((await client.get(`/b/${slug}/v/1/presentation`)).status).toBe(403);
  });

  test('a share link with the setting opens it (200)', async () => {
    const { client } = await visitor({ label: 'Client board', allowPresentation: true });
    const r = await client.get(`/b/${slug}/presentation`);
    expect(r.status).toBe(200);
    expect(slidesOf(r.body)).toContain('opening');
  });

  test('the owner turns the setting on and off for a link already handed out; links start without it', async () => {
    const { client, id } = await visitor({});
    const [row] = await sql('SELECT allow_presentation FROM share_links WHERE id = $1', [id]);
    expect(row.allow_presentation).toBe(false);
    const on = await owner.patch(api(`/share-links/${id}`), { allowPresentation: true });
    expect(on.status).toBe(200);
    expect(on.body.shareLink.allowPresentation).toBe(true);
    expect((await client.get(`/b/${slug}/presentation`)).status).toBe(200);
    expect((await owner.patch(api(`/share-links/${id}`), { allowPresentation: false })).status).toBe(200);
    expect((await client.get(`/b/${slug}/presentation`)).status).toBe(403);
    // Bad input is refused with the one error shape, and the link keeps its setting.
    const bad = await owner.patch(api(`/share-links/${id}`), { allowPresentation: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBeTruthy();
    const [after] = await sql('SELECT allow_presentation FROM share_links WHERE id = $1', [id]);
    expect(after.allow_presentation).toBe(false);
    const [trail] = await sql(`SELECT details FROM audit_events WHERE action = 'shareLink.update' AND target_id = $1 ORDER BY created_at DESC LIMIT 1`, [id]);
    expect(trail.details).toEqual({ allowPresentation: false });
  });
});

describe('the presentation as a PDF', () => {
  let bytes: Uint8Array;
  let slides: string[];
  beforeAll(async () => {
    slides = slidesOf((await owner.get(`/b/${slug}/v/1/presentation`)).body);
    bytes = await fetchPdf(owner, `/b/${slug}/v/1/presentation.pdf`);
  }, 180_000);

  test('one page per slide shown', async () => {
    const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, isEvalSupported: false }).promise;
    expect(doc.numPages).toBe(slides.length);
  });

  // ITU-R BT.709 / SMPTE ST 2036-1: 16:9. 338.67 × 190.5 mm = 960 × 540 pt (1 pt = 1/72 in, 1 in = 25.4 mm);
  // Chromium snaps page sizes to its own grid, hence ±1 pt.
  test('every page is 16:9, 960 × 540 pt, read back with pdf.js', async () => {
    const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, isEvalSupported: false }).promise;
    for (let n = 1; n <= doc.numPages; n++) {
      const [x0, y0, x1, y1] = (await doc.getPage(n)).view;
      const width = x1 - x0;
      const height = y1 - y0;
      expect(Math.abs(width - 960)).toBeLessThanOrEqual(1);
      expect(Math.abs(height - 540)).toBeLessThanOrEqual(1);
      expect(Math.abs(width / height - 16 / 9)).toBeLessThan(0.005);
    }
  });

  test('the opening page carries the brand, and the file its title (ISO 32000-1 §14.3.3)', async () => {
    const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, isEvalSupported: false }).promise;
    const text = (await (await doc.getPage(1)).getTextContent()).items.map((it) => ('str' in it ? it.str : '')).join(' ');
    expect(text).toContain(BRAND);
    expect((await PDFDocument.load(bytes, { updateMetadata: false })).getTitle()).toBe(`${BRAND}: the identity, version 1`);
  });

  test('a share link with the setting gets the same file', async () => {
    const { client } = await visitor({ allowPresentation: true });
    const shared = await fetchPdf(client, `/b/${slug}/presentation.pdf`);
    expect(shared.length).toBe(bytes.length);
  });
});
