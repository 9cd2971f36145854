import type { BuildLog } from '../../db/contracts';
import { zonedDateTime } from './zoned-time';

/**
 * RFC 4180: a field with a comma, quote, CR or LF goes in double quotes with its quotes doubled.
 * A field a spreadsheet would run as a formula (= + - @, tab, CR first) gets a leading apostrophe:
 * notes are typed by people, and the file is opened by other people.
 */
export function csvField(value: string | number | null | undefined): string {
  let s = value === null || value === undefined ? '' : String(value);
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const csvRow = (fields: readonly (string | number | null | undefined)[]) => fields.map(csvField).join(',');

/** Oldest first, like a log book: a record reads from the start of the build. */
export function renderLogCsv(log: BuildLog, { tz }: { tz: string }): string {
  const header = ['Date', 'Time', 'Time zone', 'UTC', 'Who', 'Role', 'Kind', 'Part number', 'Part name', 'Traveler serial',
    'Holes', 'What happened', 'Note', 'Finding id', 'Photos'];
  const rows = [...log.entries].reverse().map((e) => {
    const local = zonedDateTime(new Date(e.at), tz);
    return csvRow([
      local.date, local.time, tz, e.at, e.actorName, e.actorRole, e.kind, e.partNumber, e.partName, e.travelerSerial,
      (e.holeIds ?? []).join(' '), e.text, e.note ?? '', e.findingId ?? '', e.photos?.length ?? '',
    ]);
  });
  // The byte-order mark lets spreadsheet programs read the file as UTF-8 (names, curly quotes).
  return `\uFEFF${[csvRow(header), ...rows].join('\r\n')}\r\n`;
}
