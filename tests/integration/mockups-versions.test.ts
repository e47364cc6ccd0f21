// Mock-ups kept and bounded, and a published version's mock-ups and pattern drawn from nothing but the version: its
// frozen identity and the file copies it keeps. PNGs measured with sharp; the pattern's tile is the generator's own.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { FIXTURE_SVG } from './fixtures';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { waitForBuild } from '../support/publish';
import { closeDb, sql } from '../support/db';

let owner: Client;
let ownerId: string;
let brandId: string;
let slug: string;
let logoId: string;
let paperId: string;
let patternId: string;
let unusedId: string;
let visitor: Client;

async function bytesOf(client: Client, path: string): Promise<{ status: number; type: string | null; body: Buffer }> {
  const res = await fetch(baseUrl() + path, { headers: { cookie: client.cookieHeader() }, redirect: 'manual' });
  return { status: res.status, type: res.headers.get('content-type'), body: Buffer.from(await res.arrayBuffer()) };
}

beforeAll(async () => {
  const person = await signUpFresh('mockup-keeper');
  owner = person.client;
  ownerId = person.id;
  const brand = (await owner.post('/api/brands', { name: 'Kept Pieces' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  logoId = (await owner.upload(`/api/brands/${brandId}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml', { variant: 'primary' })).body.logo.id;
  await owner.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#1d2a44', role: 'primary' });
  paperId = (await owner.post(`/api/brands/${brandId}/colors`, { name: 'Paper', value: '#f4efe6', role: 'secondary' })).body.color.id;
  // A shelf pattern drawn by the generator, approved: the pattern block links it, the mock-ups draw it.
  const saved = await owner.post(`/api/brands/${brandId}/patterns`, { settings: { logoId, layout: 'grid', scale: 20, spacing: 0.5, groundColorId: paperId } });
  expect(saved.status).toBe(201);
  patternId = saved.body.asset.id;
  expect((await owner.patch(`/api/brands/${brandId}/assets/${patternId}`, { state: 'approved' })).status).toBe(200);
  // Another approved pattern that no block links and the mock-ups do not draw (the first by name is theirs).
  unusedId = (await owner.post(`/api/brands/${brandId}/patterns`, { settings: { logoId, layout: 'diagonal', scale: 30 }, name: 'Zz spare pattern' })).body.asset.id;
  expect((await owner.patch(`/api/brands/${brandId}/assets/${unusedId}`, { state: 'approved' })).status).toBe(200);
  const doc = {
    type: 'doc',
    content: [
      { type: 'pattern', attrs: { id: 'pat', patternId, height: 160 } },
      { type: 'applications', attrs: { id: 'apps', templates: ['business-card', 'letterhead-a4'], logoId, photoIds: [], note: '' } },
    ],
  };
  expect((await owner.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: 0, doc })).status).toBe(200);
  expect((await owner.post(`/api/brands/${brandId}/versions`, { note: 'With a pattern' })).status).toBe(201);
  expect((await waitForBuild(owner, brandId, 1)).state).toBe('ready');
  const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true })).body.shareLink;
  visitor = new Client();
  expect((await visitor.get(new URL(url).pathname)).status).toBe(303);
});
afterAll(async () => {
  await sql('DELETE FROM rate_counters WHERE key = $1', [`mockup:${ownerId}`]);
  await closeDb();
});

describe('the version keeps its own copies', () => {
  test('the version copied the linked shelf pattern’s tile with the logos, and no pattern it does not use', async () => {
    const [row] = await sql<{ files: Record<string, { key: string; contentType: string }> }>('SELECT files FROM guideline_versions WHERE brand_id = $1 AND number = 1', [brandId]);
    expect(row.files[patternId]?.contentType).toBe('image/svg+xml');
    expect(row.files[unusedId]).toBeUndefined();
    expect(row.files[logoId]).toBeDefined();
  });

  test('the published pattern block links the shelf pattern and draws its mark from the version’s files', async () => {
    const page = await visitor.get(`/b/${slug}/v/1`);
    expect(page.status).toBe(200);
    expect(page.body).toContain(`data-shelf-pattern="${patternId}"`);
    expect(page.body).toContain(`/b/${slug}/v/1/files/${logoId}?variant=black`);
  });

  test('after the live palette and shelf change, the version’s mock-up is the same file; the draft’s is not', async () => {
    const before = await bytesOf(visitor, `/b/${slug}/v/1/mockups/business-card?format=png`);
    expect(before.status).toBe(200);
    const draftBefore = await bytesOf(owner, `/api/brands/${brandId}/mockups/business-card?format=png&logoId=${logoId}`);
    expect(draftBefore.body.equals(before.body)).toBe(true); // same inputs, the same kept drawing
    expect((await owner.patch(`/api/brands/${brandId}/colors/${paperId}`, { value: '#d8e8d0' })).status).toBe(200);
    expect((await owner.request('DELETE', `/api/brands/${brandId}/assets/${patternId}`)).status).toBeLessThan(300);
    const after = await bytesOf(visitor, `/b/${slug}/v/1/mockups/business-card?format=png`);
    expect(after.status).toBe(200);
    expect(after.body.equals(before.body)).toBe(true);
    const draftAfter = await bytesOf(owner, `/api/brands/${brandId}/mockups/business-card?format=png&logoId=${logoId}`);
    expect(draftAfter.status).toBe(200);
    expect(draftAfter.body.equals(before.body)).toBe(false);
    // The card's pattern column [62, 0, 23, 55] mm: the version's still on the old paper #f4efe6, the draft's on the new #d8e8d0.
    const ground = async (png: Buffer) => {
      const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
      const counts = new Map<string, number>();
      const px = (mm: number) => Math.round((mm / 25.4) * 96 * 2);
      for (let y = px(2); y < px(53); y += 3) {
        for (let x = px(63); x < px(84); x += 3) {
          const i = (y * info.width + x) * info.channels;
          const hex = `#${[0, 1, 2].map((c) => data[i + c].toString(16).padStart(2, '0')).join('')}`;
          counts.set(hex, (counts.get(hex) ?? 0) + 1);
        }
      }
      return [...counts.entries()].sort((a, b) => b[1] - a[1])[0][0];
    };
    expect(await ground(before.body)).toBe('#f4efe6');
    expect(await ground(draftAfter.body)).toBe('#d8e8d0');
  });
});

describe('drawings are kept and new ones are bounded per member', () => {
  test('past the member’s rate a new drawing is refused with 429; a drawing kept from before is still served', async () => {
    const kept = await bytesOf(owner, `/api/brands/${brandId}/mockups/business-card?format=png&logoId=${logoId}`);
    expect(kept.status).toBe(200);
    // The member's window is full (the limiter's own row, as 20 drawings in this minute would leave it).
    await sql(`INSERT INTO rate_counters (key, count, window_start) VALUES ($1, 1000, now()) ON CONFLICT (key) DO UPDATE SET count = 1000, window_start = now()`, [`mockup:${ownerId}`]);
    const again = await bytesOf(owner, `/api/brands/${brandId}/mockups/business-card?format=png&logoId=${logoId}`);
    expect(again.status).toBe(200);
    expect(again.body.equals(kept.body)).toBe(true);
    const fresh = await owner.get(`/api/brands/${brandId}/mockups/letterhead-a4?format=pdf&logoId=${logoId}`);
    expect(fresh.status).toBe(429);
    expect(fresh.body.error.code).toBe('rate_limited');
    expect(fresh.body.error.message).toMatch(/new mock-up drawings in a minute/);
    // The published site is not the draft route: its readers are not counted against the member.
    expect((await bytesOf(visitor, `/b/${slug}/v/1/mockups/letterhead-a4?format=pdf`)).status).toBe(200);
    await sql('DELETE FROM rate_counters WHERE key = $1', [`mockup:${ownerId}`]);
  });
});
