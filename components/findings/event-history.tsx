import { StyleSheet, View } from 'react-native';
import { dispositionLabels, findingStatusLabels, type FindingEvent } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';
import { shortDate } from './finding-row';

/** Every change to the finding: who, when, what, and why. Oldest first, like a log book. */
export function EventHistory({ events }: { events: FindingEvent[] }) {
  if (!events.length) return <Txt tone="soft">No changes recorded yet.</Txt>;
  const sorted = [...events].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return (
    <View testID="history">
      {sorted.map((e) => (
        <View key={e.id} style={styles.row} testID={`event-${e.toStatus}`}>
          <View style={styles.dot} />
          <View style={{ flex: 1, gap: 2 }}>
            <Txt bold>
              {e.fromStatus ? `${findingStatusLabels[e.fromStatus]} → ` : ''}{findingStatusLabels[e.toStatus]}
              {e.disposition ? `: ${dispositionLabels[e.disposition]}` : ''}
            </Txt>
            <Txt variant="small" tone="soft">{e.actorName} · <Mono variant="small">{shortDate(e.createdAt)}</Mono></Txt>
            {e.note ? <Txt>“{e.note}”</Txt> : null}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.md, paddingVertical: space.sm, borderLeftWidth: hairline, borderColor: colors.ink, marginLeft: 6, paddingLeft: space.md },
  dot: { position: 'absolute', left: -6, top: space.md, width: 11, height: 11, backgroundColor: colors.paper, borderWidth: 2, borderColor: colors.ink },
});
