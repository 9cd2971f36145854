import { pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { kitModels } from './designs';
import { organizations } from './organizations';
import { users } from './users';

export const buildMemberRole = pgEnum('build_member_role', ['builder', 'inspector']);

/** One builder's kit, shipped by a supplier. Access to everything under it goes through build_members. */
export const builds = pgTable('builds', {
  id: uuid('id').primaryKey().defaultRandom(),
  organizationId: uuid('organization_id').notNull().references(() => organizations.id),
  kitModelId: uuid('kit_model_id').notNull().references(() => kitModels.id),
  kitSerial: text('kit_serial').notNull().unique(),
  createdBy: uuid('created_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const buildMembers = pgTable('build_members', {
  buildId: uuid('build_id').notNull().references(() => builds.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').notNull().references(() => users.id),
  role: buildMemberRole('role').notNull(),
}, (t) => [primaryKey({ columns: [t.buildId, t.userId] })]);
