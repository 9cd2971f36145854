import { useCallback, useState } from 'react';
import { Image, Modal, ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { FindingPhoto } from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Mono } from '@/components/ui/text';

type Zoom = '1' | '2' | '4';

/**
 * A screen's photo viewer: `open` shows a list of photos at one of them, `viewer` is the element that
 * shows it (at the end of the screen, above everything when open).
 */
export function usePhotoViewer() {
  const [viewing, setViewing] = useState<{ photos: FindingPhoto[]; index: number } | null>(null);
  const open = useCallback((photos: FindingPhoto[], index: number) => setViewing({ photos, index }), []);
  const viewer = (
    <PhotoViewer
      photos={viewing?.photos ?? []}
      index={viewing ? viewing.index : null}
      onClose={() => setViewing(null)}
      onIndex={(index) => setViewing((v) => (v ? { ...v, index } : v))}
    />
  );
  return { open, viewer };
}

/** A photo full screen: pinch on iOS, and a zoom switch everywhere, scrolling both ways. */
export function PhotoViewer({
  photos,
  index,
  onClose,
  onIndex,
}: {
  photos: FindingPhoto[];
  index: number | null;
  onClose: () => void;
  onIndex: (i: number) => void;
}) {
  const { width, height } = useWindowDimensions();
  const insets = useSafeAreaInsets();
  const [zoom, setZoom] = useState<Zoom>('1');
  const photo = index == null ? null : photos[index];
  const boxW = width;
  const boxH = Math.max(200, height - insets.top - insets.bottom - 150);
  const aspect = photo && photo.width && photo.height ? photo.width / photo.height : 4 / 3;
  const fitW = Math.min(boxW, boxH * aspect);
  const z = Number(zoom);
  const imgW = fitW * z;
  const imgH = (fitW / aspect) * z;

  return (
    <Modal visible={!!photo} onRequestClose={onClose} animationType="fade" transparent={false}>
      <View style={[styles.page, { paddingTop: insets.top }]} testID="photo-viewer">
        <View style={styles.bar}>
          <Mono tone="inverse">{index == null ? '' : `${index + 1} / ${photos.length}`}</Mono>
          <View style={{ flex: 1 }} />
          <Button
            label="Close"
            variant="secondary"
            onPress={() => {
              setZoom('1');
              onClose();
            }}
            testID="photo-close"
          />
        </View>
        <ScrollView
          style={{ flex: 1 }}
          contentContainerStyle={{ minHeight: boxH, alignItems: 'center', justifyContent: 'center' }}
          maximumZoomScale={4}
          minimumZoomScale={1}
          centerContent
        >
          <ScrollView
            horizontal
            contentContainerStyle={{ minWidth: boxW, alignItems: 'center', justifyContent: 'center' }}
          >
            {photo ? (
              <Image
                source={{ uri: photo.url }}
                style={{ width: imgW, height: imgH }}
                resizeMode="contain"
                accessibilityLabel={`Photo ${index! + 1} of ${photos.length}`}
                testID="photo-large"
              />
            ) : null}
          </ScrollView>
        </ScrollView>
        <View style={[styles.bar, styles.bottom, { paddingBottom: insets.bottom + space.sm }]}>
          <Button
            label="‹"
            variant="secondary"
            disabled={!index}
            onPress={() => index && onIndex(index - 1)}
            testID="photo-prev"
            accessibilityLabel="Previous photo"
          />
          <View style={{ flex: 1, alignItems: 'center' }}>
            <Choice
              testIDPrefix="photo-zoom"
              value={zoom}
              onChange={setZoom}
              options={[
                { value: '1', label: 'Fit' },
                { value: '2', label: '2×' },
                { value: '4', label: '4×' },
              ]}
            />
          </View>
          <Button
            label="›"
            variant="secondary"
            disabled={index == null || index >= photos.length - 1}
            onPress={() => index != null && onIndex(index + 1)}
            testID="photo-next"
            accessibilityLabel="Next photo"
          />
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.ink },
  bar: { flexDirection: 'row', alignItems: 'center', gap: space.sm, padding: space.sm },
  bottom: { backgroundColor: colors.paper },
});
