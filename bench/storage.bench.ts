// PDF bytes served over HTTP from each storage driver against the physical baselines, all in the same run:
// a bare Node http server sending the same bytes from memory (the floor), and one piping fs.createReadStream from
// disk. The storage servers do what a built version's file request does after its access check: getStream, then pipe.
// The S3-compatible fake runs in a child process of its own, as a real store would be elsewhere.
import { spawn, type ChildProcess } from 'node:child_process';
import { createReadStream, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type RequestListener, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { PDFDocument } from 'pdf-lib';
import sharp from 'sharp';
import { LocalDiskStorage } from '@/lib/storage/local-disk.server';
import { S3Storage } from '@/lib/storage/s3.server';
import { newKey, type FileStorage } from '@/lib/storage/storage';
import { freePort } from '../scripts/lib/postgres';
import { median } from './support/server';

const REQUESTS = 16;
const ROUNDS = 5;
const AT_ONCE = 4;
const BRAND = '00000000-0000-4000-8000-000000000000';

/** A real multi-page PDF of a few megabytes: photographs of noise (incompressible, like real photos) on A4 pages. */
async function multiMegabytePdf(): Promise<Buffer> {
  const doc = await PDFDocument.create();
  for (let i = 0; i < 8; i++) {
    const jpeg = await sharp({ create: { width: 1400, height: 1000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } })
      .jpeg({ quality: 92 })
      .toBuffer();
    const image = await doc.embedJpg(jpeg);
    const page = doc.addPage([595.28, 841.89]);
    page.drawImage(image, { x: 40, y: 260, width: 515, height: 368 });
  }
  return Buffer.from(await doc.save());
}

function listen(handler: RequestListener): Promise<{ server: Server; url: string }> {
  const server = createServer(handler);
  return new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve({ server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/` })));
}

/** What a file request does once it is allowed: the stored stream, its size, piped out. */
function fromStorage(storage: FileStorage, key: string): RequestListener {
  return (_req, res) => {
    storage
      .getStream(key)
      .then(async (stored) => {
        if (!stored) return void res.writeHead(404).end();
        res.writeHead(200, { 'content-type': stored.contentType, 'content-length': stored.size });
        await pipeline(stored.stream, res);
      })
      .catch(() => res.destroy());
  };
}

/** REQUESTS downloads, AT_ONCE at a time, each read to the end and counted: median ms per download, and MB/s overall. */
async function load(url: string, size: number): Promise<{ ms: number; mbps: number }> {
  const times: number[] = [];
  let next = 0;
  const t0 = performance.now();
  await Promise.all(
    Array.from({ length: AT_ONCE }, async () => {
      while (next++ < REQUESTS) {
        const t = performance.now();
        const res = await fetch(url);
        let got = 0;
        for await (const chunk of res.body as AsyncIterable<Uint8Array>) got += chunk.byteLength;
        if (got !== size) throw new Error(`${url} sent ${got} bytes, not ${size}`);
        times.push(performance.now() - t);
      }
    }),
  );
  const seconds = (performance.now() - t0) / 1000;
  return { ms: median(times), mbps: (REQUESTS * size) / 1e6 / seconds };
}

/** s3rver in a child process, on a free port, with one bucket. */
async function fakeS3Process(dir: string): Promise<{ child: ChildProcess; endpoint: string }> {
  const port = await freePort();
  const script = `const S3rver = require('s3rver'); new S3rver({ address: '127.0.0.1', port: ${port}, directory: ${JSON.stringify(dir)}, silent: true, vhostBuckets: false, configureBuckets: [{ name: 'bench', configs: [] }] }).run().then(() => console.log('ready'));`;
  const child = spawn(process.execPath, ['-e', script], { cwd: process.cwd(), stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    child.stdout!.once('data', () => resolve());
    child.once('exit', (code) => reject(new Error(`the S3 fake exited (${code})`)));
  });
  return { child, endpoint: `http://127.0.0.1:${port}` };
}

export default async function storageBench(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-storage-bench-'));
  const servers: Server[] = [];
  let s3: ChildProcess | undefined;
  try {
    const pdf = await multiMegabytePdf();
    const onDisk = join(dir, 'plain.pdf');
    writeFileSync(onDisk, pdf);
    const key = newKey(BRAND, 'pdf', 'pdf');
    const local = new LocalDiskStorage(join(dir, 'files'));
    await local.put(key, pdf, 'application/pdf');
    const fake = await fakeS3Process(join(dir, 's3'));
    s3 = fake.child;
    const remote = new S3Storage({ endpoint: fake.endpoint, bucket: 'bench', region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });
    await remote.put(key, pdf, 'application/pdf');

    const ways: [string, RequestListener][] = [
      ['memory (baseline)', (_req, res) => res.writeHead(200, { 'content-type': 'application/pdf', 'content-length': pdf.length }).end(pdf)],
      ['fs.createReadStream', (_req, res) => {
        res.writeHead(200, { 'content-type': 'application/pdf', 'content-length': pdf.length });
        pipeline(createReadStream(onDisk), res).catch(() => res.destroy());
      }],
      ['storage: local disk', fromStorage(local, key)],
      ['storage: s3 (local fake)', fromStorage(remote, key)],
    ];
    // The ways take turns, round after round, so a busy machine slows each alike; each ratio is taken within a round.
    const urls: string[] = [];
    for (const [, handler] of ways) {
      const { server, url } = await listen(handler);
      servers.push(server);
      urls.push(url);
      await load(url, pdf.length); // warm up
    }
    const rounds: { ms: number; mbps: number }[][] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const results: { ms: number; mbps: number }[] = [];
      for (const url of urls) results.push(await load(url, pdf.length));
      rounds.push(results);
    }
    console.log(
      `A ${(pdf.length / 1e6).toFixed(1)} MB PDF over HTTP: ${ROUNDS} rounds of ${REQUESTS} downloads, ${AT_ONCE} at a time (medians over rounds: ms per download, throughput, time against memory and against disk in the same round)`,
    );
    ways.forEach(([name], i) => {
      const ms = median(rounds.map((r) => r[i].ms));
      const mbps = median(rounds.map((r) => r[i].mbps));
      const vsMemory = median(rounds.map((r) => r[i].ms / r[0].ms));
      const vsDisk = median(rounds.map((r) => r[i].ms / r[1].ms));
      console.log(`  ${name.padEnd(26)} ${ms.toFixed(1).padStart(7)} ms  ${mbps.toFixed(0).padStart(5)} MB/s  ${vsMemory.toFixed(2)}× memory  ${vsDisk.toFixed(2)}× disk`);
    });
  } finally {
    for (const server of servers) server.close();
    s3?.kill('SIGTERM');
    rmSync(dir, { recursive: true, force: true });
  }
}
