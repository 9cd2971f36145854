import { sql } from 'drizzle-orm';
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import {
  buildPlaces,
  dispositions,
  findingClosures,
  findingEventActions,
  findingKinds,
  findingStatuses,
  type HoleStatus,
  type Measurements,
  type RepairRecord,
} from '../contracts';
import { travelers } from './travelers';
import { users } from './users';
import { storedPhotoColumns } from './photo-columns';

// The lists live once in db/contracts: the tables and the API read the same words.
export const findingKind = pgEnum('finding_kind', findingKinds);
export const findingStatus = pgEnum('finding_status', findingStatuses);
export const disposition = pgEnum('disposition', dispositions);
export const findingClosure = pgEnum('finding_closure', findingClosures);
export const findingEventAction = pgEnum('finding_event_action', findingEventActions);
export const buildPlace = pgEnum('build_place', buildPlaces);

export const findings = pgTable(
  'findings',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    travelerId: uuid('traveler_id')
      .notNull()
      .references(() => travelers.id, { onDelete: 'cascade' }),
    /** The hole ids (one, or a run) on the traveler. */
    holeIds: text('hole_ids').array().notNull(),
    /** Each hole's status before the flag: a finding that closes as not a defect puts them back. */
    holesBefore: jsonb('holes_before').$type<Record<string, HoleStatus>>().notNull().default({}),
    kind: findingKind('kind').notNull(),
    note: text('note').notNull(),
    measurements: jsonb('measurements').$type<Measurements>().notNull().default({}),
    status: findingStatus('status').notNull().default('raised'),
    disposition: disposition('disposition'),
    dispositionNote: text('disposition_note'),
    /** The fix chosen for a repair, the check behind it and the reason when the check failed. */
    repair: jsonb('repair').$type<RepairRecord>(),
    closure: findingClosure('closure'),
    /** Once the builder has reported work done, the disposition can no longer be amended. */
    workReportedAt: timestamp('work_reported_at', { withTimezone: true }),
    raisedBy: uuid('raised_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The list's pages read in (created_at, id) order, newest or oldest first, and stop after one page:
    // all findings, open ones (the predicate GET /api/findings?status=open writes), one state, one traveler.
    index('findings_created').on(t.createdAt, t.id),
    index('findings_open_created')
      .on(t.createdAt, t.id)
      .where(sql`${t.status} <> 'closed'`),
    index('findings_status_created').on(t.status, t.createdAt, t.id),
    index('findings_traveler_created').on(t.travelerId, t.createdAt, t.id),
  ],
);

/** Every change to a finding: who, in what place on the build, when, what and why. */
export const findingEvents = pgTable(
  'finding_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    findingId: uuid('finding_id')
      .notNull()
      .references(() => findings.id, { onDelete: 'cascade' }),
    actorId: uuid('actor_id')
      .notNull()
      .references(() => users.id),
    action: findingEventAction('action').notNull(),
    actorPlace: buildPlace('actor_place').notNull(),
    fromStatus: findingStatus('from_status'),
    toStatus: findingStatus('to_status').notNull(),
    disposition: disposition('disposition'),
    note: text('note').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('finding_events_finding').on(t.findingId, t.createdAt, t.id)],
);

export const findingPhotos = pgTable(
  'finding_photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    findingId: uuid('finding_id')
      .notNull()
      .references(() => findings.id, { onDelete: 'cascade' }),
    /** The event the photo came with: null for the photos of the hole as found. */
    eventId: uuid('event_id').references(() => findingEvents.id, { onDelete: 'cascade' }),
    ...storedPhotoColumns(),
  },
  (t) => [
    // A list row's photo count and first photo, and a finding's photos in order.
    index('finding_photos_finding').on(t.findingId, t.createdAt, t.id),
  ],
);

/**
 * One row per (event, recipient) once the mail is handed to SMTP: the queue delivers at least once,
 * so the worker checks here before sending again.
 */
export const sentMails = pgTable(
  'sent_mails',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    eventId: uuid('event_id')
      .notNull()
      .references(() => findingEvents.id, { onDelete: 'cascade' }),
    recipient: text('recipient').notNull(),
    subject: text('subject').notNull(),
    attempts: integer('attempts').notNull().default(1),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('sent_mails_event_recipient').on(t.eventId, t.recipient)],
);
