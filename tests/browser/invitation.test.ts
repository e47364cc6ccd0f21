// The invitation, end to end in Debian's chromium: the owner invites an unknown address, the e-mailed link is
// followed, the invitee creates an account on the way, proves the address by the mailed link, accepts and lands on
// the brand with the invited role.
import { randomUUID } from 'node:crypto';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, signUpFresh, verificationPath } from '../support/client';
import { launchOptions } from '../support/browser';
import { lastMailTo, linkIn } from '../support/mailbox';

let browser: Browser;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
});
afterAll(async () => {
  await browser?.close();
});

test('an invited person follows the e-mailed link, signs up and joins as reviewer', async () => {
  const { client: owner } = await signUpFresh('owner');
  const brand = (await owner.post('/api/brands', { name: `Tollgate Cider ${Date.now()}` })).body.brand;
  // RFC 2606: example.com-style reserved names only.
  const email = `invitee-${randomUUID().slice(0, 8)}@orchard.example`;
  expect((await owner.post(`/api/brands/${brand.id}/members`, { email, role: 'reviewer' })).status).toBe(201);
  const { url } = linkIn(lastMailTo(email), '/invite/');

  const context = await browser.newContext();
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(url);
  await page.getByRole('heading', { level: 1, name: `Join ${brand.name} as reviewer` }).waitFor();
  expect(await page.getByText(email).first().isVisible()).toBe(true);
  await page.getByRole('link', { name: 'Create an account' }).click();
  await page.waitForURL(/\/sign-up\?next=/);
  await page.getByLabel('Name').fill('Orchard Reviewer');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('correct-horse-battery');
  await page.getByRole('button', { name: /create/i }).click();
  // Back on the invitation: the new account must prove its address before it can accept.
  await page.getByRole('heading', { name: 'Check your inbox' }).waitFor();
  expect(await page.getByRole('button', { name: /accept/i }).count()).toBe(0);
  await page.goto(baseUrl() + verificationPath(email));
  await page.waitForURL(new RegExp(`/invite/`));
  await page.getByRole('button', { name: `Accept and open ${brand.name}` }).click();
  await page.waitForURL(new RegExp(`/app/brands/${brand.id}`));
  await page.getByRole('heading', { level: 1, name: brand.name }).waitFor();
  expect(await page.getByText('Reviewer', { exact: true }).first().isVisible()).toBe(true);

  // The used link now says so, in words.
  await page.goto(url);
  await page.getByRole('heading', { level: 1, name: 'Already accepted' }).waitFor();
  expect(errors).toEqual([]);
  await context.close();
});
