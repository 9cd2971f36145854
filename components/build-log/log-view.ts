import { logEntryMatches, type BuildLogEntry, type BuildLogGroup } from '@/db/contracts';
import { zonedDateTime } from '@/lib/zoned-time';

/**
 * The build log screen's filters and day grouping, as plain functions so the list stays a view.
 * The server narrows by family and part; the same test runs here so a filter shows at once, on the
 * entries already loaded, while the narrower answer is on its way.
 */
export type LogFilters = { group: BuildLogGroup | 'all'; travelerId: string | null; text: string };

export const noLogFilters: LogFilters = { group: 'all', travelerId: null, text: '' };

export function isFiltered(f: LogFilters): boolean {
  return f.group !== 'all' || f.travelerId !== null || f.text.trim() !== '';
}

export function filterEntries(entries: readonly BuildLogEntry[], f: LogFilters): BuildLogEntry[] {
  return entries.filter(
    (e) =>
      (f.group === 'all' || e.group === f.group) &&
      (f.travelerId === null || e.travelerId === f.travelerId) &&
      logEntryMatches(e, f.text),
  );
}

/** The calendar day (YYYY-MM-DD) of a moment on the clock of `timeZone` (the device's when not given). */
export function dayOf(iso: string, timeZone?: string): string {
  return zonedDateTime(iso, timeZone).date;
}

/** "Tuesday, 1 December 2026" for a YYYY-MM-DD day; the day itself is the calendar's, no zone applies. */
export function dayLabel(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString(undefined, {
    timeZone: 'UTC',
    weekday: 'long',
    day: 'numeric',
    month: 'long',
    year: 'numeric',
  });
}

export type LogDay = { day: string; entries: BuildLogEntry[] };

/** Entries by calendar day, days and entries in the order given (the log comes newest first). */
export function groupByDay(entries: readonly BuildLogEntry[], timeZone?: string): LogDay[] {
  const days = new Map<string, LogDay>();
  for (const e of entries) {
    const day = dayOf(e.at, timeZone);
    const found = days.get(day);
    if (found) found.entries.push(e);
    else days.set(day, { day, entries: [e] });
  }
  return [...days.values()];
}

/** One flat list for a FlatList: a heading row per day, then its entries. */
export type LogRow =
  { type: 'day'; key: string; day: string; count: number } | { type: 'entry'; key: string; entry: BuildLogEntry };

export function logRows(entries: readonly BuildLogEntry[], timeZone?: string): LogRow[] {
  return groupByDay(entries, timeZone).flatMap(({ day, entries: es }) => [
    { type: 'day' as const, key: `day-${day}`, day, count: es.length },
    ...es.map((entry) => ({ type: 'entry' as const, key: entry.id, entry })),
  ]);
}

/** "14 entries over 3 days". */
export function countLine(entries: readonly BuildLogEntry[], timeZone?: string): string {
  const days = groupByDay(entries, timeZone).length;
  const n = entries.length;
  return `${n} ${n === 1 ? 'entry' : 'entries'}${n ? ` over ${days} ${days === 1 ? 'day' : 'days'}` : ''}`;
}

/** "14:05" on the device's clock (or `timeZone`'s), as the exports print it. */
export function timeOf(iso: string, timeZone?: string): string {
  return zonedDateTime(iso, timeZone).hm;
}
