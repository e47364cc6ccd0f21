// The editor in Debian's chromium: insert blocks, reload, find them again; change a colour, see it everywhere.
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { DEMO_BRANDS, DEMO_PASSWORD, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn } from '../support/client';
import { launchOptions } from '../support/browser';

let browser: Browser;
let brandId: string;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  const editor = await signIn(DEMO_PEOPLE[1].email);
  brandId = (await editor.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[1].slug).id;
});
afterAll(async () => {
  await browser?.close();
});

async function editorPage(): Promise<Page> {
  const context = await browser.newContext();
  const r = await context.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[1].email, password: DEMO_PASSWORD }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
  const page = await context.newPage();
  await page.goto(`${baseUrl()}/app/brands/${brandId}/guidelines`);
  await page.getByRole('textbox', { name: 'Guideline document' }).waitFor();
  return page;
}

async function insert(page: Page, label: string) {
  await page.getByRole('button', { name: '+ Add a block' }).click();
  await page.getByRole('combobox', { name: 'Find a block' }).fill(label);
  await page.getByRole('combobox', { name: 'Find a block' }).press('Enter');
}

test('the demo editor inserts a palette block and a paragraph; both survive a reload; a colour change shows in the block', async () => {
  const page = await editorPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));

  await insert(page, 'Colour palette');
  const palette = page.locator('[data-block-frame="colorPalette"]').first();
  await palette.waitFor();
  await insert(page, 'Paragraph');
  await page.keyboard.type('Library blue leads every poster.');
  await page.getByText(/All changes saved/).waitFor({ timeout: 15_000 });

  await page.reload();
  await page.getByRole('textbox', { name: 'Guideline document' }).waitFor();
  expect(await page.getByText('Library blue leads every poster.', { exact: true }).isVisible()).toBe(true);
  expect(await page.getByText('#1f3a5f').first().isVisible()).toBe(true); // the demo's Library blue

  // Change the colour in the identity (as the identity screen does); the block renders the new value.
  const editor = await signIn(DEMO_PEOPLE[1].email);
  const identity = (await editor.get(`/api/brands/${brandId}/identity`)).body.identity;
  const blue = identity.colors.find((c: { hex: string }) => c.hex === '#1f3a5f');
  expect((await editor.patch(`/api/brands/${brandId}/colors/${blue.id}`, { value: '#1d4270' })).status).toBe(200);
  await page.reload();
  await page.getByRole('textbox', { name: 'Guideline document' }).waitFor();
  expect(await page.getByText('#1d4270').first().isVisible()).toBe(true);
  expect(await page.getByText('#1f3a5f').count()).toBe(0);

  // A comment on the palette block, from the margin, shows in the margin under the block's name.
  const form = page.getByRole('form', { name: 'Comment on a block' });
  await form.getByLabel('Comment on').selectOption({ label: 'Colour palette' });
  await form.getByLabel('Comment', { exact: true }).fill('Show the print values here too.');
  const posted = page.waitForResponse((r) => r.url().endsWith('/comments') && r.request().method() === 'POST');
  await form.getByRole('button', { name: 'Add comment' }).click();
  const answer = await posted;
  expect(answer.status(), await answer.text()).toBe(201);
  await page.getByRole('complementary', { name: 'Review comments' }).getByText('Show the print values here too.').waitFor();
  const margin = await page.getByRole('complementary', { name: 'Review comments' }).innerText();
  expect(margin).toContain('On Colour palette');
  expect(errors).toEqual([]);
  await page.context().close();
});
