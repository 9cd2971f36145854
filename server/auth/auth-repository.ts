import { eq } from 'drizzle-orm';
import type { SessionUser } from '../../db/contracts';
import type { Db } from '../../db';
import { organizations, users } from '../../db/schema';

const sessionColumns = {
  id: users.id, email: users.email, name: users.name, role: users.role,
  organizationId: users.organizationId, organizationName: organizations.name,
};

export async function findSessionUser(db: Db, id: string): Promise<SessionUser | undefined> {
  const [row] = await db.select(sessionColumns).from(users).leftJoin(organizations, eq(organizations.id, users.organizationId)).where(eq(users.id, id));
  return row;
}

export async function findUserForSignIn(db: Db, email: string) {
  const [row] = await db.select({ ...sessionColumns, passwordHash: users.passwordHash }).from(users)
    .leftJoin(organizations, eq(organizations.id, users.organizationId)).where(eq(users.email, email));
  return row;
}
