import { Image, Pressable, StyleSheet, View } from 'react-native';
import type { FindingPhoto } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Label, Txt } from '@/components/ui/text';

function Group({
  title,
  photos,
  prefix,
  empty,
  onOpen,
}: {
  title: string;
  photos: FindingPhoto[];
  prefix: string;
  empty: string;
  onOpen: (i: number) => void;
}) {
  return (
    <View style={{ gap: space.xs }} testID={`${prefix}s`}>
      <Label>{`${title} (${photos.length})`}</Label>
      {photos.length ? (
        <View style={styles.photos}>
          {photos.map((p, i) => (
            <Pressable
              key={p.id}
              onPress={() => onOpen(i)}
              testID={`${prefix}-${i}`}
              accessibilityRole="button"
              accessibilityLabel={`${title}, photo ${i + 1}, open large`}
            >
              <Image source={{ uri: p.thumbUrl }} style={styles.thumb} />
            </Pressable>
          ))}
        </View>
      ) : (
        <Txt variant="small" tone="soft">
          {empty}
        </Txt>
      )}
    </View>
  );
}

/**
 * The photos of a finding, as found and of the work done kept apart: the inspector compares the two,
 * and a photo of the work must never pass for one of the defect. `onOpen` gets the group and the index.
 */
export function FindingPhotos({
  photos,
  onOpen,
}: {
  photos: FindingPhoto[];
  onOpen: (group: FindingPhoto[], i: number) => void;
}) {
  const found = photos.filter((p) => p.stage === 'found');
  const work = photos.filter((p) => p.stage === 'work');
  return (
    <View style={{ gap: space.md }}>
      <Group
        title="As found"
        photos={found}
        prefix="finding-photo"
        empty="No photo of the finding."
        onOpen={(i) => onOpen(found, i)}
      />
      {work.length ? (
        <Group title="Work done" photos={work} prefix="work-photo" empty="" onOpen={(i) => onOpen(work, i)} />
      ) : null}
      <Txt variant="small" tone="faint">
        Tap a photo to see it large and zoom in.
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  thumb: { width: 120, height: 120, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
});
