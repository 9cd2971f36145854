import { and, asc, count, eq, gt, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db';
import { buildMembers, builds, invitations, kitModels, organizations, users } from '../../db/schema';
import type { MemberPlace, OrganizationKind, Role } from '../../db/contracts';

export async function listOrganizations(db: Db) {
  const people = db.select({ organizationId: users.organizationId, n: count().as('n') }).from(users).groupBy(users.organizationId).as('people');
  return db.select({ id: organizations.id, name: organizations.name, kind: organizations.kind, createdAt: organizations.createdAt, people: sql<number>`coalesce(${people.n}, 0)`.mapWith(Number) })
    .from(organizations).leftJoin(people, eq(people.organizationId, organizations.id)).orderBy(asc(organizations.name));
}

export async function findOrganization(db: Db, id: string) {
  const [row] = await db.select().from(organizations).where(eq(organizations.id, id));
  return row;
}

export async function insertOrganization(db: Db, name: string, kind: OrganizationKind) {
  const [row] = await db.insert(organizations).values({ name, kind }).returning();
  return row;
}

export async function listPeople(db: Db, organizationId?: string) {
  return db.select({
    id: users.id, email: users.email, name: users.name, role: users.role, organizationId: users.organizationId,
    organizationName: organizations.name, active: users.active, lead: users.lead, createdAt: users.createdAt,
  }).from(users).leftJoin(organizations, eq(organizations.id, users.organizationId))
    .where(organizationId ? eq(users.organizationId, organizationId) : undefined)
    .orderBy(asc(users.name));
}

export async function findPerson(db: Db, id: string) {
  const [row] = (await listPeople(db)).filter((p) => p.id === id);
  return row;
}

export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db.select({ id: users.id, role: users.role, name: users.name, active: users.active }).from(users).where(eq(users.email, email));
  return row;
}

export async function updatePerson(db: Db, id: string, set: { role?: Role; active?: boolean; lead?: boolean }) {
  // Any change of role or standing ends the person's sign-ins: their tokens carry the old version.
  await db.update(users).set({ ...set, sessionVersion: sql`${users.sessionVersion} + 1` }).where(eq(users.id, id));
}

export async function insertInvitation(db: Db, values: typeof invitations.$inferInsert) {
  const [row] = await db.insert(invitations).values(values).returning();
  return row;
}

/** A live invitation by its token's hash, with who sent it and the organisation it joins. */
export async function findLiveInvitation(db: Db, tokenHash: string) {
  const [row] = await db.select({
    invitation: invitations, invitedByName: users.name, organizationName: organizations.name,
  }).from(invitations).innerJoin(users, eq(users.id, invitations.invitedBy)).leftJoin(organizations, eq(organizations.id, invitations.organizationId))
    .where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())));
  return row;
}

/** Every open invitation to this address: joining through one accepts them all (each build it was asked to). */
export async function takeOpenInvitations(db: Db, email: string) {
  return db.update(invitations).set({ acceptedAt: new Date() })
    .where(and(eq(invitations.email, email), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
    .returning();
}

export async function listPendingInvitations(db: Db, by: { organizationId?: string; buildId?: string } = {}) {
  const c = [isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())];
  if (by.organizationId) c.push(eq(invitations.organizationId, by.organizationId));
  if (by.buildId) c.push(eq(invitations.buildId, by.buildId));
  return db.select({
    id: invitations.id, email: invitations.email, name: invitations.name, role: invitations.role, organizationName: organizations.name,
    invitedByName: users.name, expiresAt: invitations.expiresAt, buildKitSerial: builds.kitSerial, place: invitations.place,
  }).from(invitations).innerJoin(users, eq(users.id, invitations.invitedBy))
    .leftJoin(organizations, eq(organizations.id, invitations.organizationId))
    .leftJoin(builds, eq(builds.id, invitations.buildId))
    .where(and(...c)).orderBy(asc(invitations.createdAt));
}

export async function insertUser(db: Db, values: typeof users.$inferInsert) {
  const [row] = await db.insert(users).values(values).returning();
  return row;
}

export async function findBuildBrief(db: Db, id: string) {
  const [row] = await db.select({ id: builds.id, kitSerial: builds.kitSerial, kitName: kitModels.name, organizationId: builds.organizationId })
    .from(builds).innerJoin(kitModels, eq(kitModels.id, builds.kitModelId)).where(eq(builds.id, id));
  return row;
}

export async function addBuildMember(db: Db, v: { buildId: string; userId: string; place: MemberPlace; role: 'builder' | 'inspector'; addedBy: string }) {
  await db.insert(buildMembers).values(v).onConflictDoNothing();
}
