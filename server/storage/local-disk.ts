import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { dirname, resolve, sep } from 'node:path';
import type { BlobStorage } from './index';

/** Keys are made by the server ("drafts/12/5f3c….jpg"): letters, digits, dots, dashes and slashes only. */
const SAFE_KEY = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/i;

/** Files under `dir`, one per key; the directory is created on first write. */
export function localDiskStorage(dir: string): BlobStorage {
  const root = resolve(dir);
  const pathOf = (key: string) => {
    const path = resolve(root, key);
    // NOTE: the pattern already rules out "..", the prefix check keeps it so if the pattern ever loosens.
    if (!SAFE_KEY.test(key) || !path.startsWith(root + sep)) throw new Error(`Not a storage key: ${key}`);
    return path;
  };
  return {
    async put(key, bytes) {
      const path = pathOf(key);
      await mkdir(dirname(path), { recursive: true });
      await writeFile(path, bytes, { mode: 0o600 });
    },
    async get(key) {
      try {
        return await readFile(pathOf(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async delete(key) {
      await rm(pathOf(key), { force: true });
    },
  };
}
