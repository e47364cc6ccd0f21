// Debian's chromium for browser tests: never a downloaded browser. Plus the checks several walks share.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { LaunchOptions, Page } from 'playwright-core';
import { DEMO_BRANDS } from '@db/seeders/demo';
import type { Client } from './client';
import { publishAndWait, waitForBuild } from './publish';

/** Launch options for headless chromium on a closed network. */
export function launchOptions(): LaunchOptions {
  const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  // global-setup installs it as root; say plainly what is missing rather than a launcher's stack trace.
  if (!existsSync(executablePath)) {
    throw new Error(`Chromium is missing at ${executablePath}: run \`npm test\` as root once (it installs Debian's "chromium"), or \`sudo apt-get install -y --no-install-recommends chromium\`.`);
  }
  return {
    executablePath,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  };
}

const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

/** The contrast block's "Aa" tiles show a pair as it looks, failing or not, beside its verdict: incidental text
 *  in the sense of WCAG 2.2 SC 1.4.3, left out of every check on purpose. */
export const SAMPLE_TILES = '[data-sample]';

/**
 * Serious and critical violations that axe-core (Deque, rules for WCAG 2.0–2.2 levels A and AA) finds on the page
 * as it stands, as "rule (count): first element", so a failure names what to fix.
 */
export async function seriousViolations(page: Page, exclude: string[] = [SAMPLE_TILES]): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ content: axeSource });
  type Result = { violations: { id: string; impact: string; nodes: { target: string[] }[] }[] };
  const result = await page.evaluate(
    (excluded) => (window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<Result> } }).axe.run(
      { exclude: excluded.map((s) => [s]) },
      // Every rule still runs; only the violations are written out node by node (axe-core's API.md, "Performance":
      // resultTypes), since building selectors for every passing node is most of axe's time on a long page.
      { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'] }, resultTypes: ['violations'] },
    ),
    exclude,
  );
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.nodes.length}): ${v.nodes[0]?.target.join(' ')}`);
}

/** Wait until the islands have their data: those that wake when seen are scrolled to, the network is quiet
 *  and no "Loading…" status is left. */
export async function settled(page: Page): Promise<void> {
  for (const island of await page.locator('astro-island[client="visible"]').all()) await island.scrollIntoViewIfNeeded();
  await page.waitForLoadState('networkidle');
  await page.waitForFunction(() => ![...document.querySelectorAll('[role="status"]')].some((e) => /^\s*(Loading|Opening)/.test(e.textContent ?? '')));
}

/** The main demo brand with guidelines from its template and at least one published version; its id. */
export async function publishedDemoBrand(owner: Client): Promise<string> {
  const brand = (await owner.get('/api/brands')).body.brands.find((b: { slug: string }) => b.slug === DEMO_BRANDS[0].slug);
  const base = `/api/brands/${brand.id}`;
  const versions = (await owner.get(`${base}/versions`)).body.versions;
  if (versions.length === 0) {
    const draft = (await owner.get(`${base}/guideline`)).body;
    if (draft.doc.content.length === 0) await owner.post(`${base}/guideline/template`, { template: 'brand-book', baseRevision: draft.revision });
    await publishAndWait(owner, brand.id, 'For the browser walks');
  } else {
    await waitForBuild(owner, brand.id, versions[0].number);
  }
  return brand.id;
}
