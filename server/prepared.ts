import { sql, type Placeholder } from 'drizzle-orm';
import type { Db } from '../db';

/**
 * The hottest reads (a part's page, a page of findings, the signed-in person) as prepared statements:
 * drizzle builds a statement's SQL once per shape instead of on every request (≈ 1 ms for a wide
 * select), and PostgreSQL parses it once per connection. A shape is everything that changes the SQL
 * text (the reader's role, which filters are given, the order); values go in as placeholders.
 * Kept per client (the pool's one lives as long as the app) and bounded, as shapes are few but finite.
 */
const byClient = new WeakMap<Db, Map<string, unknown>>();
const MAX_SHAPES = 256;

export function preparedFor<P>(db: Db, name: string, make: (name: string) => P): P {
  let shapes = byClient.get(db);
  if (!shapes) byClient.set(db, (shapes = new Map()));
  let statement = shapes.get(name) as P | undefined;
  if (!statement) {
    if (shapes.size >= MAX_SHAPES) shapes.clear();
    // PostgreSQL cuts statement names at 63 bytes; shapes are named well within that.
    shapes.set(name, (statement = make(name)));
  }
  return statement;
}

/** Who reads, as the visibility rule needs them: values, or a prepared statement's placeholders. */
export type Viewer = {
  role: Express.User['role'];
  id: string | Placeholder;
  organizationId: string | null | Placeholder;
};

/**
 * The reader as placeholders for a prepared statement, with the shape their role gives the SQL
 * (a supplier without an organisation sees nothing, a condition of its own) and the values to fill in.
 */
export function viewerAsParams(user: Express.User) {
  const orgless = user.role === 'supplier' && !user.organizationId;
  return {
    shape: orgless ? 'so' : user.role.slice(0, 2),
    viewer: {
      role: user.role,
      id: sql.placeholder('viewerId'),
      organizationId: orgless ? null : sql.placeholder('viewerOrg'),
    } satisfies Viewer,
    params: { viewerId: user.id, viewerOrg: user.organizationId },
  };
}
