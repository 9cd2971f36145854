import { zonedDateTime } from '@/server/build-log/zoned-time';

/**
 * The export's clock reads the zone's offset once per quarter hour. The reference is the platform's own
 * Intl time-zone data (ICU's copy of the IANA tz database), asked for each moment on its own.
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
