// Mock-up files through the API and the published site: PDF pages read back with pdf-lib (trim + 2 × 3 mm bleed;
// the business card is 85 × 55 mm, common practice in Europe; 1 pt = 1/72 in), refusals with their sizes, and the
// site's downloads behind the share link's download right.
import { PDFDocument } from 'pdf-lib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { FIXTURE_SVG } from './fixtures';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb } from '../support/db';
import { publishAndWait } from '../support/publish';

let owner: Client;
let brandId: string;
let slug: string;
let logoId: string;
const PT = (mm: number) => (mm / 25.4) * 72;

/** The answer's bytes (the test client reads text). */
async function bytesOf(client: Client, path: string): Promise<{ status: number; type: string | null; body: Buffer }> {
  const res = await fetch(baseUrl() + path, { headers: { cookie: client.cookieHeader() }, redirect: 'manual' });
  return { status: res.status, type: res.headers.get('content-type'), body: Buffer.from(await res.arrayBuffer()) };
}

async function visit(url: string): Promise<Client> {
  const client = new Client();
  expect((await client.get(new URL(url).pathname)).status).toBe(303);
  return client;
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('mockup-owner'));
  const brand = (await owner.post('/api/brands', { name: 'Mockup Makers' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const up = await owner.upload(`/api/brands/${brandId}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml', { variant: 'primary' });
  expect(up.status).toBe(201);
  logoId = up.body.logo.id;
  await owner.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#1d2a44', role: 'primary' });
  await owner.request('PUT', `/api/brands/${brandId}/guideline`, {
    baseRevision: 0,
    doc: { type: 'doc', content: [{ type: 'applications', attrs: { id: 'apps', templates: ['business-card', 'social-post'], logoId, photoIds: [], note: '' } }] },
  });
  await publishAndWait(owner, brandId, 'Mock-ups');
});
afterAll(closeDb);

describe('the draft route', () => {
  test('a business card PDF has two pages of 91 × 61 mm (85 × 55 mm trim + 3 mm bleed each side)', async () => {
    const r = await bytesOf(owner, `/api/brands/${brandId}/mockups/business-card?format=pdf`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('application/pdf');
    const doc = await PDFDocument.load(r.body);
    expect(doc.getPageCount()).toBe(2);
    for (const page of doc.getPages()) {
      expect(page.getMediaBox().width).toBeCloseTo(PT(91), 2);
      expect(page.getMediaBox().height).toBeCloseTo(PT(61), 2);
      expect(page.getTrimBox().width).toBeCloseTo(PT(85), 2);
    }
  });

  test('a square post is a 1080 px PNG; asked as PDF it is refused as a screen piece', async () => {
    const png = await bytesOf(owner, `/api/brands/${brandId}/mockups/social-post?format=png`);
    expect(png.status).toBe(200);
    const meta = await sharp(png.body).metadata();
    expect([meta.width, meta.height]).toEqual([1080, 1080]);
    const pdf = await owner.get(`/api/brands/${brandId}/mockups/social-post?format=pdf`);
    expect(pdf.status).toBe(422);
    expect(pdf.body.error.code).toBe('not_print');
  });

  test('an unknown template is 404; a logo whose minimum is larger than the card is refused with both sizes', async () => {
    expect((await owner.get(`/api/brands/${brandId}/mockups/mug`)).status).toBe(404);
    expect((await owner.patch(`/api/brands/${brandId}/logos/${logoId}`, { minPrintMm: 60 })).status).toBe(200);
    const r = await owner.get(`/api/brands/${brandId}/mockups/business-card?format=pdf`);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('mockup_too_small');
    expect(r.body.error.message).toContain('42 × 20 mm');
    expect(r.body.error.message).toContain('minimum width of 60 mm');
    await owner.patch(`/api/brands/${brandId}/logos/${logoId}`, { minPrintMm: null });
  });
});

describe('the published site', () => {
  test('a link that allows downloads gets the version’s mock-ups the page shows, and only those', async () => {
    const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true })).body.shareLink;
    const visitor = await visit(url);
    const page = await visitor.get(`/b/${slug}/v/1`);
    expect(page.body).toContain(`/b/${slug}/v/1/mockups/business-card?format=pdf`);
    const pdf = await bytesOf(visitor, `/b/${slug}/v/1/mockups/business-card?format=pdf`);
    expect(pdf.status).toBe(200);
    expect((await PDFDocument.load(pdf.body)).getPageCount()).toBe(2);
    expect((await bytesOf(visitor, `/b/${slug}/v/1/mockups/sign?format=pdf`)).status).toBe(404);
  });

  test('a link without downloads reads the page but is refused the files', async () => {
    const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: false })).body.shareLink;
    const visitor = await visit(url);
    expect((await visitor.get(`/b/${slug}/v/1`)).status).toBe(200);
    expect((await bytesOf(visitor, `/b/${slug}/v/1/mockups/business-card?format=png`)).status).toBe(403);
  });
});
