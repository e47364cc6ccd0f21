// The published site and its PDF, each against a baseline measured in the same run:
// - requests/s and p99 of the published page as a share-link visitor reads it (the cookie from opening the link,
//   Accept-Encoding as a browser sends it) at 50 connections, vs a bare Node `http` server in its own process sending
//   the same bytes with the same headers from memory (bench/support/bare-server.mjs): the limit for a Node server
//   here. The page is answered by the fast path (src/lib/publishing/fast-path.server.ts) ahead of Astro;
// - PDF of a 20-section version (made by the version's build, so every ask is served from storage) vs Chromium
//   printing the same page directly, once. The build prints twice per book (body with outline, then cover and
//   contents with page numbers) and binds both with pdf-lib; publish-to-ready itself is in build.bench.ts.
import { spawn, type ChildProcess } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { join } from 'node:path';
import autocannon from 'autocannon';
import puppeteer, { type Browser } from 'puppeteer-core';
import { freePort } from '../scripts/lib/postgres';
import { benchServer, call, type BenchServer } from './support/server';

/** What a current browser sends (common practice: Chromium and Firefox). */
const BROWSER_ENCODINGS = 'gzip, deflate, br, zstd';

async function load(url: string, headers: Record<string, string>, duration = 8) {
  const result = await autocannon({ url, connections: 50, duration, headers });
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx, total: result.requests.total };
}

/** One GET with the bytes and headers as sent on the wire (fetch would decode the body). */
function rawGet(url: string, headers: Record<string, string>): Promise<{ status: number; headers: Record<string, string>; body: Buffer }> {
  return new Promise((resolve, reject) => {
    request(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const kept: Record<string, string> = {};
        // What the bare server repeats: every header of the answer but those Node writes itself.
        for (const [name, value] of Object.entries(res.headers)) if (!['date', 'connection', 'keep-alive', 'transfer-encoding'].includes(name) && typeof value === 'string') kept[name] = value;
        resolve({ status: res.statusCode!, headers: kept, body: Buffer.concat(chunks) });
      });
      res.on('error', reject);
    })
      .on('error', reject)
      .end();
  });
}

/** The bare baseline server in its own process, answering with `body` and `headers`; its URL and the process. */
async function bareServer(body: Buffer, headers: Record<string, string>): Promise<{ url: string; child: ChildProcess }> {
  const dir = process.env.PLUMBLINE_OUT_DIR!;
  writeFileSync(join(dir, 'bench-bare-body'), body);
  writeFileSync(join(dir, 'bench-bare-headers.json'), JSON.stringify(headers));
  const port = await freePort();
  const child = spawn(process.execPath, [join(import.meta.dirname, 'support', 'bare-server.mjs'), String(port), join(dir, 'bench-bare-body'), join(dir, 'bench-bare-headers.json')], { stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => d.toString().includes('listening') && resolve());
    child.once('exit', (code) => reject(new Error(`the bare server stopped (${code})`)));
  });
  return { url: `http://127.0.0.1:${port}/`, child };
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
    const { url: link } = (await call(server, cookie, 'POST', `/api/brands/${small.id}/share-links`, { label: 'Bench' })).shareLink;
    const opened = await fetch(link, { redirect: 'manual' });
    const visitor = { cookie: opened.headers.getSetCookie().map((c) => c.split(';')[0]).join('; '), 'accept-encoding': BROWSER_ENCODINGS, ...(process.env.BENCH_DNT ? { dnt: '1' } : {}) };
    const pageUrl = `${server.baseUrl}/b/${small.slug}`;
    const sent = await rawGet(pageUrl, visitor);
    if (sent.status !== 200) throw new Error(`the page answered ${sent.status}`);
    const html = await (await fetch(pageUrl, { headers: { cookie: visitor.cookie } })).text();
    const bare = await bareServer(sent.body, sent.headers);
    try {
      // Warm both up, then alternate, so a machine busy with something else weighs on both alike.
      await load(pageUrl, visitor, 3);
      await load(bare.url, visitor, 3);
      const rounds = [];
      for (let i = 0; i < 2; i++) rounds.push({ page: await load(pageUrl, visitor), bare: await load(bare.url, visitor) });
      const sum = (pick: (r: (typeof rounds)[number]) => number) => rounds.reduce((n, r) => n + pick(r), 0);
      const page = { rps: sum((r) => r.page.rps) / rounds.length, p99: Math.max(...rounds.map((r) => r.page.p99)), errors: sum((r) => r.page.errors) };
      const base = { rps: sum((r) => r.bare.rps) / rounds.length, p99: Math.max(...rounds.map((r) => r.bare.p99)), errors: sum((r) => r.bare.errors) };
      console.log(`page as sent: ${sent.body.length} bytes ${sent.headers['content-encoding'] ?? 'identity'} of ${Buffer.byteLength(html)}, headers ${Object.keys(sent.headers).join(', ')}`);
      for (const [i, r] of rounds.entries()) console.log(`round ${i + 1}: published page ${r.page.rps.toFixed(0)} req/s (p99 ${r.page.p99} ms), bare server ${r.bare.rps.toFixed(0)} req/s (p99 ${r.bare.p99} ms)`);
      console.log(`published page through a share link: ${page.rps.toFixed(0)} req/s, p99 ${page.p99} ms (${page.errors} errors)`);
      console.log(`bare Node http server, same bytes and headers from memory: ${base.rps.toFixed(0)} req/s, p99 ${base.p99} ms (${base.errors} errors)`);
      console.log(`ratio published / bare: ${(page.rps / base.rps).toFixed(2)} (goal ≥ 0.9); p99 ratio ${(page.p99 / Math.max(base.p99, 1)).toFixed(2)} (goal ≤ 2)`);
    } finally {
      bare.child.kill('SIGTERM');
    }
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
