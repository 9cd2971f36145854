import type { DraftPhoto } from './photo-form-data';

/**
 * Native builds: a picked photo is a file in the app's cache that outlives a restart, so a draft keeps its
 * URI as it is. These are the calls of lib/kept-photos.web.ts, which keeps the web's page-lived photos.
 */
export async function keepPhotos(photos: DraftPhoto[]): Promise<DraftPhoto[]> {
  return photos;
}

export async function revivePhotos(photos: DraftPhoto[]): Promise<DraftPhoto[]> {
  return photos;
}

/** A native photo is a file: it outlives the page (the app) as it is. */
export const outlivesPage = (_p: DraftPhoto): boolean => true;

export async function keptBlob(_keptId: string): Promise<Blob | null> {
  return null;
}

export async function forgetPhotos(_keptIds: string[]): Promise<void> {}

export async function sweepKeptPhotos(): Promise<number> {
  return 0;
}
