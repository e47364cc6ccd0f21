// One storage interface for every stored file: local disk by default, an S3-compatible store later.

export interface StoredObject {
  key: string;
  size: number;
}

export interface FileStorage {
  /** Store bytes under a key; overwrites. */
  put(key: string, bytes: Uint8Array, contentType: string): Promise<StoredObject>;
  /** The bytes under a key, or null when there are none. For small files; serve big ones with getStream. */
  get(key: string): Promise<Buffer | null>;
  /** A stream of the bytes under a key and their size, or null when there are none: nothing is buffered whole. */
  getStream(key: string): Promise<{ stream: import('node:stream').Readable; size: number } | null>;
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
