// A fresh designer builds an identity in Debian's chromium: two colours, the contrast table, a wrong value
// refused in words, a changed colour, and a logo whose clear-space box is drawn from its measured bounds.
import { wcagContrast } from 'culori';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, signUpFresh } from '../support/client';
import { launchOptions } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
});
afterAll(async () => {
  await browser?.close();
});

// Our own test artwork: a 100 × 50 block in a 200 × 100 viewBox, so 50 units of transparent margin left and
// right and 25 above and below must not count towards the drawn bounds.
const MARGIN_LOGO = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100" width="200" height="100">
  <rect x="50" y="25" width="100" height="50" fill="#1d3b53"/>
</svg>`;

interface Box { x: number; y: number; width: number; height: number }

test('add two colours, read the contrast table, change one, upload a logo and see its clear space', async () => {
  const { client, email } = await signUpFresh('identity');
  const created = await client.post('/api/brands', { name: `Fenwick Ropeworks ${Date.now()}` });
  expect(created.status).toBe(201);
  const brandId: string = created.body.brand.id;

  const context = await browser.newContext({ permissions: ['clipboard-read', 'clipboard-write'] });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('correct-horse-battery');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/app$/);

  await page.goto(`${baseUrl()}/app/brands/${brandId}/identity`);
  await page.getByText('No colours yet').waitFor();
  await page.getByText('Nothing to compare yet').waitFor();

  const addForm = page.getByRole('form', { name: 'Add a colour' });
  const addColour = async (name: string, value: string) => {
    await addForm.getByLabel('Name').fill(name);
    await addForm.getByLabel('Value').fill(value);
    await addForm.getByRole('button', { name: 'Add colour' }).click();
  };

  // A value the server cannot read: its message is shown in words and the typed text stays in the box.
  await addColour('Tarred Rope', 'not-a-colour');
  await addForm.getByRole('alert').waitFor();
  expect((await addForm.getByRole('alert').innerText()).length).toBeGreaterThan(10);
  expect(await addForm.getByLabel('Value').inputValue()).toBe('not-a-colour');

  await addColour('Tarred Rope', '#767676');
  await page.getByRole('listitem', { name: 'Tarred Rope' }).waitFor();
  await addColour('Sailcloth', '#ffffff');
  await page.getByRole('listitem', { name: 'Sailcloth' }).waitFor();

  // Copy one value and see the confirmation.
  await page.getByRole('button', { name: 'Copy HEX of Tarred Rope' }).click();
  await page.getByRole('button', { name: 'Copy HEX of Tarred Rope' }).getByText('Copied').waitFor();

  const table = page.getByRole('table', { name: 'Contrast of text colours on background colours' });
  const cell = (fg: string, bg: string) => table.locator(`td[data-fg="${fg}"][data-bg="${bg}"]`);

  // W3C WCAG 2.2, definition of contrast ratio (relative luminance, sRGB cut-off 0.04045): #767676 on #ffffff
  // gives 4.54:1, which passes AA (≥ 4.5:1, Success Criterion 1.4.3) and fails AAA (≥ 7:1, SC 1.4.6).
  await cell('#767676', '#ffffff').waitFor();
  const passing = cell('#767676', '#ffffff');
  expect(await passing.locator('[data-ratio]').innerText()).toContain('4.54');
  expect(await passing.locator('[data-level="aa"]').innerText()).toContain('AA pass');
  expect(await passing.locator('[data-level="aaa"]').innerText()).toContain('AAA fail');
  // The same definition is symmetric: white text on #767676 is 4.54:1 too.
  expect(await cell('#ffffff', '#767676').locator('[data-ratio]').innerText()).toContain('4.54');

  // Change the grey to #777777: W3C WCAG 2.2 contrast-ratio definition gives 4.48:1, which fails AA (< 4.5:1)
  // but passes AA for large text (≥ 3:1, SC 1.4.3).
  const card = page.getByRole('listitem', { name: 'Tarred Rope' });
  await card.getByRole('button', { name: 'Edit' }).click();
  const edit = page.getByRole('form', { name: 'Edit Tarred Rope' });
  await edit.getByLabel('Value').fill('#777777');
  await edit.getByRole('button', { name: 'Save' }).click();
  await cell('#777777', '#ffffff').waitFor();
  const failing = cell('#777777', '#ffffff');
  // The cell takes the new value as soon as it is saved; its ratio follows once the contrast table is read again.
  await failing.locator('[data-ratio]', { hasText: '4.48' }).waitFor();
  expect(await failing.locator('[data-ratio]').innerText()).toContain('4.48');
  expect(await failing.locator('[data-level="aa"]').innerText()).toContain('AA fail');
  expect(await failing.locator('[data-level="aaLarge"]').innerText()).toContain('AA large pass');
  expect(await cell('#767676', '#ffffff').count()).toBe(0);

  // The failing pair offers the nearest passing shade; by the WCAG 2.2 definition it must reach 4.5:1.
  await failing.getByRole('button', { name: 'Nearest passing shade' }).click();
  const suggestion = page.getByRole('region', { name: 'Nearest passing shade' });
  await suggestion.waitFor();
  const suggested = (await suggestion.innerText()).match(/suggested (#[0-9a-f]{6}) at (\d+\.\d\d):1/);
  expect(suggested, 'the suggestion names a hex and its ratio').not.toBeNull();
  // Measured with culori's wcagContrast (a general-purpose reference library), not with the ratio the screen shows.
  const measured = wcagContrast(suggested![1], '#ffffff');
  expect(measured).toBeGreaterThanOrEqual(4.5);
  expect(Math.abs(Number(suggested![2]) - measured)).toBeLessThanOrEqual(0.005);

  // Upload the logo with transparent margins and see the clear-space box drawn over it.
  await page.locator('#logos').scrollIntoViewIfNeeded();
  const upload = page.getByRole('form', { name: 'Upload a logo' });
  await upload.waitFor();
  await upload.getByLabel('File', { exact: true }).setInputFiles({ name: 'fenwick-block.svg', mimeType: 'image/svg+xml', buffer: Buffer.from(MARGIN_LOGO) });
  await upload.getByRole('button', { name: 'Upload logo' }).click();
  const overlay = page.locator('[data-overlay="clear-space"]');
  await overlay.waitFor();

  const identity = await page.request.get(`${baseUrl()}/api/brands/${brandId}/identity`);
  const logo = (await identity.json()).identity.logos[0] as { bounds: Box; clearSpace: { box: Box; unitSize: number; multiple: number } };
  // The test artwork's own geometry: the block spans x 50–150, y 25–75; the raster measure may be off by a unit.
  expect(logo.bounds.x).toBeCloseTo(50, -0.5);
  expect(logo.bounds.y).toBeCloseTo(25, -0.5);
  expect(logo.bounds.width).toBeCloseTo(100, -0.5);
  expect(logo.bounds.height).toBeCloseTo(50, -0.5);

  const drawn = await overlay.evaluate((el) => ({
    x: Number(el.getAttribute('x')),
    y: Number(el.getAttribute('y')),
    width: Number(el.getAttribute('width')),
    height: Number(el.getAttribute('height')),
  }));
  for (const k of ['x', 'y', 'width', 'height'] as const) expect(drawn[k]).toBeCloseTo(logo.clearSpace.box[k], 6);
  // The box sits margin = unit × multiple outside the drawn bounds on every side (the definition of clear space, common practice).
  const margin = logo.clearSpace.unitSize * logo.clearSpace.multiple;
  expect(drawn.x).toBeCloseTo(logo.bounds.x - margin, 6);
  expect(drawn.width).toBeCloseTo(logo.bounds.width + 2 * margin, 6);
  const bounds = page.locator('[data-overlay="bounds"]');
  expect(Number(await bounds.getAttribute('width'))).toBeCloseTo(logo.bounds.width, 6);

  // The size slider redraws the same geometry larger.
  const stage = page.locator('svg[data-logo-stage]');
  const before = Number(await stage.getAttribute('width'));
  const slider = page.getByRole('slider', { name: /Drawn width/ });
  await slider.focus();
  await page.keyboard.press('End');
  await expect.poll(async () => Number(await stage.getAttribute('width'))).toBeGreaterThan(before);
  expect(Number(await overlay.getAttribute('width'))).toBeCloseTo(logo.clearSpace.box.width, 6);

  expect(errors).toEqual([]);
  await context.close();
});
