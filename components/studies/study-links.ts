/** "14 Oct 2026, 09:30" in the reader's own locale. */
export function whenText(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/** A study's screen (rib or wing alike: the screen reads the kind), at a revision or the latest. */
export const studyHref = (id: string, revision?: number) => `/studies/${id}${revision ? `?revision=${revision}` : ''}`;
