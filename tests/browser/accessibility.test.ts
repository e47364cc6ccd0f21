// Every screen of the app, and the published site on a desk and on a phone, checked in Debian's chromium with
// axe-core (Deque; its rules for WCAG 2.0–2.2 levels A and AA): no serious or critical violation anywhere. The
// contrast rule is WCAG 2.2 SC 1.4.3 (contrast minimum): 4.5:1 for body text, 3:1 for large text.
import { chromium, type Browser, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn } from '../support/client';
import { launchOptions, publishedDemoBrand, seriousViolations, settled } from '../support/browser';

let browser: Browser;
let owner: BrowserContext;
let anonymous: BrowserContext;
let brandId: string;

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  brandId = await publishedDemoBrand(await signIn(DEMO_PEOPLE[0].email));
  anonymous = await browser.newContext();
  owner = await browser.newContext();
  const r = await owner.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[0].email, password: DEMO_PASSWORD }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
});
afterAll(async () => {
  await browser?.close();
});

// [screen, address, who, what shows once the screen is ready]
const SCREENS: [string, () => string, 'anonymous' | 'owner', string][] = [
  ['sign-in', () => '/sign-in', 'anonymous', 'form'],
  ['sign-up', () => '/sign-up', 'anonymous', 'form'],
  ['dashboard', () => '/app', 'owner', 'table[aria-label="Your brands"]'],
  ['brand overview', () => `/app/brands/${brandId}`, 'owner', 'table[aria-label="Members"]'],
  ['identity', () => `/app/brands/${brandId}/identity`, 'owner', 'li[data-color-hex]'],
  ['guidelines editor', () => `/app/brands/${brandId}/guidelines`, 'owner', '[data-block-frame="colorPalette"]'],
  ['assets', () => `/app/brands/${brandId}/assets`, 'owner', 'main h2'],
  ['publishing', () => `/app/brands/${brandId}/publishing`, 'owner', 'main h2'],
  ['client', () => `/app/brands/${brandId}/client`, 'owner', 'main h2'],
  ['insights', () => `/app/brands/${brandId}/insights`, 'owner', 'section[aria-label="Over time"] table'],
  ['mail', () => '/app/mail', 'owner', 'h1'],
];

describe('axe-core finds no serious or critical violation', () => {
  test.each(SCREENS)('on the %s screen', async (_name, path, who, ready) => {
    const page = await (who === 'owner' ? owner : anonymous).newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(String(e)));
    await page.goto(baseUrl() + path());
    await page.locator(ready).first().waitFor();
    await settled(page);
    const serious = await seriousViolations(page);
    // Named on its own: the app's faint text once failed WCAG 2.2 SC 1.4.3 (4.5:1 for body text).
    expect(serious.filter((v) => v.startsWith('color-contrast')), 'WCAG 2.2 SC 1.4.3 contrast (minimum)').toEqual([]);
    expect(serious).toEqual([]);
    expect(errors).toEqual([]);
    await page.close();
    // axe-core over the whole editor (every block drawn live) takes over a minute on a busy two-core machine.
  }, 300_000);

  test.each([
    ['a desk', 1440, 900],
    ['a phone', 390, 844],
  ])('on the published site, on %s', async (_name, width, height) => {
    const page = await owner.newPage();
    await page.setViewportSize({ width, height });
    await page.goto(`${baseUrl()}/b/${DEMO_BRANDS[0].slug}`);
    await page.getByRole('navigation', { name: 'Contents' }).waitFor();
    await settled(page);
    // The demo brand's own colours pass as well as our chrome (header, contents, footer), which must pass for any brand.
    expect(await seriousViolations(page)).toEqual([]);
    // The phone's contents menu, opened, passes too.
    if (width < 1024) {
      await page.locator('details.site-contents > summary').click();
      expect(await seriousViolations(page)).toEqual([]);
    }
    await page.close();
  }, 120_000);
});
