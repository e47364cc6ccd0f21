// Search on the published demo guidelines through a share link, in Debian's chromium, on a desk (1280 × 800) and on a
// phone (390 × 844 CSS px, a common handset size: common practice). The pattern checked is the WAI-ARIA Authoring
// Practices' editable combobox with a listbox popup (role=combobox, aria-expanded, aria-controls,
// aria-activedescendant moved by the arrow keys, Enter accepts); axe-core (Deque; WCAG 2.0–2.2 A and AA rules) finds no
// serious or critical violation with the results open. The colour and logo looked for are read from the page itself.
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEMO_PEOPLE } from '@db/seeders/demo';
import { signIn } from '../support/client';
import { launchOptions, publishedDemoBrand, seriousViolations } from '../support/browser';

let browser: Browser;
let shareUrl: string;

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  const owner = await signIn(DEMO_PEOPLE[0].email);
  const brandId = await publishedDemoBrand(owner);
  const link = await owner.post(`/api/brands/${brandId}/share-links`, { label: 'Search walk', allowDownloads: false });
  expect(link.status).toBe(201);
  shareUrl = link.body.shareLink.url;
});
afterAll(async () => {
  await browser?.close();
});

const VIEWPORTS = [
  ['desk', { viewport: { width: 1280, height: 800 } }],
  ['phone', { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true }],
] as const;

async function open(options: (typeof VIEWPORTS)[number][1]): Promise<{ page: Page; errors: string[]; beacons: string[] }> {
  const context = await browser.newContext(options);
  const page = await context.newPage();
  const errors: string[] = [];
  const beacons: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('request', (r) => {
    // Only search's own reports: the page's section views go to the same address.
    if (r.url().endsWith('/events') && r.postData()?.includes('"kind":"search"')) beacons.push(r.postData() ?? '');
  });
  await page.goto(shareUrl);
  await page.locator('[data-site-search]:not([hidden])').waitFor();
  return { page, errors, beacons };
}

describe.each(VIEWPORTS)('on a %s', (name, options) => {
  test('type a hex, see the colour with its swatch, Enter jumps to its block and moves focus there', async () => {
    const { page, errors } = await open(options);
    const swatch = page.locator('[data-color-id]').last();
    const hex = (await swatch.locator('[data-value="HEX"]').textContent())!.trim();
    const colourName = (await swatch.locator('p').first().textContent())!.trim();
    const box = page.getByRole('combobox', { name: 'Search these guidelines' });
    expect(await box.getAttribute('aria-keyshortcuts')).toBe('/');

    if (name === 'desk') {
      // The shortcut from anywhere on the page.
      await page.locator('main').click({ position: { x: 5, y: 5 } });
      await page.keyboard.press('/');
      expect(await box.evaluate((el) => el === document.activeElement)).toBe(true);
    } else await box.tap();
    await box.pressSequentially(hex, { delay: 20 });

    const listbox = page.getByRole('listbox', { name: 'Search results' });
    const option = listbox.getByRole('option', { name: new RegExp(colourName) }).first();
    await option.waitFor();
    expect(await box.getAttribute('aria-expanded')).toBe('true');
    expect(await listbox.getByRole('group', { name: 'Colours' }).count()).toBe(1);
    expect(await option.locator('[aria-hidden="true"]').first().evaluate((el) => getComputedStyle(el).backgroundColor)).toBe(
      `rgb(${[1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)).join(', ')})`,
    );
    expect(await seriousViolations(page)).toEqual([]);

    // Arrow down makes the first result active (aria-activedescendant), Enter goes there.
    await page.keyboard.press('ArrowDown');
    const activeId = await box.getAttribute('aria-activedescendant');
    expect(activeId).toBeTruthy();
    expect(await page.locator(`#${activeId}`).getAttribute('aria-selected')).toBe('true');
    await page.keyboard.press('Enter');
    expect(await box.getAttribute('aria-expanded')).toBe('false');
    const focused = page.locator(':focus');
    await expect.poll(() => focused.evaluate((el) => el.hasAttribute('data-block-id'))).toBe(true);
    expect(await focused.locator(`[data-color-id]`).filter({ hasText: hex }).count()).toBeGreaterThan(0);
    expect(await focused.getAttribute('data-search-target')).not.toBeNull();
    await expect.poll(() => focused.evaluate((el) => {
      const r = el.getBoundingClientRect();
      return r.top >= -1 && r.top < window.innerHeight;
    })).toBe(true);
    const width = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
    expect(width.scroll).toBeLessThanOrEqual(width.client);
    expect(errors).toEqual([]);
  });

  test('a logo by its name', async () => {
    const { page } = await open(options);
    const logoName = (await page.locator('figure[data-logo-id] figcaption').first().textContent())!.trim();
    const box = page.getByRole('combobox', { name: 'Search these guidelines' });
    await box.fill(logoName);
    const option = page.getByRole('group', { name: 'Logos' }).getByRole('option', { name: new RegExp(logoName) });
    await option.first().waitFor();
    await option.first().click();
    await expect.poll(() => page.locator(':focus').evaluate((el) => el.querySelector('figure[data-logo-id]') !== null)).toBe(true);
  });
});

test('a settled search that finds nothing is reported once, and not at all when the browser asks not to be tracked', async () => {
  const { page, beacons } = await open({ viewport: { width: 1280, height: 800 } });
  const box = page.getByRole('combobox', { name: 'Search these guidelines' });
  await box.fill('zebra crossing');
  await page.getByText('Nothing found for “zebra crossing”').waitFor();
  await box.press('Enter');
  await expect.poll(() => beacons.length).toBe(1);
  expect(JSON.parse(beacons[0])).toEqual({ kind: 'search', query: 'zebra crossing', results: 0 });

  // Global Privacy Control on: nothing leaves the page.
  const quiet = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  await quiet.addInitScript(() => Object.defineProperty(Navigator.prototype, 'globalPrivacyControl', { get: () => true }));
  const page2 = await quiet.newPage();
  const sent: string[] = [];
  page2.on('request', (r) => {
    if (r.url().endsWith('/events') && r.postData()?.includes('"kind":"search"')) sent.push(r.url());
  });
  await page2.goto(shareUrl);
  const box2 = page2.getByRole('combobox', { name: 'Search these guidelines' });
  await box2.fill('zebra crossing');
  await page2.getByText('Nothing found for “zebra crossing”').waitFor();
  await box2.press('Enter');
  await page2.waitForTimeout(2000);
  expect(sent).toEqual([]);
});
