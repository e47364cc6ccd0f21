// The shelf's filters live in the page's address: a filtered shelf reloads (or opens from a shared link) to the same view.
import { chromium, type Browser, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn } from '../support/client';
import { waitForBuild } from '../support/publish';
import { launchOptions, settled } from '../support/browser';

let browser: Browser;
let owner: BrowserContext;
let brandId: string;
let client: Awaited<ReturnType<typeof signIn>>;
const ids: Record<string, string> = {};
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const svg = (fill: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 50"><rect x="10" y="10" width="80" height="30" fill="${fill}"/></svg>`;

beforeAll(async () => {
  client = await signIn(DEMO_PEOPLE[0].email);
  const created = await client.post('/api/brands', { name: 'Shelf Address Brand' });
  brandId = created.body.brand.id;
  // Invented demo files: two marks with rights and expiry, one without.
  const files: [string, string, Record<string, unknown>][] = [
    ['harbour-navy.svg', '#1d2a44', { name: 'Harbour navy', rights: 'Owned outright by the client.', credit: 'Drawn by the studio', expiresOn: '2031-06-30', tags: ['primary'] }],
    ['harbour-white.svg', '#e9e4da', { name: 'Harbour white', tags: ['reverse'] }],
    ['crate.svg', '#c8553d', { name: 'Crate pattern' }],
    ['quay.svg', '#2f6f8f', { name: 'Quay sign', credit: 'Lettering: the studio', rights: 'Licensed for signage in the home market; print runs need the type foundry’s print licence.', expiresOn: inDays(4), tags: ['signage'] }],
  ];
  for (const [file, fill, patch] of files) {
    const up = await client.upload(`/api/brands/${brandId}/assets`, file, svg(fill), 'image/svg+xml');
    expect(up.status).toBe(201);
    ids[String(patch.name)] = up.body.assets[0].id;
    expect((await client.patch(`/api/brands/${brandId}/assets/${up.body.assets[0].id}`, patch)).status).toBe(200);
  }
  browser = await chromium.launch(launchOptions());
  owner = await browser.newContext();
  const r = await owner.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
});
afterAll(async () => {
  await browser?.close();
});

const names = async (page: import('playwright-core').Page) => (await page.locator('ul[aria-label="Assets"] li p.font-semibold').allTextContents()).sort();

test('a filtered shelf keeps its filters in the address and reloads to the same view', async () => {
  const page = await owner.newPage();
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.goto(`${baseUrl()}/app/brands/${brandId}/assets`);
  await page.locator('ul[aria-label="Assets"]').waitFor();
  expect(await names(page)).toEqual(['Crate pattern', 'Harbour navy', 'Harbour white', 'Quay sign']);

  await page.locator('#f-q').fill('harbour');
  await page.locator('#f-rights').selectOption('with');
  await page.waitForURL(/\?q=harbour&rights=with$/);
  await page.waitForFunction(() => document.querySelectorAll('ul[aria-label="Assets"] > li').length === 1);
  expect(await names(page)).toEqual(['Harbour navy']);

  await page.reload();
  await page.locator('ul[aria-label="Assets"]').waitFor();
  await settled(page);
  expect(page.url()).toMatch(/\?q=harbour&rights=with$/);
  await expect.poll(() => page.locator('#f-q').inputValue()).toBe('harbour');
  expect(await page.locator('#f-rights').inputValue()).toBe('with');
  expect(await names(page)).toEqual(['Harbour navy']);
  await expect.poll(() => page.locator('[data-asset-rights]').first().textContent()).toContain('Owned outright by the client.');
  if (process.env.SHELF_SCREENSHOTS) await page.screenshot({ path: `${process.env.SHELF_SCREENSHOTS}/shelf-filtered.png`, fullPage: true });

  // The address alone opens the same view in a fresh page (a shared link).
  const shared = await owner.newPage();
  await shared.setViewportSize({ width: 1440, height: 1000 });
  await shared.goto(`${baseUrl()}/app/brands/${brandId}/assets?expiry=none`);
  await shared.locator('ul[aria-label="Assets"]').waitFor();
  expect(await shared.locator('#f-expiry').inputValue()).toBe('none');
  expect(await names(shared)).toEqual(['Crate pattern', 'Harbour white']);
});

test('an asset expiring soon is flagged on the shelf, and its rights reach the published downloads with the caution', async () => {
  const page = await owner.newPage();
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.goto(`${baseUrl()}/app/brands/${brandId}/assets?expiry=expiring&days=7`);
  await page.locator('ul[aria-label="Assets"]').waitFor();
  expect(await names(page)).toEqual(['Quay sign']);
  await expect.poll(() => page.locator(`[data-asset-rights="${ids['Quay sign']}"]`).textContent()).toContain('· soon');
  await page.getByText('Tags, usage notes, rights and expiry').first().click();
  expect(await page.locator(`#expires-${ids['Quay sign']}`).inputValue()).toBe(inDays(4));
  if (process.env.SHELF_SCREENSHOTS) await page.screenshot({ path: `${process.env.SHELF_SCREENSHOTS}/shelf-expiring.png`, fullPage: true });

  for (const name of ['Harbour navy', 'Quay sign']) expect((await client.patch(`/api/brands/${brandId}/assets/${ids[name]}`, { state: 'approved' })).status).toBe(200);
  await client.request('PUT', `/api/brands/${brandId}/guideline`, {
    baseRevision: 0,
    doc: { type: 'doc', content: [{ type: 'sectionHeading', attrs: { id: 'dl', title: 'Files', eyebrow: '', intro: '' } }, { type: 'downloads', attrs: { id: 'files', title: 'Files to download', assetIds: [], note: '' } }] },
  });
  const published = await client.post(`/api/brands/${brandId}/versions`, { note: 'With files' });
  expect(published.status).toBe(201);
  expect((await waitForBuild(client, brandId, published.body.version.number)).state).toBe('ready');
  const slug = (await client.get(`/api/brands/${brandId}`)).body.brand.slug;
  const site = await owner.newPage();
  await site.setViewportSize({ width: 1280, height: 900 });
  await site.goto(`${baseUrl()}/b/${slug}/downloads`);
  await site.locator(`[data-asset-rights="${ids['Quay sign']}"]`).waitFor();
  expect(await site.locator(`[data-asset-rights="${ids['Quay sign']}"]`).textContent()).toContain('print runs need the type foundry’s print licence');
  expect(await site.locator('[data-rights-caution]').textContent()).toContain('not legal advice');
  if (process.env.SHELF_SCREENSHOTS) await site.screenshot({ path: `${process.env.SHELF_SCREENSHOTS}/downloads-rights.png`, fullPage: true });
});
