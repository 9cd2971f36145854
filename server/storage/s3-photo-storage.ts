import { randomUUID } from 'node:crypto';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { KEY, type PhotoStorage, type StoredFile } from './photo-storage';

export type S3PhotoStorageOptions = {
  bucket: string;
  region: string;
  endpoint: string | null;
  forcePathStyle: boolean;
  /** '' or a folder-like prefix ending in '/'; stored keys (what rows keep) never include it. */
  prefix: string;
  credentials: { accessKeyId: string; secretAccessKey: string } | null;
};

const CONTENT_TYPES: Record<string, string> = { jpg: 'image/jpeg', webp: 'image/webp' };

/**
 * Photos in an S3-compatible bucket, shared by every server process: a photo uploaded through one is
 * read through any other. The same keys as the local folder, so rows never know where the bytes are.
 */
export function s3PhotoStorage(
  opts: S3PhotoStorageOptions,
): PhotoStorage & { check: () => Promise<void>; close: () => void } {
  const client = new S3Client({
    region: opts.region,
    endpoint: opts.endpoint ?? undefined,
    forcePathStyle: opts.forcePathStyle,
    credentials: opts.credentials ?? undefined,
    // The SDK's default checksums (CRC32 trailers since early 2025) are refused by many S3-compatible
    // services; only send them where an operation requires them.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
    // A store that does not answer fails the request instead of holding it (and a pool slot) forever.
    requestHandler: { connectionTimeout: 5000, requestTimeout: 30000 },
  });
  const objectOf = (key: string) => {
    // Keys are ours; refusing anything else keeps a crafted key from naming another object in the bucket.
    if (!KEY.test(key)) throw new Error(`not a storage key: ${key}`);
    return `${opts.prefix}${key}`;
  };
  return {
    async put(bytes, ext) {
      const key = `${randomUUID()}.${ext}`;
      await client.send(
        new PutObjectCommand({
          Bucket: opts.bucket,
          Key: objectOf(key),
          Body: bytes,
          ContentType: CONTENT_TYPES[ext] ?? 'application/octet-stream',
        }),
      );
      return key;
    },
    async get(key) {
      try {
        const res = await client.send(new GetObjectCommand({ Bucket: opts.bucket, Key: objectOf(key) }));
        if (!res.Body) throw new Error(`photo ${key} came back empty from bucket ${opts.bucket}`);
        return Buffer.from(await res.Body.transformToByteArray());
      } catch (err) {
        if (err instanceof NoSuchKey)
          throw Object.assign(new Error(`photo ${key} is not in bucket ${opts.bucket}`), { code: 'ENOENT' });
        throw err;
      }
    },
    async remove(key) {
      // Removing an object that is not there succeeds, as rm({ force: true }) does for the folder.
      await client.send(new DeleteObjectCommand({ Bucket: opts.bucket, Key: objectOf(key) }));
    },
    async *list(pageSize = 500) {
      let token: string | undefined;
      const seen = new Set<string>();
      do {
        const res = await client.send(
          new ListObjectsV2Command({
            Bucket: opts.bucket,
            Prefix: opts.prefix || undefined,
            MaxKeys: Math.min(pageSize, 1000),
            ContinuationToken: token,
          }),
        );
        const page: StoredFile[] = [];
        for (const o of res.Contents ?? []) {
          const key = o.Key?.slice(opts.prefix.length);
          // Only our keys directly under the prefix: anything else in the bucket is left alone.
          if (key && KEY.test(key) && o.LastModified) page.push({ key, modifiedAt: o.LastModified });
        }
        if (page.length) yield page;
        token = res.IsTruncated ? res.NextContinuationToken : undefined;
        // A store that hands back a token twice would list for ever: stop there.
        if (token && seen.has(token)) break;
        if (token) seen.add(token);
      } while (token);
    },
    /** Start-up check: the bucket exists and these credentials reach it, so a wrong setting shows at once, not at the first upload. */
    async check() {
      try {
        await client.send(new HeadBucketCommand({ Bucket: opts.bucket }));
      } catch (err) {
        const status = err instanceof S3ServiceException ? err.$metadata.httpStatusCode : undefined;
        const where = opts.endpoint ? ` at ${opts.endpoint}` : '';
        const why =
          status === 404
            ? 'does not exist'
            : status === 403
              ? 'refuses these credentials'
              : `cannot be reached (${(err as Error).message || (err as Error).name})`;
        throw new Error(`photo store: bucket ${opts.bucket}${where} ${why}`);
      }
    },
    close: () => client.destroy(),
  };
}
