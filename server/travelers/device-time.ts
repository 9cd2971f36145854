import type { DeviceTime } from '../../db/contracts';
import { badRequest } from '../http-error';

/** The largest clock offset kept (the column is a 32-bit integer of milliseconds: about 24 days). */
const MAX_OFFSET_MS = 2 ** 31 - 1;
/** A device with no send time may still be a little ahead of the server: its clock is not ours. */
const AHEAD_ALLOWED_MS = 5 * 60_000;

export type BenchTime = { doneAt: Date | null; clockOffsetMs: number | null };
export type BenchTimeRefusal = { message: string; field: 'doneAt' | 'sentAt' };

/**
 * When a bench action was done and how far off the device's clock was, from what the device sent and the
 * moment it arrived. Both device times are read on the same clock, so "done after it was sent" is a
 * faulty device, not clock drift. Without a device time the server's own (null) stands.
 */
export function benchTime(input: DeviceTime, arrival: Date): BenchTime | BenchTimeRefusal {
  const done = input.doneAt ? new Date(input.doneAt) : null;
  const sent = input.sentAt ? new Date(input.sentAt) : null;
  if (done && sent && done.getTime() > sent.getTime()) {
    return { field: 'doneAt', message: 'doneAt is after sentAt: work cannot be done after it was sent' };
  }
  let clockOffsetMs: number | null = null;
  if (sent) {
    clockOffsetMs = arrival.getTime() - sent.getTime();
    if (Math.abs(clockOffsetMs) > MAX_OFFSET_MS) {
      return {
        field: 'sentAt',
        message: `this device's clock is ${Math.round(Math.abs(clockOffsetMs) / 86_400_000)} days off the server's: set its date and time, then do the work again`,
      };
    }
  } else if (done && done.getTime() > arrival.getTime() + AHEAD_ALLOWED_MS) {
    return { field: 'doneAt', message: 'doneAt is in the future: check the device’s date and time' };
  }
  return { doneAt: done, clockOffsetMs };
}

/** The device's time of an action, read against the moment it arrived; a faulty one is a 400 naming the field. */
export function benchTimeOf(input: DeviceTime, arrival = new Date()): BenchTime {
  const when = benchTime(input, arrival);
  if ('message' in when) throw badRequest(when.message, { [when.field]: when.message });
  return when;
}
