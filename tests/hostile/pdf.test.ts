// The PDF renderer against stored values that would make Chromium fetch an address of the attacker's choosing.
// The values are written straight into the published version's snapshot, past every schema, as a bug or an old
// row could leave them; a tiny HTTP server on another loopback port records whatever reaches it.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';
import { FIXTURE_SVG } from '../integration/fixtures';
import { publishAndWait } from '../support/publish';

let owner: Client;
let recorder: Server;
let trap = '';
const hits: string[] = [];
let connections = 0;

beforeAll(async () => {
  recorder = createServer((req, res) => {
    hits.push(`${req.method} ${req.url}`);
    res.writeHead(200, { 'content-type': 'image/png' }).end();
  });
  recorder.on('connection', () => connections++);
  await new Promise<void>((resolve) => recorder.listen(0, '127.0.0.1', resolve));
  trap = `http://127.0.0.1:${(recorder.address() as AddressInfo).port}`;
  ({ client: owner } = await signUpFresh('ssrf'));
});
afterAll(async () => {
  await new Promise((resolve) => recorder.close(resolve));
  await closeDb();
});

/** fetch, tried once more when the server closed an idle keep-alive socket just as the request went out. */
async function fetchOnce(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch {
    return fetch(url, init);
  }
}

async function fetchPdf(path: string): Promise<Uint8Array> {
  for (let polls = 0; polls < 240; polls++) {
    const r = await fetchOnce(baseUrl() + path, { headers: { accept: 'application/json', cookie: owner.cookieHeader() } });
    if (r.headers.get('content-type')?.includes('application/pdf')) return new Uint8Array(await r.arrayBuffer());
    const status = await r.json();
    expect(['queued', 'rendering'], JSON.stringify(status)).toContain(status.state);
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('the PDF was not ready within 2 minutes');
}

it('OWASP SSRF Prevention Cheat Sheet / ASVS 5.0 V1.3.6 (allow list for server-side requests): stored image, font and brand values pointing at loopback or outside addresses make the PDF renderer fetch nothing', async () => {
  const brand = (await owner.post('/api/brands', { name: 'Trap Street Rolls' })).body.brand;
  const base = `/api/brands/${brand.id}`;
  expect((await owner.post(`${base}/colors`, { name: 'Ink', value: '#1d2a44' })).status).toBe(201);
  expect((await owner.upload(`${base}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml')).status).toBe(201);
  expect((await owner.post(`${base}/typefaces`, { shipped: 'dm-sans', role: 'body' })).status).toBe(201);
  const doc = {
    type: 'doc',
    content: [
      { type: 'sectionHeading', attrs: { id: 's1', title: 'Imagery', eyebrow: '', intro: '' } },
      { type: 'imagery', attrs: { id: 'img', columns: 2, items: [{ src: 'photo-to-come-1', alt: 'A loaf', verdict: 'do', caption: 'Warm light' }] } },
    ],
  };
  expect((await owner.request('PUT', `${base}/guideline`, { baseRevision: 0, doc })).status).toBe(200);
  await publishAndWait(owner, brand.id, 'Trap');

  // What an attacker stores: image addresses on loopback, and CSS smuggled into names that reach style attributes
  // and the running heads (a newline ends a CSS string, so what follows would be read as a declaration).
  const [row] = await sql(`SELECT id, snapshot FROM guideline_versions WHERE brand_id = $1 AND number = 1`, [brand.id]);
  const snapshot = row.snapshot;
  snapshot.doc.content[1].attrs.items = [
    { src: `${trap}/imagery.png`, alt: 'loopback', verdict: 'do', caption: '' },
    { src: `${trap.replace('127.0.0.1', 'localhost')}/by-name.png`, alt: 'by name', verdict: 'dont', caption: '' },
  ];
  snapshot.doc.content[0].attrs.title = `Imagery"\n;}@import url(${trap}/title.css);@page{x:"`;
  const face = snapshot.identity.typefaces[0];
  face.family = `DM Sans\n;background-image:url(${trap}/family.png);x:"`;
  face.fallback = [`serif\n;background:url(${trap}/fallback.png)`];
  snapshot.identity.brand.name = `Trap Street Rolls"\n;}@import url(${trap}/brand.css);x{`;
  await sql(`UPDATE guideline_versions SET snapshot = $2 WHERE id = $1`, [row.id, JSON.stringify(snapshot)]);

  const bytes = await fetchPdf(`/b/${brand.slug}/v/1/guideline.pdf?size=a4`);
  expect((await PDFDocument.load(bytes)).getPageCount()).toBeGreaterThanOrEqual(3);
  expect(hits).toEqual([]);
  expect(connections).toBe(0);
});
