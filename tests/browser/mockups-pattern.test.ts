// The pattern and applications blocks in Debian's chromium: inserted in the editor and set up there (a shelf pattern
// linked by id, photographs chosen for the mock-ups), then published and read on the site through a share link:
// every picture the blocks draw answers, and the pieces download as PNG and as PDF (a PDF file starts "%PDF-",
// ISO 32000-1 §7.5.2).
import sharp from 'sharp';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { FIXTURE_SVG } from '../integration/fixtures';
import { baseUrl, type Client, signUpFresh } from '../support/client';
import { waitForBuild } from '../support/publish';
import { launchOptions } from '../support/browser';

let browser: Browser;
let owner: Client;
let email: string;
let brandId: string;
let slug: string;
let patternId: string;
let photoId: string;

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  ({ client: owner, email } = await signUpFresh('blocks'));
  const brand = (await owner.post('/api/brands', { name: 'Pattern Block Bakers' })).body.brand;
  brandId = brand.id;
  slug = brand.slug;
  const logoId = (await owner.upload(`/api/brands/${brandId}/logos`, 'mark.svg', FIXTURE_SVG, 'image/svg+xml', { variant: 'primary' })).body.logo.id;
  await owner.post(`/api/brands/${brandId}/colors`, { name: 'Ink', value: '#1d2a44', role: 'primary' });
  const paper = (await owner.post(`/api/brands/${brandId}/colors`, { name: 'Paper', value: '#f4efe6', role: 'secondary' })).body.color.id;
  const saved = await owner.post(`/api/brands/${brandId}/patterns`, { settings: { logoId, layout: 'brick', scale: 24, groundColorId: paper }, name: 'Bakery brick' });
  patternId = saved.body.asset.id;
  expect((await owner.patch(`/api/brands/${brandId}/assets/${patternId}`, { state: 'approved' })).status).toBe(200);
  const picture = await sharp({ create: { width: 1200, height: 800, channels: 3, background: '#7a5236' } }).jpeg().toBuffer();
  photoId = (await owner.upload(`/api/brands/${brandId}/assets`, 'oven.jpg', picture, 'image/jpeg', { kind: 'photo' })).body.assets[0].id;
  expect((await owner.patch(`/api/brands/${brandId}/assets/${photoId}`, { state: 'approved', altText: 'The oven door.' })).status).toBe(200);
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

async function signedIn(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ acceptDownloads: true });
  const r = await context.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email, password: 'correct-horse-battery' }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  return { context, page, errors };
}

async function addBlock(page: Page, name: string) {
  await page.getByRole('button', { name: '+ Add a block' }).click();
  await page.getByRole('combobox', { name: 'Find a block' }).fill(name);
  await page.getByRole('option', { name: new RegExp(`^${name}\\b`) }).click();
}

const draftBlock = async (type: string) => ((await owner.get(`/api/brands/${brandId}/guideline`)).body.doc.content as { type: string; attrs: Record<string, unknown> }[]).find((n) => n.type === type)?.attrs;

/** Every picture address inside `selector` on the page (SVG <image> and <img>), fetched with the page's own cookies. */
async function picturesAnswer(page: Page, context: BrowserContext, selector: string): Promise<string[]> {
  const hrefs: string[] = await page.locator(`${selector} image, ${selector} img`).evaluateAll((els) => [...new Set(els.map((e) => e.getAttribute('href') ?? e.getAttribute('src') ?? ''))]);
  expect(hrefs.length).toBeGreaterThan(0);
  for (const href of hrefs) {
    const res = await context.request.get(new URL(href, baseUrl()).toString());
    expect(res.status(), href).toBe(200);
    expect(res.headers()['content-type'], href).toMatch(/^image\//);
  }
  return hrefs;
}

test('both blocks are set up in the editor, published, and read and downloaded on the site', async () => {
  const { context, page, errors } = await signedIn();
  await page.goto(`${baseUrl()}/app/brands/${brandId}/guidelines`);
  await page.getByRole('textbox', { name: 'Guideline document' }).waitFor();

  // The pattern block links the approved shelf pattern by id.
  await addBlock(page, 'Pattern');
  await page.getByRole('button', { name: 'Settings', exact: true }).last().click();
  await page.getByRole('button', { name: 'Link a shelf pattern' }).click();
  await page.getByLabel('Shelf pattern').selectOption(patternId);
  await expect.poll(async () => (await draftBlock('pattern'))?.patternId, { timeout: 15_000 }).toBe(patternId);
  await page.locator('[data-linked-pattern]').getByText('Bakery brick').waitFor();

  // The applications block: six pieces to start with, the photograph chosen for them.
  await addBlock(page, 'Applications');
  await page.getByRole('button', { name: 'Settings', exact: true }).last().click();
  await page.getByRole('group', { name: /Photographs/ }).getByRole('checkbox', { name: /oven/ }).check();
  await expect.poll(async () => (await draftBlock('applications'))?.photoIds, { timeout: 15_000 }).toEqual([photoId]);
  expect((await draftBlock('applications'))?.templates).toHaveLength(6);
  await page.locator('figure[data-mockup="business-card"] svg').first().waitFor();
  // The editor's own download of a piece is the draft route's PNG.
  const draftPng = await page.locator('figure[data-mockup="business-card"] a', { hasText: 'PNG' }).getAttribute('href');
  const drawn = await context.request.get(new URL(draftPng!, baseUrl()).toString());
  expect(drawn.status()).toBe(200);
  expect(drawn.headers()['content-type']).toBe('image/png');

  const published = await owner.post(`/api/brands/${brandId}/versions`, { note: 'Blocks in a browser' });
  expect(published.status).toBe(201);
  expect((await waitForBuild(owner, brandId, published.body.version.number)).state).toBe('ready');
  const { url } = (await owner.post(`/api/brands/${brandId}/share-links`, { allowDownloads: true })).body.shareLink;
  expect(errors).toEqual([]);
  await context.close();

  // A reader with the share link: the published page, its pictures and its downloads.
  const reader = await browser.newContext({ acceptDownloads: true });
  const site = await reader.newPage();
  const siteErrors: string[] = [];
  site.on('pageerror', (e) => siteErrors.push(String(e)));
  await site.goto(url);
  await site.waitForURL(new RegExp(`/b/${slug}`));
  await site.locator(`[data-shelf-pattern="${patternId}"]`).waitFor();
  const marks = await picturesAnswer(site, reader, 'figure:has([data-shelf-pattern])');
  expect(marks.every((h) => h.startsWith(`/b/${slug}/v/1/files/`))).toBe(true);
  expect(await site.locator('figure[data-mockup]').count()).toBe(6);
  const pictures = await picturesAnswer(site, reader, 'figure[data-mockup="editorial-spread"]');
  expect(pictures).toContain(`/b/${slug}/v/1/files/${photoId}`);

  const card = site.locator('figure[data-mockup="business-card"]');
  const [pdf] = await Promise.all([site.waitForEvent('download'), card.getByRole('link', { name: 'PDF with bleed and crop marks' }).click()]);
  expect(pdf.suggestedFilename()).toBe(`${slug}-v1-business-card.pdf`);
  const bytes = await (await import('node:fs/promises')).readFile((await pdf.path())!);
  expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  const [png] = await Promise.all([site.waitForEvent('download'), site.locator('figure[data-mockup="social-post"]').getByRole('link', { name: 'PNG' }).click()]);
  const meta = await sharp(await (await import('node:fs/promises')).readFile((await png.path())!)).metadata();
  expect([meta.format, meta.width, meta.height]).toEqual(['png', 1080, 1080]);
  expect(siteErrors).toEqual([]);
  await reader.close();
}, 240_000);
