import {
  findingKindLabels,
  findingStatuses,
  isOpenFinding,
  type FindingStatus,
  type FindingSummary,
} from '@/db/contracts';

/** The review queue's filters and sort, as plain functions so the table stays a view. */
export type StatusFilter = 'open' | 'all' | FindingStatus;
export type ReviewFilters = { status: StatusFilter; build: string | 'all'; text: string };
export type ReviewSortKey = 'date' | 'part' | 'status';
export type ReviewSort = { key: ReviewSortKey; dir: 'asc' | 'desc' };

/**
 * What of the filters the server answers (state and build), so every page it sends is made of what
 * is asked for; `buildIds` maps the kit serials met so far to their build. The words stay here.
 */
export function serverFilters(
  f: ReviewFilters,
  buildIds: ReadonlyMap<string, string>,
): { status?: FindingStatus | 'open'; buildId?: string } {
  return {
    status: f.status === 'all' ? undefined : f.status,
    buildId: f.build === 'all' ? undefined : buildIds.get(f.build),
  };
}

export function filterFindings(rows: readonly FindingSummary[], f: ReviewFilters): FindingSummary[] {
  const words = f.text.trim().toLowerCase().split(/\s+/).filter(Boolean);
  return rows.filter((r) => {
    if (f.status === 'open' && !isOpenFinding(r.status)) return false;
    if (f.status !== 'open' && f.status !== 'all' && r.status !== f.status) return false;
    if (f.build !== 'all' && r.kitSerial !== f.build) return false;
    if (!words.length) return true;
    const hay = [r.partNumber, r.serial, r.kitSerial, r.raisedByName, findingKindLabels[r.kind], ...r.holeIds]
      .join(' ')
      .toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}

const statusOrder = new Map(findingStatuses.map((s, i) => [s, i]));

function compare(a: FindingSummary, b: FindingSummary, key: ReviewSortKey): number {
  switch (key) {
    case 'date':
      return a.createdAt.localeCompare(b.createdAt);
    case 'part':
      return (
        a.partNumber.localeCompare(b.partNumber, undefined, { numeric: true }) ||
        a.serial.localeCompare(b.serial, undefined, { numeric: true }) ||
        (a.holeIds[0] ?? '').localeCompare(b.holeIds[0] ?? '', undefined, { numeric: true })
      );
    case 'status':
      return (statusOrder.get(a.status) ?? 0) - (statusOrder.get(b.status) ?? 0);
  }
}

/** Sorts by the chosen column; ties fall back to the newest first. */
export function sortFindings(rows: readonly FindingSummary[], s: ReviewSort): FindingSummary[] {
  const sign = s.dir === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => sign * compare(a, b, s.key) || b.createdAt.localeCompare(a.createdAt));
}

/** Clicking a header: a new column starts in its natural order, the same column flips. */
export function nextSort(current: ReviewSort, key: ReviewSortKey): ReviewSort {
  if (current.key === key) return { key, dir: current.dir === 'asc' ? 'desc' : 'asc' };
  return { key, dir: key === 'date' ? 'desc' : 'asc' };
}

export function buildsIn(rows: readonly FindingSummary[]): string[] {
  return Array.from(new Set(rows.map((r) => r.kitSerial))).sort((a, b) =>
    a.localeCompare(b, undefined, { numeric: true }),
  );
}
