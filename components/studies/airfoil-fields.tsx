import { useState } from 'react';
import { Controller, useWatch, type Control, type UseFormSetValue } from 'react-hook-form';
import { Platform, View } from 'react-native';
import { parseCoordinateText } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormTextField } from '@/components/forms/form-fields';
import { Button } from '@/components/ui/button';
import { Choice } from '@/components/ui/choice';
import { Field, TextBox } from '@/components/ui/field';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import type { StudyFormValues } from './study-form-values';

const MAX_FILE_BYTES = 256 * 1024;

/** Opens the browser's file chooser through a hidden input and reads the chosen file as text. */
function pickTextFile(): Promise<{ name: string; text: string } | { error: string } | null> {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return Promise.resolve(null);
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = '.dat,.txt,.csv,text/plain';
    input.style.display = 'none';
    const done = (v: Parameters<typeof resolve>[0]) => {
      input.remove();
      resolve(v);
    };
    input.addEventListener('cancel', () => done(null));
    input.onchange = async () => {
      const f = input.files?.[0];
      if (!f) return done(null);
      if (f.size > MAX_FILE_BYTES)
        return done({
          error: `${f.name} is ${Math.round(f.size / 1024)} kB: an airfoil file is a few kB of x y pairs.`,
        });
      try {
        done({ name: f.name, text: await f.text() });
      } catch {
        done({ error: `${f.name} could not be read.` });
      }
    };
    document.body.appendChild(input);
    input.click();
  });
}

export const pointsToText = (points: readonly [number, number][]): string =>
  points.map(([x, y]) => `${x} ${y}`).join('\n');

/** Airfoil as a NACA designation, or as coordinates pasted or loaded from a file (x y a line). */
export function AirfoilFields({
  control,
  setValue,
  errors,
}: {
  control: Control<StudyFormValues>;
  setValue: UseFormSetValue<StudyFormValues>;
  errors: { root?: string; points?: string };
}) {
  const airfoil = useWatch({ control, name: 'inputs.airfoil' });
  const kind = airfoil?.kind ?? 'naca';
  // What was typed in the other mode stays, so switching back and forth loses nothing.
  const [designation, setDesignation] = useState(airfoil?.kind === 'naca' ? (airfoil.designation ?? '') : '');
  const [text, setText] = useState(() => (airfoil?.kind === 'coordinates' ? pointsToText(airfoil.points ?? []) : ''));
  const [fileNote, setFileNote] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const count = airfoil?.kind === 'coordinates' ? (airfoil.points?.length ?? 0) : 0;

  const opts = { shouldValidate: true, shouldDirty: true } as const;
  const takeText = (t: string, name?: string) => {
    setText(t);
    const current = airfoil?.kind === 'coordinates' ? airfoil.name : undefined;
    setValue('inputs.airfoil', { kind: 'coordinates', name: name ?? current, points: parseCoordinateText(t) }, opts);
  };

  const switchTo = (k: 'naca' | 'coordinates') => {
    if (k === kind) return;
    if (k === 'naca') {
      setValue('inputs.airfoil', { kind: 'naca', designation }, opts);
    } else {
      if (airfoil?.kind === 'naca') setDesignation(airfoil.designation ?? '');
      setValue('inputs.airfoil', { kind: 'coordinates', points: parseCoordinateText(text) }, opts);
    }
  };

  const load = async () => {
    setFileNote(null);
    const got = await pickTextFile();
    if (!got) return;
    if ('error' in got) {
      setFileNote({ tone: 'error', text: got.error });
      return;
    }
    const pts = parseCoordinateText(got.text);
    takeText(got.text, got.name.replace(/\.[^.]+$/, '').slice(0, 80));
    setFileNote(
      pts.length
        ? { tone: 'ok', text: `${got.name}: ${pts.length} points read.` }
        : { tone: 'error', text: `${got.name} has no lines of two numbers.` },
    );
  };

  return (
    <View style={{ gap: space.md }}>
      <Field label="Airfoil given as" error={errors.root}>
        <Choice
          testIDPrefix="study-airfoil-kind"
          value={kind}
          onChange={switchTo}
          options={[
            { value: 'naca', label: 'NACA designation' },
            { value: 'coordinates', label: 'Coordinates' },
          ]}
        />
      </Field>
      {kind === 'naca' ? (
        <FormTextField
          control={control}
          name="inputs.airfoil.designation"
          label="NACA designation"
          hint="Four or five digits, e.g. 2412 or 23012"
          testID="study-naca"
          mono
          autoCapitalize="characters"
        />
      ) : (
        <>
          <FormTextField
            control={control}
            name="inputs.airfoil.name"
            label="Airfoil name (optional)"
            testID="study-airfoil-name"
          />
          <Controller
            control={control}
            name="inputs.airfoil.points"
            render={({ fieldState }) => (
              <Field
                label="Coordinates"
                hint="One x y pair a line, x from 0 to 1 (Selig or Lednicer order); other lines are skipped."
                error={fieldState.error?.message ?? errors.points}
                testID="study-coordinates-field"
              >
                <TextBox
                  mono
                  multiline
                  value={text}
                  onChangeText={(t) => takeText(t)}
                  placeholder={'1.0000 0.0013\n0.9500 0.0147\n…'}
                  testID="study-coordinates"
                  accessibilityLabel="Airfoil coordinates"
                  invalid={!!fieldState.error}
                  style={{ minHeight: 160 }}
                />
              </Field>
            )}
          />
          <View style={{ flexDirection: 'row', gap: space.md, alignItems: 'center', flexWrap: 'wrap' }}>
            {Platform.OS === 'web' ? (
              <Button
                label="Load a coordinate file"
                variant="secondary"
                compact
                onPress={() => void load()}
                testID="study-coordinates-file"
              />
            ) : null}
            <Txt variant="small" tone="soft" testID="study-coordinates-count">
              <Mono variant="small" bold>
                {count}
              </Mono>{' '}
              points read
            </Txt>
          </View>
          {fileNote ? <Notice tone={fileNote.tone}>{fileNote.text}</Notice> : null}
        </>
      )}
    </View>
  );
}
