import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Txt } from '@/components/ui/text';

/**
 * Files picked for a form and not sent yet (a finding's photos, a notice's photos and PDFs): a grid of
 * tiles, each its thumbnail with a Remove button under it big enough for a thumb; `empty` says what to
 * add when there is nothing yet.
 */
export function DraftTiles<T extends { uri: string }>({
  items,
  thumb,
  removeLabel,
  onRemove,
  tileTestID,
  removeTestID,
  empty,
}: {
  items: readonly T[];
  /** The tile's picture, drawn in `tileStyles.thumb`'s box. */
  thumb: (item: T, i: number) => ReactNode;
  removeLabel: (item: T, i: number) => string;
  onRemove: (i: number) => void;
  tileTestID: (i: number) => string;
  removeTestID: (i: number) => string;
  empty: ReactNode;
}) {
  if (!items.length) return <Txt tone="soft">{empty}</Txt>;
  return (
    <View style={tileStyles.grid}>
      {items.map((item, i) => (
        <View key={`${item.uri.slice(0, 64)}-${i}`} style={styles.item} testID={tileTestID(i)}>
          {thumb(item, i)}
          <Pressable
            onPress={() => onRemove(i)}
            testID={removeTestID(i)}
            accessibilityRole="button"
            accessibilityLabel={removeLabel(item, i)}
            style={styles.remove}
          >
            <Txt variant="small" bold tone="error">
              Remove
            </Txt>
          </Pressable>
        </View>
      ))}
    </View>
  );
}

/** The grid and the thumbnail's box, for a screen that shows sent files the same way. */
export const tileStyles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  thumb: { width: 112, height: 112, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
});

const styles = StyleSheet.create({
  item: { width: 112, gap: 2 },
  remove: { minHeight: touch, justifyContent: 'center', alignItems: 'center' },
});
