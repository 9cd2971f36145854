import { jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/**
 * The columns of a free-form log event after its owner's id: who acted, what kind of event, its detail
 * and when. The bench (traveler_events) and the build's own events (build_events) are written alike and
 * read side by side in the build log. A function, so each table gets columns of its own.
 */
export const logEventColumns = () => ({
  actorId: uuid('actor_id')
    .notNull()
    .references(() => users.id),
  kind: text('kind').notNull(),
  detail: jsonb('detail').$type<Record<string, unknown>>().notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
