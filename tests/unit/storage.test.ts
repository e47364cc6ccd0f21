// The storage interface, the same checks on both drivers: local disk and an S3-compatible store (s3rver, started
// here on a free loopback port). Content is checked with SHA-256 from node:crypto (FIPS 180-4), byte ranges with the
// inclusive first-last positions of RFC 9110 §14.1.2.
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3, type FakeS3 } from '@/lib/storage/fake-s3';
import { LocalDiskStorage } from '@/lib/storage/local-disk.server';
import { S3Storage } from '@/lib/storage/s3.server';
import { newKey, RangeNotSatisfiable, type FileStorage } from '@/lib/storage/storage';
import { storageEnv } from '@/lib/storage/settings';
import { s3Settings, storageChoice } from '../../scripts/lib/settings';

const MB = 1024 * 1024;
const dir = mkdtempSync(join(tmpdir(), 'plumbline-storage-'));
let fake: FakeS3;

beforeAll(async () => {
  fake = await startFakeS3({ dir: join(dir, 's3'), bucket: 'plumbline-test' });
});
afterAll(async () => {
  await fake?.close();
  rmSync(dir, { recursive: true, force: true });
});

const drivers: [string, () => FileStorage][] = [
  ['local disk', () => new LocalDiskStorage(join(dir, 'disk'))],
  ['s3', () => new S3Storage(fake.settings)],
];

/** `total` bytes of a repeatable pseudo-random sequence (a linear congruential generator), made 64 KiB at a time. */
function generated(total: number, seed = 1): { stream: Readable; sha256: Promise<string> } {
  const hash = createHash('sha256');
  let state = seed;
  let made = 0;
  let done!: (digest: string) => void;
  const sha256 = new Promise<string>((resolve) => (done = resolve));
  const stream = new Readable({
    read() {
      if (made >= total) {
        done(hash.digest('hex'));
        this.push(null);
        return;
      }
      const chunk = Buffer.alloc(Math.min(64 * 1024, total - made));
      for (let i = 0; i < chunk.length; i++) {
        state = (state * 1103515245 + 12345) & 0x7fffffff;
        chunk[i] = state >> 16;
      }
      made += chunk.length;
      hash.update(chunk);
      this.push(chunk);
    },
  });
  return { stream, sha256 };
}

async function drain(stream: Readable): Promise<{ sha256: string; size: number; largestChunk: number }> {
  const hash = createHash('sha256');
  let size = 0;
  let largestChunk = 0;
  for await (const chunk of stream as AsyncIterable<Buffer>) {
    hash.update(chunk);
    size += chunk.length;
    largestChunk = Math.max(largestChunk, chunk.length);
  }
  return { sha256: hash.digest('hex'), size, largestChunk };
}

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

describe.each(drivers)('storage on %s', (_name, open) => {
  let storage: FileStorage;
  const brand = randomUUID();
  const other = randomUUID();
  beforeAll(() => {
    storage = open();
  });

  it('says where its files are', () => {
    expect(storage.description).toMatch(/^(local disk at \/|s3 at http:\/\/127\.0\.0\.1:\d+, bucket plumbline-test)/);
  });

  it('gives back the bytes it was given, with their size and media type', async () => {
    const key = newKey(brand, 'logo', 'svg');
    const bytes = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"/>');
    expect(await storage.put(key, bytes, 'image/svg+xml')).toEqual({ key, size: bytes.byteLength });
    expect(sha256((await storage.get(key))!)).toBe(sha256(bytes));
    expect(await storage.stat(key)).toEqual({ size: bytes.byteLength, contentType: 'image/svg+xml' });
    expect(await storage.exists(key)).toBe(true);
    const streamed = (await storage.getStream(key))!;
    expect({ size: streamed.size, contentType: streamed.contentType, start: streamed.start, end: streamed.end }).toEqual({
      size: bytes.byteLength,
      contentType: 'image/svg+xml',
      start: 0,
      end: bytes.byteLength - 1,
    });
    expect((await drain(streamed.stream)).sha256).toBe(sha256(bytes));
  });

  it('keeps the media type it was given, not one guessed from the key', async () => {
    const key = newKey(brand, 'build', 'bin');
    await storage.put(key, new Uint8Array([1, 2, 3]), 'font/woff2');
    expect((await storage.stat(key))?.contentType).toBe('font/woff2');
  });

  it('streams 20 MB in and out without holding it whole, byte-identical', async () => {
    const key = newKey(brand, 'asset', 'pdf');
    const source = generated(20 * MB);
    expect(await storage.putStream(key, source.stream, 'application/pdf')).toEqual({ key, size: 20 * MB });
    expect(await storage.stat(key)).toEqual({ size: 20 * MB, contentType: 'application/pdf' });
    const out = (await storage.getStream(key))!;
    expect(out.size).toBe(20 * MB);
    const read = await drain(out.stream);
    expect(read.size).toBe(20 * MB);
    expect(read.sha256).toBe(await source.sha256);
    // The bytes came as a stream of pieces, never as one 20 MB buffer.
    expect(read.largestChunk).toBeLessThanOrEqual(MB);
  });

  it('answers a byte range with exactly those bytes (first and last included, RFC 9110 §14.1.2)', async () => {
    const key = newKey(brand, 'asset', 'bin');
    const bytes = new Uint8Array(1000).map((_, i) => i % 251);
    await storage.put(key, bytes, 'application/octet-stream');
    const part = (await storage.getStream(key, { start: 10, end: 19 }))!;
    expect({ size: part.size, start: part.start, end: part.end }).toEqual({ size: 1000, start: 10, end: 19 });
    expect((await drain(part.stream)).sha256).toBe(sha256(bytes.subarray(10, 20)));
    // An open-ended range, and a last byte past the end, run to the object's last byte.
    const tail = (await storage.getStream(key, { start: 990 }))!;
    expect((await drain(tail.stream)).sha256).toBe(sha256(bytes.subarray(990)));
    const past = (await storage.getStream(key, { start: 995, end: 5000 }))!;
    expect(past.end).toBe(999);
    expect((await drain(past.stream)).size).toBe(5);
    await expect(storage.getStream(key, { start: 1000 })).rejects.toBeInstanceOf(RangeNotSatisfiable);
  });

  it('answers null for a key that holds nothing', async () => {
    const key = newKey(brand, 'asset', 'png');
    expect(await storage.get(key)).toBeNull();
    expect(await storage.getStream(key)).toBeNull();
    expect(await storage.getStream(key, { start: 0, end: 9 })).toBeNull();
    expect(await storage.stat(key)).toBeNull();
    expect(await storage.exists(key)).toBe(false);
  });

  it('keeps an empty file as empty', async () => {
    const key = newKey(brand, 'asset', 'txt');
    await storage.put(key, new Uint8Array(0), 'text/plain');
    expect((await storage.get(key))!.length).toBe(0);
    const out = (await storage.getStream(key))!;
    expect(out.size).toBe(0);
    expect((await drain(out.stream)).size).toBe(0);
  });

  it('overwrites: the newer bytes and type win', async () => {
    const key = newKey(brand, 'logo', 'png');
    await storage.put(key, new TextEncoder().encode('first'), 'image/png');
    await storage.put(key, new TextEncoder().encode('second, longer'), 'image/webp');
    expect((await storage.get(key))!.toString()).toBe('second, longer');
    expect(await storage.stat(key)).toEqual({ size: 14, contentType: 'image/webp' });
    const again = generated(3 * MB, 7);
    await storage.putStream(key, again.stream, 'application/octet-stream');
    expect((await drain((await storage.getStream(key))!.stream)).sha256).toBe(await again.sha256);
  });

  it('keeps the stored file when a streamed replacement fails half-way', async () => {
    const key = newKey(brand, 'asset', 'zip');
    await storage.put(key, new TextEncoder().encode('kept'), 'application/zip');
    const failing = new Readable({
      read() {
        this.push(Buffer.alloc(64 * 1024, 1));
        this.destroy(new Error('the upload was cut off'));
      },
    });
    await expect(storage.putStream(key, failing, 'application/zip')).rejects.toThrow();
    expect((await storage.get(key))!.toString()).toBe('kept');
    expect((await storage.stat(key))?.contentType).toBe('application/zip');
  });

  it('deletes one key, and a missing key is no error', async () => {
    const key = newKey(brand, 'asset', 'png');
    await storage.put(key, new Uint8Array([1]), 'image/png');
    await storage.delete(key);
    expect(await storage.get(key)).toBeNull();
    expect(await storage.exists(key)).toBe(false);
    await expect(storage.delete(key)).resolves.toBeUndefined();
  });

  it("deletes every file of one brand, built files included, and nobody else's", async () => {
    const doomed = randomUUID();
    const mine = [newKey(doomed, 'logo', 'svg'), newKey(doomed, 'asset', 'pdf'), `${doomed}/build/${randomUUID()}/${'a'.repeat(64)}.html`];
    const theirs = newKey(other, 'logo', 'svg');
    for (const key of [...mine, theirs]) await storage.put(key, new Uint8Array([1, 2]), 'application/octet-stream');
    await storage.deleteBrandFiles(doomed);
    for (const key of mine) expect(await storage.exists(key)).toBe(false);
    expect(await storage.exists(theirs)).toBe(true);
    await expect(storage.deleteBrandFiles(doomed)).resolves.toBeUndefined();
  });

  it('refuses keys and brand ids that are not ours', async () => {
    const unsafe = [
      '../etc/passwd',
      `${brand}/logo/../../../etc/passwd`,
      `/${brand}/logo/${randomUUID()}.svg`,
      `${brand}/logo/${randomUUID()}.svg/..`,
      `${brand}/LOGO/${randomUUID()}.svg`,
      `${brand}/logo/${randomUUID()}.svg?x=1`,
      `${brand}/logo/${randomUUID()}.a.svg`,
      '',
    ];
    for (const key of unsafe) {
      await expect(storage.put(key, new Uint8Array([1]), 'image/svg+xml'), key).rejects.toThrow(/unexpected storage key/);
      await expect(storage.putStream(key, Readable.from([Buffer.from('x')]), 'image/svg+xml'), key).rejects.toThrow(/unexpected storage key/);
      await expect(storage.get(key), key).rejects.toThrow(/unexpected storage key/);
      await expect(storage.getStream(key), key).rejects.toThrow(/unexpected storage key/);
      await expect(storage.stat(key), key).rejects.toThrow(/unexpected storage key/);
      await expect(storage.delete(key), key).rejects.toThrow(/unexpected storage key/);
    }
    for (const id of ['', '..', `${brand}/..`, brand.toUpperCase(), `${brand.slice(0, -1)}`]) {
      await expect(storage.deleteBrandFiles(id), id).rejects.toThrow(/unexpected brand id/);
    }
    await expect(storage.getStream(newKey(brand, 'asset', 'bin'), { start: -1 })).rejects.toThrow(/malformed byte range/);
  });
});

describe('choosing the store from settings', () => {
  it('is local disk unless STORAGE says s3, and refuses a store it does not know', () => {
    expect(storageChoice({})).toEqual({ driver: 'local' });
    expect(storageChoice({ STORAGE: 'local' })).toEqual({ driver: 'local' });
    expect(storageChoice({ STORAGE: 's3' })).toEqual({ driver: 's3', fakeS3: true });
    expect(storageChoice({ STORAGE: 'S3', S3_ENDPOINT: 'https://objects.example' })).toEqual({ driver: 's3', fakeS3: false });
    expect(() => storageChoice({ STORAGE: 'tape' })).toThrow(/STORAGE=tape is not a storage Plumbline knows/);
  });

  it('passes S3 settings to the server under the names the app reads', () => {
    const settings = s3Settings({ S3_ENDPOINT: 'https://objects.example', S3_BUCKET: 'brand-files', S3_ACCESS_KEY_ID: 'id', S3_SECRET_ACCESS_KEY: 'secret', S3_FORCE_PATH_STYLE: 'false' });
    expect(settings).toEqual({ endpoint: 'https://objects.example', bucket: 'brand-files', region: 'us-east-1', accessKeyId: 'id', secretAccessKey: 'secret', forcePathStyle: false });
    expect(storageEnv({ driver: 's3', ...settings })).toEqual({
      STORAGE: 's3',
      S3_ENDPOINT: 'https://objects.example',
      S3_BUCKET: 'brand-files',
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'id',
      S3_SECRET_ACCESS_KEY: 'secret',
      S3_FORCE_PATH_STYLE: 'false',
    });
    expect(storageEnv({ driver: 'local', filesDir: '/srv/files' })).toEqual({ STORAGE: 'local', FILES_DIR: '/srv/files' });
  });
});
