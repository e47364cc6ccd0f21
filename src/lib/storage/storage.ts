// One storage interface for every stored file, with two drivers: local disk (local-disk.server.ts, the default)
// and an S3-compatible object store (s3.server.ts). Files are named by keys; the database holds keys, never paths.
import type { Readable } from 'node:stream';

export interface StoredObject {
  key: string;
  size: number;
}

/** What is known about a stored object without reading it. */
export interface StoredInfo {
  size: number;
  /** The media type it was stored with. */
  contentType: string;
}

/** A part of an object: the bytes from `start` to `end`, both included (as in an HTTP Range header). */
export interface ByteRange {
  start: number;
  /** The last byte wanted; past the object's end (or left out), the object's last byte. */
  end?: number;
}

/** A stored object's bytes as a stream. `size` is the whole object's; `start`/`end` are what the stream holds. */
export interface StoredStream extends StoredInfo {
  stream: Readable;
  start: number;
  end: number;
}

export interface FileStorage {
  /** Where the files are, for people: "local disk at …", "s3 at …, bucket …". */
  readonly description: string;
  /** Store bytes under a key; overwrites. For small files (a logo, a page); stream big ones with putStream. */
  put(key: string, bytes: Uint8Array, contentType: string): Promise<StoredObject>;
  /** Store a stream under a key without holding it whole; overwrites. A reader sees the old or the new bytes, never half. */
  putStream(key: string, stream: Readable, contentType: string): Promise<StoredObject>;
  /** The bytes under a key, or null when there are none. For small files; serve big ones with getStream. */
  get(key: string): Promise<Buffer | null>;
  /**
   * A stream of the bytes under a key (or of one range of them), or null when there are none: nothing is buffered
   * whole. A range starting past the end is refused with a RangeNotSatisfiable error. Read or destroy the stream.
   */
  getStream(key: string, range?: ByteRange): Promise<StoredStream | null>;
  /** Size and media type of the object under a key, or null when there is none. */
  stat(key: string): Promise<StoredInfo | null>;
  /** Whether an object is stored under a key. */
  exists(key: string): Promise<boolean>;
  /** Remove a key; a missing key is not an error. */
  delete(key: string): Promise<void>;
  /** Remove every file kept for a brand (all its keys start with its id); none left is not an error. */
  deleteBrandFiles(brandId: string): Promise<void>;
}

/** A generated, unguessable key inside a brand's folder, keeping only a safe extension. */
export function newKey(brandId: string, kind: string, extension: string): string {
  const ext = extension.replace(/[^a-z0-9]/gi, '').toLowerCase().slice(0, 8);
  return `${brandId}/${kind}/${crypto.randomUUID()}${ext ? `.${ext}` : ''}`;
}

/** A brand's folder name: its UUID, nothing that could climb out of the store. */
export const SAFE_BRAND_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

export const SAFE_KEY = /^[0-9a-f-]{36}\/(?:[a-z-]+\/[0-9a-f-]{36}|build\/[0-9a-f-]{36}\/[0-9a-f]{64})(\.[a-z0-9]{1,8})?$/;

/** The key itself when it has the shape our keys have; anything else could climb out of the store or alias another. */
export function checkedKey(key: string): string {
  if (!SAFE_KEY.test(key)) throw new Error(`refusing an unexpected storage key: ${key}`);
  return key;
}

/** A brand's id when it is one; keys are deleted by this prefix, so it must name exactly one brand's folder. */
export function checkedBrandId(brandId: string): string {
  if (!SAFE_BRAND_ID.test(brandId)) throw new Error(`refusing an unexpected brand id: ${brandId}`);
  return brandId;
}

/** A range that starts at or past the end of the object. */
export class RangeNotSatisfiable extends Error {
  constructor(
    readonly key: string,
    readonly size: number,
  ) {
    super(`the range asked of ${key} starts past its end (${size} bytes)`);
    this.name = 'RangeNotSatisfiable';
  }
}

/** The range itself when it is whole numbers in order; checked before the object is looked up. */
export function checkedRange(key: string, range: ByteRange | undefined): range is ByteRange {
  if (!range) return false;
  if (!Number.isSafeInteger(range.start) || range.start < 0 || (range.end !== undefined && (!Number.isSafeInteger(range.end) || range.end < range.start))) {
    throw new Error(`a malformed byte range for ${key}`);
  }
  return true;
}

/** The inclusive byte span a range covers in an object of `size` bytes (the whole object without a range). */
export function rangeSpan(key: string, size: number, range?: ByteRange): { start: number; end: number } {
  if (!checkedRange(key, range)) return { start: 0, end: size - 1 };
  if (range.start >= size) throw new RangeNotSatisfiable(key, size);
  return { start: range.start, end: Math.min(range.end ?? size - 1, size - 1) };
}
