// An anonymous visit through a share link, in Debian's chromium, with an accessibility check by axe-core.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { baseUrl, signIn } from '../support/client';
import { launchOptions } from '../support/browser';
import { DEMO_BRANDS, DEMO_PEOPLE } from '@db/seeders/demo';
import { publishAndWait, waitForBuild } from '../support/publish';

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
let browser: Browser;
let shareUrl: string;

beforeAll(async () => {
  browser = await chromium.launch(launchOptions());
  // The demo owner publishes the demo brand from its brand-book template and makes a link.
  const owner = await signIn(DEMO_PEOPLE[0].email);
  const brand = (await owner.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
  const base = `/api/brands/${brand.id}`;
  const versions = (await owner.get(`${base}/versions`)).body.versions;
  if (versions.length === 0) {
    const draft = (await owner.get(`${base}/guideline`)).body;
    if (draft.doc.content.length === 0) await owner.post(`${base}/guideline/template`, { template: 'brand-book', baseRevision: draft.revision });
    await publishAndWait(owner, brand.id, 'For the browser walk');
  } else {
    await waitForBuild(owner, brand.id, versions[0].number);
  }
  shareUrl = (await owner.post(`${base}/share-links`, { label: 'Browser walk' })).body.shareLink.url;
});
afterAll(async () => {
  await browser?.close();
});

test('an anonymous visitor opens the share link, reads the guidelines, and the page has no serious accessibility faults', async () => {
  const context = await browser.newContext();
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  await page.goto(shareUrl);
  await page.waitForURL(new RegExp(`/b/${DEMO_BRANDS[0].slug}$`));
  await page.getByRole('navigation', { name: 'Contents' }).waitFor();
  expect(await page.getByRole('heading', { level: 2, name: 'Colour' }).isVisible()).toBe(true);
  expect(await page.getByText('shared with you by link').isVisible()).toBe(true);
  // The contents jump to their section.
  await page.getByRole('navigation', { name: 'Contents' }).getByRole('link', { name: 'Typography' }).click();
  expect(page.url()).toMatch(/#typography$/);

  // axe-core (Deque, WCAG 2.x rules): no serious or critical violations on the published page. The "Aa" tiles of
  // the contrast block are left out on purpose: they exist to show a failing pair as it looks, beside its verdict.
  await page.addScriptTag({ content: axeSource });
  const result = await page.evaluate(async () => (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<{ violations: { id: string; impact: string; nodes: unknown[] }[] }> } }).axe.run({ exclude: [['[data-sample]']] }, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21aa', 'wcag22aa'] } }));
  const serious = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${v.id} (${v.nodes.length})`)).toEqual([]);

  // The draft stays out of reach.
  const draft = await page.goto(`${baseUrl()}/app`);
  expect(draft?.url()).toContain('/sign-in');
  expect(errors).toEqual([]);
  await context.close();
});
