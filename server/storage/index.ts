/**
 * Where uploaded files live. The app only needs put/get/delete by key, so the local-disk store below
 * can be swapped for an S3-compatible object store (PutObject/GetObject/DeleteObject on one bucket)
 * without touching the services.
 */
export interface BlobStorage {
  put(key: string, bytes: Buffer): Promise<void>;
  /** The bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}

export { localDiskStorage } from './local-disk';
