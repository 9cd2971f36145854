/** Hours in words as the log and the screens print them: 1.5 → "1 h 30 min", 0.25 → "15 min". */
export function hoursText(h: number): string {
  const minutes = Math.round(h * 60);
  const hh = Math.floor(minutes / 60);
  const mm = minutes % 60;
  return [hh ? `${hh} h` : '', mm ? `${mm} min` : ''].filter(Boolean).join(' ') || '0 min';
}
