import type { Readable } from 'node:stream';

/**
 * Where photo files live. Keys are made by the server only (`<photo uuid>/<variant>`), never from
 * anything the user sent; drivers still refuse a key that does not have that shape.
 * Drivers: LocalPhotoStorage (a folder, the default) and S3PhotoStorage (an S3-compatible bucket,
 * PutObject / GetObject / DeleteObject); createPhotoStorage in ./index builds the configured one.
 */
export interface PhotoStorage {
  /** Stores the bytes under the key, replacing what was there. */
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** The stored bytes as a stream; rejects with StorageNotFoundError when the key holds nothing. */
  get(key: string): Promise<Readable>;
  /** Removes the key; a key that holds nothing is not an error. */
  delete(key: string): Promise<void>;
}

export class StorageNotFoundError extends Error {
  override name = 'StorageNotFoundError';
}

/** The only key shape the server writes: a lower-case uuid folder and a variant file name. */
const KEY_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\/(original|display\.webp|thumb\.webp)$/;

/** Throws unless the key has the shape the server makes (defence in depth against path tricks). */
export function assertStorageKey(key: string): void {
  if (!KEY_PATTERN.test(key)) throw new RangeError(`Not a photo storage key: ${JSON.stringify(key)}`);
}

/** The three keys of a photo, built from its server-made uuid. */
export function photoStorageKeys(photoId: string): { original: string; display: string; thumb: string } {
  const keys = { original: `${photoId}/original`, display: `${photoId}/display.webp`, thumb: `${photoId}/thumb.webp` };
  Object.values(keys).forEach(assertStorageKey);
  return keys;
}
