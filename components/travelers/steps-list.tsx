import { StyleSheet, View } from 'react-native';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Mono, Txt } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import type { TravelerStep } from '@/hooks/queries/travelers';

function Box({ on }: { on: boolean }) {
  return (
    <View style={[styles.box, on && { backgroundColor: colors.ink }]} aria-hidden>
      {on ? (
        <Txt bold tone="inverse" style={{ lineHeight: 20 }}>
          ✓
        </Txt>
      ) : null}
    </View>
  );
}

/** The shop steps, each signed as done by the builder. */
export function StepsList({
  steps,
  canToggle,
  onToggle,
}: {
  steps: TravelerStep[];
  canToggle: boolean;
  onToggle: (s: TravelerStep) => void;
}) {
  if (!steps.length) return <Txt tone="soft">This part has no shop steps listed.</Txt>;
  return (
    <View testID="steps">
      {[...steps]
        .sort((a, b) => a.seq - b.seq)
        .map((s) => {
          const done = !!s.doneAt;
          return (
            <Toggle
              key={s.id}
              kind="checkbox"
              checked={done}
              testID={`step-${s.seq}`}
              accessibilityLabel={`Step ${s.seq}: ${s.text}${done && s.doneByName ? `, done by ${s.doneByName}` : ''}`}
              disabled={!canToggle}
              onPress={() => onToggle(s)}
              style={({ pressed }) => [styles.row, pressed && { opacity: 0.7 }]}
            >
              <Box on={done} />
              <View style={{ flex: 1 }}>
                <Txt>
                  <Mono>{s.seq}.</Mono> {s.text}
                </Txt>
                {done ? (
                  <Txt variant="small" tone="soft">
                    Done{s.doneByName ? ` by ${s.doneByName}` : ''} · {new Date(s.doneAt!).toLocaleString()}
                  </Txt>
                ) : null}
              </View>
            </Toggle>
          );
        })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    gap: space.md,
    alignItems: 'center',
    minHeight: touch,
    paddingVertical: space.sm,
    borderBottomWidth: hairline,
    borderColor: colors.rule,
  },
  box: {
    width: 28,
    height: 28,
    borderWidth: 2,
    borderColor: colors.ink,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colors.paperRaised,
  },
});
