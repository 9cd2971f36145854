import { StyleSheet, View } from 'react-native';
import { judgeMeasurement, measureLabels, type MeasureBasis, type MeasureKey } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { VerdictMark } from './verdict-mark';

/**
 * A measured value beside the rule it is judged against, with the rule's source, as the contract's
 * `judgeMeasurement` says. With no value yet it shows the rule alone; with no basis (a rivet the app
 * cannot read) it shows the value without a verdict, and says so.
 */
export function MeasurementJudgement({
  measure,
  value,
  basis,
  showValue = false,
}: {
  measure: MeasureKey;
  value: number | undefined;
  basis: MeasureBasis | null;
  showValue?: boolean;
}) {
  const u = useUnits();
  const has = typeof value === 'number' && Number.isFinite(value);
  // The measure's name and its value, the value in bold; the whole line bold beside a verdict.
  const valueLine = (bold: boolean) =>
    showValue && has ? (
      <Txt variant="small" bold={bold}>
        {measureLabels[measure]}:{' '}
        <Mono variant="small" bold>
          {u.length(value)}
        </Mono>
      </Txt>
    ) : null;
  if (!basis) {
    return (
      <View style={styles.box} testID={`measure-judgement-${measure}`}>
        {valueLine(false)}
        <Txt variant="small" tone="faint">
          The rivet of this part is not one the app can read, so no limit is shown: the inspector judges it.
        </Txt>
      </View>
    );
  }
  // The rule and its source do not depend on the value; the verdict does.
  const j = judgeMeasurement(measure, has ? value : 0, basis);
  return (
    <View
      style={[styles.box, has && !j.pass && styles.fail]}
      testID={`measure-judgement-${measure}`}
      role={has ? 'group' : undefined}
      accessibilityLabel={
        has
          ? `${measureLabels[measure]} ${u.length(value)}: ${j.pass ? 'within the limit' : 'outside the limit'} ${j.limit}`
          : undefined
      }
    >
      <View style={styles.row}>
        {has ? <VerdictMark pass={j.pass} size={18} /> : null}
        {valueLine(true)}
        <Txt variant="small" bold tone={!has ? 'soft' : j.pass ? 'ink' : 'error'}>
          {!has ? 'Limit' : j.pass ? 'Within the limit' : 'Outside the limit'}
        </Txt>
        <Mono variant="small" bold>
          {j.limit}
        </Mono>
      </View>
      <Txt variant="small">Rule: {j.rule}</Txt>
      <Txt variant="small" tone="faint">
        Source: {j.source}
      </Txt>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: 2,
    paddingVertical: space.xs,
    paddingHorizontal: space.sm,
    borderLeftWidth: 3,
    borderLeftColor: colors.rule,
    borderWidth: hairline,
    borderColor: colors.rule,
    backgroundColor: colors.paperRaised,
  },
  fail: { borderLeftColor: colors.error, backgroundColor: colors.errorSoft },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
});
