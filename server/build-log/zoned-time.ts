/**
 * Dates of the log as the reader's clock shows them. The server has no zone of its own that means
 * anything to a builder, so the app sends its zone (`tz`) and exports print in it; UTC otherwise.
 */
const partsFormat = new Map<string, Intl.DateTimeFormat>();

function formatter(tz: string): Intl.DateTimeFormat {
  let f = partsFormat.get(tz);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: tz,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    partsFormat.set(tz, f);
  }
  return f;
}

function parts(at: Date, tz: string) {
  const p: Record<string, string> = {};
  for (const x of formatter(tz).formatToParts(at)) p[x.type] = x.value;
  return {
    y: Number(p.year),
    mo: Number(p.month),
    d: Number(p.day),
    h: Number(p.hour) % 24,
    mi: Number(p.minute),
    s: Number(p.second),
  };
}

/** Milliseconds the zone is ahead of UTC at that moment. */
function offsetMs(at: Date, tz: string): number {
  const p = parts(at, tz);
  return Date.UTC(p.y, p.mo - 1, p.d, p.h, p.mi, p.s) - Math.floor(at.getTime() / 1000) * 1000;
}

/** The first moment of a calendar day (YYYY-MM-DD) in the zone; handles a DST change on that day. */
export function startOfDay(day: string, tz: string): Date {
  const [y, m, d] = day.split('-').map(Number);
  const guess = Date.UTC(y, m - 1, d);
  let t = guess - offsetMs(new Date(guess), tz);
  const again = guess - offsetMs(new Date(t), tz);
  if (again !== t) t = again;
  return new Date(t);
}

export function nextDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
}

const pad = (n: number) => String(n).padStart(2, '0');

/**
 * The zone's offset for the quarter hour `at` falls in: every zone changes its offset on a quarter hour
 * (common practice in the tz database), so one lookup serves every entry of that quarter hour. Asking
 * Intl for each of 50,000 entries costs seconds.
 */
const QUARTER = 15 * 60_000;
const offsets = new Map<string, number>();
function quarterOffset(at: Date, tz: string): number {
  const q = Math.floor(at.getTime() / QUARTER);
  const key = `${tz}|${q}`;
  let off = offsets.get(key);
  if (off === undefined) {
    off = offsetMs(new Date(q * QUARTER), tz);
    if (offsets.size > 10_000) offsets.clear(); // bounded: a long export walks through many quarters
    offsets.set(key, off);
  }
  return off;
}

/** `2026-11-03` and `14:05:09` on the zone's clock. */
export function zonedDateTime(at: Date, tz: string): { date: string; time: string; hm: string } {
  const d = new Date(Math.floor(at.getTime() / 1000) * 1000 + quarterOffset(at, tz));
  const p = {
    y: d.getUTCFullYear(),
    mo: d.getUTCMonth() + 1,
    d: d.getUTCDate(),
    h: d.getUTCHours(),
    mi: d.getUTCMinutes(),
    s: d.getUTCSeconds(),
  };
  return {
    date: `${p.y}-${pad(p.mo)}-${pad(p.d)}`,
    time: `${pad(p.h)}:${pad(p.mi)}:${pad(p.s)}`,
    hm: `${pad(p.h)}:${pad(p.mi)}`,
  };
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
