import { TZDate } from '@date-fns/tz';

/**
 * Moments as a clock in a given zone shows them, for the build log on both sides: the server prints its
 * exports in the reader's zone (the app sends it as `tz`), the app groups the timeline by the device's
 * days. The zone rules are @date-fns/tz's (the runtime's own tz database through Intl); nothing here
 * adds offsets by hand.
 */

/**
 * One clock per zone, moved to each moment in turn: an export formats up to 50,000 entries, and
 * setting the time of a kept TZDate costs half as much as building one per entry. With no zone, a plain
 * Date reads the device's own clock.
 */
const clocks = new Map<string, TZDate>();
const deviceClock = new Date(0);
const MAX_ZONES = 64; // a long-running server meets few zones; the bound keeps a stream of odd ones from growing it

function clockAt(ms: number, tz: string | undefined): Date {
  if (!tz) {
    deviceClock.setTime(ms);
    return deviceClock;
  }
  let c = clocks.get(tz);
  if (!c) {
    if (clocks.size >= MAX_ZONES) clocks.clear();
    c = new TZDate(0, tz);
    clocks.set(tz, c);
  }
  c.setTime(ms);
  return c;
}

const pad = (n: number) => (n < 10 ? `0${n}` : String(n));

/** `2026-11-03`, `14:05:09` and `14:05` on the clock of `tz` (the device's when not given). */
export function zonedDateTime(at: Date | string | number, tz?: string): { date: string; time: string; hm: string } {
  const ms = typeof at === 'number' ? at : typeof at === 'string' ? Date.parse(at) : at.getTime();
  const c = clockAt(ms, tz);
  const hm = `${pad(c.getHours())}:${pad(c.getMinutes())}`;
  return {
    date: `${c.getFullYear()}-${pad(c.getMonth() + 1)}-${pad(c.getDate())}`,
    time: `${hm}:${pad(c.getSeconds())}`,
    hm,
  };
}

/** The first moment of a calendar day (YYYY-MM-DD) in the zone, even where a DST change skips midnight. */
export function startOfDay(day: string, tz: string): Date {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(new TZDate(y, m - 1, d, tz).getTime());
}

/** The calendar day after a YYYY-MM-DD day (a calendar step: no zone applies). */
export function nextDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}

/** "Tuesday 3 November 2026" for a YYYY-MM-DD day. */
export function longDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Intl.DateTimeFormat('en-GB', {
    timeZone: 'UTC',
    weekday: 'long',
    day: 'numeric',
    month: 'long',
    year: 'numeric',
  })
    .format(new Date(Date.UTC(y, m - 1, d)))
    .replace(',', '');
}
