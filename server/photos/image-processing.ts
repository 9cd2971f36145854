import sharp from 'sharp';
import { HttpError } from '../http-error';

export type ProcessedPhoto = { full: Buffer; thumb: Buffer; width: number; height: number };

const ACCEPTED = new Set(['jpeg', 'png', 'webp', 'heif', 'gif', 'tiff', 'avif']);
const MAX_EDGE = 2400;
const THUMB_EDGE = 320;

/**
 * Checks the bytes really are an image (whatever the name or type claims), then re-encodes:
 * sharp drops EXIF/GPS unless asked to keep it, so a photo's location never leaves the bench.
 */
export async function processPhoto(bytes: Buffer, originalName: string): Promise<ProcessedPhoto> {
  let format: string | undefined;
  try {
    format = (await sharp(bytes).metadata()).format;
  } catch {
    format = undefined;
  }
  if (!format || !ACCEPTED.has(format)) {
    // One sentence, said once: the field carries the same words rather than a second way of saying them.
    const said = `"${originalName}" is not a photo: send a JPEG, PNG, WebP or HEIC image`;
    throw new HttpError(415, 'not_an_image', said, { photos: said });
  }
  // rotate() applies the EXIF orientation before the metadata is dropped.
  const base = sharp(bytes, { limitInputPixels: 80_000_000 }).rotate();
  const { data: full, info } = await base
    .clone()
    .resize(MAX_EDGE, MAX_EDGE, { fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality: 85 })
    .toBuffer({ resolveWithObject: true });
  const thumb = await base.clone().resize(THUMB_EDGE, THUMB_EDGE, { fit: 'cover' }).jpeg({ quality: 75 }).toBuffer();
  return { full, thumb, width: info.width, height: info.height };
}
