// Photographs on the shelf and on the published page: uploaded as their own kind, approved only with alt text, placed
// by the imagery block by asset id, copied into the version and served there as srcset renditions cut around the
// focal point. Renditions are read back with sharp (a general-purpose image library) to check their stated widths.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { baseUrl, Client, signUpFresh } from '../support/client';
import { closeDb } from '../support/db';
import { publishAndWait } from '../support/publish';

let owner: Client;
let brandId: string;
let slug: string;
let photoId: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;

/** A 3000 × 2000 picture (3:2, a camera's shape) with a bright square where the subject is: 70 % across, 40 % down. */
async function cameraPhoto(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="3000" height="2000"><rect width="3000" height="2000" fill="#6b4a33"/><rect x="2000" y="700" width="200" height="200" fill="#ffe08a"/></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('photographer'));
  const created = (await owner.post('/api/brands', { name: 'Photo Test Roasters' })).body.brand;
  brandId = created.id;
  slug = created.slug;
}, 60_000);
afterAll(closeDb);

describe('photographs on the shelf', () => {
  test('a photo upload with the wrong bytes is refused: an SVG drawing and text named .jpg', async () => {
    const svg = await owner.upload(api('/assets'), 'mark.svg', '<svg xmlns="http://www.w3.org/2000/svg" width="8" height="8"><rect width="8" height="8"/></svg>', 'image/svg+xml', { kind: 'photo' });
    expect(svg.status).toBe(400);
    expect(svg.body.error.code).toBe('unsupported_file');
    expect(svg.body.error.message).toContain('A photograph must be JPEG, PNG, WebP or AVIF');
    const text = await owner.upload(api('/assets'), 'beans.jpg', 'not a picture', 'image/jpeg', { kind: 'photo' });
    expect(text.status).toBe(400);
    expect(text.body.error.code).toBe('unsupported_file');
  });

  test('a JPEG uploaded as a photograph is filed as one, with its size', async () => {
    const r = await owner.upload(api('/assets'), 'counter.jpg', await cameraPhoto(), 'image/jpeg', { kind: 'photo' });
    expect(r.status).toBe(201);
    const asset = r.body.assets[0];
    expect(asset).toMatchObject({ kind: 'photo', format: 'jpeg', width: 3000, height: 2000, altText: null, caption: null, focus: null });
    photoId = asset.id;
  });

  test('an approved photograph needs alt text (WCAG 2.2 SC 1.1.1 Non-text Content), and nothing else changes when refused', async () => {
    const refused = await owner.patch(api(`/assets/${photoId}`), { state: 'approved', caption: 'Kept?' });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('alt_text_required');
    expect(refused.body.error.message).toMatch(/needs alt text before it is approved/);
    expect((await owner.get(api(`/assets/${photoId}`))).body.asset).toMatchObject({ state: 'draft', caption: null });

    const blank = await owner.patch(api(`/assets/${photoId}`), { state: 'approved', altText: '   ' });
    expect(blank.status).toBe(422);

    const ok = await owner.patch(api(`/assets/${photoId}`), { state: 'approved', altText: 'A bright square on a brown counter.', caption: 'The counter at eight.', focus: { x: 0.7, y: 0.4 } });
    expect(ok.status).toBe(200);
    expect(ok.body.asset).toMatchObject({ state: 'approved', altText: 'A bright square on a brown counter.', caption: 'The counter at eight.', focus: { x: 0.7, y: 0.4 } });

    // Clearing the alt text of an approved photograph is refused the same way.
    expect((await owner.patch(api(`/assets/${photoId}`), { altText: null })).status).toBe(422);
  });

  test('a focal point outside 0–1 is refused with the field named', async () => {
    const r = await owner.patch(api(`/assets/${photoId}`), { focus: { x: 1.5, y: 0.2 } });
    expect(r.status).toBe(400);
    expect(JSON.stringify(r.body.error)).toMatch(/focus/);
  });
});

describe('the imagery block on the published page', () => {
  test('the block stores the picked asset id; the version serves srcset renditions that decode to their stated widths', async () => {
    const { revision } = (await owner.get(api('/guideline'))).body;
    const imagery = { type: 'imagery', attrs: { id: 'img-1', items: [{ src: photoId, alt: '', verdict: 'do', caption: '' }], columns: 2, aspect: '1:1' } };
    const saved = await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc: { type: 'doc', content: [imagery] } });
    expect(saved.status).toBe(200);
    expect((await owner.get(api('/guideline'))).body.doc.content[0].attrs.items[0].src).toBe(photoId);
    await publishAndWait(owner, brandId, 'With a photograph');

    const page = await owner.get(`/b/${slug}/v/1`);
    expect(page.status).toBe(200);
    // Attribute names are case-insensitive in HTML (React writes srcSet): match them as a browser would.
    const img = /<img[^>]*srcset="([^"]+)"[^>]*>/i.exec(page.body)![0];
    // The shelf's alt text and caption reach the page (WCAG 2.2 SC 1.1.1).
    expect(img).toContain('alt="A bright square on a brown counter."');
    expect(page.body).toContain('The counter at eight.');
    expect(img).toContain('loading="lazy"');
    expect(img).toMatch(/sizes="[^"]*100vw"/);
    // 3000 × 2000 cut square is 2000 px wide: 480, 960 and 1600 fit, 2400 would be upscaled (HTML srcset width descriptors).
    expect(img).toContain('width="1600" height="1600"');
    const candidates = /srcset="([^"]+)"/i.exec(img)![1].replace(/&amp;/g, '&').split(', ').map((c) => c.split(' '));
    expect(candidates.map(([, w]) => w)).toEqual(['480w', '960w', '1600w']);
    for (const [url, descriptor] of candidates) {
      expect(url.startsWith(`/b/${slug}/v/1/files/${photoId}?`)).toBe(true);
      const res = await fetch(baseUrl() + url, { headers: { cookie: owner.cookieHeader() } });
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toBe('image/jpeg');
      const meta = await sharp(Buffer.from(await res.arrayBuffer())).metadata();
      const width = Number(descriptor.slice(0, -1));
      expect([meta.width, meta.height]).toEqual([width, width]);
    }
    // Cut around the focal point: the subject (a bright square at 70 %, 40 %) sits right of the middle, not cut off.
    const mid = await fetch(baseUrl() + candidates[1][0], { headers: { cookie: owner.cookieHeader() } });
    const { data, info } = await sharp(Buffer.from(await mid.arrayBuffer())).raw().toBuffer({ resolveWithObject: true });
    // Box: left = min(2100 − 1000, 1000) = 1000; the square's centre (2100, 800) lands at (1100, 800) of 2000 → (528, 384) of 960.
    const red = data[(384 * info.width + 528) * info.channels];
    expect(red).toBeGreaterThan(200);
  }, 120_000);

  test('a width the page does not offer, or an aspect ratio outside the list, is not drawn', async () => {
    for (const query of ['w=2400&aspect=1x1', 'w=1000&aspect=1x1', 'w=480&aspect=7x3', 'w=480&aspect=']) {
      expect((await owner.get(`/b/${slug}/v/1/files/${photoId}?${query}`)).status).toBe(404);
    }
  });

  test('the version keeps its own copy: deleting the photograph from the shelf leaves the published page whole', async () => {
    expect((await owner.delete(api(`/assets/${photoId}`))).status).toBe(204);
    const r = await owner.get(`/b/${slug}/v/1/files/${photoId}?w=480&aspect=1x1`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/jpeg');
  });
});
