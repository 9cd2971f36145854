import { integer, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/**
 * The columns of a stored photo after what it belongs to: its files (server-made names inside the
 * storage folder, never the uploader's file name), its size, who sent it and when. Finding photos, work
 * photos and the photos of a notice's answer are kept alike; a function, so each table gets its own.
 */
export const storedPhotoColumns = () => ({
  fileKey: text('file_key').notNull(),
  thumbKey: text('thumb_key').notNull(),
  width: integer('width').notNull(),
  height: integer('height').notNull(),
  uploadedBy: uuid('uploaded_by')
    .notNull()
    .references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
