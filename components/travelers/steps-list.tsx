import { StyleSheet, View } from 'react-native';
import { helpWords, stepKindLabels, stepPerformerLabels, stepPerformers, type StepPerformer } from '@/db/contracts';
import { colors, hairline, space, touch } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Label, Mono, Txt } from '@/components/ui/text';
import { CheckBox, Toggle } from '@/components/ui/toggle';
import type { TravelerStep } from '@/hooks/queries/travelers';

/** Who did the work of the steps ticked next: the builder, or help named by the builder. */
export type StepCredit = { by: StepPerformer; byName: string };

/** The chooser above the steps: whose work the next step ticked records (the credit in the fabrication table). */
export function StepCreditChooser({
  value,
  onChange,
  nameError,
}: {
  value: StepCredit;
  onChange: (v: StepCredit) => void;
  nameError?: string;
}) {
  return (
    <View style={{ gap: space.sm }} testID="step-credit">
      <Choice
        label="Work done by"
        testIDPrefix="step-by"
        options={stepPerformers.map((p) => ({ value: p, label: stepPerformerLabels[p] }))}
        value={value.by}
        onChange={(by) => onChange({ ...value, by })}
      />
      {value.by !== 'builder' ? (
        <Field label={value.by === 'helper' ? 'Helper’s name' : 'Name of the shop or person'} error={nameError}>
          <TextBox
            value={value.byName}
            onChangeText={(byName) => onChange({ ...value, byName })}
            maxLength={120}
            invalid={!!nameError}
            testID="step-by-name"
          />
        </Field>
      ) : null}
    </View>
  );
}

const when = (iso: string) => new Date(iso).toLocaleString();

/** What a step's second line says: who recorded it done and whose work it was, and its stamp. */
function stepFacts(s: TravelerStep): string[] {
  const out: string[] = [stepKindLabels[s.kind]];
  if (s.doneAt) {
    const by = helpWords(s.by, s.byName);
    const help = by ? `; work by ${by}` : '';
    out.push(`Done${s.doneByName ? ` by ${s.doneByName}` : ''}${help} · ${when(s.doneAt)}`);
  }
  if (s.inspectionPoint) {
    out.push(
      s.stampedAt
        ? `Stamped${s.stampedByName ? ` by ${s.stampedByName}` : ''} · ${when(s.stampedAt)}`
        : s.doneAt
          ? 'Waiting for an inspector’s stamp: later steps wait for it'
          : 'Inspection point: an inspector stamps it before later steps',
    );
  }
  return out;
}

/** The shop steps, each signed as done by the builder; an inspection point stamped by an inspector. */
export function StepsList({
  steps,
  canToggle,
  canStamp,
  onToggle,
  onStamp,
}: {
  steps: TravelerStep[];
  canToggle: boolean;
  canStamp: boolean;
  onToggle: (s: TravelerStep) => void;
  onStamp: (s: TravelerStep) => void;
}) {
  if (!steps.length) return <Txt tone="soft">This part has no shop steps listed.</Txt>;
  return (
    <View testID="steps">
      {[...steps]
        .sort((a, b) => a.seq - b.seq)
        .map((s) => {
          const done = !!s.doneAt;
          const facts = stepFacts(s);
          return (
            <View key={s.id} style={styles.row}>
              <Toggle
                kind="checkbox"
                checked={done}
                testID={`step-${s.seq}`}
                accessibilityLabel={`Step ${s.seq}: ${s.text}. ${facts.join('. ')}`}
                disabled={!canToggle}
                onPress={() => onToggle(s)}
                style={({ pressed }) => [styles.toggle, pressed && { opacity: 0.7 }]}
              >
                <CheckBox on={done} />
                <View style={{ flex: 1, gap: 2 }}>
                  <Txt>
                    <Mono>{s.seq}.</Mono> {s.text}
                  </Txt>
                  {s.inspectionPoint ? (
                    <Label tone={s.stampedAt ? 'accent' : 'ink'} testID={`step-point-${s.seq}`}>
                      {s.stampedAt ? 'Inspection point · stamped' : 'Inspection point'}
                    </Label>
                  ) : null}
                  {facts.map((f, i) => (
                    <Txt key={i} variant="small" tone="soft">
                      {f}
                    </Txt>
                  ))}
                </View>
              </Toggle>
              {canStamp && s.inspectionPoint && done && !s.stampedAt ? (
                <Button
                  label="Stamp"
                  variant="secondary"
                  compact
                  onPress={() => onStamp(s)}
                  testID={`step-stamp-${s.seq}`}
                  accessibilityLabel={`Stamp inspection point ${s.seq}: ${s.text}`}
                />
              ) : null}
            </View>
          );
        })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    gap: space.sm,
    alignItems: 'center',
    borderBottomWidth: hairline,
    borderColor: colors.rule,
  },
  toggle: {
    flex: 1,
    flexDirection: 'row',
    gap: space.md,
    alignItems: 'center',
    minHeight: touch,
    paddingVertical: space.sm,
  },
});
