import { clockIsOff, type BuildLogEntry } from '../db/contracts';
import { zonedDateTime } from './zoned-time';

/** Sent this long after it was done, an entry says when it arrived (work done without signal). */
export const SENT_LATER_MS = 5 * 60_000;

/**
 * What the log says beside an entry about its times, in words, or null when there is nothing to say: when
 * it reached the server if that was well after the work, and a device clock far from the server's. The
 * screen, the PDF and the CSV print the same words.
 */
export function timingNote(e: Pick<BuildLogEntry, 'at' | 'receivedAt' | 'clockOffsetMs'>, tz?: string): string | null {
  const notes: string[] = [];
  const lag = Date.parse(e.receivedAt) - Date.parse(e.at);
  if (lag > SENT_LATER_MS) {
    const r = zonedDateTime(e.receivedAt, tz);
    notes.push(`Done on the device; received ${r.date} ${r.hm}.`);
  }
  if (clockIsOff(e.clockOffsetMs)) {
    const minutes = Math.round(Math.abs(e.clockOffsetMs!) / 60_000);
    const span = minutes >= 120 ? `${Math.round(minutes / 60)} hours` : `${minutes} min`;
    notes.push(
      `Device clock ${span} ${e.clockOffsetMs! > 0 ? 'behind' : 'ahead of'} the server’s: this time may be off by as much.`,
    );
  }
  return notes.length ? notes.join(' ') : null;
}
