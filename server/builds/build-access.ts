import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { buildMembers, builds } from '../../db/schema';
import type { BuildPlace } from '../../db/contracts';
import type { Viewer } from '../prepared';

/**
 * The one rule of who sees a build, as a condition on `builds`: a supplier sees its organisation's,
 * a builder the builds they build, an inspector the builds assigned to them, an admin all.
 * Every traveler, finding and photo query goes through it.
 */
export function visibleBuilds(db: Db, user: Viewer): SQL {
  switch (user.role) {
    case 'admin':
      return sql`true`;
    case 'supplier':
      return user.organizationId ? eq(builds.organizationId, user.organizationId) : sql`false`;
    case 'builder':
    case 'inspector':
      return inArray(
        builds.id,
        db
          .select({ id: buildMembers.buildId })
          .from(buildMembers)
          .where(and(eq(buildMembers.userId, user.id), eq(buildMembers.role, user.role))),
      );
  }
}

/**
 * The same place as `placeOnBuild` (builds-repository.ts), as a column of a query that already reads
 * `builds`: the part's own read answers it, so a request does not look the person's place up in a
 * statement of its own.
 */
export function placeColumn(user: Viewer): SQL<BuildPlace> {
  switch (user.role) {
    case 'supplier':
      return user.organizationId
        ? sql<BuildPlace>`case when ${builds.organizationId} = ${user.organizationId} then 'design_authority' else 'none' end`
        : sql<BuildPlace>`'none'`;
    case 'builder':
    case 'inspector':
      return sql<BuildPlace>`case when exists (select 1 from ${buildMembers} where ${buildMembers.buildId} = ${builds.id}
        and ${buildMembers.userId} = ${user.id} and ${buildMembers.role} = ${user.role}) then ${user.role} else 'none' end`;
    case 'admin':
      return sql<BuildPlace>`'none'`;
  }
}
