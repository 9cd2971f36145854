import * as ImagePicker from 'expo-image-picker';
import { Image, View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { DraftTiles, tileStyles } from '@/components/ui/draft-tiles';
import { Txt } from '@/components/ui/text';
import { ApiError } from '@/lib/api-client';
import type { DraftPhoto } from '@/lib/photo-form-data';

export const maxPhotos = 6;
/** The kinds of photo the server keeps (server/photos/image-processing.ts), in the words the picker uses. */
export const photoKinds = 'JPEG, PNG, WebP or HEIC';

/**
 * The image formats the server keeps, told by their first bytes whatever the name or type claims (as
 * the server does): a text file renamed .jpg, or a PDF, is refused at the bench instead of after upload.
 */
export function isPhotoBytes(b: Uint8Array): boolean {
  const ascii = (from: number, to: number) => String.fromCharCode(...b.subarray(from, to));
  if (b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return true; // JPEG: SOI marker then a marker
  if ([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((x, i) => b[i] === x)) return true; // PNG signature
  if (ascii(0, 6) === 'GIF87a' || ascii(0, 6) === 'GIF89a') return true;
  if (ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return true; // WebP in its RIFF container
  if (ascii(0, 4) === 'II*\0' || ascii(0, 4) === 'MM\0*') return true; // TIFF, either byte order
  // HEIC, HEIF and AVIF: an ISO base media file whose ftyp box names an image brand.
  return (
    ascii(4, 8) === 'ftyp' &&
    ['heic', 'heix', 'hevc', 'hevx', 'heim', 'heis', 'mif1', 'msf1', 'avif', 'avis'].includes(ascii(8, 12))
  );
}

function readHead(file: Blob, n: number): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(new Uint8Array(r.result as ArrayBuffer));
    r.onerror = () => reject(r.error);
    r.readAsArrayBuffer(file.slice(0, n));
  });
}

/** Said once, at the picker: which file is not a photo, and what is. */
export function notPhotosMessage(names: string[]): string {
  if (!names.length) return `That file is not a photo. Choose a ${photoKinds} image.`;
  const quoted = names.map((n) => `"${n}"`);
  return quoted.length === 1
    ? `${quoted[0]} is not a photo. Choose a ${photoKinds} image.`
    : `${quoted.slice(0, -1).join(', ')} and ${quoted[quoted.length - 1]} are not photos. Choose ${photoKinds} images.`;
}

async function isPhoto(a: ImagePicker.ImagePickerAsset): Promise<boolean> {
  if (a.type && a.type !== 'image') return false; // a video, or a live photo's film
  if (a.mimeType && !a.mimeType.startsWith('image/')) return false;
  // On the web the picker hands the file itself: its bytes say what it is. A native picker lists only images.
  if (a.file) return isPhotoBytes(await readHead(a.file, 16));
  return true;
}

function toDraftPhoto(a: ImagePicker.ImagePickerAsset, i: number): DraftPhoto {
  const type = a.mimeType ?? 'image/jpeg';
  const ext = type.split('/')[1]?.replace('jpeg', 'jpg') ?? 'jpg';
  const name = a.fileName ?? `photo-${Date.now()}-${i}.${ext}`;
  // On the web this is a blob: URI that dies with the page: a draft keeps the bytes (lib/kept-photos.web.ts).
  return { uri: a.uri, name, type, width: a.width, height: a.height };
}

/** The photos picked, and what was refused and why (photos that are fine are kept beside a refused file). */
export type Picked = { photos: DraftPhoto[]; error: string | null };

export async function pickPhotos(from: 'library' | 'camera', room: number): Promise<Picked> {
  if (room <= 0) return { photos: [], error: `At most ${maxPhotos} photos in one finding.` };
  try {
    if (from === 'camera') {
      const perm = await ImagePicker.requestCameraPermissionsAsync();
      if (!perm.granted)
        return {
          photos: [],
          error:
            'The camera was not allowed. Choose a photo from the library instead, or allow the camera in the settings.',
        };
    }
    const opts: ImagePicker.ImagePickerOptions = {
      mediaTypes: ['images'],
      quality: 0.85,
      allowsMultipleSelection: from === 'library',
      selectionLimit: room,
      exif: false,
    };
    let res: ImagePicker.ImagePickerResult;
    try {
      res =
        from === 'camera' ? await ImagePicker.launchCameraAsync(opts) : await ImagePicker.launchImageLibraryAsync(opts);
    } catch (e) {
      // The web picker refuses a file that is neither image nor video outright, for the whole choice.
      if (/unsupported file type/i.test((e as Error)?.message ?? ''))
        return { photos: [], error: notPhotosMessage([]) };
      throw e;
    }
    if (res.canceled) return { photos: [], error: null };
    const assets = res.assets.slice(0, room);
    const ok = await Promise.all(assets.map(isPhoto));
    const refused = assets.filter((_, i) => !ok[i]).map((a, i) => a.fileName ?? a.file?.name ?? `file ${i + 1}`);
    const photos = assets.filter((_, i) => ok[i]).map(toDraftPhoto);
    return { photos, error: refused.length ? notPhotosMessage(refused) : null };
  } catch (e) {
    return { photos: [], error: `The photo could not be read: ${(e as Error).message ?? 'unknown problem'}` };
  }
}

/**
 * A server's refusal of the photos (not a photo, too large, too many), said once under the photos: null
 * when the refusal is about something else. Its `fields` repeat the message, so it is not shown twice.
 */
export function photoRefusal(e: unknown): string | null {
  if (!(e instanceof ApiError) || e.isNetwork) return null;
  const keys = Object.keys(e.fields ?? {});
  const aboutPhotos = keys.length
    ? keys.every((k) => k === 'photos' || k.startsWith('photos.'))
    : e.status === 413 || e.status === 415;
  if (!aboutPhotos) return null;
  const m = e.message.trim();
  const sentence = `${m.charAt(0).toUpperCase()}${m.slice(1)}`;
  return /[.!?]$/.test(sentence) ? sentence : `${sentence}.`;
}

/** Where a photo comes from: the device's pictures, or the camera now. */
const photoSources: readonly { source: 'library' | 'camera'; label: string; testID: string }[] = [
  { source: 'library', label: 'Add a photo', testID: 'add-photo' },
  { source: 'camera', label: 'Take a photo', testID: 'take-photo' },
];

/**
 * Photos being added (a new finding's, or the work done's): thumbnails with remove buttons, and the add
 * buttons. `empty` says what a good photo shows, in the words of the form it is in.
 */
export function PhotoPicker({
  photos,
  onAdd,
  onRemove,
  error,
  empty = 'No photo yet. A close, sharp photo of the hole helps the inspector most.',
  idPrefix = '',
  max = maxPhotos,
}: {
  photos: DraftPhoto[];
  onAdd: (from: 'library' | 'camera') => void;
  onRemove: (i: number) => void;
  error?: string | null;
  empty?: string;
  /**
   * Before every testID: a screen pushed over one that has a picker too (the flag screen over the
   * traveler's photos of the work) keeps both in the page, and their controls must stay apart.
   */
  idPrefix?: string;
  /** The most photos the form it is in takes (a finding's by default). */
  max?: number;
}) {
  return (
    <View style={{ gap: space.sm }} testID={`${idPrefix}photos`}>
      <DraftTiles
        items={photos}
        thumb={(p, i) => (
          <Image source={{ uri: p.uri }} style={tileStyles.thumb} accessibilityLabel={`Photo ${i + 1}`} />
        )}
        removeLabel={(_p, i) => `Remove photo ${i + 1}`}
        onRemove={onRemove}
        tileTestID={(i) => `${idPrefix}photo-${i}`}
        removeTestID={(i) => `${idPrefix}remove-photo-${i}`}
        empty={empty}
      />
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        {photoSources.map(({ source, label, testID }) => (
          <Button
            key={source}
            label={label}
            variant="secondary"
            onPress={() => onAdd(source)}
            disabled={photos.length >= max}
            testID={`${idPrefix}${testID}`}
          />
        ))}
      </View>
      <Txt variant="small" tone="faint">
        {photos.length}/{max} photos. Location data is removed on the server.
      </Txt>
      {error ? (
        <Txt variant="small" tone="error" accessibilityRole="alert" testID={`${idPrefix}photos-error`}>
          {error}
        </Txt>
      ) : null}
    </View>
  );
}
