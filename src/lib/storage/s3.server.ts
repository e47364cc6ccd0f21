// Files in an S3-compatible object store, through the AWS SDK for JavaScript v3. Keys are the same keys as on
// local disk; big files go up in parts (lib-storage's Upload) and come down as the response's own stream.
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { Transform, type Readable } from 'node:stream';
import { checkedBrandId, checkedKey, checkedRange, RangeNotSatisfiable, rangeSpan, type ByteRange, type FileStorage, type StoredInfo, type StoredObject, type StoredStream } from './storage';

export interface S3Settings {
  /** The store's address, e.g. http://127.0.0.1:9000; left out, the provider's own for the region. */
  endpoint?: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Bucket in the path (http://host/bucket/key) rather than in the host name: what most self-hosted stores want. */
  forcePathStyle: boolean;
}

/** Parts of a streamed upload: S3's smallest part is 5 MiB; two in flight keep memory at a few parts whatever the file. */
const PART_BYTES = 5 * 1024 * 1024;
const PARTS_IN_FLIGHT = 2;
/** How long to wait for a connection to the store. */
const CONNECT_MS = 5_000;

const missing = (err: unknown) =>
  err instanceof S3ServiceException && (err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata?.httpStatusCode === 404);

export class S3Storage implements FileStorage {
  private readonly client: S3Client;
  private readonly bucket: string;
  readonly description: string;

  constructor(settings: S3Settings) {
    this.bucket = settings.bucket;
    this.description = `s3 at ${settings.endpoint ?? `the provider's endpoint for ${settings.region}`}, bucket ${settings.bucket}`;
    this.client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      forcePathStyle: settings.forcePathStyle,
      credentials: settings.accessKeyId && settings.secretAccessKey ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } : undefined,
      // Checksums only where S3 requires them: S3-compatible stores differ in the newer optional ones.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      // A store that cannot be reached fails the request rather than holding it. No idle limit after that: a slow
      // visitor's download pauses the store's stream (backpressure), and that pause must not cut the file off.
      requestHandler: { connectionTimeout: CONNECT_MS },
    });
  }

  async put(key: string, bytes: Uint8Array, contentType: string): Promise<StoredObject> {
    await this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: checkedKey(key), Body: bytes, ContentType: contentType }));
    return { key, size: bytes.byteLength };
  }

  async putStream(key: string, stream: Readable, contentType: string): Promise<StoredObject> {
    let size = 0;
    const count = new Transform({
      transform(chunk: Buffer, _encoding, done) {
        size += chunk.byteLength;
        done(null, chunk);
      },
    });
    stream.once('error', (err) => count.destroy(err));
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.bucket, Key: checkedKey(key), Body: stream.pipe(count), ContentType: contentType },
      partSize: PART_BYTES,
      queueSize: PARTS_IN_FLIGHT,
      // A failed upload leaves no parts behind to be billed.
      leavePartsOnError: false,
    });
    await upload.done();
    return { key, size };
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: checkedKey(key) }));
      return Buffer.from(await out.Body!.transformToByteArray());
    } catch (err) {
      if (missing(err)) return null;
      throw err;
    }
  }

  async getStream(key: string, range?: ByteRange): Promise<StoredStream | null> {
    checkedKey(key);
    if (checkedRange(key, range)) {
      // The store answers a range past the end with an error of its own; ours says the same for both drivers.
      const info = await this.stat(key);
      if (!info) return null;
      rangeSpan(key, info.size, range);
    }
    try {
      const out = await this.client.send(
        new GetObjectCommand({ Bucket: this.bucket, Key: key, Range: range ? `bytes=${range.start}-${range.end ?? ''}` : undefined }),
      );
      const stream = out.Body as Readable;
      // Content-Range ("bytes 0-9/1234") names the whole size when a range was asked.
      const total = out.ContentRange ? Number(out.ContentRange.split('/')[1]) : Number(out.ContentLength ?? 0);
      const { start, end } = rangeSpan(key, total, range && { start: range.start, end: range.end });
      return { stream, size: total, contentType: out.ContentType ?? 'application/octet-stream', start, end };
    } catch (err) {
      if (missing(err)) return null;
      if (err instanceof S3ServiceException && err.$metadata?.httpStatusCode === 416) throw new RangeNotSatisfiable(key, 0);
      throw err;
    }
  }

  async stat(key: string): Promise<StoredInfo | null> {
    try {
      const out = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: checkedKey(key) }));
      return { size: Number(out.ContentLength ?? 0), contentType: out.ContentType ?? 'application/octet-stream' };
    } catch (err) {
      if (missing(err)) return null;
      throw err;
    }
  }

  async exists(key: string): Promise<boolean> {
    return (await this.stat(key)) !== null;
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: checkedKey(key) }));
  }

  async deleteBrandFiles(brandId: string): Promise<void> {
    const prefix = `${checkedBrandId(brandId)}/`;
    // List a page (at most 1000 keys, the most one DeleteObjects takes) and delete it, until none are left.
    let token: string | undefined;
    do {
      const page = await this.client.send(new ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix, ContinuationToken: token }));
      const keys = (page.Contents ?? []).map((o) => ({ Key: o.Key! }));
      if (keys.length > 0) {
        const out = await this.client.send(new DeleteObjectsCommand({ Bucket: this.bucket, Delete: { Objects: keys, Quiet: true } }));
        if (out.Errors?.length) throw new Error(`the store kept ${out.Errors.length} of ${brandId}'s files: ${out.Errors[0].Code} ${out.Errors[0].Message}`);
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }

  /** Make the bucket unless it is there (for the local fake; a real store's bucket is made by whoever runs it). */
  async ensureBucket(): Promise<void> {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
    } catch {
      await this.client.send(new CreateBucketCommand({ Bucket: this.bucket }));
    }
  }
}
