// The editor shows what will publish: at 1920 × 1080 in Debian's chromium, its page is the published reading
// column's width, and the blocks inside it lay out as they do on the published site.
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn } from '../support/client';
import { launchOptions, publishedDemoBrand } from '../support/browser';

let browser: Browser;
let brandId: string;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  brandId = await publishedDemoBrand(await signIn(DEMO_PEOPLE[0].email));
});
afterAll(async () => {
  await browser?.close();
});

/** How many distinct columns the palette's swatches sit in. */
const paletteColumns = (page: Page, block: string) =>
  page.locator(`${block} [data-color-id]`).evaluateAll((cards) => new Set(cards.map((c) => Math.round(c.getBoundingClientRect().left))).size);

test('at 1920 px the editor page is as wide as the published column, and the palette keeps its grid in both', async () => {
  const context = await browser.newContext({ viewport: { width: 1920, height: 1080 } });
  const r = await context.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[1].email, password: DEMO_PASSWORD }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));

  await page.goto(`${baseUrl()}/b/${DEMO_BRANDS[0].slug}`);
  const published = await page.locator('main#content').evaluate((el) => el.getBoundingClientRect().width);
  const publishedBlock = await page.locator('[data-block="colorPalette"]').first().evaluate((el) => el.getBoundingClientRect().width);
  const publishedColumns = await paletteColumns(page, '[data-block="colorPalette"]');

  await page.goto(`${baseUrl()}/app/brands/${brandId}/guidelines`);
  const column = page.getByRole('textbox', { name: 'Guideline document' });
  await column.waitFor();
  const frame = page.locator('[data-block-frame="colorPalette"]').first();
  await frame.waitFor();
  const editing = await column.evaluate((el) => {
    const style = getComputedStyle(el);
    return el.getBoundingClientRect().width - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
  });
  const editingBlock = await frame.locator('[data-block-preview]').evaluate((el) => {
    const style = getComputedStyle(el);
    return el.getBoundingClientRect().width - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
  });

  // The same column, and each block drawn at the same width inside it.
  expect(published).toBeGreaterThan(900);
  expect(Math.abs(editing - published)).toBeLessThanOrEqual(2);
  expect(Math.abs(editingBlock - publishedBlock)).toBeLessThanOrEqual(2);
  // The palette is a grid of swatches in both, not one stacked column.
  expect(publishedColumns).toBeGreaterThan(1);
  expect(await paletteColumns(page, '[data-block-frame="colorPalette"]')).toBe(publishedColumns);

  // No list markers or list indents from the rich-text styles reach inside a block's rendering.
  const markers = await page.locator('[data-block-preview] li').evaluateAll((items) =>
    items.filter((li) => getComputedStyle(li).listStyleType !== 'none' || parseFloat(getComputedStyle(li.parentElement!).paddingLeft) > 0).length,
  );
  expect(markers).toBe(0);
  // Rich text still reads as the site sets it: bullets on the document's own lists.
  expect(await column.locator(':scope > ul').first().evaluate((ul) => getComputedStyle(ul).listStyleType)).toBe('disc');

  // The type scale sets each step on one line: every sample row is one line of its size high.
  const samples = await page.locator('[data-block-frame="typography"] [data-scale-sample]').evaluateAll((cells) =>
    cells.map((cell) => {
      const style = getComputedStyle(cell);
      const inner = cell.getBoundingClientRect().height - parseFloat(style.paddingTop) - parseFloat(style.paddingBottom);
      return inner / parseFloat(style.lineHeight);
    }),
  );
  expect(samples.length).toBeGreaterThan(3);
  for (const lines of samples) expect(lines).toBeLessThan(1.5);
  expect(errors).toEqual([]);
  await context.close();
});
