import { index, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { buildMemberRoles } from '../contracts/people';
import { kitModels } from './designs';
import { organizations } from './organizations';
import { memberPlace, users } from './users';
import { logEventColumns } from './log-events';

export const buildMemberRole = pgEnum('build_member_role', buildMemberRoles);

/** One builder's kit, shipped by a supplier. Access to everything under it goes through build_members. */
export const builds = pgTable(
  'builds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organizationId: uuid('organization_id')
      .notNull()
      .references(() => organizations.id),
    kitModelId: uuid('kit_model_id')
      .notNull()
      .references(() => kitModels.id),
    kitSerial: text('kit_serial').notNull().unique(),
    /** The supplier's note on the shipment (what went in the crate, what follows later). */
    note: text('note').notNull().default(''),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The list's order (newest first, then id): the admin's whole list and a supplier's own.
    index('builds_created').on(t.createdAt, t.id),
    index('builds_org_created').on(t.organizationId, t.createdAt, t.id),
  ],
);

/** A person on a build: their account role (what they may do) and their place (owner, helper, adviser…). */
export const buildMembers = pgTable(
  'build_members',
  {
    buildId: uuid('build_id')
      .notNull()
      .references(() => builds.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id),
    role: buildMemberRole('role').notNull(),
    place: memberPlace('place').notNull(),
    addedBy: uuid('added_by').references(() => users.id),
    addedAt: timestamp('added_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.buildId, t.userId] }),
    // A builder's or inspector's builds: which builds a person is on, from the person's side.
    index('build_members_user').on(t.userId, t.role),
  ],
);

/** What happened to the build itself (people added, removed, handed over): the build's part of the log. */
export const buildEvents = pgTable(
  'build_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildId: uuid('build_id')
      .notNull()
      .references(() => builds.id, { onDelete: 'cascade' }),
    ...logEventColumns(),
  },
  (t) => [index('build_events_build').on(t.buildId, t.doneAt, t.id)],
);
