import type { BuildLogEntry } from '../../db/contracts';
import { zonedDateTime } from '../../lib/zoned-time';

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

const HEADER = [
  'Date',
  'Time',
  'Time zone',
  'UTC',
  'Who',
  'Role',
  'Kind',
  'Part number',
  'Part name',
  'Traveler serial',
  'Holes',
  'What happened',
  'Note',
  'Finding id',
  'Photos',
];

/** The file's start: the byte-order mark lets spreadsheet programs read it as UTF-8 (names, curly quotes). */
export const csvHead = () => `\uFEFF${csvRow(HEADER)}\r\n`;

/** Rows of entries, each ended by CRLF; the caller writes them oldest first, like a log book. */
export function csvLines(entries: readonly BuildLogEntry[], tz: string): string {
  let out = '';
  for (const e of entries) {
    const local = zonedDateTime(new Date(e.at), tz);
    out += `${csvRow([
      local.date,
      local.time,
      tz,
      e.at,
      e.actorName,
      e.actorRole,
      e.kind,
      e.partNumber,
      e.partName,
      e.travelerSerial,
      (e.holeIds ?? []).join(' '),
      e.text,
      e.note ?? '',
      e.findingId ?? '',
      e.photos?.length ?? '',
    ])}\r\n`;
  }
  return out;
}
