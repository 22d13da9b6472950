import {
  CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, PutObjectCommand, S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import type { BlobStorage } from './index';

export interface S3Config {
  /** The store's address, e.g. http://127.0.0.1:4784 for the local fake; empty for AWS itself. */
  endpoint: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/** Keys are made by the server ("drafts/12/5f3c….jpg"): letters, digits, dots, dashes and slashes only. */
const SAFE_KEY = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/i;

function checkedKey(key: string): string {
  if (!SAFE_KEY.test(key)) throw new Error(`Not a storage key: ${key}`);
  return key;
}

const missing = (err: unknown) => err instanceof S3ServiceException && (err.name === 'NoSuchKey' || err.$metadata.httpStatusCode === 404);

/** An object store reached through the S3 API, with readiness and bucket creation beside put/get/delete. */
export interface S3Storage extends BlobStorage {
  /** The keys under a prefix (the first thousand), sorted: for checks and tests. */
  keys(prefix: string): Promise<string[]>;
  /** Creates the bucket when it is not there yet (at start). */
  ensureBucket(): Promise<void>;
  /** Resolves when the bucket answers; rejects otherwise. */
  check(signal?: AbortSignal): Promise<void>;
  close(): void;
}

/**
 * Uploaded files as objects in one bucket of any S3-compatible store (path-style addressing, so a
 * local fake on loopback works as well as a hosted store). Objects stay private: the app serves them
 * after its own access check.
 */
export function s3Storage(config: S3Config): S3Storage {
  const client = new S3Client({
    ...(config.endpoint ? { endpoint: config.endpoint } : {}),
    region: config.region,
    forcePathStyle: true,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    // Checksums only where the API demands them: the local fake knows no trailing checksums.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 2,
  });
  const Bucket = config.bucket;
  return {
    async put(key, bytes) {
      await client.send(new PutObjectCommand({ Bucket, Key: checkedKey(key), Body: bytes }));
    },
    async get(key) {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key: checkedKey(key) }));
        return out.Body ? Buffer.from(await out.Body.transformToByteArray()) : Buffer.alloc(0);
      } catch (err) {
        if (missing(err)) return null;
        throw err;
      }
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: checkedKey(key) }));
    },
    async keys(prefix) {
      const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix }));
      return (page.Contents ?? []).map((o) => o.Key ?? '').sort();
    },
    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket }));
      } catch (err) {
        if (!(err instanceof S3ServiceException) || err.$metadata.httpStatusCode !== 404) throw err;
        await client.send(new CreateBucketCommand({ Bucket }));
      }
    },
    async check(signal) {
      await client.send(new HeadBucketCommand({ Bucket }), { abortSignal: signal });
    },
    close() {
      client.destroy();
    },
  };
}
