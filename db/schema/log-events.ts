import { integer, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/**
 * The columns of a free-form log event after its owner's id: who acted, what kind of event, its detail
 * and when. The bench (traveler_events) and the build's own events (build_events) are written alike and
 * read side by side in the build log. A function, so each table gets columns of its own.
 *
 * `createdAt` is when the event reached the server; `doneAt` when it was done, by the device's clock for
 * what the bench sends (a tick made without signal arrives later). The log is ordered and dated by
 * `doneAt`. `clockOffsetMs` is how far the device's clock was behind the server's when it sent the event
 * (arrival minus the device's own time of sending): null for what the server did itself.
 */
export const logEventColumns = () => ({
  actorId: uuid('actor_id')
    .notNull()
    .references(() => users.id),
  kind: text('kind').notNull(),
  detail: jsonb('detail').$type<Record<string, unknown>>().notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  doneAt: timestamp('done_at', { withTimezone: true }).notNull().defaultNow(),
  clockOffsetMs: integer('clock_offset_ms'),
});
