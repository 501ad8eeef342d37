import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { assertStorageKey, StorageNotFoundError, type PhotoStorage } from './photo-storage';

/** Where and how to reach an S3-compatible bucket. */
export interface S3PhotoStorageOptions {
  /**
   * Base URL of an S3-compatible service (`https://objects.example.net`, `http://127.0.0.1:9000`);
   * omitted for Amazon S3 itself, whose endpoint follows from the region.
   */
  endpoint?: string;
  /** Signing region; `us-east-1` for most S3-compatible services that have no regions. */
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /**
   * Address the bucket in the path (`<endpoint>/<bucket>/<key>`) instead of the host name
   * (`<bucket>.<endpoint host>`). Most self-hosted services need true; Amazon S3 takes false.
   */
  forcePathStyle: boolean;
  /**
   * Folder inside the bucket for the photo keys (`gnomon/photos/`), so the bucket can be shared.
   * A trailing `/` is added when missing. Default: none (keys at the bucket's top level).
   */
  prefix?: string;
  /** Longest wait for the TCP/TLS connection, ms (default 5 000). */
  connectionTimeoutMs?: number;
  /** Longest silence on an open connection, sending or receiving, ms (default 30 000). */
  idleTimeoutMs?: number;
  /** Longest wait from sending a request to its response headers, upload included, ms (default 300 000). */
  requestTimeoutMs?: number;
  /** Tries per call, the first included; the SDK retries throttling, 5xx and network errors only (default 3). */
  maxAttempts?: number;
}

/** Defaults for the timeouts and tries: long enough for a 30 MB original on a slow link, short enough that a dead service fails the upload instead of hanging it. */
export const S3_STORAGE_DEFAULTS: Readonly<Required<Pick<S3PhotoStorageOptions, 'connectionTimeoutMs' | 'idleTimeoutMs' | 'requestTimeoutMs' | 'maxAttempts'>>> = {
  connectionTimeoutMs: 5_000,
  idleTimeoutMs: 30_000,
  requestTimeoutMs: 300_000,
  maxAttempts: 3,
};

/** A call to the object store that failed for a reason other than a missing key. */
export class S3StorageError extends Error {
  override name = 'S3StorageError';

  constructor(
    message: string,
    /** The service's error code (`AccessDenied`, `NoSuchBucket` ...) or the network error's name. */
    readonly code: string,
    /** HTTP status of the answer; undefined when no answer came. */
    readonly status: number | undefined,
    options?: ErrorOptions,
  ) {
    super(message, options);
  }
}

/** `photos` -> `photos/`; refuses prefixes that would make odd or escaping object names. */
function normalizePrefix(prefix: string | undefined): string {
  if (!prefix) return '';
  const withSlash = prefix.endsWith('/') ? prefix : `${prefix}/`;
  const segments = withSlash.slice(0, -1).split('/');
  if (withSlash.startsWith('/') || segments.some((s) => s === '' || s === '.' || s === '..') || !/^[A-Za-z0-9._\-/]+$/.test(withSlash)) {
    throw new RangeError(`Not a usable object key prefix: ${JSON.stringify(prefix)} (letters, digits, . _ - and / between folder names)`);
  }
  return withSlash;
}

function positive(name: string, value: number): number {
  if (!Number.isInteger(value) || value < 1) throw new RangeError(`${name} must be a positive whole number, got ${value}`);
  return value;
}

/** True when the service says the object is not there (and not, say, that the bucket is not there). */
function isMissingObject(error: unknown): boolean {
  if (!(error instanceof S3ServiceException)) return false;
  if (error.name === 'NoSuchKey') return true;
  // Some services answer a bare 404 without an error body; a 404 that names another missing thing
  // (NoSuchBucket, for one) is a configuration fault and must not read as a missing photo.
  return error.$metadata.httpStatusCode === 404 && !error.name.startsWith('NoSuch');
}

/**
 * Photo files in an S3-compatible bucket through the AWS SDK v3: one object per key
 * (`<prefix><photo uuid>/<variant>`), written whole with PutObject (the largest upload is tens of
 * MB, well under the 5 GB single-request limit, so no multipart upload). Every key is checked with
 * assertStorageKey before any request goes out. Requests are signed with Signature Version 4 from
 * the given keys; the SDK adds a CRC32 checksum to each upload and checks it on download when the
 * service returns one.
 */
export class S3PhotoStorage implements PhotoStorage {
  private readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(options: S3PhotoStorageOptions) {
    if (!options.bucket) throw new RangeError('An S3 bucket name is required');
    if (!options.accessKeyId || !options.secretAccessKey) throw new RangeError('An S3 access key id and secret access key are required');
    if (!options.region) throw new RangeError('An S3 region is required');
    this.bucket = options.bucket;
    this.prefix = normalizePrefix(options.prefix);
    const d = S3_STORAGE_DEFAULTS;
    this.client = new S3Client({
      ...(options.endpoint ? { endpoint: options.endpoint } : {}),
      region: options.region,
      forcePathStyle: options.forcePathStyle,
      credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
      maxAttempts: positive('maxAttempts', options.maxAttempts ?? d.maxAttempts),
      requestHandler: {
        connectionTimeout: positive('connectionTimeoutMs', options.connectionTimeoutMs ?? d.connectionTimeoutMs),
        socketTimeout: positive('idleTimeoutMs', options.idleTimeoutMs ?? d.idleTimeoutMs),
        requestTimeout: positive('requestTimeoutMs', options.requestTimeoutMs ?? d.requestTimeoutMs),
        // Without this the SDK only logs a warning when requestTimeout passes.
        throwOnRequestTimeout: true,
      },
    });
  }

  private objectKey(key: string): string {
    assertStorageKey(key);
    return this.prefix + key;
  }

  /** Stores the bytes under the key with their content type, replacing any object there. */
  async put(key: string, data: Buffer, contentType: string): Promise<void> {
    const Key = this.objectKey(key);
    try {
      await this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key, Body: data, ContentType: contentType, ContentLength: data.length }));
    } catch (error) {
      throw this.failure('PutObject', Key, error);
    }
  }

  /** The object's bytes as a Node stream; StorageNotFoundError when the key holds nothing. */
  async get(key: string): Promise<Readable> {
    const Key = this.objectKey(key);
    let body: unknown;
    try {
      body = (await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key }))).Body;
    } catch (error) {
      if (isMissingObject(error)) throw new StorageNotFoundError(key);
      throw this.failure('GetObject', Key, error);
    }
    // In Node the SDK hands back the HTTP response itself (or a checksum-checking stream over it).
    if (!(body instanceof Readable)) throw new S3StorageError(`GetObject of ${Key} returned no readable body`, 'NoBody', undefined);
    return body;
  }

  /** Removes the object; S3 answers 204 for a missing key too, and a 404 from a stricter service is also fine. */
  async delete(key: string): Promise<void> {
    const Key = this.objectKey(key);
    try {
      await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key }));
    } catch (error) {
      if (isMissingObject(error)) return;
      throw this.failure('DeleteObject', Key, error);
    }
  }

  /** Closes the client's kept-alive connections (at shutdown, and in tests). */
  close(): void {
    this.client.destroy();
  }

  private failure(operation: string, objectKey: string, error: unknown): S3StorageError {
    if (error instanceof S3ServiceException) {
      const status = error.$metadata.httpStatusCode;
      return new S3StorageError(`${operation} of ${objectKey} in bucket ${this.bucket} failed: ${error.name} (HTTP ${status ?? '?'}): ${error.message}`, error.name, status, { cause: error });
    }
    const name = error instanceof Error ? error.name : 'Error';
    const message = error instanceof Error ? error.message : String(error);
    return new S3StorageError(`${operation} of ${objectKey} in bucket ${this.bucket} failed: ${name}: ${message}`, name, undefined, { cause: error });
  }
}
