// The pure parts of the fast path for published reads: which content coding a request gets, when an If-None-Match
// matches, and the size-bounded memory of stored bytes.
import { describe, expect, test } from 'vitest';
import { ByteMemory } from '@/lib/publishing/byte-memory';
import { chooseEncoding, etagMatches, isCompressible } from '@/lib/publishing/encoding';

describe('Accept-Encoding (RFC 9110 §12.5.3)', () => {
  test.each([
    // The field values below are RFC 9110 §12.5.3's own examples, then what browsers send (common practice).
    ['compress, gzip', 'gzip'],
    ['', 'identity'], // "Accept-Encoding:" empty: only identity is acceptable
    ['*', 'br'], // any coding; br is ours when the client does not mind
    ['compress;q=0.5, gzip;q=1.0', 'gzip'],
    ['gzip;q=1.0, identity; q=0.5, *;q=0', 'gzip'],
    ['gzip, deflate, br, zstd', 'br'], // Chromium and Firefox (common practice): equal q, br is smaller
    ['gzip, deflate', 'gzip'], // older clients (common practice)
    ['br;q=0.4, gzip;q=0.8', 'gzip'], // the client's higher q wins
    ['br;q=0, gzip;q=0', 'identity'], // q=0 means "not acceptable" (§12.4.2)
    ['identity', 'identity'],
    ['BR', 'br'], // codings are case-insensitive (§8.4.1)
  ])('%j → %s', (header, coding) => {
    expect(chooseEncoding(header)).toBe(coding);
  });

  test('no header at all: identity (§12.5.3: the server then does not know, and identity is always fine)', () => {
    expect(chooseEncoding(undefined)).toBe('identity');
  });

  test.each([
    ['text/html; charset=utf-8', true],
    ['text/css; charset=utf-8', true],
    ['application/javascript', true],
    ['application/json', true],
    ['image/svg+xml', true],
    ['application/ld+json', true],
    // Already compressed formats gain nothing (common practice).
    ['image/png', false],
    ['image/jpeg', false],
    ['font/woff2', false],
    ['application/pdf', false],
  ])('%s compressible: %s', (type, compressible) => {
    expect(isCompressible(type)).toBe(compressible);
  });
});

describe('If-None-Match, weak comparison (RFC 9110 §13.1.2 and its table)', () => {
  test.each([
    // The four rows of the §13.1.2 example table, weak comparison column (If-None-Match uses weak comparison, §13.1.2).
    ['W/"1"', 'W/"1"', true],
    ['W/"1"', 'W/"2"', false],
    ['W/"1"', '"1"', true],
    ['"1"', '"1"', true],
    // A list matches when any member does (§13.1.2), and "*" matches any current representation.
    ['"a", "b-br"', '"b-br"', true],
    ['"a-gz"', '"a-br"', false],
    ['*', '"x"', true],
  ])('If-None-Match %s against %s → %s', (header, etag, matches) => {
    expect(etagMatches(header, etag)).toBe(matches);
  });

  test('no If-None-Match: never a 304', () => {
    expect(etagMatches(undefined, '"x"')).toBe(false);
  });
});

describe('the memory of stored bytes', () => {
  const bytes = (n: number, fill = 1) => Buffer.alloc(n, fill);

  test('keeps what fits and lets the least recently used go first', async () => {
    const memory = new ByteMemory(100);
    await memory.remember('a', async () => bytes(40));
    await memory.remember('b', async () => bytes(40));
    await memory.remember('a', async () => bytes(40, 9)); // a hit: 'a' becomes the most recent
    await memory.remember('c', async () => bytes(40)); // 120 > 100: 'b' goes
    expect(memory.size).toBe(80);
    let looked = 0;
    await memory.remember('a', async () => (looked++, bytes(40)));
    expect(looked).toBe(0);
    await memory.remember('b', async () => (looked++, bytes(40)));
    expect(looked).toBe(1);
  });

  test('concurrent misses share one lookup; nothing larger than the whole memory and no null is kept', async () => {
    const memory = new ByteMemory(100);
    let looked = 0;
    const slow = () => new Promise<Buffer>((r) => setTimeout(() => (looked++, r(bytes(10))), 5));
    const [x, y] = await Promise.all([memory.remember('k', slow), memory.remember('k', slow)]);
    expect(looked).toBe(1);
    expect(x).toBe(y);
    await memory.remember('huge', async () => bytes(101));
    await memory.remember('gone', async () => null);
    expect(memory.size).toBe(10);
  });

  test('a failed lookup is not kept and the next ask tries again', async () => {
    const memory = new ByteMemory(100);
    await expect(memory.remember('k', async () => Promise.reject(new Error('storage away')))).rejects.toThrow('storage away');
    expect(await memory.remember('k', async () => bytes(3))).toEqual(bytes(3));
  });
});
