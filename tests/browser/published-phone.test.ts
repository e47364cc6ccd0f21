// The published guidelines on a phone (390 × 844 CSS px, a common handset size: common practice), in Debian's
// chromium: nothing wider than the screen, a contents menu that opens and jumps, a type scale that folds into
// rows without blank space, and downloads that save a file.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PEOPLE } from '@db/seeders/demo';
import { signIn } from '../support/client';
import { launchOptions, publishedDemoBrand } from '../support/browser';

let browser: Browser;
let shareUrl: string;

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  const owner = await signIn(DEMO_PEOPLE[0].email);
  const brandId = await publishedDemoBrand(owner);
  const base = `/api/brands/${brandId}`;
  // One approved file on the shelf, so the downloads page has something to save.
  const shelf = (await owner.get(`${base}/assets`)).body.assets as { state: string }[];
  if (!shelf.some((a) => a.state === 'approved')) {
    const svg = readFileSync(join(import.meta.dirname, '../../db/seeders/files/larchmere-mark.svg'));
    const up = await owner.upload(`${base}/assets`, 'larchmere-mark.svg', svg, 'image/svg+xml');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect((await owner.patch(`${base}/assets/${up.body.assets[0].id}`, { state: 'approved' })).status).toBe(200);
  }
  const link = await owner.post(`${base}/share-links`, { label: 'Phone walk', allowDownloads: true });
  expect(link.status).toBe(201);
  shareUrl = link.body.shareLink.url;
});
afterAll(async () => {
  await browser?.close();
});

async function phone(): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  await page.goto(shareUrl);
  await page.waitForURL(new RegExp(`/b/${DEMO_BRANDS[0].slug}$`));
  return page;
}

/** The document is no wider than the screen: nothing scrolls sideways. */
const noSidewaysScroll = (page: Page) => page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));

test('on a phone the page fits the screen and the contents menu opens, jumps to a section and closes', async () => {
  const page = await phone();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  const width = await noSidewaysScroll(page);
  expect(width.scroll).toBeLessThanOrEqual(width.client);

  // The desk's side rail is gone; in its place a bar that folds the same list.
  const contents = page.getByRole('navigation', { name: 'Contents' });
  await contents.waitFor();
  expect(await contents.count()).toBe(1);
  const menu = contents.locator('details');
  const toggle = contents.locator('summary');
  expect(await contents.getByRole('link', { name: 'Typography' }).isVisible()).toBe(false);
  await toggle.click();
  expect(await menu.getAttribute('open')).not.toBeNull();
  await contents.getByRole('link', { name: 'Typography' }).click();
  await page.waitForURL(/#typography$/);
  // The section starts just under the sticky bar, and the menu has folded away.
  await expect.poll(() => page.locator('#typography').evaluate((el) => Math.round(el.getBoundingClientRect().top))).toBeLessThan(80);
  expect(await page.locator('#typography').evaluate((el) => el.getBoundingClientRect().top)).toBeGreaterThanOrEqual(0);
  expect(await menu.getAttribute('open')).toBeNull();

  // From the keyboard: Enter on the focused bar opens it, Escape closes it and leaves focus on the bar.
  await toggle.focus();
  await page.keyboard.press('Enter');
  expect(await menu.getAttribute('open')).not.toBeNull();
  await page.keyboard.press('Escape');
  expect(await menu.getAttribute('open')).toBeNull();
  expect(await toggle.evaluate((el) => el === document.activeElement)).toBe(true);

  const after = await noSidewaysScroll(page);
  expect(after.scroll).toBeLessThanOrEqual(after.client);
  expect(errors).toEqual([]);
  await page.context().close();
});

test('on a phone the type scale folds into rows with no blank cells, and colour values stay inside their cards', async () => {
  const page = await phone();
  const scale = page.locator('[data-block="typography"] table');
  await scale.waitFor();
  const box = scale.locator('xpath=..');
  expect(await box.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
  const rows = await scale.locator('tbody tr').evaluateAll((trs) =>
    trs.map((tr) => {
      const cells = [...tr.children].map((cell) => {
        const range = document.createRange();
        range.selectNodeContents(cell);
        const style = getComputedStyle(cell);
        const inner = cell.getBoundingClientRect().height - parseFloat(style.paddingTop) - parseFloat(style.paddingBottom);
        return { blank: inner - range.getBoundingClientRect().height, right: cell.getBoundingClientRect().right };
      });
      return { step: tr.getAttribute('data-step'), cells, right: tr.getBoundingClientRect().right };
    }),
  );
  expect(rows.length).toBeGreaterThanOrEqual(5);
  for (const row of rows) {
    // No cell stands taller than what it holds (the old table padded each name to its sample's height).
    for (const cell of row.cells) expect(cell.blank, `step ${row.step}`).toBeLessThan(8);
    expect(row.right).toBeLessThanOrEqual(390);
  }

  // Each value of the palette ends inside its swatch card.
  const overflow = await page.locator('[data-color-id]').evaluateAll((cards) =>
    cards.flatMap((card) => {
      const edge = card.getBoundingClientRect().right;
      return [...card.querySelectorAll('dd')].filter((dd) => dd.getBoundingClientRect().right > edge + 0.5).map((dd) => dd.textContent);
    }),
  );
  expect(overflow).toEqual([]);
  await page.context().close();
});

test('on a phone the downloads save a file instead of opening it', async () => {
  const page = await phone();
  await page.goto(`${new URL(page.url()).origin}/b/${DEMO_BRANDS[0].slug}/downloads`);
  const links = page.locator('main a[href*="/api/assets/"]');
  await links.first().waitFor();
  const hrefs = await links.evaluateAll((as) => as.map((a) => ({ href: (a as HTMLAnchorElement).href, download: a.hasAttribute('download') })));
  expect(hrefs.length).toBeGreaterThan(0);
  for (const link of hrefs) expect(link.download, link.href).toBe(true);
  // RFC 6266: "attachment" asks the browser to save the file rather than show it.
  const answer = await page.request.get(hrefs[0].href);
  expect(answer.status()).toBe(200);
  expect(answer.headers()['content-disposition']).toMatch(/^attachment; filename="/);

  // A download started from the phone lands as a file.
  const [download] = await Promise.all([page.waitForEvent('download'), links.first().click()]);
  expect(download.suggestedFilename().length).toBeGreaterThan(3);
  await page.context().close();
});
