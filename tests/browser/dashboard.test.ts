// The designer's first minutes, in Debian's chromium: sign in, see the brands, start a new one.
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl } from '../support/client';
import { launchOptions } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
});
afterAll(async () => {
  await browser?.close();
});

test('the demo designer signs in, sees the brands table, creates a brand and sees it listed', async () => {
  const page = await browser.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/app`);
  await expect.poll(() => page.url()).toContain('/sign-in');

  await page.getByLabel('E-mail').fill(DEMO_PEOPLE[0].email);
  await page.getByLabel('Password').fill('wrong-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('alert').waitFor();
  expect(await page.getByRole('alert').innerText()).toContain('do not match');

  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/app$/);
  const table = page.getByRole('table', { name: 'Your brands' });
  await table.waitFor();
  expect(await table.innerText()).toContain('Larchmere Coffee Roasters');

  await page.getByRole('button', { name: 'Create brand' }).click();
  expect(await page.getByText('Give the brand a name.').isVisible()).toBe(true);

  const name = `Quayside Ferries ${Date.now()}`;
  await page.getByLabel('Client or brand name').fill(name);
  await page.getByRole('button', { name: 'Create brand' }).click();
  await table.getByRole('link', { name }).waitFor();
  await table.getByRole('link', { name }).click();
  await page.getByRole('heading', { level: 1, name }).waitFor();
  expect(await page.getByRole('table', { name: 'Members' }).innerText()).toContain(DEMO_PEOPLE[0].name);
  expect(errors).toEqual([]);
  await page.close();
});

test('a reviewer sees the brand but not the controls to change its people', async () => {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(DEMO_PEOPLE[2].email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/app$/);
  await page.getByRole('link', { name: 'Larchmere Coffee Roasters' }).click();
  await page.getByRole('heading', { level: 1, name: 'Larchmere Coffee Roasters' }).waitFor();
  expect(await page.getByText(/owners manage its people/).isVisible()).toBe(true);
  expect(await page.getByRole('button', { name: 'Remove' }).count()).toBe(0);
  await context.close();
});
