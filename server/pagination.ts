import { sql, type AnyColumn, type Placeholder, type SQL } from 'drizzle-orm';
import type { Page } from '../db/contracts';
import { badRequest } from './http-error';

/**
 * Keyset pagination, one way for every list: rows are read in a stable order (a sort value, then the id),
 * one more than the page asks for, and the last shown row's key becomes the opaque `next` cursor.
 * Reading "after this key" uses the index, so a page costs the same on page 1 and page 500.
 * A timestamp key is read as PostgreSQL's own text (`col::text`), never through a JS Date: a Date keeps
 * milliseconds, the column microseconds, and a truncated key would skip or repeat rows.
 */
export type CursorKey = readonly (string | number)[];
type Shape = readonly ('string' | 'number')[];

export function encodeCursor(key: CursorKey): string {
  return Buffer.from(JSON.stringify(key)).toString('base64url');
}

/** The key a cursor carries, checked against the shape the list sorts by; a cursor of another list or a made-up one is refused. */
export function decodeCursor(cursor: string | undefined, shape: Shape): CursorKey | null {
  if (cursor === undefined) return null;
  let key: unknown;
  try {
    key = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
  } catch {
    key = null;
  }
  const fits =
    Array.isArray(key) &&
    key.length === shape.length &&
    key.every(
      (v, i) =>
        typeof v === shape[i] &&
        (typeof v !== 'string' || v.length <= 200) &&
        (typeof v !== 'number' || Number.isFinite(v)),
    );
  if (!fits)
    throw badRequest('cursor is not one this list gave: start again from the first page', {
      cursor: 'not a cursor of this list',
    });
  return key as CursorKey;
}

/** `(a, b) < (x, y)` for a descending list, `>` for an ascending one: a row comparison PostgreSQL answers from a two-column index. */
export function afterKey(
  columns: readonly (AnyColumn | SQL)[],
  key: CursorKey | readonly Placeholder[] | null,
  order: 'asc' | 'desc',
): SQL | undefined {
  if (!key) return undefined;
  const cols = sql.join(
    columns.map((c) => sql`${c}`),
    sql`, `,
  );
  const vals = sql.join(
    key.map((v) => sql`${v}`),
    sql`, `,
  );
  return order === 'desc' ? sql`(${cols}) < (${vals})` : sql`(${cols}) > (${vals})`;
}

/** Cuts the `limit + 1` rows read into a page; the extra row only says that another page exists. */
export function pageOf<T>(rows: T[], limit: number, keyOf: (row: T) => CursorKey): Page<T> {
  const items = rows.slice(0, limit);
  const more = rows.length > limit && items.length > 0;
  return { items, next: more ? encodeCursor(keyOf(items[items.length - 1])) : null };
}
