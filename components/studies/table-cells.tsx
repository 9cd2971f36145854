import { View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import type { CandidateKey } from './study-result';

/** A row's name as the button that shows its details below the table; marked while shown. */
export function RowPickButton({
  name,
  on,
  onPick,
  testID,
  says,
}: {
  name: string;
  on: boolean;
  onPick: (name: string) => void;
  testID: string;
  /** What pressing it shows, for a screen reader ("Rib W-101: show its zones"). */
  says: string;
}) {
  return (
    <Button
      label={name}
      variant="quiet"
      compact
      selected={on}
      onPress={() => onPick(name)}
      testID={testID}
      accessibilityLabel={`${says}${on ? ' (shown)' : ''}`}
      style={{ alignSelf: 'flex-start' }}
    />
  );
}

/** A recommended gauge and rivet in a narrow column: gauge over rivet, two short lines instead of one long one. */
export function GaugeOverRivet({ c, testID }: { c: CandidateKey; testID: string }) {
  const u = useUnits();
  return (
    <View testID={testID} accessibilityLabel={`${u.length(c.gaugeIn)} with ${c.rivet}`}>
      <Mono variant="small" bold>
        {u.length(c.gaugeIn)}
      </Mono>
      <Mono variant="small" bold>
        {c.rivet}
      </Mono>
    </View>
  );
}

/** A table's "does it carry the loads" cell: a plain yes, or a no in red. */
export function YesNoCell({ yes }: { yes: boolean }) {
  return (
    <Txt variant="small" bold tone={yes ? 'ink' : 'error'}>
      {yes ? '✓ yes' : '✕ no'}
    </Txt>
  );
}
