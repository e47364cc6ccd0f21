// One-colour proofs in Debian's chromium: the logo screen shows the three proofs and says in words which colours run
// together in grey; the guideline block's greyscale filter gives the WCAG 2.2 relative-luminance grey (checked against
// colorjs.io) in the browser that prints the PDFs.
import Color from 'colorjs.io';
import { chromium, type Browser } from 'playwright-core';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import sharp from 'sharp';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { Render } from '@/blocks/oneColourProofs/Render';
import type { Identity } from '@/lib/identity/types';
import { DEMO_BRANDS, DEMO_PEOPLE } from '@db/seeders/demo';
import { baseUrl, signIn, signUpFresh } from '../support/client';
import { launchOptions, publishedDemoBrand, seriousViolations } from '../support/browser';

let browser: Browser;
beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
});
afterAll(async () => {
  await browser?.close();
});

// Red and a green of the same relative luminance (colorjs.io puts #009400 within 0.002 of red's 0.2126).
const RED_GREEN = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100"><rect width="100" height="100" fill="#ff0000"/><rect x="100" width="100" height="100" fill="#009400"/></svg>';

/** The grey level of a colour by relative luminance, from colorjs.io. */
const greyLevel = (hex: string) => {
  const y = new Color(hex).luminance;
  return Math.round(new Color('srgb-linear', [y, y, y]).to('srgb').coords[0]! * 255);
};

test('the logo screen shows the proofs and names the colours that run together in grey', async () => {
  const { client, email } = await signUpFresh('proofs-browser');
  const brandId: string = (await client.post('/api/brands', { name: `Proof Walk ${Date.now()}` })).body.brand.id;
  expect((await client.upload(`/api/brands/${brandId}/logos`, 'red-green.svg', RED_GREEN, 'image/svg+xml', { variant: 'mark' })).status).toBe(201);

  const page = await (await browser.newContext()).newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('correct-horse-battery');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/app$/);
  await page.goto(`${baseUrl()}/app/brands/${brandId}/identity#logos`);

  const proofs = page.getByRole('heading', { name: 'One-colour proofs' }).locator('xpath=ancestor::section[1]');
  await expect.poll(() => proofs.getByText('This logo leans on colour').count(), { timeout: 20_000 }).toBe(1);
  await expect.poll(() => proofs.getByText(/#ff0000.*#009400|#009400.*#ff0000/).count()).toBeGreaterThan(0);
  for (const alt of ['in black on white', 'in white on black', 'in greyscale']) {
    const img = proofs.getByRole('img', { name: new RegExp(alt) });
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth), { timeout: 20_000 }).toBeGreaterThan(0);
  }
  expect(await seriousViolations(page)).toEqual([]);
  expect(errors).toEqual([]);
});

test('the block’s greyscale is relative luminance in chromium (colorjs.io)', async () => {
  const logo = { id: 'l-mark', name: 'Mark', canvas: { width: 200, height: 100 }, format: 'svg', files: { original: '/files/mark.svg', black: '/files/mark.svg', white: '/files/mark.svg' } };
  const identity = { logos: [logo], colors: [], typefaces: [] } as unknown as Identity;
  const block = renderToStaticMarkup(createElement(Render, { attrs: { id: 'b', logoIds: ['l-mark'], caption: '' } as never, identity, mode: 'site', uid: 'pl-b' }));
  const page = await (await browser.newContext({ viewport: { width: 400, height: 1200 } })).newPage();
  // Our own origin on the page's side only: every request is answered here, nothing leaves the machine.
  await page.route('http://proofs.test/**', (route) =>
    route.request().url().endsWith('/files/mark.svg')
      ? route.fulfill({ body: RED_GREEN, contentType: 'image/svg+xml' })
      : route.fulfill({ body: `<!doctype html><body style="margin:0;background:#fff"><div id="grey" style="width:400px">${block}</div></body>`, contentType: 'text/html' }),
  );
  await page.goto('http://proofs.test/');
  const grey = page.locator('[data-proof="grey"] svg');
  await grey.evaluate((svg) => new Promise((done) => { const img = svg.querySelector('image'); return img ? setTimeout(done, 300) : done(null); }));
  const box = (await grey.boundingBox())!;
  const png = await page.screenshot({ clip: box, fullPage: true });
  const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
  const at = (fx: number) => data[(Math.round(info.height / 2) * info.width + Math.round(fx * info.width)) * info.channels];
  expect(Math.abs(at(0.25) - greyLevel('#ff0000'))).toBeLessThanOrEqual(1);
  expect(Math.abs(at(0.75) - greyLevel('#009400'))).toBeLessThanOrEqual(1);
});

// An open book with a paper-white spine and an amber lamp apart from it (ours). The amber, #e0a526, is 2.19:1 against
// white by the WCAG 2.2 contrast ratio: under SC 1.4.11's 3:1, so cut out it would vanish.
const BOOK_AND_LAMP = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 160 120"><path d="M80 30 C62 18 36 16 14 22 L14 100 C36 94 62 96 80 108 Z" fill="#1f3a5f"/><path d="M80 30 C98 18 124 16 146 22 L146 100 C124 94 98 96 80 108 Z" fill="#2b4c78"/><path d="M80 30 L80 108" stroke="#faf7f0" stroke-width="6"/><circle cx="118" cy="12" r="9" fill="#e0a526"/></svg>`;

test('on the proofs the designer chooses how light parts print in one colour, by looking at both', async () => {
  const { client, email } = await signUpFresh('light-parts-browser');
  const brandId: string = (await client.post('/api/brands', { name: `Lamp Walk ${Date.now()}` })).body.brand.id;
  const logoId: string = (await client.upload(`/api/brands/${brandId}/logos`, 'book.svg', BOOK_AND_LAMP, 'image/svg+xml', { variant: 'mark' })).body.logo.id;

  const page = await (await browser.newContext()).newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('correct-horse-battery');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/app$/);
  await page.goto(`${baseUrl()}/app/brands/${brandId}/identity#logos`);

  const choice = page.getByRole('group', { name: 'Light parts in one colour' });
  await choice.waitFor({ timeout: 20_000 });
  await expect.poll(() => choice.getByText('#e0a526').count()).toBeGreaterThan(0);
  const cut = choice.getByRole('radio', { name: /Cut out/ });
  const ink = choice.getByRole('radio', { name: /Printed in the ink/ });
  expect(await cut.isChecked()).toBe(true);
  // Both choices are drawn, so the decision is made by looking.
  for (const alt of [/light parts cut out/, /light parts printed in the ink/]) {
    const img = choice.getByRole('img', { name: alt });
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth), { timeout: 20_000 }).toBeGreaterThan(0);
  }
  // A click, not check(): the choice is saved first and the radio shows it once the server has answered.
  await ink.click();
  await page.getByText('light parts are now printed in the ink').waitFor();
  await expect.poll(() => ink.isChecked()).toBe(true);
  const proof = page.getByRole('img', { name: /in black on white$/ }).first();
  await expect.poll(() => proof.getAttribute('src')).toContain('lightParts=ink');
  const logo = (await client.get(`/api/brands/${brandId}/identity`)).body.identity.logos.find((l: { id: string }) => l.id === logoId);
  expect(logo.lightParts).toBe('ink');
  expect(await seriousViolations(page)).toEqual([]);
  expect(errors).toEqual([]);
});

test('the published demo shows each logo in one colour and in grey through the block, from the version’s own files', async () => {
  const owner = await signIn(DEMO_PEOPLE[0].email);
  await publishedDemoBrand(owner);
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const signedIn = await context.request.post(`${baseUrl()}/api/auth/sign-in/email`, { data: { email: DEMO_PEOPLE[0].email, password: 'plumbline-demo' }, headers: { origin: baseUrl() } });
  expect(signedIn.ok()).toBe(true);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(`${baseUrl()}/b/${DEMO_BRANDS[0].slug}`);
  const figures = page.locator('figure[data-logo-id]:has([data-proof])');
  await figures.first().waitFor();
  expect(await figures.count()).toBeGreaterThanOrEqual(2);
  for (const figure of await figures.all()) {
    await figure.scrollIntoViewIfNeeded();
    for (const proof of ['black', 'white']) {
      const img = figure.locator(`[data-proof="${proof}"] img`);
      expect(await img.getAttribute('src')).toMatch(new RegExp(`/b/${DEMO_BRANDS[0].slug}/v/\\d+/files/[^?]+\\?variant=${proof}`));
      await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth), { timeout: 20_000 }).toBeGreaterThan(0);
    }
    expect(await figure.locator('[data-proof="grey"] svg image').count()).toBe(1);
  }
  expect(errors).toEqual([]);
  await context.close();
});
