import type { RequestHandler } from 'express';
import multer, { MulterError } from 'multer';
import { badRequest, HttpError } from '../http-error';
import type { PhotoStorage } from '../storage/photo-storage';
import { processPhoto } from './image-processing';

/** Photos one request may carry (a finding's, or work at the bench). */
export const MAX_PHOTOS = 6;

/** A photo or notice file's largest size. */
const FILE_MAX_MB = 10;

/** Multipart photos in memory: checked and re-encoded before anything is stored. */
const photoUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: FILE_MAX_MB * 1024 * 1024, files: MAX_PHOTOS, fields: 16, fieldSize: 64 * 1024 },
});

/**
 * Runs a multer middleware. Its own limits (MulterError) go on as `onLimit` words them; any other error
 * is busboy on a body it cannot read (no boundary, cut short, a malformed part header): the sender's
 * fault, a 400 naming `field`, not the 500 a plain Error would become.
 */
export function readUpload(
  read: RequestHandler,
  field: string,
  onLimit: (err: MulterError) => unknown,
): RequestHandler {
  return (req, res, next) =>
    read(req, res, (err?: unknown) => {
      if (!err) return next();
      if (err instanceof MulterError) return next(onLimit(err));
      next(badRequest('the upload could not be read: send it again', { [field]: 'unreadable upload' }));
    });
}

/**
 * Up to `max` photos (or a notice's files: `noun` 'file') of a multipart request, under `field`. A
 * limit is refused in the words of this route's field and count: a notice takes four files, a finding six photos.
 */
export function photosIn(field: string, max: number, noun: 'photo' | 'file' = 'photo'): RequestHandler {
  return readUpload(photoUpload.array(field, max), field, (err) => {
    if (err.code === 'LIMIT_FILE_SIZE')
      return new HttpError(413, 'too_large', `a ${noun} is larger than ${FILE_MAX_MB} MB`);
    if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE')
      return badRequest(`attach at most ${max} ${noun}s, as the "${field}" field`, {
        [field]: `at most ${max} ${noun}s`,
      });
    return badRequest(`the upload is over a limit: ${err.message}`, { [field]: err.message });
  });
}

export type UploadedPhoto = { buffer: Buffer; originalname: string };
export type StoredPhoto = { fileKey: string; thumbKey: string; width: number; height: number };

/** The files multer kept for a request (none when it sent no photos). */
export const uploadedFiles = (req: { files?: unknown }) => (req.files as Express.Multer.File[] | undefined) ?? [];

/** Multipart fields are strings: lists and objects come as JSON (holeIds also as a comma list from a plain form). */
export function parseJsonField(raw: unknown, field: string, example: string): unknown {
  if (typeof raw !== 'string') return raw;
  const s = raw.trim();
  if (s.startsWith('[') || s.startsWith('{')) {
    try {
      return JSON.parse(s);
    } catch {
      throw badRequest(`${field} is not valid JSON`, { [field]: `send JSON such as ${example}` });
    }
  }
  return field === 'holeIds'
    ? s
        .split(',')
        .map((h) => h.trim())
        .filter(Boolean)
    : raw;
}

/** Photos are checked and re-encoded before anything is written; on any failure their files are removed again. */
export async function withStoredPhotos<T>(
  storage: PhotoStorage,
  files: UploadedPhoto[],
  work: (keys: StoredPhoto[]) => Promise<T>,
): Promise<T> {
  const processed = [];
  for (const f of files) processed.push(await processPhoto(f.buffer, f.originalname));
  const written: string[] = [];
  try {
    const keys: StoredPhoto[] = [];
    for (const p of processed) {
      const fileKey = await storage.put(p.full, 'jpg');
      written.push(fileKey);
      const thumbKey = await storage.put(p.thumb, 'jpg');
      written.push(thumbKey);
      keys.push({ fileKey, thumbKey, width: p.width, height: p.height });
    }
    return await work(keys);
  } catch (err) {
    await Promise.all(written.map((k) => storage.remove(k)));
    throw err;
  }
}

/** The header every PDF starts with ("%PDF-", ISO 32000-1 §7.5.2, from memory), whatever its name says. */
export const startsAsPdf = (bytes: Buffer) => bytes.subarray(0, 5).toString('latin1') === '%PDF-';
