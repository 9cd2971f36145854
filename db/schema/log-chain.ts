import { integer, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { builds } from './builds';

/**
 * The build log's hash chain: every event of a build (its own, its findings', its bench's), in the order
 * the server wrote them, with a SHA-256 over the previous link's hash and the event's stored fields.
 * Written by the database itself on every insert into an event table, so no write path can leave an event
 * out; changing a stored event afterwards makes the recomputed hash differ from the one kept here.
 */
export const logChain = pgTable(
  'log_chain',
  {
    buildId: uuid('build_id')
      .notNull()
      .references(() => builds.id, { onDelete: 'cascade' }),
    /** 1, 2, 3… within the build: the order of writing, not of the work. */
    seq: integer('seq').notNull(),
    /** Which event table: b build_events, f finding_events, t traveler_events (the log's entry id prefixes). */
    source: text('source', { enum: ['b', 'f', 't'] }).notNull(),
    eventId: uuid('event_id').notNull(),
    /** Lower-case hex SHA-256 of the previous link's hash and this event's canonical text. */
    hash: text('hash').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.buildId, t.seq] }), uniqueIndex('log_chain_event').on(t.source, t.eventId)],
);
