import { startOfDay, zonedDateTime } from '@/lib/zoned-time';

/**
 * The log's clock (server exports and the app's timeline) reads @date-fns/tz's zone rules through one kept
 * TZDate per zone. The reference is the platform's own Intl time-zone data (ICU's copy of the IANA tz
 * database), asked for each moment on its own with a formatter that shares nothing with the code under test.
 */
const formats = new Map<string, Intl.DateTimeFormat>();
function reference(at: Date, tz: string): string {
  const f =
    formats.get(tz) ??
    new Intl.DateTimeFormat('en-US', {
      timeZone: tz,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
  formats.set(tz, f);
  const p: Record<string, string> = {};
  for (const x of f.formatToParts(at)) p[x.type] = x.value;
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}:${p.second}`;
}

describe('zonedDateTime', () => {
  // Zones with DST on the hour, a half-hour DST step (Lord Howe), and offsets of :30 and :45.
  it.each([
    'UTC',
    'Europe/Berlin',
    'America/Denver',
    'Australia/Lord_Howe',
    'Asia/Kolkata',
    'America/St_Johns',
    'Pacific/Chatham',
  ])('reads every moment of 2026 in %s as Intl does, DST changes included', (tz) => {
    const wrong: string[] = [];
    // Steps of 7 min 13.001 s walk across every quarter hour boundary in the year, with odd seconds and milliseconds.
    for (let t = Date.UTC(2026, 0, 1); t < Date.UTC(2027, 0, 1) && wrong.length < 5; t += 433_001) {
      const z = zonedDateTime(new Date(t), tz);
      if (`${z.date} ${z.time}` !== reference(new Date(t), tz)) wrong.push(new Date(t).toISOString());
    }
    expect(wrong).toEqual([]);
  });
});

describe('startOfDay', () => {
  // From the IANA tz database's rules (from memory, as published in its `southamerica`, `northamerica` and
  // `europe` files): Chile springs forward at 24:00 local on the Saturday before the first Sunday after
  // 1 September (Rule Chile "Sep Sun>=2 4:00u"), so 6 September 2026 has no midnight and begins at 01:00 -03;
  // Cuba likewise skips midnight on 8 March 2026 (Rule Cuba "Mar Sun>=8 0:00s"), beginning at 01:00 -04;
  // the EU changes at 01:00 UTC on the last Sunday of March, after Berlin's midnight (+01:00).
  it.each([
    ['2026-09-06', 'America/Santiago', '2026-09-06T04:00:00.000Z'],
    ['2026-09-05', 'America/Santiago', '2026-09-05T04:00:00.000Z'],
    ['2026-03-08', 'America/Havana', '2026-03-08T05:00:00.000Z'],
    ['2026-03-29', 'Europe/Berlin', '2026-03-28T23:00:00.000Z'],
    ['2026-11-01', 'America/Denver', '2026-11-01T06:00:00.000Z'],
    ['2026-11-03', 'UTC', '2026-11-03T00:00:00.000Z'],
  ])('begins %s in %s at %s, even where a DST change skips midnight', (day, tz, iso) => {
    expect(startOfDay(day, tz).toISOString()).toBe(iso);
  });

  it.each(['Europe/Berlin', 'America/Santiago', 'America/Havana', 'Australia/Lord_Howe', 'Pacific/Chatham'])(
    'in %s, is a moment of that day whose second before is the day before, by Intl, for every day of 2026',
    (tz) => {
      const wrong: string[] = [];
      for (let t = Date.UTC(2026, 0, 2); t < Date.UTC(2027, 0, 1) && wrong.length < 5; t += 86_400_000) {
        const day = new Date(t).toISOString().slice(0, 10);
        const start = startOfDay(day, tz);
        const before = new Date(start.getTime() - 1000);
        if (!reference(start, tz).startsWith(day) || reference(before, tz).startsWith(day)) wrong.push(day);
      }
      expect(wrong).toEqual([]);
    },
  );
});
