import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { RibStudyResult, WingStudyResult } from '../../lib/engineering-results';
import { studyKinds, type RibStudyInputValues, type WingStudyInputValues } from '../contracts/studies';
import { kitModels } from './designs';
import { organizations } from './organizations';
import { users } from './users';

/** What a study looks at: one rib, or a whole wing (every rib and skin panel). */
export const studyKind = pgEnum('study_kind', studyKinds);

/**
 * A supplier's load study of one rib or of a whole wing of a kit; each save is a new numbered revision
 * of it. Its kind is fixed when it is made (a revision of another kind would not compare with the earlier ones).
 */
export const loadStudies = pgTable(
  'load_studies',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kind: studyKind('kind').notNull().default('rib'),
    organizationId: uuid('organization_id')
      .notNull()
      .references(() => organizations.id),
    kitModelId: uuid('kit_model_id')
      .notNull()
      .references(() => kitModels.id),
    name: text('name').notNull(),
    latestRevision: integer('latest_revision').notNull().default(1),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The list's order within an organisation: last changed first, then id.
    index('load_studies_org_updated').on(t.organizationId, t.updatedAt, t.id),
  ],
);

/** Inputs and the computed result, frozen per revision: a draft part design cites one as its basis. */
export const loadStudyRevisions = pgTable(
  'load_study_revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => loadStudies.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    /** The request's inputs (the study's kind tells which); the engine's own input is the result's `inputs`. */
    inputs: jsonb('inputs').$type<RibStudyInputValues | WingStudyInputValues>().notNull(),
    result: jsonb('result').$type<RibStudyResult | WingStudyResult>().notNull(),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('load_study_revisions_study_rev').on(t.studyId, t.revision)],
);
