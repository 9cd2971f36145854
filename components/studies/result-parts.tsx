import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { ErrorState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import type { CandidateKey } from './study-result';

/** A stored result this screen cannot read (an older shape): the caution still heads it, and the way out. */
export function UnreadableResult() {
  return (
    <View style={{ gap: space.lg }}>
      <Caution testID="study-caution" />
      <ErrorState
        title="This result cannot be drawn"
        error={
          new Error(
            'The stored result of this revision is not in the shape this screen reads. Compute it again to make a new revision.',
          )
        }
      />
    </View>
  );
}

/** The candidate a section shows, in its header: "0.032 in · MS20470AD4". */
export function CandidateTag({ c }: { c: CandidateKey }) {
  const u = useUnits();
  return (
    <Mono variant="small" bold>
      {u.length(c.gaugeIn)} · {c.rivet}
    </Mono>
  );
}

/** The design conditions behind a result, said in a headline: " · n +3.80 / −1.52 · W/S 11.0 psf". */
export function DesignFigures({
  design,
}: {
  design?: { loadFactors: { positive: number; negative: number }; wingLoadingPsf: number } | null;
}) {
  const u = useUnits();
  if (!design) return null;
  return (
    <>
      {' · n '}
      <Mono variant="small">{design.loadFactors.positive.toFixed(2)}</Mono> /{' '}
      <Mono variant="small">{design.loadFactors.negative.toFixed(2)}</Mono> · W/S{' '}
      <Mono variant="small">{u.wingLoading(design.wingLoadingPsf)}</Mono>
    </>
  );
}

/**
 * A result's headline: "`lead` 0.032 in with MS20470AD4" for the candidate it recommends, or in red
 * what `failure` says when there is none. Both under one testID.
 */
export function RecommendedLine({
  rec,
  lead,
  failure,
  testID,
}: {
  rec: CandidateKey | null | undefined;
  lead: string;
  failure: string;
  testID: string;
}) {
  const u = useUnits();
  return rec ? (
    <Txt variant="heading" testID={testID}>
      {lead}{' '}
      <Mono variant="heading" bold>
        {u.length(rec.gaugeIn)}
      </Mono>{' '}
      with{' '}
      <Mono variant="heading" bold>
        {rec.rivet}
      </Mono>
    </Txt>
  ) : (
    <Txt variant="heading" tone="error" testID={testID}>
      {failure}
    </Txt>
  );
}
