import sharp from 'sharp';

/** A small plain JPEG for an upload: 64 × 48 px of one grey (a test may pick its own, to tell photos apart). */
export const jpeg = (background = '#777') =>
  sharp({ create: { width: 64, height: 48, channels: 3, background } })
    .jpeg()
    .toBuffer();
