import { Image, StyleSheet, View } from 'react-native';
import {
  dispositionLabels,
  findingClosureLabels,
  findingKindLabels,
  findingStatusLabels,
  type FindingSummary,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { ListRow } from '@/components/ui/list-row';
import { FindingStatusTag } from '@/components/ui/status-mark';
import { Mono, Txt } from '@/components/ui/text';

export function shortDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/** A finding row's name: what the row shows, its state first, since the name is all that is read of it. */
export function findingRowLabel(f: FindingSummary, showPart = true): string {
  const state =
    f.status === 'closed' && f.closure
      ? `${findingStatusLabels[f.status]}, ${findingClosureLabels[f.closure]}`
      : f.disposition
        ? `${findingStatusLabels[f.status]}, ${dispositionLabels[f.disposition]}`
        : findingStatusLabels[f.status];
  return [
    `Finding on ${f.holeIds.join(', ')}: ${findingKindLabels[f.kind]}`,
    state,
    showPart ? `part ${f.partNumber}, serial ${f.serial}` : null,
    `raised by ${f.raisedByName}, ${shortDate(f.createdAt)}`,
  ]
    .filter(Boolean)
    .join('; ');
}

/** One finding in a list: its status mark, the holes, what is wrong and who raised it. */
export function FindingRow({
  f,
  onPress,
  showPart = true,
}: {
  f: FindingSummary;
  onPress: () => void;
  showPart?: boolean;
}) {
  return (
    <ListRow testID={`finding-${f.id}`} label={findingRowLabel(f, showPart)} onPress={onPress} style={styles.row}>
      {f.thumbUrl ? (
        <Image source={{ uri: f.thumbUrl }} style={styles.thumb} accessibilityIgnoresInvertColors />
      ) : (
        <View style={[styles.thumb, styles.noThumb]} />
      )}
      <View style={{ flex: 1, gap: 2 }}>
        <View style={styles.top}>
          <FindingStatusTag status={f.status} disposition={f.disposition} closure={f.closure} />
          <Mono bold>{f.holeIds.join(' ')}</Mono>
        </View>
        <Txt>{findingKindLabels[f.kind]}</Txt>
        <Txt variant="small" tone="soft">
          {showPart ? (
            <>
              <Mono variant="small">
                {f.partNumber} · {f.serial}
              </Mono>{' '}
              ·{' '}
            </>
          ) : null}
          raised by {f.raisedByName} · <Mono variant="small">{shortDate(f.createdAt)}</Mono>
        </Txt>
      </View>
    </ListRow>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.sm },
  top: { flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' },
  thumb: { width: 56, height: 56, borderWidth: hairline, borderColor: colors.rule, backgroundColor: colors.paperSunk },
  noThumb: {},
});
