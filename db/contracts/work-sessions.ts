import { z } from 'zod';
import { deviceTime, isLogDate } from './build-log';
import { plainText } from './common';
import { creditFields, helpIsNamed, helpUnnamed, type StepPerformer } from './travelers';

/** The longest session or entry of hours a part takes at once: a long day at the bench (common practice). */
export const MAX_SESSION_HOURS = 16;

const hours = z
  .number({ message: 'hours must be a number' })
  .positive('hours must be more than 0')
  .max(MAX_SESSION_HOURS, `at most ${MAX_SESSION_HOURS} hours at once: enter a long job day by day`)
  .refine((h) => Number.isInteger(h * 60), 'give hours to the minute, e.g. 1.25 or 0.5');

/** POST /api/travelers/:id/work/start: a session on the part starts now (the device's time). */
export const workStartInput = deviceTime.extend(creditFields).refine(helpIsNamed, helpUnnamed);
export type WorkStartInput = z.input<typeof workStartInput>;
export type WorkStartChange = z.output<typeof workStartInput>;

/**
 * POST /api/travelers/:id/work/stop: the person's running session ends now, or after `hours` when the
 * bench forgot to stop it.
 */
export const workStopInput = deviceTime.extend({ hours: hours.optional() });
export type WorkStopInput = z.input<typeof workStopInput>;
export type WorkStopChange = z.output<typeof workStopInput>;

/** POST /api/travelers/:id/work/hours: hours worked entered afterwards, from the moment they began. */
export const workHoursInput = z
  .object({
    startedAt: z
      .string({ message: 'startedAt must be a date and time' })
      .refine(
        (s) => s.includes('T') && isLogDate(s),
        'startedAt must be a date and time with its offset, such as 2026-11-03T09:00:00+01:00',
      ),
    hours,
    ...creditFields,
  })
  .refine(helpIsNamed, helpUnnamed);
export type WorkHoursInput = z.input<typeof workHoursInput>;
export type WorkHoursChange = z.output<typeof workHoursInput>;

export type WorkSession = {
  id: string;
  personName: string;
  by: StepPerformer;
  byName: string | null;
  startedAt: string;
  endedAt: string | null;
  /** Typed in afterwards rather than timed at the bench. */
  entered: boolean;
};

/** Hours worked by one person or one named helper. */
export type HoursByWho = { who: string; by: StepPerformer; hours: number };

/** A part's time worked: the reader's running session, the latest sessions, and the sums. */
export type PartWork = {
  running: WorkSession | null;
  /** Newest first, at most 20; the sums count them all. */
  recent: WorkSession[];
  totalHours: number;
  byWho: HoursByWho[];
};

/**
 * POST /api/travelers/:id/photos (multipart, 1–6 files in `photos`): photos of the work, of one step,
 * of a run of holes, or of the part as a whole, with a few words.
 */
export const workPhotosInput = z.object({
  stepId: z.uuid({ message: 'stepId must be the id of a step of this part' }).optional(),
  holeIds: z.array(z.string().trim().min(1).max(20)).max(500, 'at most 500 holes at a time').default([]),
  note: plainText('the note', 0, 500).default(''),
});
export type WorkPhotosInput = z.input<typeof workPhotosInput>;
export type WorkPhotosChange = z.output<typeof workPhotosInput>;
