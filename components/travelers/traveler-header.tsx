import { useState } from 'react';
import { Platform, StyleSheet, View, type ViewStyle } from 'react-native';
import { partKindLabels, type TravelerDetail } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { ConfirmStep } from '@/components/designs/confirm-step';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { useTravelerMoveRevisionMutation } from '@/hooks/queries/travelers';
import { errorMessage } from '@/lib/api-client';

function Cell({ label, children, testID }: { label: string; children: React.ReactNode; testID?: string }) {
  return (
    <View style={styles.cell} testID={testID}>
      <Label>{label}</Label>
      {children}
    </View>
  );
}

/** The title block of the traveler: what the part is and the numbers the builder works to. */
export function TravelerHeader({ t }: { t: TravelerDetail }) {
  const u = useUnits();
  return (
    <View style={{ gap: space.md }} testID="traveler-header">
      <View style={styles.grid}>
        <Cell label="Part">
          <Mono bold testID="part-number">
            {t.partNumber}
          </Mono>
          <Txt variant="small">{t.partName}</Txt>
        </Cell>
        <Cell label="Revision">
          <Mono bold variant="title" testID="revision-letter">
            {t.letter}
          </Mono>
        </Cell>
        <Cell label="Serial">
          <Mono testID="traveler-serial">{t.serial}</Mono>
          <Mono variant="small" tone="soft">
            {t.shortCode}
          </Mono>
        </Cell>
        <Cell label="Material">
          <Txt>{t.material}</Txt>
          <Txt variant="small" tone="soft">
            {partKindLabels[t.kind]}
          </Txt>
        </Cell>
        <Cell label="Gauge" testID="gauge">
          <Mono bold>{u.length(t.gaugeIn)}</Mono>
        </Cell>
        <Cell label="Rivet" testID="rivet-spec">
          <Mono bold>{t.rivetSpec}</Mono>
        </Cell>
        <Cell label="Drill" testID="drill">
          <Mono bold>{t.drillSize}</Mono>
          <Mono variant="small">⌀ {u.length(t.drillDiameterIn)}</Mono>
        </Cell>
        <Cell label="Edge distance" testID="edge-distance">
          <Mono bold>{u.length(t.edgeDistanceIn)}</Mono>
        </Cell>
        <Cell label="Chord">
          <Mono>{u.length(t.chordIn)}</Mono>
        </Cell>
      </View>
      <Txt variant="small" tone="soft" testID="approved-by">
        {t.approvedByName
          ? `Revision ${t.letter} approved by ${t.approvedByName}.`
          : `Revision ${t.letter}: approver not recorded.`}{' '}
        Build {t.kitSerial}.
      </Txt>
      {t.newerRevision ? <NewerRevision t={t} newer={t.newerRevision} /> : null}
      <Caution />
    </View>
  );
}

/**
 * A newer revision of the part is out. Before work starts the reader may be offered the move to it (the
 * server's `revisionMove`); once work is recorded, the part stays as built and the supplier's notices say
 * what to do about the change.
 */
function NewerRevision({ t, newer }: { t: TravelerDetail; newer: string }) {
  const move = useTravelerMoveRevisionMutation(t.id);
  const [confirming, setConfirming] = useState(false);
  return (
    <Notice tone="caution" testID="newer-revision">
      <Txt bold>Revision {newer} of this part is out.</Txt>
      {t.revisionMove?.started ? (
        <Txt>
          This traveler follows revision {t.letter}, and work is recorded on it: it stays on revision {t.letter} and
          follows the supplier&rsquo;s notices about the change.
        </Txt>
      ) : t.revisionMove?.allowed ? (
        <Txt>
          This traveler follows revision {t.letter}. No work is recorded on it yet: it can move to revision {newer}.
        </Txt>
      ) : (
        <Txt>This traveler follows revision {t.letter}. Ask the supplier before you go on with this part.</Txt>
      )}
      {t.revisionMove?.allowed && !confirming ? (
        <Button
          label={`Move to revision ${newer}`}
          variant="secondary"
          onPress={() => {
            move.reset();
            setConfirming(true);
          }}
          testID="move-to-revision"
        />
      ) : null}
      {t.revisionMove?.allowed && confirming ? (
        <ConfirmStep
          message={`The part's holes and steps are made again from revision ${newer}, as a new part's would be, and the build log says so. It cannot be moved back to revision ${t.letter}.`}
          confirmLabel={`Move to revision ${newer}`}
          busy={move.isPending}
          error={move.error ? errorMessage(move.error) : null}
          onConfirm={() => move.mutate(undefined, { onSuccess: () => setConfirming(false) })}
          onCancel={() => setConfirming(false)}
          testID="move-to-revision-confirm"
        />
      ) : null}
    </Notice>
  );
}

/**
 * A cell is never narrower than its longest value (a serial, a callout): values do not break, so a
 * cell that cannot fit one takes a row of its own instead of letting it run into the next cell.
 */
const fitValues = (Platform.OS === 'web' ? { minWidth: 'min-content' } : {}) as ViewStyle;

const styles = StyleSheet.create({
  grid: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    borderTopWidth: hairline,
    borderLeftWidth: hairline,
    borderColor: colors.ink,
  },
  cell: {
    flexGrow: 1,
    flexBasis: 110,
    padding: space.sm,
    gap: 2,
    borderRightWidth: hairline,
    borderBottomWidth: hairline,
    borderColor: colors.ink,
    backgroundColor: colors.paperRaised,
    ...fitValues,
  },
});
