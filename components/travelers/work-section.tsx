import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { z } from 'zod';
import { helpWords, whoWithHelp, type PartWork, type WorkSession } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormError } from '@/components/forms/form-error';
import { FormTextField } from '@/components/forms/form-fields';
import { useFormSubmit } from '@/components/forms/use-form-submit';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/sheet';
import { Mono, Txt } from '@/components/ui/text';
import { ApiError } from '@/lib/api-client';
import { useWorkStartMutation, useWorkStopMutation } from '@/hooks/queries/bench-actions';
import { useWorkHoursMutation } from '@/hooks/queries/travelers';
import { hoursText } from '@/lib/hours-text';
import { zonedDateTime } from '@/lib/zoned-time';
import type { StepCredit } from './steps-list';

/** What the form holds: the day and time the work began on the device's clock, and the hours as typed. */
const hoursForm = z.object({
  day: z
    .string()
    .trim()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'give the day as 2026-11-03'),
  start: z
    .string()
    .trim()
    .regex(/^\d{1,2}:\d{2}$/, 'give the time work began, e.g. 09:00'),
  hours: z.string().trim().min(1, 'give the hours worked, e.g. 1.5'),
});
type HoursValues = z.infer<typeof hoursForm>;

const helpOf = (s: Pick<WorkSession, 'by' | 'byName'>) => {
  const help = helpWords(s.by, s.byName);
  return help ? ` · work of ${help}` : '';
};

function sessionLine(s: WorkSession): string {
  const from = zonedDateTime(s.startedAt);
  const span = s.endedAt ? hoursText((Date.parse(s.endedAt) - Date.parse(s.startedAt)) / 3_600_000) : 'running';
  return `${from.date} ${from.hm} · ${span} · ${s.personName}${helpOf(s)}${s.entered ? ' · entered afterwards' : ''}`;
}

/**
 * Time worked on the part: a session started and stopped at the bench, or hours entered afterwards,
 * credited as the chooser above the steps says (the builder, or named help). The sums come from the server.
 */
export function WorkSection({
  travelerId,
  work,
  canWork,
  credit,
  onCreditError,
}: {
  travelerId: string;
  work: PartWork | undefined;
  canWork: boolean;
  credit: StepCredit;
  onCreditError: (message: string | undefined) => void;
}) {
  const start = useWorkStartMutation(travelerId);
  const stop = useWorkStopMutation(travelerId);
  const enter = useWorkHoursMutation(travelerId);
  // Today by the device's clock, read once when the form is made.
  const [today] = useState(() => zonedDateTime(new Date()).date);
  const { control, handleSubmit, setError, reset } = useForm<HoursValues>({
    resolver: zodResolver(hoursForm),
    defaultValues: { day: today, start: '09:00', hours: '' },
  });
  const helped = credit.by !== 'builder' ? { byName: credit.byName } : {};
  const { submit, formError } = useFormSubmit({
    handleSubmit,
    setError,
    toField: (path) => (path === 'startedAt' ? 'day' : path === 'hours' ? 'hours' : null),
    send: async (v) => {
      onCreditError(undefined);
      try {
        await enter.mutateAsync({
          startedAt: new Date(`${v.day}T${v.start.padStart(5, '0')}:00`).toISOString(),
          hours: Number(v.hours),
          by: credit.by,
          ...helped,
        });
      } catch (e) {
        // The help's name is asked by the chooser above the steps: its box shows the server's words.
        onCreditError(e instanceof ApiError ? e.fields?.byName : undefined);
        throw e;
      }
      reset({ day: v.day, start: v.start, hours: '' });
    },
  });
  const running = work?.running ?? null;

  return (
    <Section title="Time worked">
      <View style={{ gap: space.sm }} testID="work-section">
        <Txt testID="work-total">
          <Mono bold>{hoursText(work?.totalHours ?? 0)}</Mono> on this part
          {work?.byWho.length
            ? `: ${work.byWho.map((w) => `${whoWithHelp(w.who, w.by)} ${hoursText(w.hours)}`).join(', ')}`
            : ''}
        </Txt>
        {canWork ? (
          running ? (
            <View style={{ gap: space.xs }}>
              <Txt testID="work-running">
                Working since {zonedDateTime(running.startedAt).hm}
                {helpOf(running)}
              </Txt>
              <Button label="Stop work" onPress={() => stop.mutate()} testID="work-stop" />
            </View>
          ) : (
            <Button
              label="Start work"
              variant="secondary"
              onPress={() => {
                onCreditError(undefined);
                start.mutate(
                  { by: credit.by, ...helped },
                  { onError: (e) => onCreditError(e instanceof ApiError ? e.fields?.byName : undefined) },
                );
              }}
              testID="work-start"
            />
          )
        ) : null}
        {canWork ? (
          <View style={{ gap: space.sm }} testID="work-hours-form">
            <Txt bold>Enter hours afterwards</Txt>
            <FormTextField control={control} name="day" label="Day" testID="work-day" inputMode="numeric" />
            <FormTextField
              control={control}
              name="start"
              label="Began at"
              testID="work-start-time"
              inputMode="numeric"
            />
            <FormTextField control={control} name="hours" label="Hours" testID="work-hours" inputMode="decimal" />
            <FormError message={formError} testID="work-hours-error" />
            <Button label="Add the hours" variant="secondary" onPress={submit} testID="work-hours-add" />
          </View>
        ) : null}
        {work?.recent.length ? (
          <View testID="work-recent">
            {work.recent.map((s) => (
              <Txt key={s.id} variant="small" tone="soft">
                {sessionLine(s)}
              </Txt>
            ))}
          </View>
        ) : null}
      </View>
    </Section>
  );
}
