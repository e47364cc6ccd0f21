// A published version is built by a job: publishing answers at once with the version `building`, the job runs its
// steps (recorded for the publishing screen) and turns it `ready` with a manifest whose every file is in storage;
// the token and PDF addresses then stream those stored files with strong ETags.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import { signUpFresh, type Client } from '../support/client';
import { closeDb, sql } from '../support/db';
import { mailTo } from '../support/mailbox';
import { joinBrand } from '../support/client';
import { waitForBuild, type PublishedVersion } from '../support/publish';

let owner: Client;
let brandId: string;
let slug: string;
let published: { status: number; body: { version: PublishedVersion & { number: number } } };
let built: PublishedVersion;
let follower: { client: Client; email: string };
const api = (p = '') => `/api/brands/${brandId}${p}`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('builder'));
  const brand = (await owner.post('/api/brands', { name: 'Build Test Roastery' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  await owner.post(api('/colors'), { name: 'Roast', value: '#4a2c21' });
  follower = await signUpFresh('follower');
  await joinBrand(owner, brandId, follower, 'viewer');
  expect((await follower.client.request('PUT', api('/follow'), {})).status).toBeLessThan(300);
  const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 's1', title: 'Colour', eyebrow: '', intro: '' } }] };
  expect((await owner.request('PUT', api('/guideline'), { baseRevision: 0, doc })).status).toBe(200);
  published = await owner.post(api('/versions'), { note: 'First build' });
  if (published.status !== 201) throw new Error(JSON.stringify(published.body));
  built = await waitForBuild(owner, brandId, 1);
});
afterAll(closeDb);

describe('the build job', () => {
  test('publishing answers at once with the version building; the job makes it ready with every step done', async () => {
    expect(published.status).toBe(201);
    // Existing fields stay; the build's state is added.
    expect(published.body.version).toMatchObject({ number: 1, note: 'First build', state: 'building' });
    expect(built.state).toBe('ready');
    expect(built.buildError).toBeNull();
    expect(built.buildSteps.map((s) => [s.id, s.state])).toEqual(expect.arrayContaining([['tokens', 'done'], ['pdf', 'done']]));
    // The order of the steps is files → pages → tokens → pdf (each helper's steps in its place).
    const ids = built.buildSteps.map((s) => s.id);
    expect(ids.indexOf('tokens')).toBeLessThan(ids.indexOf('pdf'));
  });

  test('the ready version has a manifest whose every key is in storage with the recorded hash and size', async () => {
    const [row] = await sql(`SELECT state, manifest, built_at FROM guideline_versions WHERE brand_id = $1 AND number = 1`, [brandId]);
    expect(row.state).toBe('ready');
    expect(row.built_at).toBeTruthy();
    const entries = Object.entries<{ key: string; hash: string; size: number; type: string }>(row.manifest.entries);
    expect(entries.map(([path]) => path)).toEqual(expect.arrayContaining(['tokens?format=dtcg', 'tokens?format=css', 'guideline.pdf?size=a4', 'guideline.pdf?size=letter', 'presentation.pdf']));
    for (const [, entry] of entries) {
      expect(entry.key.startsWith(`${brandId}/build/`)).toBe(true); // an object key, never a machine path
      const bytes = await readFile(join(inject('filesDir'), entry.key));
      expect(bytes.byteLength).toBe(entry.size);
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(entry.hash);
    }
  });

  test('the token address streams the built file with a strong ETag and answers 304 to it', async () => {
    const r = await owner.get(`/b/${slug}/v/1/tokens?format=dtcg`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-disposition')).toContain('.tokens.json');
    const etag = r.headers.get('etag')!;
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/); // strong: no W/ prefix (RFC 9110 §8.8.3)
    // DTCG format (Design Tokens Community Group, Format Module): a token is an object with $value; the brand colour is one.
    expect(JSON.stringify(r.body)).toContain('"$value"');
    expect(JSON.stringify(r.body).toLowerCase()).toContain('4a2c21');
    const again = await owner.request('GET', `/b/${slug}/v/1/tokens?format=dtcg`, undefined, { 'if-none-match': etag });
    expect(again.status).toBe(304); // RFC 9110 §13.1.2: If-None-Match on a matching strong validator
    // The latest address and the API's ?version= serve the same bytes.
    const latest = await owner.get(`/b/${slug}/tokens?format=dtcg`);
    expect(latest.headers.get('etag')).toBe(etag);
    const viaApi = await owner.get(api('/tokens?format=dtcg&version=1'));
    expect(viaApi.headers.get('etag')).toBe(etag);
    expect((await owner.get(`/b/${slug}/v/1/tokens?format=nope`)).status).toBe(400);
  });

  test('the PDF address streams the built A4 book (ISO 216: 595.28 × 841.89 pt) with its manifest ETag', async () => {
    const res = await fetch(`${inject('baseUrl')}/b/${slug}/v/1/guideline.pdf?size=a4`, { headers: { cookie: owner.cookieHeader() } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const [row] = await sql(`SELECT manifest FROM guideline_versions WHERE brand_id = $1 AND number = 1`, [brandId]);
    expect(res.headers.get('etag')).toBe(`"${row.manifest.entries['guideline.pdf?size=a4'].hash.slice(0, 32)}"`);
    const doc = await PDFDocument.load(new Uint8Array(await res.arrayBuffer()));
    expect(Math.abs(doc.getPage(0).getWidth() - 595.28)).toBeLessThanOrEqual(1);
    expect(Math.abs(doc.getPage(0).getHeight() - 841.89)).toBeLessThanOrEqual(1);
  });

  test('followers are e-mailed by the queue once the version is ready, once', async () => {
    const notice = () => mailTo(follower.email).filter((m) => /version 1/i.test(m.subject));
    for (let i = 0; i < 100 && notice().length === 0; i++) await new Promise((r) => setTimeout(r, 100));
    const notices = notice();
    expect(notices).toHaveLength(1);
    expect(notices[0].text).toContain(`/b/${slug}`);
  });

  test('retrying a build that did not fail is refused with the reason', async () => {
    const r = await owner.post(api('/versions/1/build'));
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('already_built');
    expect((await owner.post(api('/versions/99/build'))).status).toBe(404);
  });

  test('while a newer version builds, "latest" stays on the last ready one', async () => {
    const v2 = await owner.post(api('/versions'), { note: 'Second build' });
    expect(v2.body.version.state).toBe('building');
    const site = await owner.get(`/b/${slug}/tokens?format=css`);
    const [{ state }] = await sql(`SELECT state FROM guideline_versions WHERE brand_id = $1 AND number = 2`, [brandId]);
    if (state === 'building') {
      // Read while version 2 was still building: the latest address served version 1's file.
      const [row] = await sql(`SELECT manifest FROM guideline_versions WHERE brand_id = $1 AND number = 1`, [brandId]);
      expect(site.headers.get('etag')).toBe(`"${row.manifest.entries['tokens?format=css'].hash.slice(0, 32)}"`);
    }
    expect((await waitForBuild(owner, brandId, 2)).state).toBe('ready');
  });
});
