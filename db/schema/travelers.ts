import { sql } from 'drizzle-orm';
import {
  type AnyPgColumn,
  boolean,
  index,
  integer,
  pgEnum,
  pgTable,
  real,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { holeStatuses, replacementReasons, stepKinds, stepPerformers } from '../contracts';
import { builds } from './builds';
import { designRevisions } from './designs';
import { users } from './users';
import { logEventColumns } from './log-events';

export const holeStatus = pgEnum('hole_status', holeStatuses);
export const replacedReason = pgEnum('replaced_reason', replacementReasons);

/** One physical part of a build, made from one published revision. */
export const travelers = pgTable(
  'travelers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildId: uuid('build_id')
      .notNull()
      .references(() => builds.id, { onDelete: 'cascade' }),
    revisionId: uuid('revision_id')
      .notNull()
      .references(() => designRevisions.id),
    serial: text('serial').notNull().unique(),
    /** Random, unguessable: what the QR label carries. */
    qrToken: text('qr_token').notNull().unique(),
    /** Short, typeable, unambiguous alphabet: for a label the camera cannot read. */
    shortCode: text('short_code').notNull().unique(),
    signedOffBy: uuid('signed_off_by').references(() => users.id),
    signedOffAt: timestamp('signed_off_at', { withTimezone: true }),
    /** Scrap or return to supplier: the part stays in the log, marked, and its replacement carries on. */
    replacedById: uuid('replaced_by_id').references((): AnyPgColumn => travelers.id),
    replacedAt: timestamp('replaced_at', { withTimezone: true }),
    replacedReason: replacedReason('replaced_reason'),
    replacesId: uuid('replaces_id').references((): AnyPgColumn => travelers.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('travelers_build').on(t.buildId),
    // The travelers list's order (live parts first, then serial, id): a page reads its rows straight off it.
    index('travelers_list_order').on(sql`(${t.replacedById} is not null)`, t.serial, t.id),
  ],
);

export const holes = pgTable(
  'holes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    travelerId: uuid('traveler_id')
      .notNull()
      .references(() => travelers.id, { onDelete: 'cascade' }),
    holeId: text('hole_id').notNull(),
    line: text('line').notNull(),
    seq: integer('seq').notNull(),
    stationIn: real('station_in').notNull(),
    status: holeStatus('status').notNull().default('pending'),
    updatedBy: uuid('updated_by').references(() => users.id),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('holes_traveler_hole').on(t.travelerId, t.holeId)],
);

export const stepKind = pgEnum('step_kind', stepKinds);
export const stepPerformer = pgEnum('step_performer', stepPerformers);

export const travelerSteps = pgTable('traveler_steps', {
  id: uuid('id').primaryKey().defaultRandom(),
  travelerId: uuid('traveler_id')
    .notNull()
    .references(() => travelers.id, { onDelete: 'cascade' }),
  seq: integer('seq').notNull(),
  text: text('text').notNull(),
  kind: stepKind('kind').notNull().default('other'),
  /** An inspector stamps it before any later step may be done. */
  inspectionPoint: boolean('inspection_point').notNull().default(false),
  /** Who recorded it done (a builder's account) … */
  doneBy: uuid('done_by').references(() => users.id),
  doneAt: timestamp('done_at', { withTimezone: true }),
  /** … and who did the work: the builder, or help named in `performerName`. */
  performer: stepPerformer('performer'),
  performerName: text('performer_name'),
  stampedBy: uuid('stamped_by').references(() => users.id),
  stampedAt: timestamp('stamped_at', { withTimezone: true }),
});

/** Bench events (holes ticked, steps done, sign-off): the traveler half of the build log. */
export const travelerEvents = pgTable(
  'traveler_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    travelerId: uuid('traveler_id')
      .notNull()
      .references(() => travelers.id, { onDelete: 'cascade' }),
    ...logEventColumns(),
  },
  (t) => [index('traveler_events_traveler').on(t.travelerId, t.doneAt, t.id)],
);
