// Search on a published site, as a share-link visitor in Chromium, against a baseline measured in the same run:
// the same browser fetching the guideline page it is on (one request to the same server). Measured: the first
// search (the engine and the index load on first focus) and later ones, from the last keystroke to the result on
// screen, for a colour's hex and a logo's name. SEARCH_SHARE_URL=<a share link> measures a running site instead
// (e.g. the demo of `npm start`); otherwise a brand is published on the bench server.
import puppeteer, { type Page } from 'puppeteer-core';
import { FIXTURE_SVG } from '../tests/integration/fixtures';
import { benchServer, call, median } from './support/server';

async function shareLink(): Promise<string> {
  if (process.env.SEARCH_SHARE_URL) return process.env.SEARCH_SHARE_URL;
  const server = await benchServer();
  const cookie = await server.signUp('bench-search');
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: 'Bench Search' })).brand;
  const base = `/api/brands/${brand.id}`;
  const colorIds: string[] = [];
  for (const [name, value] of [['Harbour navy', '#1d2a44'], ['Gull white', '#f7f5ef'], ['Buoy orange', '#e8602c']]) colorIds.push((await call(server, cookie, 'POST', `${base}/colors`, { name, value })).color.id);
  const form = new FormData();
  form.append('file', new Blob([FIXTURE_SVG], { type: 'image/svg+xml' }), 'rope-knot.svg');
  const logo = await (await fetch(`${server.baseUrl}${base}/logos`, { method: 'POST', headers: { origin: server.baseUrl, cookie }, body: form })).json();
  const content: unknown[] = [];
  for (let i = 0; i < 20; i++) {
    content.push({ type: 'sectionHeading', attrs: { id: `s${i}`, title: `Section ${i + 1}`, eyebrow: 'Guidelines', intro: 'What this part covers and why it matters.' } });
    content.push({ type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance for the people who apply the brand every day, with the reasoning behind it.' }] });
    if (i === 2) content.push({ type: 'colorPalette', attrs: { id: 'pal', colorIds, showPrint: true, note: '' } });
    if (i === 4) content.push({ type: 'logoShowcase', attrs: { id: 'show', logoIds: [logo.logo.id], brandColorId: null, onDark: 'white', caption: '' } });
  }
  const { revision } = await call(server, cookie, 'GET', `${base}/guideline`);
  await call(server, cookie, 'PUT', `${base}/guideline`, { baseRevision: revision, doc: { type: 'doc', content } });
  await call(server, cookie, 'POST', `${base}/versions`, { note: 'Bench' });
  while ((await call(server, cookie, 'GET', `${base}/versions`)).versions[0].state === 'building') await new Promise((r) => setTimeout(r, 100));
  return `${server.baseUrl}${(await call(server, cookie, 'POST', `${base}/share-links`, { allowDownloads: false })).shareLink.url.replace(/^https?:\/\/[^/]+/, '')}`;
}

/** Milliseconds from typing `query` (the last key) until an option naming `expected` is shown. */
async function timeSearch(page: Page, query: string, expected: string): Promise<number> {
  return page.evaluate(
    async (q, name) => {
      const box = document.querySelector<HTMLInputElement>('[data-search-input]')!;
      box.value = '';
      box.dispatchEvent(new Event('input'));
      box.focus();
      const t0 = performance.now();
      box.value = q;
      box.dispatchEvent(new Event('input'));
      for (;;) {
        const options = [...document.querySelectorAll('[role="option"]')];
        if (options.some((o) => o.textContent?.includes(name))) return performance.now() - t0;
        await new Promise((r) => requestAnimationFrame(r));
      }
    },
    query,
    expected,
  );
}

export default async function searchBench(): Promise<void> {
  const url = await shareLink();
  const browser = await puppeteer.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: ['--no-sandbox', '--headless=new'] });
  try {
    const page = await browser.newPage();
    await page.goto(url, { waitUntil: 'load' });
    await page.waitForSelector('[data-site-search]:not([hidden])');
    // What to look for, read from the page itself: the last colour's hex and name, the first logo's name.
    const { hex, colour, logo } = await page.evaluate(() => {
      const swatch = [...document.querySelectorAll('[data-color-id]')].pop()!;
      return {
        hex: swatch.querySelector('[data-value="HEX"]')!.textContent!.trim(),
        colour: swatch.querySelector('p')!.textContent!.trim(),
        logo: document.querySelector('figure[data-logo-id] figcaption')!.textContent!.trim(),
      };
    });
    const pageFetch = await page.evaluate(async () => {
      const times = [];
      for (let i = 0; i < 7; i++) {
        const t0 = performance.now();
        await (await fetch(location.href, { cache: 'no-store' })).text();
        times.push(performance.now() - t0);
      }
      return times.sort((a, b) => a - b)[3];
    });
    const first = await timeSearch(page, hex, colour);
    const hexes: number[] = [];
    const logos: number[] = [];
    for (let i = 0; i < 9; i++) {
      hexes.push(await timeSearch(page, hex, colour));
      logos.push(await timeSearch(page, logo, logo));
    }
    console.log(`site: ${new URL(url).host}; looking for ${hex} (${colour}) and "${logo}"`);
    console.log(`baseline, the page's own HTML fetched again: ${pageFetch.toFixed(1)} ms (median of 7)`);
    console.log(`first search (engine and index load on first focus) for the hex: ${first.toFixed(1)} ms, ${(first / pageFetch).toFixed(2)}× the page fetch`);
    console.log(`later search for the hex: ${median(hexes).toFixed(1)} ms, for the logo's name: ${median(logos).toFixed(1)} ms (medians of 9; ${(median(hexes) / pageFetch).toFixed(2)}× and ${(median(logos) / pageFetch).toFixed(2)}× the page fetch)`);
  } finally {
    await browser.close();
  }
}
