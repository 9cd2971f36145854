import { Platform } from 'react-native';
import type { FindingActionInput, FindingInput, WorkPhotosInput } from '@/db/contracts';
import { keptBlob } from './kept-photos';

/**
 * A photo picked for a finding, as kept in the draft: a URI that can be read back when sending, and on
 * the web the id its bytes are kept under on the device (lib/kept-photos.web.ts) once the draft is saved.
 */
export type DraftPhoto = { uri: string; name: string; type: string; width?: number; height?: number; keptId?: string };

/** The ids under which a draft's photos are kept on the device (web only; none elsewhere). */
export const keptIdsOf = (photos: DraftPhoto[]): string[] => photos.flatMap((p) => (p.keptId ? [p.keptId] : []));

export class PhotoReadError extends Error {
  constructor(readonly photo: DraftPhoto) {
    super(
      `The photo "${photo.name}" can no longer be read (the page was reloaded or the file moved). Remove it and add it again.`,
    );
  }
}

/**
 * Picked files under one multipart field (`photos`, or a notice's `files`). On the web the picker gives
 * blob: (or data:) URIs, which must be fetched into a Blob; React Native's FormData takes { uri, name, type } directly.
 */
export async function appendPhotos(form: FormData, photos: DraftPhoto[], field = 'photos'): Promise<void> {
  for (const p of photos) {
    if (Platform.OS === 'web') {
      let blob: Blob | null;
      try {
        const res = await fetch(p.uri);
        blob = await res.blob();
      } catch {
        // The page that made the URI has gone: the bytes kept with the draft, if any.
        blob = p.keptId ? await keptBlob(p.keptId) : null;
      }
      if (!blob) throw new PhotoReadError(p);
      form.append(field, blob, p.name);
    } else {
      form.append(field, { uri: p.uri, name: p.name, type: p.type } as unknown as Blob);
    }
  }
}

/**
 * The multipart body of POST /api/findings. Multipart fields are strings, so the hole list and the
 * measurements go as JSON (the server parses both).
 */
export async function findingFormData(input: FindingInput, photos: DraftPhoto[]): Promise<FormData> {
  const form = new FormData();
  form.append('travelerId', input.travelerId);
  form.append('holeIds', JSON.stringify(input.holeIds));
  form.append('kind', input.kind);
  form.append('note', input.note);
  form.append('measurements', JSON.stringify(input.measurements ?? {}));
  await appendPhotos(form, photos);
  return form;
}

/** The multipart body of a finding action that carries photos (the work done): its text fields, then the photos. */
export async function findingActionFormData(input: FindingActionInput, photos: DraftPhoto[]): Promise<FormData> {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) {
    if (typeof value === 'string') form.append(key, value);
  }
  await appendPhotos(form, photos);
  return form;
}

/** The multipart body of POST /api/travelers/:id/photos: what the photos show, then the photos. */
export async function workPhotosFormData(input: WorkPhotosInput, photos: DraftPhoto[]): Promise<FormData> {
  const form = new FormData();
  if (input.stepId) form.append('stepId', input.stepId);
  if (input.holeIds?.length) form.append('holeIds', JSON.stringify(input.holeIds));
  if (input.note) form.append('note', input.note);
  await appendPhotos(form, photos);
  return form;
}
