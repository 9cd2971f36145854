import { useState } from 'react';
import { View } from 'react-native';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Txt } from '@/components/ui/text';

function Fold({
  title,
  items,
  open: initial,
  testID,
  tone,
}: {
  title: string;
  items: string[];
  open: boolean;
  testID: string;
  tone?: 'caution';
}) {
  const [open, setOpen] = useState(initial);
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      <Button
        label={`${open ? '▾' : '▸'} ${title} (${items.length})`}
        variant="quiet"
        compact
        onPress={() => setOpen((o) => !o)}
        testID={`${testID}-toggle`}
        accessibilityLabel={`${open ? 'Hide' : 'Show'} ${title.toLowerCase()}`}
        style={{ alignSelf: 'flex-start', marginLeft: -space.md }}
      />
      {open ? (
        items.length ? (
          items.map((w, i) => (
            <Txt key={i} variant="small" tone={tone} style={{ paddingLeft: space.md }}>
              • {w}
            </Txt>
          ))
        ) : (
          <Txt variant="small" tone="soft" style={{ paddingLeft: space.md }}>
            None.
          </Txt>
        )
      ) : null}
    </View>
  );
}

/** What to be wary of (open) and the rules the engine applied (folded), from the stored result. */
export function ResultNotes({
  warnings,
  candidateWarnings,
  rules,
}: {
  warnings: string[];
  candidateWarnings: string[];
  rules: string[];
}) {
  const extra = candidateWarnings.filter((w) => !warnings.includes(w));
  return (
    <View style={{ gap: space.sm }} testID="result-notes">
      <Fold title="Warnings" items={[...warnings, ...extra]} open testID="result-warnings" tone="caution" />
      <Fold title="Rules applied" items={rules} open={false} testID="result-rules" />
    </View>
  );
}
