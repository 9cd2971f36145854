import * as ImagePicker from 'expo-image-picker';
import { Image, Platform, Pressable, StyleSheet, View } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Txt } from '@/components/ui/text';
import type { DraftPhoto } from '@/hooks/photo-form-data';

export const maxPhotos = 6;
/** On the web a picked photo is a blob: URI that dies with the page; small ones are kept inline. */
const keepInlineBytes = 1_500_000;

function readAsDataUrl(file: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(String(r.result));
    r.onerror = () => reject(r.error);
    r.readAsDataURL(file);
  });
}

async function toDraftPhoto(a: ImagePicker.ImagePickerAsset, i: number): Promise<DraftPhoto> {
  const type = a.mimeType ?? 'image/jpeg';
  const ext = type.split('/')[1]?.replace('jpeg', 'jpg') ?? 'jpg';
  const name = a.fileName ?? `photo-${Date.now()}-${i}.${ext}`;
  let uri = a.uri;
  if (Platform.OS === 'web' && a.file && a.file.size <= keepInlineBytes && uri.startsWith('blob:')) {
    try { uri = await readAsDataUrl(a.file); } catch { /* keep the blob: URI */ }
  }
  return { uri, name, type, width: a.width, height: a.height };
}

export async function pickPhotos(from: 'library' | 'camera', room: number): Promise<DraftPhoto[] | { error: string }> {
  if (room <= 0) return { error: `At most ${maxPhotos} photos in one finding.` };
  try {
    if (from === 'camera') {
      const perm = await ImagePicker.requestCameraPermissionsAsync();
      if (!perm.granted) return { error: 'The camera was not allowed. Choose a photo from the library instead, or allow the camera in the settings.' };
    }
    const opts: ImagePicker.ImagePickerOptions = { mediaTypes: ['images'], quality: 0.85, allowsMultipleSelection: from === 'library', selectionLimit: room, exif: false };
    const res = from === 'camera' ? await ImagePicker.launchCameraAsync(opts) : await ImagePicker.launchImageLibraryAsync(opts);
    if (res.canceled) return [];
    return await Promise.all(res.assets.slice(0, room).map(toDraftPhoto));
  } catch (e) {
    return { error: `The photo could not be read: ${(e as Error).message ?? 'unknown problem'}` };
  }
}

/**
 * Photos being added (a new finding's, or the work done's): thumbnails with remove buttons, and the add
 * buttons. `empty` says what a good photo shows, in the words of the form it is in.
 */
export function PhotoPicker({ photos, onAdd, onRemove, error, empty = 'No photo yet. A close, sharp photo of the hole helps the inspector most.' }: {
  photos: DraftPhoto[]; onAdd: (from: 'library' | 'camera') => void; onRemove: (i: number) => void; error?: string | null; empty?: string;
}) {
  return (
    <View style={{ gap: space.sm }} testID="photos">
      {photos.length ? (
        <View style={styles.grid}>
          {photos.map((p, i) => (
            <View key={`${p.uri.slice(0, 64)}-${i}`} style={styles.item} testID={`photo-${i}`}>
              <Image source={{ uri: p.uri }} style={styles.thumb} accessibilityLabel={`Photo ${i + 1}`} />
              <Pressable
                onPress={() => onRemove(i)}
                testID={`remove-photo-${i}`}
                accessibilityRole="button"
                accessibilityLabel={`Remove photo ${i + 1}`}
                style={styles.remove}
              >
                <Txt variant="small" bold tone="error">Remove</Txt>
              </Pressable>
            </View>
          ))}
        </View>
      ) : <Txt tone="soft">{empty}</Txt>}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label="Add a photo" variant="secondary" onPress={() => onAdd('library')} disabled={photos.length >= maxPhotos} testID="add-photo" />
        <Button label="Take a photo" variant="secondary" onPress={() => onAdd('camera')} disabled={photos.length >= maxPhotos} testID="take-photo" />
      </View>
      <Txt variant="small" tone="faint">{photos.length}/{maxPhotos} photos. Location data is removed on the server.</Txt>
      {error ? <Txt variant="small" tone="error" accessibilityRole="alert" testID="photos-error">{error}</Txt> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  item: { width: 112, gap: 2 },
  thumb: { width: 112, height: 112, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
  remove: { minHeight: 48, justifyContent: 'center', alignItems: 'center' },
});
