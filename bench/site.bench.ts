// The published site and its PDF, each against a baseline measured in the same run:
// - requests/s and p99 of a published page at 50 connections vs the same HTML as a static file, same process (the
//   page is built once by the version's build; a request checks access and streams the stored bytes with the manifest ETag);
// - PDF of a 20-section version (made by the version's build, so every ask is served from storage) vs Chromium
//   printing the same page directly, once. The build prints twice per book (body with outline, then cover and
//   contents with page numbers) and binds both with pdf-lib; publish-to-ready itself is in build.bench.ts.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import autocannon from 'autocannon';
import puppeteer, { type Browser } from 'puppeteer-core';
import { benchServer, call, type BenchServer } from './support/server';

async function load(url: string, headers: Record<string, string>) {
  const result = await autocannon({ url, connections: 50, duration: 8, headers });
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx };
}

async function publishedBrand(server: BenchServer, cookie: string, sections: number) {
  const brand = (await call(server, cookie, 'POST', '/api/brands', { name: `Bench Site ${sections}` })).brand;
  const base = `/api/brands/${brand.id}`;
  const colors = [];
  for (const [name, value] of [['Ink', '#1d2a44'], ['Paper', '#f7f3ea'], ['Signal', '#c8553d']]) colors.push((await call(server, cookie, 'POST', `${base}/colors`, { name, value })).color.id);
  await call(server, cookie, 'POST', `${base}/typefaces`, { shipped: 'fraunces', role: 'heading' });
  await call(server, cookie, 'POST', `${base}/typefaces`, { shipped: 'dm-sans', role: 'body' });
  const content: unknown[] = [];
  for (let i = 0; i < sections; i++) {
    content.push({ type: 'sectionHeading', attrs: { id: `s${i}`, title: `Section ${i + 1}`, eyebrow: 'Guidelines', intro: 'What this part covers and why it matters.' } });
    content.push({ type: 'paragraph', attrs: { id: `p${i}` }, content: [{ type: 'text', text: 'Guidance for the people who apply the brand every day, with the reasoning behind it so they can decide well when a case is new.' }] });
    if (i % 4 === 0) content.push({ type: 'colorPalette', attrs: { id: `c${i}`, colorIds: colors, showPrint: true, note: '' } });
    if (i % 4 === 1) content.push({ type: 'contrastPairs', attrs: { id: `k${i}`, pairs: [{ foreground: colors[0], background: colors[1] }], note: '' } });
  }
  const { revision } = await call(server, cookie, 'GET', `${base}/guideline`);
  await call(server, cookie, 'PUT', `${base}/guideline`, { baseRevision: revision, doc: { type: 'doc', content } });
  await call(server, cookie, 'POST', `${base}/versions`, { note: 'Bench' });
  // The version is built by a job after publishing: the site serves it once it is ready.
  while ((await call(server, cookie, 'GET', `${base}/versions`)).versions[0].state === 'building') await new Promise((r) => setTimeout(r, 100));
  return brand as { id: string; slug: string };
}

async function pdfReady(server: BenchServer, cookie: string, path: string): Promise<number> {
  const t0 = performance.now();
  for (;;) {
    const r = await fetch(server.baseUrl + path, { headers: { cookie, accept: 'application/json' } });
    if (r.headers.get('content-type')?.includes('application/pdf')) {
      await r.arrayBuffer();
      return performance.now() - t0;
    }
    await r.text();
    await new Promise((res) => setTimeout(res, 50));
  }
}

export default async function siteBench(): Promise<void> {
  const server = await benchServer();
  const cookie = await server.signUp('bench-site');

  // Page throughput (BENCH_PART=pdf runs only the PDF part).
  if (process.env.BENCH_PART !== 'pdf') {
    const small = await publishedBrand(server, cookie, 8);
    const pageUrl = `${server.baseUrl}/b/${small.slug}`;
    const html = await (await fetch(pageUrl, { headers: { cookie } })).text();
    writeFileSync(join(process.env.PLUMBLINE_OUT_DIR!, 'client', 'bench-static.html'), html);
    await load(pageUrl, { cookie }); // warm up both paths
    const page = await load(pageUrl, { cookie });
    const file = await load(`${server.baseUrl}/bench-static.html`, {});
    console.log(`published page: ${page.rps.toFixed(0)} req/s, p99 ${page.p99} ms (${page.errors} errors)`);
    console.log(`same HTML as a static file: ${file.rps.toFixed(0)} req/s, p99 ${file.p99} ms`);
    console.log(`ratio published / static: ${(page.rps / file.rps).toFixed(2)} (goal ≥ 0.7)`);
    const js = [...html.matchAll(/<script\b[^>]*>([\s\S]*?)<\/script>/g)].reduce((n, m) => n + Buffer.byteLength(m[1]), 0);
    const external = [...html.matchAll(/<script\b[^>]*src=/g)].length;
    console.log(`published page JavaScript: ${(js / 1024).toFixed(1)} KB inline, ${external} external scripts (goal ≤ 30 KB)`);
  }

  // PDF of a 20-section version (BENCH_PART=page stops before it).
  if (process.env.BENCH_PART === 'page') return;
  const big = await publishedBrand(server, cookie, 20);
  const cold = await pdfReady(server, cookie, `/b/${big.slug}/v/1/guideline.pdf?size=a4`);
  const warm = await pdfReady(server, cookie, `/b/${big.slug}/v/1/guideline.pdf?size=letter`);
  const cached = await pdfReady(server, cookie, `/b/${big.slug}/v/1/guideline.pdf?size=letter`);

  const printUrl = `${server.baseUrl}/b/${big.slug}/v/1/print?size=a4`;
  const printHtml = (await (await fetch(printUrl, { headers: { cookie } })).text()).replace('<head>', `<head><base href="${server.baseUrl}/">`);
  const htmlFile = join(process.env.PLUMBLINE_OUT_DIR!, 'bench-print.html');
  writeFileSync(htmlFile, printHtml);
  const args = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-dev-shm-usage'];
  const direct = async (browser: Browser) => {
    const tab = await browser.newPage();
    await tab.setCookie(...cookie.split('; ').map((c) => ({ name: c.split('=')[0], value: c.slice(c.indexOf('=') + 1), url: server.baseUrl })));
    await tab.goto(`file://${htmlFile}`, { waitUntil: 'networkidle0' });
    // The page sets its own size, margins, running heads and folios (@page), as the product's renderer uses them.
    await tab.pdf({ preferCSSPageSize: true, printBackground: true });
    await tab.close();
  };
  const t0 = performance.now();
  const browser = await puppeteer.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args });
  await direct(browser);
  const baseCold = performance.now() - t0;
  const t1 = performance.now();
  await direct(browser);
  const baseWarm = performance.now() - t1;
  await browser.close();
  console.log(`PDF, 20 sections: cold ${cold.toFixed(0)} ms, warm ${warm.toFixed(0)} ms, cached ${cached.toFixed(0)} ms`);
  console.log(`Chromium printing the same HTML directly: cold ${baseCold.toFixed(0)} ms, warm ${baseWarm.toFixed(0)} ms`);
  console.log(`ratios: cold ${(cold / baseCold).toFixed(2)}, warm ${(warm / baseWarm).toFixed(2)} (goal ≤ 1.5)`);
}
