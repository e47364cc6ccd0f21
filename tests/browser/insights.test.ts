// Insights in a browser: the published page reports each section the first time its heading scrolls into view (and
// nothing when the browser asks not to be tracked); the owner's page shows the demo's figures as charts and tables.
import { chromium, type Browser, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, Client, signIn } from '../support/client';
import { publishAndWait } from '../support/publish';
import { launchOptions, publishedDemoBrand, seriousViolations, settled } from '../support/browser';

let browser: Browser;
let owner: BrowserContext;
let client: Client;
let demoId: string;
let brandId: string;
let slug: string;

const SECTIONS = ['Colour', 'Type', 'Voice', 'Photography'];

beforeAll(async () => {
  client = await signIn(DEMO_PEOPLE[0].email);
  demoId = await publishedDemoBrand(client);
  const brand = (await client.post('/api/brands', { name: 'Scrolling Readers Co' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  // Tall sections, so each heading comes into view only when the reader scrolls to it.
  const filler = (i: number) => ({ type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance for the people who apply the brand. '.repeat(60) }] });
  const content = SECTIONS.flatMap((title, i) => [{ type: 'sectionHeading', attrs: { id: `sec-${i}`, title, eyebrow: '', intro: '' } }, filler(i)]);
  expect((await client.request('PUT', `/api/brands/${brandId}/guideline`, { baseRevision: 0, doc: { type: 'doc', content } })).status).toBe(200);
  await publishAndWait(client, brandId, 'Scroll me');
  browser = await chromium.launch(launchOptions());
  owner = await browser.newContext();
  const r = await owner.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
});
afterAll(async () => {
  await browser?.close();
});

async function sectionViews(): Promise<Record<string, number>> {
  const r = await client.get(`/api/brands/${brandId}/insights?range=7d`);
  return Object.fromEntries(r.body.insights.sections.map((s: { title: string; views: number }) => [s.title, s.views]));
}

async function readThrough(link: string, doNotTrack: boolean): Promise<void> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 700 }, extraHTTPHeaders: doNotTrack ? { dnt: '1' } : {} });
  if (doNotTrack) await context.addInitScript(() => Object.defineProperty(Navigator.prototype, 'doNotTrack', { get: () => '1' }));
  const page = await context.newPage();
  await page.goto(link);
  await page.waitForURL(new RegExp(`/b/${slug}`));
  // Scroll down and back up: each heading is seen twice, reported once.
  for (let pass = 0; pass < 2; pass++) {
    for (let y = 0; y <= 12_000; y += 500) {
      await page.mouse.wheel(0, pass === 0 ? 500 : -500);
      await page.waitForTimeout(40);
    }
  }
  await page.waitForTimeout(300);
  await context.close();
}

test('each section is reported once when its heading scrolls into view; nothing under Do Not Track', async () => {
  const quiet = (await client.post(`/api/brands/${brandId}/share-links`, { label: 'Quiet' })).body.shareLink;
  await readThrough(quiet.url, true);
  const reader = (await client.post(`/api/brands/${brandId}/share-links`, { label: 'Reader' })).body.shareLink;
  await readThrough(reader.url, false);
  const until = Date.now() + 20_000;
  let views: Record<string, number> = {};
  while (Date.now() < until) {
    views = await sectionViews();
    if (Object.keys(views).length === SECTIONS.length) break;
    await new Promise((r) => setTimeout(r, 300));
  }
  expect(views).toEqual(Object.fromEntries(SECTIONS.map((s) => [s, 1])));
  const visitors = (await client.get(`/api/brands/${brandId}/insights?range=7d`)).body.insights.visitors;
  expect(visitors.map((v: { label: string }) => v.label)).toEqual(['Reader']);
}, 120_000);

test('the owner’s page shows the demo’s readers, downloads and empty searches, with a table for each chart', async () => {
  const page = await owner.newPage();
  await page.setViewportSize({ width: 1440, height: 1000 });
  await page.goto(`${baseUrl()}/app/brands/${demoId}/insights`);
  await page.locator('section[aria-label="Over time"] table').waitFor();
  await settled(page);
  await expect.poll(() => page.locator('section[aria-label="Over time"] canvas').count()).toBe(1);
  const total = Number((await page.locator('dl dd').first().textContent())?.replace(/\D/g, ''));
  expect(total).toBeGreaterThan(0);
  const searches = await page.locator('section[aria-label="Searches that found nothing"] tbody th').allTextContents();
  expect(searches).toContain('letterhead');
  expect(await page.locator('section[aria-label="Downloads"] tbody tr').count()).toBeGreaterThan(0);
  await page.getByText('Last 12 months').click();
  await page.waitForFunction(() => document.querySelector('section[aria-label="Over time"] tbody')?.querySelectorAll('tr').length === 12);
  expect(await seriousViolations(page)).toEqual([]);
  await page.screenshot({ path: '/tmp/insights-page.png', fullPage: true });
  await page.close();
}, 120_000);
