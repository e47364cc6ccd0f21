// The imagery block's photo picker in Debian's chromium: thumbnails of the brand's approved photographs, chosen with
// the keyboard alone (arrow keys move between radio buttons, WAI-ARIA Authoring Practices "Radio Group" pattern), and
// the choice saved as the photograph's asset id, never a typed id or address.
import sharp from 'sharp';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, type Client, signUpFresh } from '../support/client';
import { launchOptions } from '../support/browser';

let browser: Browser;
let owner: Client;
let email: string;
let brandId: string;
const ids: Record<string, string> = {};

/** A small photograph of one colour with a lighter band, drawn by sharp. */
const photo = (colour: string) =>
  sharp({ create: { width: 1200, height: 800, channels: 3, background: colour } })
    .composite([{ input: { create: { width: 1200, height: 120, channels: 3, background: '#f3e3c4' } }, top: 340, left: 0 }])
    .jpeg()
    .toBuffer();

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  ({ client: owner, email } = await signUpFresh('picker'));
  brandId = (await owner.post('/api/brands', { name: 'Picker Test Roasters' })).body.brand.id;
  for (const [name, colour] of [['first-light', '#6b4a33'], ['lake-view', '#55625f']] as const) {
    const up = await owner.upload(`/api/brands/${brandId}/assets`, `${name}.jpg`, await photo(colour), 'image/jpeg', { kind: 'photo' });
    expect(up.status).toBe(201);
    ids[name] = up.body.assets[0].id;
    expect((await owner.patch(`/api/brands/${brandId}/assets/${ids[name]}`, { state: 'approved', altText: `A test picture called ${name}.` })).status).toBe(200);
  }
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

test('a photograph is picked from thumbnails with the arrow keys and saved as its asset id', async () => {
  const context = await browser.newContext();
  const r = await context.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email, password: 'correct-horse-battery' }, headers: { origin: baseUrl() } });
  expect(r.ok()).toBe(true);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/app/brands/${brandId}/guidelines`);
  await page.getByRole('textbox', { name: 'Guideline document' }).waitFor();

  await page.getByRole('button', { name: '+ Add a block' }).click();
  await page.getByRole('combobox', { name: 'Find a block' }).fill('Imagery');
  await page.getByRole('combobox', { name: 'Find a block' }).press('Enter');
  await page.getByRole('button', { name: 'Add an image' }).click();

  const picker = page.getByRole('group', { name: 'Photograph 1' });
  await picker.waitFor();
  // Thumbnails, not a list of names or an id field: each choice is a radio button with the photo's picture.
  expect(await picker.getByRole('radio').count()).toBe(3); // two photographs and "photo to come"
  expect(await picker.locator('img').count()).toBe(2);
  expect(await page.getByRole('textbox', { name: /asset id|address/i }).count()).toBe(0);

  const first = picker.getByRole('radio', { name: 'first-light' });
  expect(await first.isChecked()).toBe(true);
  await first.focus();
  await page.keyboard.press('ArrowRight');
  expect(await picker.getByRole('radio', { name: 'lake-view' }).isChecked()).toBe(true);
  // The editor saves on its own; the stored draft holds the chosen photograph's id.
  const saved = async () => {
    const draft = (await owner.get(`/api/brands/${brandId}/guideline`)).body.doc;
    return draft.content.find((n: { type: string }) => n.type === 'imagery')?.attrs.items[0]?.src;
  };
  await expect.poll(saved, { timeout: 15_000 }).toBe(ids['lake-view']);
  expect(errors).toEqual([]);
  await context.close();
}, 120_000);
