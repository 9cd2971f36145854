import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/** Where photo bytes live. Local folder by default; an object store would implement the same three calls. */
export type PhotoStorage = {
  put: (bytes: Buffer, ext: string) => Promise<string>;
  get: (key: string) => Promise<Buffer>;
  remove: (key: string) => Promise<void>;
};

const KEY = /^[0-9a-f-]{36}\.(jpg|webp)$/;

export function localPhotoStorage(dir: string): PhotoStorage {
  const fileOf = (key: string) => {
    // Keys are ours; refusing anything else keeps a crafted key from reaching outside the folder.
    if (!KEY.test(key)) throw new Error(`not a storage key: ${key}`);
    return path.join(dir, key);
  };
  return {
    async put(bytes, ext) {
      await mkdir(dir, { recursive: true });
      const key = `${randomUUID()}.${ext}`;
      await writeFile(fileOf(key), bytes, { flag: 'wx' });
      return key;
    },
    get: (key) => readFile(fileOf(key)),
    remove: (key) => rm(fileOf(key), { force: true }),
  };
}
