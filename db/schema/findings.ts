import { index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { travelers } from './travelers';
import { users } from './users';

export const findingKind = pgEnum('finding_kind', [
  'elongated', 'oversize', 'cracked', 'edge_distance_short', 'deformed_flange', 'poor_shop_head', 'other',
]);
export const findingStatus = pgEnum('finding_status', [
  'flagged', 'in_review', 'dispositioned', 'rework_done', 'verified', 'closed',
]);
export const disposition = pgEnum('disposition', ['use_as_is', 'rework', 'repair', 'scrap']);

export const findings = pgTable('findings', {
  id: uuid('id').primaryKey().defaultRandom(),
  travelerId: uuid('traveler_id').notNull().references(() => travelers.id, { onDelete: 'cascade' }),
  /** The hole ids (one, or a run) on the traveler. */
  holeIds: text('hole_ids').array().notNull(),
  kind: findingKind('kind').notNull(),
  note: text('note').notNull(),
  status: findingStatus('status').notNull().default('flagged'),
  disposition: disposition('disposition'),
  dispositionNote: text('disposition_note'),
  flaggedBy: uuid('flagged_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}, (t) => [index('findings_traveler').on(t.travelerId), index('findings_status').on(t.status)]);

export const findingPhotos = pgTable('finding_photos', {
  id: uuid('id').primaryKey().defaultRandom(),
  findingId: uuid('finding_id').notNull().references(() => findings.id, { onDelete: 'cascade' }),
  /** Server-made names inside the storage folder; never the uploader's file name. */
  fileKey: text('file_key').notNull(),
  thumbKey: text('thumb_key').notNull(),
  width: integer('width').notNull(),
  height: integer('height').notNull(),
  uploadedBy: uuid('uploaded_by').notNull().references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Every change to a finding: who, when, what. */
export const findingEvents = pgTable('finding_events', {
  id: uuid('id').primaryKey().defaultRandom(),
  findingId: uuid('finding_id').notNull().references(() => findings.id, { onDelete: 'cascade' }),
  actorId: uuid('actor_id').notNull().references(() => users.id),
  fromStatus: findingStatus('from_status'),
  toStatus: findingStatus('to_status').notNull(),
  disposition: disposition('disposition'),
  note: text('note').notNull().default(''),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
}, (t) => [index('finding_events_finding').on(t.findingId, t.createdAt)]);

/**
 * One row per (event, recipient) once the mail is handed to SMTP: the queue delivers at least once,
 * so the worker checks here before sending again.
 */
export const sentMails = pgTable('sent_mails', {
  id: uuid('id').primaryKey().defaultRandom(),
  eventId: uuid('event_id').notNull().references(() => findingEvents.id, { onDelete: 'cascade' }),
  recipient: text('recipient').notNull(),
  subject: text('subject').notNull(),
  attempts: integer('attempts').notNull().default(1),
  sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
}, (t) => [uniqueIndex('sent_mails_event_recipient').on(t.eventId, t.recipient)]);
