// Brand settings over HTTP: a changed public address keeps published links working (a permanent redirect, RFC 9110
// §15.4.2 "301 Moved Permanently"), and a former address stays reserved for its brand.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Client, signUpFresh } from '../support/client';
import { closeDb } from '../support/db';
import { publishAndWait } from '../support/publish';

let owner: Client;
let other: Client;
let brandId: string;
let oldSlug: string;
const api = (p = '') => `/api/brands/${brandId}${p}`;

beforeAll(async () => {
  ({ client: owner } = await signUpFresh('settings-owner'));
  ({ client: other } = await signUpFresh('settings-other'));
  const created = (await owner.post('/api/brands', { name: `Moving Address ${Date.now()}` })).body.brand;
  brandId = created.id;
  oldSlug = created.slug;
  const colorId = (await owner.post(api('/colors'), { name: 'Slate', value: '#3b4a5a' })).body.color.id;
  const { revision } = (await owner.get(api('/guideline'))).body;
  const doc = { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 's1', title: 'Colour', eyebrow: '', intro: '' } }, { type: 'colorPalette', attrs: { id: 'p1', colorIds: [colorId], showPrint: true, note: '' } }] };
  expect((await owner.request('PUT', api('/guideline'), { baseRevision: revision, doc })).status).toBe(200);
  await publishAndWait(owner, brandId, 'First');
});
afterAll(closeDb);

describe('a brand that changes its address', () => {
  const newSlug = `moved-${Date.now()}`;
  test('old links redirect to the new address, path and query kept', async () => {
    expect((await owner.patch(api(), { slug: newSlug })).status).toBe(200);
    const page = await owner.get(`/b/${oldSlug}/v/1?x=1`);
    expect(page.status).toBe(301);
    expect(page.headers.get('location')).toBe(`/b/${newSlug}/v/1?x=1`);
    expect((await owner.get(`/b/${oldSlug}`)).headers.get('location')).toBe(`/b/${newSlug}`);
    expect((await owner.get(`/b/${newSlug}`)).status).toBe(200);
  });

  test('the redirect grants nothing: the new address still checks access', async () => {
    const page = await other.get(`/b/${oldSlug}`);
    expect(page.status).toBe(301);
    expect((await other.get(`/b/${newSlug}`)).status).toBe(404);
  });

  test('another brand cannot take the former address; its own brand can take it back', async () => {
    const second = (await other.post('/api/brands', { name: 'Address Squatter' })).body.brand;
    const clash = await other.patch(`/api/brands/${second.id}`, { slug: oldSlug });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('slug_taken');
    const back = await owner.patch(api(), { slug: oldSlug });
    expect(back.status).toBe(200);
    expect((await owner.get(`/b/${oldSlug}`)).status).toBe(200);
    expect((await owner.get(`/b/${newSlug}`)).headers.get('location')).toBe(`/b/${oldSlug}`);
  });

  test('a new brand named like a former address does not get it', async () => {
    const renamed = (await owner.post('/api/brands', { name: 'Former Name Brand' })).body.brand;
    const fresh = `former-${Date.now()}`;
    await owner.patch(`/api/brands/${renamed.id}`, { slug: fresh });
    await owner.patch(`/api/brands/${renamed.id}`, { slug: `${fresh}-now` });
    const lookalike = (await other.post('/api/brands', { name: fresh })).body.brand;
    expect(lookalike.slug).not.toBe(fresh);
  });
});
