import { StyleSheet, View } from 'react-native';
import { dispositionLabels, type TravelerSummary } from '@/db/contracts';
import { space, statusColors } from '@/constants/theme';
import { ListRow, RowBar } from '@/components/ui/list-row';
import { Mono, Txt } from '@/components/ui/text';

/** Live parts first, replaced ones after them: a replaced part stays in the record but is not worked. */
export function liveFirst<T extends Pick<TravelerSummary, 'replaced'>>(rows: readonly T[]): T[] {
  return [...rows].sort((a, b) => Number(!!a.replaced) - Number(!!b.replaced));
}

/**
 * A traveler in a list: part, revision, serial and short code, how far along it is (holes done, and
 * holes waiting for the inspector apart), and whether it was replaced.
 */
/**
 * The card's name for a screen reader: everything the card shows in words, warnings included ("1 open
 * finding", a newer revision), since a button's name is all that is read of it.
 */
export function travelerCardLabel(t: TravelerSummary): string {
  return [
    `${t.partNumber} ${t.partName}, revision ${t.letter}, serial ${t.serial}, code ${t.shortCode}, build ${t.kitSerial}`,
    t.replaced ? `replaced (${dispositionLabels[t.replaced.reason].toLowerCase()})` : null,
    `${t.holesDone} of ${t.holesTotal} holes done`,
    t.holesAwaitingInspector ? `${t.holesAwaitingInspector} awaiting the inspector` : null,
    t.openFindings ? `${t.openFindings} open finding${t.openFindings === 1 ? '' : 's'}` : null,
    t.newerRevision ? `revision ${t.newerRevision} is out` : null,
    t.signedOff ? 'signed off' : null,
  ]
    .filter(Boolean)
    .join(', ');
}

export function TravelerCard({ t, onPress }: { t: TravelerSummary; onPress: () => void }) {
  return (
    <ListRow
      testID={`traveler-${t.shortCode}`}
      label={travelerCardLabel(t)}
      onPress={onPress}
      style={[styles.row, t.replaced && styles.replaced]}
      chevron
    >
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold>
          <Mono bold>{t.partNumber}</Mono> {t.partName}
        </Txt>
        <Txt variant="small" tone="soft">
          Rev{' '}
          <Mono variant="small" bold>
            {t.letter}
          </Mono>{' '}
          · <Mono variant="small">{t.serial}</Mono> · code{' '}
          <Mono variant="small" bold>
            {t.shortCode}
          </Mono>{' '}
          · build {t.kitSerial}
        </Txt>
        <RowBar done={t.holesDone} total={t.holesTotal} awaiting={t.holesAwaitingInspector} />
        <View style={styles.flags}>
          {t.replaced ? (
            <Txt variant="small" bold tone="error" testID={`traveler-replaced-${t.shortCode}`}>
              ✕ Replaced ({dispositionLabels[t.replaced.reason].toLowerCase()})
            </Txt>
          ) : null}
          <Mono variant="small">
            {t.holesDone}/{t.holesTotal} holes done
          </Mono>
          {t.holesAwaitingInspector ? (
            <Mono variant="small" tone="soft">
              {t.holesAwaitingInspector} awaiting the inspector
            </Mono>
          ) : null}
          {t.openFindings ? (
            <Txt variant="small" bold tone="warning">
              ▲ {t.openFindings} open finding{t.openFindings === 1 ? '' : 's'}
            </Txt>
          ) : null}
          {t.newerRevision ? (
            <Txt variant="small" bold tone="caution">
              Rev {t.newerRevision} is out
            </Txt>
          ) : null}
          {t.signedOff ? (
            <Txt variant="small" bold style={{ color: statusColors.accepted }}>
              Signed off
            </Txt>
          ) : null}
        </View>
      </View>
    </ListRow>
  );
}

const styles = StyleSheet.create({
  row: { paddingHorizontal: space.xs },
  replaced: { opacity: 0.75 },
  flags: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
});
