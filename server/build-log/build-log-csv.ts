import { buildLogKindLabels, chainHeadCell, logCsvColumns, type BuildLogEntry } from '../../db/contracts';
import { timingNote } from '../../lib/log-timing';
import { zonedDateTime } from '../../lib/zoned-time';

/**
 * RFC 4180: a field with a comma, quote, CR or LF goes in double quotes with its quotes doubled.
 * A text field a spreadsheet would run as a formula (= + - @, tab, CR first) gets a leading apostrophe:
 * notes are typed by people, and the file is opened by other people.
 */
export function csvField(value: string | number | null | undefined): string {
  let s = value === null || value === undefined ? '' : String(value);
  // A number is never a formula: a negative one stays a number.
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export const csvRow = (fields: readonly (string | number | null | undefined)[]) => fields.map(csvField).join(',');

const HEADER = [
  logCsvColumns.dateDone,
  logCsvColumns.timeDone,
  'Time zone',
  'Done (UTC)',
  'Received (UTC)',
  'Device clock behind by (s)',
  'Who',
  'Role',
  'Kind',
  'Part number',
  'Part name',
  'Traveler serial',
  'Holes',
  logCsvColumns.what,
  'Note',
  'Times',
  'Finding id',
  'Photos',
  logCsvColumns.entry,
  logCsvColumns.entryHash,
];

/** The file's start: the byte-order mark lets spreadsheet programs read it as UTF-8 (names, curly quotes). */
export const csvHead = () => `\uFEFF${csvRow(HEADER)}\r\n`;

/**
 * Rows of entries, each ended by CRLF; the caller writes them oldest first, like a log book. Kinds in
 * words, both times (done by the device's clock, received by the server's), photo links made absolute
 * on `publicUrl`, and each entry's link in the build's hash chain.
 */
export function csvLines(entries: readonly BuildLogEntry[], tz: string, publicUrl: string): string {
  let out = '';
  for (const e of entries) {
    const local = zonedDateTime(new Date(e.at), tz);
    out += `${csvRow([
      local.date,
      local.time,
      tz,
      e.at,
      e.receivedAt,
      e.clockOffsetMs === null ? '' : Math.round(e.clockOffsetMs / 1000),
      e.actorName,
      e.actorRole,
      buildLogKindLabels[e.kind],
      e.partNumber,
      e.partName,
      e.travelerSerial,
      (e.holeIds ?? []).join(' '),
      e.text,
      e.note ?? '',
      timingNote(e, tz) ?? '',
      e.findingId ?? '',
      (e.photos ?? []).map((p) => `${publicUrl}${p.url}`).join(' '),
      e.id,
      e.hash ?? '',
    ])}\r\n`;
  }
  return out;
}

/** The last row: the chain's head when the file was made, which a later check of the file starts from. */
export function csvChainHead(head: { seq: number; hash: string } | null): string {
  const row: string[] = HEADER.map(() => '');
  row[HEADER.indexOf(logCsvColumns.what)] = chainHeadCell(head);
  return `${csvRow(row)}\r\n`;
}
