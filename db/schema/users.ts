import { boolean, index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { roles } from '../contracts/common';
import { memberPlaces } from '../contracts/people';
import { organizations } from './organizations';

export const userRole = pgEnum('user_role', roles);

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    // Stored lower-cased so sign-in and shipping by address match however the address was typed.
    email: text('email').notNull().unique(),
    name: text('name').notNull(),
    role: userRole('role').notNull(),
    organizationId: uuid('organization_id').references(() => organizations.id),
    passwordHash: text('password_hash').notNull(),
    /** A deactivated person cannot sign in, and their sign-ins end at once. */
    active: boolean('active').notNull().default(true),
    /** Every token carries it; deactivating, a new password or "sign out everywhere" bumps it, ending them all. */
    sessionVersion: integer('session_version').notNull().default(0),
    /** A supplier's lead engineer manages their own organisation's engineers. */
    lead: boolean('lead').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The people list's order (name, then id), for everyone and within one organisation (also its head count).
    index('users_name').on(t.name, t.id),
    index('users_org_name').on(t.organizationId, t.name, t.id),
  ],
);

export const memberPlace = pgEnum('member_place', memberPlaces);

/**
 * A one-time link by mail to join: the token itself is never stored, only its SHA-256. An invitation
 * made by shipping a build (or adding to one) carries the build and the place it grants on joining.
 */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    role: userRole('role').notNull(),
    organizationId: uuid('organization_id').references(() => organizations.id),
    lead: boolean('lead').notNull().default(false),
    buildId: uuid('build_id'),
    place: memberPlace('place'),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: uuid('invited_by')
      .notNull()
      .references(() => users.id),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('invitations_email').on(t.email),
    // Pending invitations in the order they were sent, for everyone and within one organisation.
    index('invitations_created').on(t.createdAt, t.id),
    index('invitations_org_created').on(t.organizationId, t.createdAt, t.id),
  ],
);

export const passwordResets = pgTable('password_resets', {
  id: uuid('id').primaryKey().defaultRandom(),
  userId: uuid('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
