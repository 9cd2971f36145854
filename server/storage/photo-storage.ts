import { randomUUID } from 'node:crypto';
import { mkdir, opendir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';

/** A stored file as the sweep sees it. */
export type StoredFile = { key: string; modifiedAt: Date };

/** Where photo bytes live: a local folder by default, or an S3-compatible bucket (s3-photo-storage.ts). */
export type PhotoStorage = {
  put: (bytes: Buffer, ext: string) => Promise<string>;
  get: (key: string) => Promise<Buffer>;
  remove: (key: string) => Promise<void>;
  /** Every stored file, in pages of at most `pageSize` (the sweep never holds the whole folder at once). */
  list: (pageSize?: number) => AsyncIterable<StoredFile[]>;
};

/** Every key we make: a random UUID and the file type. Anything else is not ours to read or remove. */
export const KEY = /^[0-9a-f-]{36}\.(jpg|webp|pdf)$/;

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
    async *list(pageSize = 500) {
      let folder;
      try {
        folder = await opendir(dir);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return; // nothing stored yet
        throw err;
      }
      let page: StoredFile[] = [];
      // Only names that are our keys: .gitkeep and anything a person put there are left alone.
      for await (const entry of folder) {
        if (!entry.isFile() || !KEY.test(entry.name)) continue;
        const info = await stat(path.join(dir, entry.name)).catch(() => null); // removed meanwhile
        if (!info) continue;
        page.push({ key: entry.name, modifiedAt: info.mtime });
        if (page.length >= pageSize) {
          yield page;
          page = [];
        }
      }
      if (page.length) yield page;
    },
  };
}
