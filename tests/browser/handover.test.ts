// The handover in a browser: the owner fills in and sends the invoice on the Handover tab; the client opens the pay
// link, goes through the local test checkout and comes back to a paid invoice. Screenshots of each screen are kept in
// the run's temporary folder for a person to look at.
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, signUpFresh, type Client } from '../support/client';
import { lastMailTo, linkIn } from '../support/mailbox';
import { launchOptions, seriousViolations, settled } from '../support/browser';

let browser: Browser;
let ownerContext: BrowserContext;
let owner: Client;
let brandId: string;
const clientEmail = `browser-client-${Date.now()}@handover.example`;
const shot = (name: string) => join(tmpdir(), `plumbline-handover-${name}.png`);

beforeAll(async () => {
  const made = await signUpFresh('handover-browser');
  owner = made.client;
  brandId = (await owner.post('/api/brands', { name: 'Handover Browser Co' })).body.brand.id;
  browser = await chromium.launch(launchOptions());
  ownerContext = await browser.newContext();
  await ownerContext.addCookies(owner.cookieHeader().split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: baseUrl() };
  }));
});
afterAll(async () => {
  await browser?.close();
});

test('the owner sets and sends the invoice on the Handover tab', async () => {
  const page = await ownerContext.newPage();
  await page.setViewportSize({ width: 1280, height: 1000 });
  await page.goto(`${baseUrl()}/app/brands/${brandId}/handover`);
  await page.getByLabel('Amount, in the currency’s smallest unit').fill('250000');
  await page.getByLabel('Currency (ISO 4217)').selectOption('EUR');
  // Shown as people read it before saving: ISO 4217 gives EUR two minor digits.
  await expect.poll(() => page.getByText('The client pays €2,500.00.').count()).toBe(1);
  await page.getByLabel('Due').fill('2027-03-31');
  await page.getByLabel('Client contact’s e-mail').fill(clientEmail);
  await page.getByLabel(/Print files/).check();
  await page.getByRole('button', { name: 'Save as draft' }).click();
  await page.locator('[data-invoice-state="draft"]').waitFor();
  await page.getByRole('button', { name: 'Send to the client' }).click();
  await page.locator('[data-invoice-state="sent"]').waitFor();
  await settled(page);
  expect(await seriousViolations(page)).toEqual([]);
  await page.screenshot({ path: shot('owner'), fullPage: true });
});

test('bad input shows the field’s own message and keeps what was typed', async () => {
  const page = await ownerContext.newPage();
  await page.goto(`${baseUrl()}/app/brands/${brandId}/handover`);
  await page.getByLabel('Client contact’s e-mail').fill('not an address');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await page.getByText('Enter a valid e-mail address for the client contact.').waitFor();
  expect(await page.getByLabel('Client contact’s e-mail').inputValue()).toBe('not an address');
  expect((await owner.get(`/api/brands/${brandId}/handover`)).body.invoice.clientEmail).toBe(clientEmail);
});

test('the client pays through the local test checkout and comes back to a paid invoice', async () => {
  const { url } = linkIn(lastMailTo(clientEmail), '/pay/');
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(url);
  await page.getByRole('button', { name: 'Pay €2,500.00' }).click();
  // The fake's own page says plainly what it is.
  await page.getByText('Local test checkout: not a real payment page.').waitFor();
  await page.screenshot({ path: shot('checkout'), fullPage: true });
  await page.getByRole('button', { name: 'Pay (test)' }).click();
  await page.waitForURL(/\/pay\/[^?]+\?checkout=done$/);
  expect(await page.locator('[data-state]').getAttribute('data-state')).toBe('paid');
  await page.screenshot({ path: shot('paid'), fullPage: true });
  await context.close();
  expect((await owner.get(`/api/brands/${brandId}/handover`)).body.invoice.state).toBe('paid');
});
