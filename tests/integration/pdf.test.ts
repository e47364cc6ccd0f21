// The print-ready PDF, read back: paper sizes and metadata with pdf-lib; outline, contents page, page labels, break
// rules, fonts and vector logos with pdf.js (Mozilla's reference PDF reader).
import { getDocument, OPS, type PDFDocumentProxy } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRef, PDFStream } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';
import { FIXTURE_SVG } from './fixtures';
import { publishAndWait } from '../support/publish';

let owner: Client;
let slug: string;
const BRAND = 'Print Test Bakery';
const TITLES = ['Our story', 'Logo', 'Colour', 'Typography', 'In use'];
/** Headings inside the long first section, set between paragraphs of varied length to land near page feet. */
const SUBHEADS = Array.from({ length: 14 }, (_, i) => `Principle ${i + 1}`);
const HEADINGS = new Set([...TITLES, ...SUBHEADS]);

/** fetch, tried once more when the server closed an idle keep-alive socket just as the request went out. */
async function fetchOnce(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch {
    return fetch(url, init);
  }
}

/** Ask for the PDF until it is ready (the job runs in the background); resolves to its bytes. */
async function fetchPdf(client: Client, path: string): Promise<{ bytes: Uint8Array; polls: number }> {
  for (let polls = 0; polls < 240; polls++) {
    const r = await fetchOnce(baseUrl() + path, { headers: { accept: 'application/json', cookie: client.cookieHeader() } });
    if (r.headers.get('content-type')?.includes('application/pdf')) return { bytes: new Uint8Array(await r.arrayBuffer()), polls };
    expect(r.status).toBe(202);
    const status = await r.json();
    expect(['queued', 'rendering']).toContain(status.state);
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('the PDF was not ready within 2 minutes');
}

const open = (bytes: Uint8Array) => getDocument({ data: bytes.slice(), useSystemFonts: false, isEvalSupported: false }).promise;

interface Line {
  text: string;
  y: number;
}

/** A page's text as lines (items on one baseline joined), top to bottom, with the page height. */
async function pageLines(doc: PDFDocumentProxy, n: number): Promise<{ lines: Line[]; height: number }> {
  const page = await doc.getPage(n);
  const items = (await page.getTextContent()).items.filter((it: any) => typeof it.str === 'string' && it.str.trim()) as any[];
  const lines: Line[] = [];
  for (const it of [...items].sort((a, b) => b.transform[5] - a.transform[5] || a.transform[4] - b.transform[4])) {
    const y = it.transform[5];
    const last = lines[lines.length - 1];
    if (last && Math.abs(last.y - y) < 3) last.text = `${last.text} ${it.str}`.replace(/\s+/g, ' ').trim();
    else lines.push({ text: it.str.trim(), y });
  }
  return { lines, height: page.view[3] };
}

let a4: Uint8Array;
let pdf: PDFDocumentProxy;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('printer'));
  const brand = (await owner.post('/api/brands', { name: BRAND })).body.brand;
  slug = brand.slug;
  const base = `/api/brands/${brand.id}`;
  const colors: string[] = [];
  for (const [name, value] of [['Crust', '#a0522d'], ['Flour', '#f6efe3'], ['Char', '#2b1d14']]) colors.push((await owner.post(`${base}/colors`, { name, value })).body.color.id);
  const logo = (await owner.upload(`${base}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml')).body.logo;
  expect((await owner.post(`${base}/typefaces`, { shipped: 'fraunces', role: 'heading' })).status).toBe(201);
  expect((await owner.post(`${base}/typefaces`, { shipped: 'dm-sans', role: 'body' })).status).toBe(201);
  const para = (id: string, words: number) => ({ type: 'paragraph', attrs: { id }, content: [{ type: 'text', text: 'Bread is baked before dawn and sold warm by the loaf. '.repeat(words).trim() } ] });
  const content: unknown[] = [{ type: 'sectionHeading', attrs: { id: 's0', title: TITLES[0], eyebrow: 'About us', intro: 'Where the bakery comes from.' } }];
  SUBHEADS.forEach((title, i) => {
    content.push({ type: 'heading', attrs: { id: `h${i}`, level: 3 }, content: [{ type: 'text', text: title }] });
    content.push(para(`p${i}a`, 4 + ((i * 7) % 11)), para(`p${i}b`, 2 + ((i * 5) % 9)));
  });
  content.push({ type: 'sectionHeading', attrs: { id: 's1', title: TITLES[1], eyebrow: '', intro: '' } });
  content.push({ type: 'logoShowcase', attrs: { id: 'show', logoIds: [logo.id], brandColorId: colors[0], onDark: 'white', caption: '' } });
  content.push({ type: 'sectionHeading', attrs: { id: 's2', title: TITLES[2], eyebrow: '', intro: '' } });
  content.push({ type: 'colorPalette', attrs: { id: 'pal', colorIds: colors, showPrint: true, note: '' } });
  content.push({ type: 'sectionHeading', attrs: { id: 's3', title: TITLES[3], eyebrow: '', intro: '' } });
  content.push({ type: 'typography', attrs: { id: 'type', roles: ['heading', 'body'], showSpecimen: true, specimenText: 'Warm loaves, honest crust, early mornings', showScale: true } });
  content.push({ type: 'sectionHeading', attrs: { id: 's4', title: TITLES[4], eyebrow: '', intro: '' } });
  content.push(para('end', 6));
  expect((await owner.request('PUT', `${base}/guideline`, { baseRevision: 0, doc: { type: 'doc', content } })).status).toBe(200);
  await publishAndWait(owner, brand.id, 'For print');
  a4 = (await fetchPdf(owner, `/b/${slug}/v/1/guideline.pdf?size=a4`)).bytes;
  pdf = await open(a4);
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
    const doc = await PDFDocument.load(bytes);
    expect(doc.getPageCount()).toBeGreaterThanOrEqual(TITLES.length + 2); // cover, contents, a page per section
    for (const page of doc.getPages()) {
      expect(Math.abs(page.getWidth() - width)).toBeLessThanOrEqual(1);
      expect(Math.abs(page.getHeight() - height)).toBeLessThanOrEqual(1);
    }
    const read = await open(bytes);
    const text = (await Promise.all(Array.from({ length: read.numPages }, (_, i) => pageLines(read, i + 1)))).flatMap((p) => p.lines.map((l) => l.text)).join('\n');
    for (const title of TITLES) expect(text).toContain(title);
    expect(text).toContain(BRAND);
    expect(text).toMatch(/Version 1/);
  });

  test('title, author (the studio), subject and language are set in the document information (ISO 32000-1 §14.3.3)', async () => {
    const doc = await PDFDocument.load(a4, { updateMetadata: false });
    expect(doc.getTitle()).toBe(`${BRAND} brand guidelines, version 1`);
    const [studio] = await sql(`SELECT s.name FROM studios s JOIN brands b ON b.studio_id = s.id WHERE b.slug = $1`, [slug]);
    expect(doc.getAuthor()).toBe(studio.name);
    expect(doc.getSubject()).toContain(BRAND);
    expect(doc.getKeywords()).toContain('brand guidelines');
  });

  test('the outline has one top-level entry per section, in order, each opening the page its heading is on', async () => {
    const outline = await pdf.getOutline();
    expect(outline.map((e) => e.title)).toEqual(TITLES);
    for (const entry of outline) {
      const index = await pdf.getPageIndex((entry.dest as unknown[])[0] as never);
      const { lines } = await pageLines(pdf, index + 1);
      expect(lines.map((l) => l.text)).toContain(entry.title);
    }
    // The subheads of the first section are nested under it.
    expect(outline[0].items.map((e) => e.title)).toEqual(SUBHEADS);
  });

  test('the contents page lists each section with the page number printed on the page where it starts', async () => {
    const labels = (await pdf.getPageLabels()) ?? [];
    const outline = await pdf.getOutline();
    const { lines } = await pageLines(pdf, 2);
    expect(lines[0].text).toBe('Contents');
    for (const [i, title] of TITLES.entries()) {
      const row = lines.find((l) => l.text.startsWith(`${String(i + 1).padStart(2, '0')} ${title}`));
      expect(row, `contents row for ${title}`).toBeDefined();
      const listed = row!.text.match(/(\d+)$/)![1];
      const index = await pdf.getPageIndex((outline[i].dest as unknown[])[0] as never);
      // The page label (ISO 32000-1 §12.4.2) and the folio printed at the page's foot both say the listed number.
      expect(labels[index]).toBe(listed);
      const page = await pageLines(pdf, index + 1);
      expect(page.lines[page.lines.length - 1].text).toMatch(new RegExp(`${listed}$`));
    }
    // Front matter is numbered i, ii (common practice in book design); the body starts at 1.
    expect(labels.slice(0, 2)).toEqual(['i', 'ii']);
  });

  test('each contents row links to the page where its section starts', async () => {
    const doc = await PDFDocument.load(a4);
    const pages = doc.getPages().map((p) => p.ref.toString());
    const annots = doc.getPage(1).node.lookupMaybe(PDFName.of('Annots'), PDFArray);
    const targets = Array.from({ length: annots?.size() ?? 0 }, (_, i) => annots!.lookup(i, PDFDict).lookupMaybe(PDFName.of('Dest'), PDFArray)?.get(0))
      .filter((t): t is PDFRef => t instanceof PDFRef)
      .map((t) => pages.indexOf(t.toString()));
    const outline = await pdf.getOutline();
    const starts = await Promise.all(outline.map((e) => pdf.getPageIndex((e.dest as unknown[])[0] as never)));
    expect(targets).toEqual(starts);
  });

  test('no page ends with a heading: the running text under a heading always starts on the same page', async () => {
    let subheadsSeen = 0;
    for (let n = 3; n <= pdf.numPages; n++) {
      const { lines, height } = await pageLines(pdf, n);
      // Leave out the running head (baseline about 17 mm from the top) and the folio line (about 11 mm from the foot);
      // the body runs between the 22 mm and 20 mm margins.
      const body = lines.filter((l) => l.y > 45 && l.y < height - 56);
      subheadsSeen += body.filter((l) => SUBHEADS.includes(l.text)).length;
      expect(HEADINGS.has(body[body.length - 1]?.text ?? ''), `page ${n} ends with "${body[body.length - 1]?.text}"`).toBe(false);
    }
    expect(subheadsSeen).toBe(SUBHEADS.length);
  });

  test('every font is embedded as a font program (ISO 32000-1 §9.9: FontFile, FontFile2 or FontFile3), the brand faces among them', async () => {
    const doc = await PDFDocument.load(a4);
    const names: string[] = [];
    for (const [, object] of doc.context.enumerateIndirectObjects()) {
      if (!(object instanceof PDFDict) || object.get(PDFName.of('Type'))?.toString() !== '/Font') continue;
      const subtype = object.get(PDFName.of('Subtype'))?.toString();
      if (subtype === '/CIDFontType0' || subtype === '/CIDFontType2') continue; // checked through their Type0 parent
      // A Type 3 font (glyphs drawn as PDF procedures, what Chromium writes for variable fonts) has no font program.
      expect(subtype, 'no Type 3 fonts').not.toBe('/Type3');
      const name = object.get(PDFName.of('BaseFont'))?.toString() ?? '';
      names.push(name);
      const descendant = object.lookupMaybe(PDFName.of('DescendantFonts'), PDFArray)?.lookup(0, PDFDict) ?? object;
      const descriptor = descendant.lookup(PDFName.of('FontDescriptor'), PDFDict);
      const file = ['FontFile', 'FontFile2', 'FontFile3'].map((k) => descriptor.lookupMaybe(PDFName.of(k), PDFStream)).find(Boolean);
      expect(file, `${name} is embedded`).toBeDefined();
    }
    const all = names.join(' ');
    expect(all).toMatch(/Fraunces/i);
    expect(all).toMatch(/DMSans|DM-Sans|DM Sans/i);
  });

  test('the logo stays vector: the cover and the logo page draw its curves as paths and paint no raster image', async () => {
    const outline = await pdf.getOutline();
    const logoPage = (await pdf.getPageIndex((outline[1].dest as unknown[])[0] as never)) + 1;
    const IMAGE_OPS = [OPS.paintImageXObject, OPS.paintInlineImageXObject, OPS.paintImageMaskXObject, OPS.paintImageXObjectRepeat];
    for (const n of [1, logoPage]) {
      const ops = await (await pdf.getPage(n)).getOperatorList();
      const images = ops.fnArray.filter((fn) => IMAGE_OPS.includes(fn)).length;
      // The fixture logo's circle can only be drawn with Bézier curves (ISO 32000-1 §8.5.2.2, operator c).
      const curves = ops.fnArray.reduce((sum, fn, i) => (fn === OPS.constructPath ? sum + (ops.argsArray[i][0] as number[]).filter((op) => op === OPS.curveTo).length : sum), 0);
      expect(images, `page ${n} paints no raster image`).toBe(0);
      expect(curves, `page ${n} draws curves`).toBeGreaterThan(0);
    }
  });

  test('the built PDF is served at once, the latest address gives the same file, and both sizes are in the manifest', async () => {
    const again = await fetchPdf(owner, `/b/${slug}/v/1/guideline.pdf?size=a4`);
    expect(again.polls).toBe(0);
    const latest = await fetchPdf(owner, `/b/${slug}/guideline.pdf?size=a4`);
    expect(latest.polls).toBe(0);
    expect(Buffer.from(latest.bytes).equals(Buffer.from(again.bytes))).toBe(true);
    const [row] = await sql(`SELECT v.manifest FROM guideline_versions v JOIN brands b ON b.id = v.brand_id WHERE b.slug = $1 AND v.number = 1`, [slug]);
    expect(Object.keys(row.manifest.entries)).toEqual(expect.arrayContaining(['guideline.pdf?size=a4', 'guideline.pdf?size=letter', 'presentation.pdf']));
    expect(row.manifest.entries['guideline.pdf?size=a4'].size).toBe(again.bytes.byteLength);
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
