// Types for s3-fake.mjs, so the TypeScript tests and benchmarks can start the local object store.
export interface S3Fake {
  port: number;
  env: Record<string, string>;
  stop(): Promise<void>;
}
export function startS3Fake(options: { port: number; dir: string; bucket: string }): Promise<S3Fake>;
