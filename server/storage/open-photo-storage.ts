import type { Config } from '../config';
import { localPhotoStorage, type PhotoStorage } from './photo-storage';
import { s3PhotoStorage } from './s3-photo-storage';

/**
 * The photo store that the configuration names, checked before the process takes any work: the local
 * folder (one machine) or an S3-compatible bucket (any number of server and worker processes).
 */
export async function openPhotoStorage(
  config: Pick<Config, 'photoStore' | 'uploadsDir'>,
): Promise<{ storage: PhotoStorage; where: string; close: () => void }> {
  const store = config.photoStore;
  if (store.kind === 'local')
    return {
      storage: localPhotoStorage(config.uploadsDir),
      where: `folder ${config.uploadsDir}`,
      close: () => undefined,
    };
  const s3 = s3PhotoStorage(store);
  try {
    await s3.check();
  } catch (err) {
    s3.close();
    throw err;
  }
  return {
    storage: s3,
    where: `bucket ${store.bucket}${store.endpoint ? ` at ${store.endpoint}` : ''}`,
    close: s3.close,
  };
}
