import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db';
import { organizations, passwordResets, users } from '../../db/schema';
import { forgetSessionUser, type SessionRow } from './session-cache';

const sessionColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  lead: users.lead,
  organizationId: users.organizationId,
  organizationName: organizations.name,
};

/**
 * Every signed-in request reads its person: prepared once per client, so drizzle builds the statement
 * once and PostgreSQL parses it once per connection (the first name keeps it on each).
 */
const sessionUserQueries = new WeakMap<Db, ReturnType<typeof prepareSessionUser>>();
const prepareSessionUser = (db: Db) =>
  db
    .select({ ...sessionColumns, active: users.active, sessionVersion: users.sessionVersion })
    .from(users)
    .leftJoin(organizations, eq(organizations.id, users.organizationId))
    .where(eq(users.id, sql.placeholder('id')))
    .prepare('session_user');

export async function findSessionUser(db: Db, id: string): Promise<SessionRow | undefined> {
  let query = sessionUserQueries.get(db);
  if (!query) sessionUserQueries.set(db, (query = prepareSessionUser(db)));
  const [row] = await query.execute({ id });
  return row;
}

export async function findUserForSignIn(db: Db, email: string) {
  const [row] = await db
    .select({
      ...sessionColumns,
      passwordHash: users.passwordHash,
      active: users.active,
      sessionVersion: users.sessionVersion,
    })
    .from(users)
    .leftJoin(organizations, eq(organizations.id, users.organizationId))
    .where(eq(users.email, email));
  return row;
}

/** Ends every sign-in of the person: their tokens carry the old version. Returns the new one. */
export async function bumpSessionVersion(
  db: Db,
  userId: string,
  set: Partial<typeof users.$inferInsert> = {},
): Promise<number> {
  const [row] = await db
    .update(users)
    .set({ ...set, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .returning({ v: users.sessionVersion });
  forgetSessionUser(userId);
  return row.v;
}

export async function insertPasswordReset(db: Db, userId: string, tokenHash: string, expiresAt: Date) {
  await db.insert(passwordResets).values({ userId, tokenHash, expiresAt });
}

/** Whose live reset link this is, without using it up (a weak new password must not spend the link). */
export async function findLiveReset(db: Db, tokenHash: string) {
  const [row] = await db
    .select({ userId: passwordResets.userId })
    .from(passwordResets)
    .where(
      and(
        eq(passwordResets.tokenHash, tokenHash),
        isNull(passwordResets.usedAt),
        gt(passwordResets.expiresAt, new Date()),
      ),
    );
  return row;
}

/** Takes a live reset link once: marks it used in the same statement that finds it. */
export async function takePasswordReset(db: Db, tokenHash: string) {
  const [row] = await db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(passwordResets.tokenHash, tokenHash),
        isNull(passwordResets.usedAt),
        gt(passwordResets.expiresAt, new Date()),
      ),
    )
    .returning({ userId: passwordResets.userId });
  return row;
}

export async function findPasswordHash(db: Db, userId: string) {
  const [row] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, userId));
  return row?.passwordHash;
}
