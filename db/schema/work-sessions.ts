import { sql } from 'drizzle-orm';
import { boolean, index, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { stepPerformer, travelers } from './travelers';
import { users } from './users';

/**
 * Time worked on a part: a session started and stopped at the bench, or hours entered afterwards. The
 * person who recorded it is `personId`; the work may be a helper's or a shop's (`performer`, with a name).
 */
export const workSessions = pgTable(
  'work_sessions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    travelerId: uuid('traveler_id')
      .notNull()
      .references(() => travelers.id, { onDelete: 'cascade' }),
    personId: uuid('person_id')
      .notNull()
      .references(() => users.id),
    performer: stepPerformer('performer').notNull().default('builder'),
    performerName: text('performer_name'),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    /** Null while the session runs. */
    endedAt: timestamp('ended_at', { withTimezone: true }),
    /** Typed in afterwards rather than timed at the bench. */
    entered: boolean('entered').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('work_sessions_traveler').on(t.travelerId, t.startedAt),
    // One running session per person and part: a second start is a mistake, not a second worker.
    uniqueIndex('work_sessions_running')
      .on(t.travelerId, t.personId)
      .where(sql`${t.endedAt} is null`),
  ],
);
