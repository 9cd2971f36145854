import {
  foreignKey,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { complianceStatuses, noticeLevels, noticeReaches, type NoticeEffectivity } from '../contracts/notices';
import { buildEvents, builds } from './builds';
import { kitModels } from './designs';
import { organizations } from './organizations';
import { users } from './users';
import { storedPhotoColumns } from './photo-columns';

export const noticeLevel = pgEnum('notice_level', noticeLevels);
export const noticeReach = pgEnum('notice_reach', noticeReaches);
export const complianceStatus = pgEnum('compliance_status', complianceStatuses);

/**
 * A supplier's notice to the kits it shipped. Never changed once issued: its effectivity was resolved
 * into `notice_builds` when it went out, and a correction is a new notice.
 */
export const notices = pgTable(
  'notices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organizationId: uuid('organization_id')
      .notNull()
      .references(() => organizations.id),
    kitModelId: uuid('kit_model_id')
      .notNull()
      .references(() => kitModels.id),
    /** 1, 2, 3… per supplier: what people say and write ("notice 4"). */
    number: integer('number').notNull(),
    level: noticeLevel('level').notNull(),
    title: text('title').notNull(),
    body: text('body').notNull(),
    serialFrom: text('serial_from'),
    serialTo: text('serial_to'),
    parts: jsonb('parts').$type<NoticeEffectivity['parts']>().notNull(),
    reaches: noticeReach('reaches').notNull(),
    issuedBy: uuid('issued_by')
      .notNull()
      .references(() => users.id),
    issuedAt: timestamp('issued_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('notices_org_number').on(t.organizationId, t.number),
    index('notices_kit_issued').on(t.kitModelId, t.issuedAt, t.id),
  ],
);

/** What the supplier attached: photos (re-encoded, with a thumbnail) or PDFs (checked, kept as sent). */
export const noticeFiles = pgTable(
  'notice_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    noticeId: uuid('notice_id')
      .notNull()
      .references(() => notices.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: ['photo', 'pdf'] }).notNull(),
    /** The order the supplier attached them in (one insert gives them one time). */
    position: integer('position').notNull(),
    /** The file's name as the supplier gave it, cleaned: shown and used when downloading. */
    name: text('name').notNull(),
    fileKey: text('file_key').notNull(),
    thumbKey: text('thumb_key'),
    width: integer('width'),
    height: integer('height'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('notice_files_notice').on(t.noticeId)],
);

/** One build a notice reached, the parts it reached there, and the build's answer (latest; the log keeps each). */
export const noticeBuilds = pgTable(
  'notice_builds',
  {
    noticeId: uuid('notice_id')
      .notNull()
      .references(() => notices.id, { onDelete: 'cascade' }),
    buildId: uuid('build_id')
      .notNull()
      .references(() => builds.id, { onDelete: 'cascade' }),
    travelerIds: uuid('traveler_ids').array().notNull().default([]),
    status: complianceStatus('status').notNull().default('open'),
    acknowledgedBy: uuid('acknowledged_by').references(() => users.id),
    acknowledgedAt: timestamp('acknowledged_at', { withTimezone: true }),
    answeredBy: uuid('answered_by').references(() => users.id),
    answeredAt: timestamp('answered_at', { withTimezone: true }),
    note: text('note'),
    reason: text('reason'),
  },
  (t) => [primaryKey({ columns: [t.noticeId, t.buildId] }), index('notice_builds_build').on(t.buildId)],
);

/** Photos of what a build did about a notice, with the log entry that records them. */
export const noticePhotos = pgTable(
  'notice_photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    noticeId: uuid('notice_id').notNull(),
    buildId: uuid('build_id').notNull(),
    eventId: uuid('event_id')
      .notNull()
      .references(() => buildEvents.id, { onDelete: 'cascade' }),
    ...storedPhotoColumns(),
  },
  (t) => [
    foreignKey({
      columns: [t.noticeId, t.buildId],
      foreignColumns: [noticeBuilds.noticeId, noticeBuilds.buildId],
    }).onDelete('cascade'),
    index('notice_photos_answer').on(t.noticeId, t.buildId),
  ],
);

/** Each person mailed about a notice, once: the queue may run a job twice, the mail goes out once. */
export const noticeMails = pgTable(
  'notice_mails',
  {
    noticeId: uuid('notice_id')
      .notNull()
      .references(() => notices.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id),
    recipient: text('recipient').notNull(),
    subject: text('subject').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.noticeId, t.userId] })],
);
