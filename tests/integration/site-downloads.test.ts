// Downloads on the published side: a share link that allows them reaches approved files (and is logged);
// one that does not is refused with a reason.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { FIXTURE_SVG } from './fixtures';
import { Client, signUpFresh } from '../support/client';
import { closeDb, sql } from '../support/db';
import { publishAndWait } from '../support/publish';

let owner: Client;
let brandId: string;
let slug: string;
let approvedId: string;
let draftId: string;

async function visit(url: string): Promise<Client> {
  const client = new Client();
  const r = await client.get(new URL(url).pathname);
  expect(r.status).toBe(303);
  return client;
}

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('shelf-owner'));
  const brand = (await owner.post('/api/brands', { name: 'Shelf Site Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const up = await owner.upload(`/api/brands/${brandId}/assets`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml');
  approvedId = up.body.assets[0].id;
  await owner.patch(`/api/brands/${brandId}/assets/${approvedId}`, { state: 'approved' });
  const draft = await owner.upload(`/api/brands/${brandId}/assets`, 'draft.svg', FIXTURE_SVG.replace('#c8553d', '#123456'), 'image/svg+xml');
  draftId = draft.body.assets[0].id;
  await owner.request('PUT', `/api/brands/${brandId}/guideline`, {
    baseRevision: 0,
    doc: { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'dl', title: 'Files', eyebrow: '', intro: '' } }, { type: 'downloads', attrs: { id: 'files', title: 'Files to download', assetIds: [], note: '' } }] },
  });
  await publishAndWait(owner, brandId, 'With files');
});
afterAll(closeDb);

describe('published downloads', () => {
  test('a download-enabled link lists approved files only, downloads one, and the log names the link', async () => {
    const { url, id } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true })).body.shareLink;
    const visitor = await visit(url);
    const page = await visitor.get(`/b/${slug}/downloads`);
    expect(page.status).toBe(200);
    expect(page.body).toContain(`/api/assets/${approvedId}/file`);
    expect(page.body).not.toContain(draftId);
    const site = await visitor.get(`/b/${slug}`);
    expect(site.body).toContain(`/api/assets/${approvedId}/file?format=original`); // the downloads block lists it
    const png = await visitor.get(`/api/assets/${approvedId}/file?format=png&width=256`);
    expect(png.status).toBe(200);
    expect(png.headers.get('content-type')).toBe('image/png');
    expect((await visitor.get(`/api/assets/${draftId}/file?format=png&width=256`)).status).toBe(404);
    const rows = await sql('SELECT share_link_id FROM asset_downloads WHERE asset_id = $1', [approvedId]);
    expect(rows.map((r) => r.share_link_id)).toContain(id);
  });

  test('a link without downloads reads the site but gets 403 on files, with the reason', async () => {
    const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: false })).body.shareLink;
    const visitor = await visit(url);
    expect((await visitor.get(`/b/${slug}`)).status).toBe(200);
    const file = await visitor.get(`/api/assets/${approvedId}/file?format=png&width=256`);
    expect(file.status).toBe(403);
    expect(file.body.error.code).toBe('downloads_not_allowed');
    const page = await visitor.get(`/b/${slug}/downloads`);
    expect(page.status).toBe(403);
    expect(page.body).toContain('not download files');
  });
});
