import { describeHoleRuns, expandKindFilter, logEntryMatches, type BuildLogEntry } from '@/db/contracts';
import {
  countLine,
  dayOf,
  filterEntries,
  groupByDay,
  isFiltered,
  timeOf,
  logRows,
  noLogFilters,
} from '@/components/build-log/log-view';
import { logEntry } from '../fixtures/build-log';

const e = (over: Partial<BuildLogEntry>): BuildLogEntry =>
  logEntry({ id: Math.random().toString(36).slice(2), ...over });

// Newest first, as the server sends them.
const log = [
  e({
    id: 'sign',
    at: '2026-11-04T16:00:00.000Z',
    kind: 'signed_off',
    group: 'sign_off',
    travelerId: 'outer',
    partNumber: 'W-105',
    travelerSerial: 'NK2-0147-W-105',
    actorName: 'Priya Ashdown',
    actorRole: 'inspector',
    text: 'Signed the part off.',
    holeIds: undefined,
  }),
  e({
    id: 'flag',
    at: '2026-11-04T02:30:00.000Z',
    kind: 'finding_raised',
    group: 'findings',
    text: 'Flagged hole U-09 as suspect: elongated hole.',
    holeIds: ['U-09'],
    note: 'Oval, about a drill size long',
    findingId: 'f1',
  }),
  e({
    id: 'step',
    at: '2026-11-03T18:00:00.000Z',
    kind: 'step_done',
    group: 'bench',
    text: 'Step 1 done: Deburr all holes',
    holeIds: undefined,
  }),
  e({ id: 'tick', at: '2026-11-03T15:00:00.000Z' }),
];
const ids = (xs: { id: string }[]) => xs.map((x) => x.id);

describe('the build log view', () => {
  it('shows everything with no filters, and knows when a filter is on', () => {
    expect(ids(filterEntries(log, noLogFilters))).toEqual(['sign', 'flag', 'step', 'tick']);
    expect(isFiltered(noLogFilters)).toBe(false);
    expect(isFiltered({ ...noLogFilters, text: '  ' })).toBe(false);
    expect(isFiltered({ ...noLogFilters, group: 'findings' })).toBe(true);
  });

  it('filters by kind family: bench, findings, sign-off', () => {
    expect(ids(filterEntries(log, { ...noLogFilters, group: 'bench' }))).toEqual(['step', 'tick']);
    expect(ids(filterEntries(log, { ...noLogFilters, group: 'findings' }))).toEqual(['flag']);
    expect(ids(filterEntries(log, { ...noLogFilters, group: 'sign_off' }))).toEqual(['sign']);
  });

  it('filters by part, and by every word of a search over hole, part, person and note', () => {
    expect(ids(filterEntries(log, { ...noLogFilters, travelerId: 'outer' }))).toEqual(['sign']);
    expect(ids(filterEntries(log, { ...noLogFilters, text: 'u-09' }))).toEqual(['flag']);
    expect(ids(filterEntries(log, { ...noLogFilters, text: 'drill oval' }))).toEqual(['flag']);
    expect(ids(filterEntries(log, { ...noLogFilters, text: 'priya W-105' }))).toEqual(['sign']);
    expect(ids(filterEntries(log, { ...noLogFilters, text: 'priya W-104' }))).toEqual([]);
    expect(logEntryMatches(log[3], 'installed u-02')).toBe(true);
  });

  it('groups by calendar day on the reader’s clock, newest day first', () => {
    expect(groupByDay(log, 'UTC').map((d) => [d.day, ids(d.entries)])).toEqual([
      ['2026-11-04', ['sign', 'flag']],
      ['2026-11-03', ['step', 'tick']],
    ]);
    // 02:30 UTC on the 4th is still the evening of the 3rd in Denver.
    expect(dayOf('2026-11-04T02:30:00.000Z', 'America/Denver')).toBe('2026-11-03');
    expect(groupByDay(log, 'America/Denver').map((d) => [d.day, ids(d.entries)])).toEqual([
      ['2026-11-04', ['sign']],
      ['2026-11-03', ['flag', 'step', 'tick']],
    ]);
  });

  it('reads times on the reader’s clock across a DST change', () => {
    // US daylight time ends on the first Sunday of November at 02:00 local (15 U.S.C. 260a, as amended in
    // 2005): 1 November 2026 in Denver, when 08:00 UTC is 02:00 MDT, read as 01:00 MST. The hour 01:00–02:00
    // is seen twice, an hour apart.
    expect(timeOf('2026-11-01T07:30:00.000Z', 'America/Denver')).toBe('01:30');
    expect(timeOf('2026-11-01T08:30:00.000Z', 'America/Denver')).toBe('01:30');
    expect(timeOf('2026-11-01T09:30:00.000Z', 'America/Denver')).toBe('02:30');
    // India has kept UTC+05:30 all year since 1945 (the IANA tz database's `asia` file, from memory).
    expect(timeOf('2026-11-03T18:40:00.000Z', 'Asia/Kolkata')).toBe('00:10');
    expect(dayOf('2026-11-03T18:40:00.000Z', 'Asia/Kolkata')).toBe('2026-11-04');
  });

  it('flattens days and entries into one list for the timeline, with a heading per day', () => {
    const rows = logRows(log, 'UTC');
    expect(rows.map((r) => (r.type === 'day' ? `${r.day}:${r.count}` : r.entry.id))).toEqual([
      '2026-11-04:2',
      'sign',
      'flag',
      '2026-11-03:2',
      'step',
      'tick',
    ]);
    expect(new Set(rows.map((r) => r.key)).size).toBe(rows.length);
    expect(logRows([], 'UTC')).toEqual([]);
  });

  it('counts entries and days in plain words', () => {
    expect(countLine(log, 'UTC')).toBe('4 entries over 2 days');
    expect(countLine(log.slice(0, 1), 'UTC')).toBe('1 entry over 1 day');
    expect(countLine([], 'UTC')).toBe('0 entries');
  });

  it('writes hole ids as short runs', () => {
    expect(describeHoleRuns(['U-01', 'U-02', 'U-03', 'U-07'])).toBe('U-01 to U-03, U-07');
    expect(describeHoleRuns(['U-01', 'U-02'])).toBe('U-01, U-02');
    expect(describeHoleRuns(['L-09', 'L-10', 'L-11', 'U-01'])).toBe('L-09 to L-11, U-01');
    expect(describeHoleRuns(['U-9', 'U-10', 'U-11'])).toBe('U-9, U-10, U-11');
  });

  it('reads a kind family as its kinds', () => {
    expect(expandKindFilter(['sign_off'])).toEqual(['step_stamped', 'signed_off', 'sign_off_withdrawn']);
    expect(expandKindFilter(['bench'])).toEqual([
      'holes_installed',
      'holes_pending',
      'step_done',
      'step_undone',
      'part_replaced',
      'work_started',
      'work_stopped',
      'hours_entered',
      'photos_added',
      'revision_changed',
      'other',
    ]);
    expect(expandKindFilter(['findings', 'finding_raised'])).toHaveLength(6);
    expect(expandKindFilter(['notices'])).toEqual(['notice_received', 'notice_acknowledged', 'notice_answered']);
  });
});
