import { Image, Pressable, StyleSheet, View } from 'react-native';
import {
  buildPlaceLabels,
  dispositionLabels,
  findingActionLabels,
  findingActions,
  findingStatusLabels,
  type FindingAction,
  type FindingEvent,
  type FindingEventAction,
  type FindingPhoto,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';
import { shortDate } from './finding-row';

/** The actions that are not a person's decision on the finding get their own words. */
export function eventWords(action: FindingEventAction): string {
  if (action === 'raise') return 'Raised';
  if (action === 'part-replaced') return 'Part replaced';
  return (findingActions as readonly string[]).includes(action) ? findingActionLabels[action as FindingAction] : action;
}

/**
 * Every change to the finding: what was done, by whom and in what place on the build, when, the state
 * it moved to, why, and the photos that went with it (the work done). Oldest first, like a log book.
 */
export function EventHistory({
  events,
  photos = [],
  onPhoto,
}: {
  events: FindingEvent[];
  photos?: FindingPhoto[];
  onPhoto?: (photo: FindingPhoto) => void;
}) {
  if (!events.length) return <Txt tone="soft">No changes recorded yet.</Txt>;
  const sorted = [...events].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return (
    <View testID="history">
      {sorted.map((e) => {
        const withIt = photos.filter((p) => p.eventId === e.id);
        return (
          <View key={e.id} style={styles.row} testID={`event-${e.action}`}>
            <View style={styles.dot} />
            <View style={{ flex: 1, gap: 2 }}>
              <Txt bold>
                {eventWords(e.action)}
                {e.disposition ? `: ${dispositionLabels[e.disposition]}` : ''}
              </Txt>
              {e.fromStatus ? (
                <Txt variant="small" tone="soft">
                  {e.fromStatus !== e.toStatus ? `${findingStatusLabels[e.fromStatus]} → ` : ''}
                  {findingStatusLabels[e.toStatus]}
                </Txt>
              ) : null}
              <Txt variant="small" tone="soft">
                {e.actorName}
                {e.actorPlace !== 'none' ? `, ${buildPlaceLabels[e.actorPlace]}` : ''} ·{' '}
                <Mono variant="small">{shortDate(e.createdAt)}</Mono>
              </Txt>
              {e.note ? <Txt>“{e.note}”</Txt> : null}
              {withIt.length ? (
                <View style={styles.photos}>
                  {withIt.map((p) => (
                    <Pressable
                      key={p.id}
                      onPress={() => onPhoto?.(p)}
                      accessibilityRole="button"
                      accessibilityLabel="Photo of this step, open large"
                    >
                      <Image source={{ uri: p.thumbUrl }} style={styles.thumb} />
                    </Pressable>
                  ))}
                </View>
              ) : null}
            </View>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    gap: space.md,
    paddingVertical: space.sm,
    borderLeftWidth: hairline,
    borderColor: colors.ink,
    marginLeft: 6,
    paddingLeft: space.md,
  },
  dot: {
    position: 'absolute',
    left: -6,
    top: space.md,
    width: 11,
    height: 11,
    backgroundColor: colors.paper,
    borderWidth: 2,
    borderColor: colors.ink,
  },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, paddingTop: space.xs },
  thumb: { width: 56, height: 56, borderWidth: hairline, borderColor: colors.ink, backgroundColor: colors.paperSunk },
});
