// Files on local disk under FILES_DIR (default .data/files), outside public/. Each file's media type is kept
// beside it in `<file>.type`; a file stored before that existed is typed by its extension.
import { randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, open, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { dirname, join, resolve } from 'node:path';
import { FORMAT_TYPES } from '@/lib/uploads/rules';
import { checkedBrandId, checkedKey, checkedRange, rangeSpan, type ByteRange, type FileStorage, type StoredInfo, type StoredObject, type StoredStream } from './storage';

const notFound = (err: unknown) => (err as NodeJS.ErrnoException).code === 'ENOENT';

/** Media types by extension, for files stored before their type was kept beside them. */
const TYPE_OF_EXTENSION: Record<string, string> = {
  ...Object.fromEntries(Object.values(FORMAT_TYPES).flatMap((f) => f.extensions.map((e) => [e, f.mime]))),
  html: 'text/html; charset=utf-8',
  css: 'text/css; charset=utf-8',
  json: 'application/json',
};

export class LocalDiskStorage implements FileStorage {
  private readonly root: string;
  readonly description: string;

  constructor(root: string) {
    this.root = resolve(root);
    this.description = `local disk at ${this.root}`;
  }

  private path(key: string): string {
    return join(this.root, checkedKey(key));
  }

  /** Write to a file of our own beside the target, then rename: a reader never sees half a file. */
  private async replace(path: string, write: (partial: string) => Promise<void>): Promise<void> {
    await mkdir(dirname(path), { recursive: true });
    const partial = `${path}.${randomUUID()}.partial`;
    try {
      await write(partial);
      await rename(partial, path);
    } catch (err) {
      await rm(partial, { force: true });
      throw err;
    }
  }

  private async keepType(path: string, contentType: string): Promise<void> {
    await this.replace(`${path}.type`, (partial) => writeFile(partial, contentType));
  }

  private async typeOf(path: string): Promise<string> {
    try {
      return (await readFile(`${path}.type`, 'utf8')) || 'application/octet-stream';
    } catch (err) {
      if (!notFound(err)) throw err;
      return TYPE_OF_EXTENSION[path.match(/\.([a-z0-9]+)$/)?.[1] ?? ''] ?? 'application/octet-stream';
    }
  }

  async put(key: string, bytes: Uint8Array, contentType: string): Promise<StoredObject> {
    const path = this.path(key);
    await this.keepType(path, contentType);
    await this.replace(path, (partial) => writeFile(partial, bytes));
    return { key, size: bytes.byteLength };
  }

  async putStream(key: string, stream: Readable, contentType: string): Promise<StoredObject> {
    const path = this.path(key);
    await this.keepType(path, contentType);
    let size = 0;
    const count = new Transform({
      transform(chunk: Buffer, _encoding, done) {
        size += chunk.byteLength;
        done(null, chunk);
      },
    });
    await this.replace(path, (partial) => pipeline(stream, count, createWriteStream(partial)));
    return { key, size };
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await readFile(this.path(key));
    } catch (err) {
      if (notFound(err)) return null;
      throw err;
    }
  }

  async getStream(key: string, range?: ByteRange): Promise<StoredStream | null> {
    const path = this.path(key);
    checkedRange(key, range);
    // Open first, so the size and the bytes come from the same file even if the key is rewritten meanwhile.
    const handle = await open(path, 'r').catch((err: unknown) => {
      if (notFound(err)) return null;
      throw err;
    });
    if (!handle) return null;
    try {
      const { size } = await handle.stat();
      const { start, end } = rangeSpan(key, size, range);
      const contentType = await this.typeOf(path);
      // The stream owns the handle from here and closes it at its end or when destroyed.
      const stream = handle.createReadStream(range ? { start, end } : {});
      return { stream, size, contentType, start, end };
    } catch (err) {
      await handle.close();
      throw err;
    }
  }

  async stat(key: string): Promise<StoredInfo | null> {
    const path = this.path(key);
    try {
      const { size } = await stat(path);
      return { size, contentType: await this.typeOf(path) };
    } catch (err) {
      if (notFound(err)) return null;
      throw err;
    }
  }

  async exists(key: string): Promise<boolean> {
    return (await this.stat(key)) !== null;
  }

  async delete(key: string): Promise<void> {
    const path = this.path(key);
    await rm(path, { force: true });
    await rm(`${path}.type`, { force: true });
  }

  async deleteBrandFiles(brandId: string): Promise<void> {
    await rm(join(this.root, checkedBrandId(brandId)), { recursive: true, force: true });
  }
}
