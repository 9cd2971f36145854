import { holesDoneStatuses, type FastenerLine, type Hole } from '@/db/contracts';

/**
 * The holes list as flat items for windowing: each fastener line is a heading item followed by rows of
 * `cols` holes in order along the line. Only the items near the screen are drawn (a 2,000-hole part
 * drew 20,000 DOM nodes); the rest are stood in for by spacers of their height.
 */
export type HoleItem =
  | { kind: 'head'; key: string; line: FastenerLine; done: number; total: number }
  | { kind: 'row'; key: string; line: string; holes: Hole[] };

export type HoleItems = {
  items: HoleItem[];
  /** Which item shows each hole, and each line's heading (by line code). */
  itemOfHole: Map<string, number>;
  itemOfLine: Map<string, number>;
  holeCount: number;
};

export function holeItems(lines: readonly FastenerLine[], holes: readonly Hole[], cols: number): HoleItems {
  const per = Math.max(1, Math.floor(cols));
  const byLine = new Map<string, Hole[]>();
  for (const h of holes) {
    const l = byLine.get(h.line);
    if (l) l.push(h);
    else byLine.set(h.line, [h]);
  }
  const items: HoleItem[] = [];
  const itemOfHole = new Map<string, number>();
  const itemOfLine = new Map<string, number>();
  let holeCount = 0;
  for (const line of lines) {
    const onLine = (byLine.get(line.code) ?? []).slice().sort((a, b) => a.seq - b.seq);
    const done = onLine.filter((h) => holesDoneStatuses.includes(h.status)).length;
    itemOfLine.set(line.code, items.length);
    items.push({ kind: 'head', key: `head:${line.code}`, line, done, total: onLine.length });
    for (let i = 0; i < onLine.length; i += per) {
      const row = onLine.slice(i, i + per);
      for (const h of row) itemOfHole.set(h.holeId, items.length);
      items.push({ kind: 'row', key: `row:${line.code}:${i / per}`, line: line.code, holes: row });
    }
    holeCount += onLine.length;
  }
  return { items, itemOfHole, itemOfLine, holeCount };
}

/** Where each item starts, from the top of the list; the last entry is the list's whole height. */
export function itemOffsets(heights: readonly number[]): number[] {
  const out = new Array<number>(heights.length + 1);
  out[0] = 0;
  for (let i = 0; i < heights.length; i++) out[i + 1] = out[i] + heights[i];
  return out;
}

/** The first item whose bottom is below `y` (binary search over the offsets). */
function itemAt(offsets: readonly number[], y: number): number {
  const n = offsets.length - 1;
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (offsets[mid + 1] <= y) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The items to draw, as [first, end): those within `overscan` px of the part of the list on screen
 * (`top`..`bottom`, px from the list's top; negative when the list starts below the top of the
 * screen), widened to at least `minItems` around them so a list just off screen is ready when it
 * scrolls in, and a keyboard's next Tab always has a row to land on.
 */
export function windowRange(
  offsets: readonly number[],
  top: number,
  bottom: number,
  overscan: number,
  minItems: number,
): [number, number] {
  const n = offsets.length - 1;
  if (n <= 0) return [0, 0];
  const min = Math.min(n, Math.max(1, minItems));
  let first = itemAt(offsets, Math.max(0, top - overscan));
  // The items that start above the lower edge.
  let end = Math.min(
    n,
    itemAt(offsets, bottom + overscan) + (offsets[itemAt(offsets, bottom + overscan)] < bottom + overscan ? 1 : 0),
  );
  if (first >= n) first = n; // the whole list has scrolled away above
  if (end < first) end = first;
  // Widen evenly about the middle, then against whichever end of the list it meets.
  const short = min - (end - first);
  if (short > 0) {
    first = Math.max(0, first - Math.floor(short / 2));
    end = Math.min(n, first + min);
    first = Math.max(0, end - min);
  }
  return [first, end];
}

/**
 * Runs of items to draw, in order: the window plus any item that must stay (the one holding focus,
 * the one just asked for), each run with the height of the skipped items before it.
 */
export function renderRuns(
  offsets: readonly number[],
  range: [number, number],
  keep: readonly number[],
): { from: number; to: number; gapBefore: number }[] {
  const n = offsets.length - 1;
  const spans: [number, number][] = [];
  if (range[1] > range[0]) spans.push(range);
  for (const k of keep) if (k >= 0 && k < n) spans.push([k, k + 1]);
  spans.sort((a, b) => a[0] - b[0]);
  const merged: [number, number][] = [];
  for (const s of spans) {
    const last = merged[merged.length - 1];
    if (last && s[0] <= last[1]) last[1] = Math.max(last[1], s[1]);
    else merged.push([s[0], s[1]]);
  }
  let at = 0;
  return merged.map(([from, to]) => {
    const gapBefore = offsets[from] - offsets[at];
    at = to;
    return { from, to, gapBefore };
  });
}

/**
 * A hole id as typed in the "go to" box: letter case, spaces and leading zeros of the number do not
 * matter ("u-7" finds U-007).
 */
export function normaliseHoleId(s: string): string {
  return s
    .trim()
    .toUpperCase()
    .replace(/\s+/g, '')
    .replace(/-0+(?=\d)/g, '-');
}

/** The hole or line that a "go to" query names, or null. A line code alone goes to its heading. */
export function findTarget(
  q: string,
  holes: readonly Hole[],
  lines: readonly FastenerLine[],
): { hole: Hole } | { line: FastenerLine } | null {
  const want = normaliseHoleId(q);
  if (!want) return null;
  const hole = holes.find((h) => normaliseHoleId(h.holeId) === want);
  if (hole) return { hole };
  const line = lines.find((l) => l.code.toUpperCase() === want);
  return line ? { line } : null;
}
