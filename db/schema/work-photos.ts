import { index, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { travelerEvents, travelerSteps, travelers } from './travelers';
import { storedPhotoColumns } from './photo-columns';

/**
 * Photos of the work itself (not of a suspect hole): of a step, of a run of holes, or of the part.
 * They come with the bench event that records them and show with it in the log.
 */
export const workPhotos = pgTable(
  'work_photos',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    travelerId: uuid('traveler_id')
      .notNull()
      .references(() => travelers.id, { onDelete: 'cascade' }),
    eventId: uuid('event_id')
      .notNull()
      .references(() => travelerEvents.id, { onDelete: 'cascade' }),
    stepId: uuid('step_id').references(() => travelerSteps.id, { onDelete: 'set null' }),
    holeIds: text('hole_ids').array().notNull().default([]),
    ...storedPhotoColumns(),
  },
  (t) => [index('work_photos_event').on(t.eventId), index('work_photos_traveler').on(t.travelerId)],
);
