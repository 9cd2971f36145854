import { and, asc, eq, gt, isNull, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { buildMembers, builds, invitations, kitModels, organizations, users } from '../../db/schema';
import type { MemberPlace, OrganizationKind, PageQuery, Role } from '../../db/contracts';
import { forgetSessionUser } from '../auth/session-cache';
import { afterKey, decodeCursor, pageOf } from '../pagination';

/** One page of the organisations by name (then id), each with its head count counted by PostgreSQL. */
export async function pageOrganizations(db: Db, q: PageQuery) {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await db
    .select({
      id: organizations.id,
      name: organizations.name,
      kind: organizations.kind,
      createdAt: organizations.createdAt,
      // Spelled out: a one-table select names its columns bare, which inside the subquery would mean the users'.
      people: sql<number>`(select count(*) from ${users} u where u.organization_id = "organizations"."id")`.mapWith(
        Number,
      ),
    })
    .from(organizations)
    .where(afterKey([organizations.name, organizations.id], key, 'asc'))
    .orderBy(asc(organizations.name), asc(organizations.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (o) => [o.name, o.id]);
}

export async function findOrganization(db: Db, id: string) {
  const [row] = await db.select().from(organizations).where(eq(organizations.id, id));
  return row;
}

export async function insertOrganization(db: Db, name: string, kind: OrganizationKind) {
  const [row] = await db.insert(organizations).values({ name, kind }).returning();
  return row;
}

const personColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  organizationId: users.organizationId,
  organizationName: organizations.name,
  active: users.active,
  lead: users.lead,
  createdAt: users.createdAt,
};

/** One page of people (of one organisation, or everyone) by name, then id. */
export async function pagePeople(db: Db, organizationId: string | undefined, q: PageQuery) {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await db
    .select(personColumns)
    .from(users)
    .leftJoin(organizations, eq(organizations.id, users.organizationId))
    .where(
      and(
        organizationId ? eq(users.organizationId, organizationId) : undefined,
        afterKey([users.name, users.id], key, 'asc'),
      ),
    )
    .orderBy(asc(users.name), asc(users.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (p) => [p.name, p.id]);
}

/** A person as the people list shows them; with `lock`, their row locked (a change checks its rules on it). */
export async function findPerson(db: Db, id: string, lock = false) {
  const query = db
    .select(personColumns)
    .from(users)
    .leftJoin(organizations, eq(organizations.id, users.organizationId))
    .where(eq(users.id, id));
  const [row] = lock ? await query.for('update', { of: users }) : await query;
  return row;
}

export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db
    .select({ id: users.id, role: users.role, name: users.name, active: users.active })
    .from(users)
    .where(eq(users.email, email));
  return row;
}

export async function updatePerson(db: Db, id: string, set: { role?: Role; active?: boolean; lead?: boolean }) {
  // Any change of role or standing ends the person's sign-ins: their tokens carry the old version.
  await db
    .update(users)
    .set({ ...set, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, id));
  forgetSessionUser(id);
}

export async function insertInvitation(db: Db, values: typeof invitations.$inferInsert) {
  const [row] = await db.insert(invitations).values(values).returning();
  return row;
}

/** A live invitation by its token's hash, with who sent it and the organisation it joins. */
export async function findLiveInvitation(db: Db, tokenHash: string) {
  const [row] = await db
    .select({
      invitation: invitations,
      invitedByName: users.name,
      organizationName: organizations.name,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .leftJoin(organizations, eq(organizations.id, invitations.organizationId))
    .where(
      and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())),
    );
  return row;
}

/** Every open invitation to this address: joining through one accepts them all (each build it was asked to). */
export async function takeOpenInvitations(db: Db, email: string) {
  return db
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(and(eq(invitations.email, email), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
    .returning();
}

type PendingBy = { organizationId?: string; buildId?: string };

/** Invitations not yet taken up and still live, oldest first (then id). */
function pendingInvitations(db: Db, by: PendingBy, after: SQL | undefined, limit?: number) {
  const c = [isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())];
  if (by.organizationId) c.push(eq(invitations.organizationId, by.organizationId));
  if (by.buildId) c.push(eq(invitations.buildId, by.buildId));
  if (after) c.push(after);
  const q = db
    .select({
      id: invitations.id,
      email: invitations.email,
      name: invitations.name,
      role: invitations.role,
      organizationName: organizations.name,
      invitedByName: users.name,
      expiresAt: invitations.expiresAt,
      buildKitSerial: builds.kitSerial,
      place: invitations.place,
      createdKey: sql<string>`${invitations.createdAt}::text`,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .leftJoin(organizations, eq(organizations.id, invitations.organizationId))
    .leftJoin(builds, eq(builds.id, invitations.buildId))
    .where(and(...c))
    .orderBy(asc(invitations.createdAt), asc(invitations.id));
  return limit === undefined ? q : q.limit(limit);
}

/** The pending invitations of one build (a handful: its places). */
export const listPendingInvitations = (db: Db, by: { buildId: string }) => pendingInvitations(db, by, undefined);

/** One page of the pending invitations (of one organisation, or all). */
export async function pagePendingInvitations(db: Db, organizationId: string | undefined, q: PageQuery) {
  const key = decodeCursor(q.cursor, ['string', 'string']);
  const rows = await pendingInvitations(
    db,
    { organizationId },
    afterKey([invitations.createdAt, invitations.id], key, 'asc'),
    q.limit + 1,
  );
  return pageOf(rows, q.limit, (i) => [i.createdKey, i.id]);
}

/** Whether anyone has an account yet (the demo loads only into a database without). */
export async function anyUserExists(db: Db): Promise<boolean> {
  const rows = await db.select({ id: users.id }).from(users).limit(1);
  return rows.length > 0;
}

export async function insertUser(db: Db, values: typeof users.$inferInsert) {
  const [row] = await db.insert(users).values(values).returning();
  return row;
}

export async function findBuildBrief(db: Db, id: string) {
  const [row] = await db
    .select({
      id: builds.id,
      kitSerial: builds.kitSerial,
      kitName: kitModels.name,
      organizationId: builds.organizationId,
    })
    .from(builds)
    .innerJoin(kitModels, eq(kitModels.id, builds.kitModelId))
    .where(eq(builds.id, id));
  return row;
}

export async function addBuildMember(
  db: Db,
  v: { buildId: string; userId: string; place: MemberPlace; role: 'builder' | 'inspector'; addedBy: string },
) {
  await db.insert(buildMembers).values(v).onConflictDoNothing();
}
