/**
 * Where uploaded files live: put/get/delete by key in one bucket of an S3-compatible object store
 * (s3.ts), shared by every app server. The services see only this interface.
 */
export interface BlobStorage {
  put(key: string, bytes: Buffer): Promise<void>;
  /** The bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}
