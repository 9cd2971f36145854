import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { buildMembers, builds } from '../../db/schema';

/**
 * The one rule of who sees a build, as a condition on `builds`: a supplier sees its organisation's,
 * a builder the builds they build, an inspector the builds assigned to them, an admin all.
 * Every traveler, finding and photo query goes through it.
 */
export function visibleBuilds(db: Db, user: Express.User): SQL {
  switch (user.role) {
    case 'admin': return sql`true`;
    case 'supplier': return user.organizationId ? eq(builds.organizationId, user.organizationId) : sql`false`;
    case 'builder':
    case 'inspector':
      return inArray(builds.id, db.select({ id: buildMembers.buildId }).from(buildMembers)
        .where(and(eq(buildMembers.userId, user.id), eq(buildMembers.role, user.role))));
  }
}
