// Palette routes in Debian's chromium: the client opens the e-mailed link without an account, reads the contrast of
// each route, chooses one; the designer then uses it as the palette from the client page.
import { randomUUID } from 'node:crypto';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, signUpFresh } from '../support/client';
import { launchOptions, seriousViolations, settled } from '../support/browser';
import { lastMailTo, linkIn } from '../support/mailbox';

let browser: Browser;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
});
afterAll(async () => {
  await browser?.close();
});

const ROUTES = [
  { name: 'Tide <i>pool</i>', rationale: 'Cool water and wet stone.', colors: [{ name: 'Deep', value: '#1d3557', role: 'primary' }, { name: 'Foam', value: '#f1faee', role: 'background' }, { name: 'Grey stone', value: '#777777', role: 'neutral' }] },
  { name: 'Bonfire', rationale: 'Warm and close.', colors: [{ name: 'Ember', value: '#9c2f1b', role: 'primary' }, { name: 'Ash', value: '#f7f3ef', role: 'background' }, { name: 'Soot', value: '#1b1714', role: 'text' }] },
];

test('the client chooses a route through the link; the designer uses it as the palette', async () => {
  const { client: designer, email: designerEmail } = await signUpFresh('routes-designer');
  const brand = (await designer.post('/api/brands', { name: `Saltmarsh Ferries ${Date.now()}` })).body.brand;
  const set = (await designer.post(`/api/brands/${brand.id}/palette-routes`, { title: 'Harbour colours', routes: ROUTES })).body.set;
  const email = `routes-${randomUUID().slice(0, 8)}@harbour.example`;
  expect((await designer.post(`/api/brands/${brand.id}/palette-routes/${set.id}/send`, { contactName: 'Nell Harbour', contactEmail: email })).status).toBe(200);
  const { url } = linkIn(lastMailTo(email), '/palette/');

  const context = await browser.newContext();
  const page = await context.newPage();
  await page.setViewportSize({ width: 1280, height: 900 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(url);
  await page.getByRole('heading', { level: 1, name: 'Harbour colours' }).waitFor();
  // The hostile-looking name is shown as text, never as markup.
  await page.getByRole('heading', { level: 3, name: 'Tide <i>pool</i>' }).waitFor();
  // #777777 on #f1faee: about 4.19:1 by the WCAG 2.2 formula, under SC 1.4.3's 4.5:1 but over 3:1: large text only.
  expect(await page.getByRole('row', { name: /Grey stone on Foam/ }).textContent()).toContain('AA for large text only');
  await settled(page);
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByLabel('Choose “Bonfire”').check();
  await page.getByRole('button', { name: 'Go with “Bonfire”' }).click();
  await page.getByText('You chose “Bonfire”').waitFor();
  expect(await page.getByRole('button', { name: /Go with/ }).count()).toBe(0);
  expect(lastMailTo(designerEmail).subject).toContain('Bonfire');
  await context.close();

  const designerContext = await browser.newContext();
  const signedIn = await designerContext.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: designerEmail, password: 'correct-horse-battery' }, headers: { origin: baseUrl() } });
  expect(signedIn.ok()).toBe(true);
  const app = await designerContext.newPage();
  await app.goto(`${baseUrl()}/app/brands/${brand.id}/client#palette-routes`);
  await app.getByRole('button', { name: 'Use this route' }).click();
  await app.getByRole('button', { name: 'Replace the palette' }).click();
  await app.getByText('The chosen route is now the brand’s palette').waitFor();
  const colors = (await designer.get(`/api/brands/${brand.id}/identity`)).body.identity.colors.map((c: { name: string }) => c.name);
  expect(colors).toEqual(['Ember', 'Ash', 'Soot']);
  expect(errors).toEqual([]);
  await designerContext.close();
});
