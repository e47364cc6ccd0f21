// The print-ready PDF: paper sizes read back with pdf-lib, every section title in its text (pdf.js), cached.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';

let owner: Client;
let slug: string;
const TITLES = ['Our story', 'Logo', 'Colour', 'Typography'];

/** Ask for the PDF until it is ready (the job runs in the background); resolves to its bytes. */
async function fetchPdf(client: Client, path: string): Promise<{ bytes: Uint8Array; polls: number }> {
  for (let polls = 0; polls < 240; polls++) {
    const r = await fetch(baseUrl() + path, { headers: { accept: 'application/json', cookie: client.cookieHeader() } });
    if (r.headers.get('content-type')?.includes('application/pdf')) return { bytes: new Uint8Array(await r.arrayBuffer()), polls };
    expect(r.status).toBe(202);
    const status = await r.json();
    expect(['queued', 'rendering']).toContain(status.state);
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('the PDF was not ready within 2 minutes');
}

async function pdfText(bytes: Uint8Array): Promise<string> {
  const doc = await getDocument({ data: bytes.slice(), useSystemFonts: false, isEvalSupported: false }).promise;
  let text = '';
  for (let i = 1; i <= doc.numPages; i++) {
    const page = await doc.getPage(i);
    text += (await page.getTextContent()).items.map((it: any) => it.str).join(' ') + '\n';
  }
  return text;
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('printer'));
  const brand = (await owner.post('/api/brands', { name: 'Print Test Bakery' })).body.brand;
  slug = brand.slug;
  const color = (await owner.post(`/api/brands/${brand.id}/colors`, { name: 'Crust', value: '#a0522d' })).body.color;
  const content = TITLES.flatMap((title, i) => [
    { type: 'sectionHeading', attrs: { id: `s${i}`, title, eyebrow: '', intro: '' } },
    { type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: `Guidance for ${title.toLowerCase()}.` }] },
  ]);
  content.push({ type: 'colorPalette', attrs: { id: 'pal', colorIds: [color.id], showPrint: true, note: '' } } as never);
  await owner.request('PUT', `/api/brands/${brand.id}/guideline`, { baseRevision: 0, doc: { type: 'doc', content } });
  expect((await owner.post(`/api/brands/${brand.id}/versions`, { note: 'For print' })).status).toBe(201);
});
afterAll(closeDb);

describe('PDF export', () => {
  // ISO 216: A4 = 210 × 297 mm = 595.28 × 841.89 pt; ANSI/ASME Y14.1: Letter = 8.5 × 11 in = 612 × 792 pt.
  // Chromium snaps page sizes to its own grid, hence ±1 pt.
  test.each([
    ['a4', 595.28, 841.89],
    ['letter', 612, 792],
  ])('%s pages measure %d × %d pt and carry every section title', async (size, width, height) => {
    const { bytes } = await fetchPdf(owner, `/b/${slug}/v/1/guideline.pdf?size=${size}`);
    const pdf = await PDFDocument.load(bytes);
    expect(pdf.getPageCount()).toBeGreaterThanOrEqual(TITLES.length + 2); // cover, contents, a page per section
    for (const page of pdf.getPages()) {
      expect(Math.abs(page.getWidth() - width)).toBeLessThanOrEqual(1);
      expect(Math.abs(page.getHeight() - height)).toBeLessThanOrEqual(1);
    }
    const text = await pdfText(bytes);
    for (const title of TITLES) expect(text).toContain(title);
    expect(text).toContain('Print Test Bakery');
    expect(text).toMatch(/Version 1/);
  });

  test('a second request is served from the cache at once, and the latest address gives the same file', async () => {
    const again = await fetchPdf(owner, `/b/${slug}/v/1/guideline.pdf?size=a4`);
    expect(again.polls).toBe(0);
    const latest = await fetchPdf(owner, `/b/${slug}/guideline.pdf?size=a4`);
    expect(latest.polls).toBe(0);
    expect(Buffer.from(latest.bytes).equals(Buffer.from(again.bytes))).toBe(true);
    const rows = await sql(`SELECT size, state FROM pdf_exports e JOIN guideline_versions v ON v.id = e.version_id JOIN brands b ON b.id = v.brand_id WHERE b.slug = $1 ORDER BY size`, [slug]);
    expect(rows).toEqual([{ size: 'a4', state: 'done' }, { size: 'letter', state: 'done' }]);
  });

  test('a browser gets a progress page while the PDF is made; an unknown size is a 400', async () => {
    const bad = await owner.get(`/b/${slug}/v/1/guideline.pdf?size=a3`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/a4 or letter/);
  });

  test('a stranger cannot print the guidelines', async () => {
    const { client } = await signUpFresh('nosy');
    expect((await client.get(`/b/${slug}/v/1/guideline.pdf?size=a4`)).status).toBe(404);
    expect((await client.get(`/b/${slug}/v/1/print?size=a4`)).status).toBe(404);
  });
});
