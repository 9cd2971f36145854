import { sql } from 'drizzle-orm';
import { index, integer, jsonb, pgEnum, pgTable, real, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { partKinds, revisionStatuses, type FastenerLine, type RevisionStep } from '../contracts/designs';
import { aircraftCategories } from '../contracts/kits';
import { organizations } from './organizations';
import { users } from './users';

// The lists live once in db/contracts: the tables and the API read the same words.
export const aircraftCategory = pgEnum('aircraft_category', aircraftCategories);
export const partKind = pgEnum('part_kind', partKinds);
export const revisionStatus = pgEnum('revision_status', revisionStatuses);

/** A supplier's aircraft kit with the design data load studies start from. Stored in lb, ft², in, KEAS. */
export const kitModels = pgTable(
  'kit_models',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organizationId: uuid('organization_id')
      .notNull()
      .references(() => organizations.id),
    code: text('code').notNull(),
    name: text('name').notNull(),
    weightLb: real('weight_lb').notNull(),
    wingAreaSqFt: real('wing_area_sq_ft').notNull(),
    meanChordIn: real('mean_chord_in').notNull(),
    stallSpeedKeas: real('stall_speed_keas').notNull(),
    cruiseSpeedKeas: real('cruise_speed_keas'),
    category: aircraftCategory('category').notNull().default('normal'),
    airfoil: text('airfoil').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('kit_models_org_code').on(t.organizationId, t.code)],
);

/**
 * A change to a kit model's data, old and new values side by side: studies and published parts were made
 * from the old numbers, so they are never silently overwritten.
 */
export const kitModelChanges = pgTable(
  'kit_model_changes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kitModelId: uuid('kit_model_id')
      .notNull()
      .references(() => kitModels.id, { onDelete: 'cascade' }),
    changedBy: uuid('changed_by')
      .notNull()
      .references(() => users.id),
    reason: text('reason').notNull().default(''),
    /** Only the fields that changed: { field: value } before and after. */
    before: jsonb('before').$type<Record<string, unknown>>().notNull(),
    after: jsonb('after').$type<Record<string, unknown>>().notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('kit_model_changes_kit').on(t.kitModelId, t.createdAt)],
);

export const partDesigns = pgTable(
  'part_designs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kitModelId: uuid('kit_model_id')
      .notNull()
      .references(() => kitModels.id),
    partNumber: text('part_number').notNull(),
    name: text('name').notNull(),
    kind: partKind('kind').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('part_designs_kit_number').on(t.kitModelId, t.partNumber),
    // The catalogue's order across kits: part number, then id.
    index('part_designs_number').on(t.partNumber, t.id),
  ],
);

/**
 * One revision (A, B, C…) of a part design. A published revision is frozen: the service refuses
 * every change to it, and a change is a new revision with a change note.
 */
export const designRevisions = pgTable(
  'design_revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    partDesignId: uuid('part_design_id')
      .notNull()
      .references(() => partDesigns.id),
    letter: text('letter').notNull(),
    status: revisionStatus('status').notNull().default('draft'),
    material: text('material').notNull(),
    gaugeIn: real('gauge_in').notNull(),
    rivetSpec: text('rivet_spec').notNull(),
    drillSize: text('drill_size').notNull(),
    drillDiameterIn: real('drill_diameter_in').notNull(),
    edgeDistanceIn: real('edge_distance_in').notNull(),
    chordIn: real('chord_in').notNull(),
    lines: jsonb('lines').$type<FastenerLine[]>().notNull(),
    steps: jsonb('steps')
      .$type<RevisionStep[]>()
      .notNull()
      .default(sql`'[]'::jsonb`),
    changeNote: text('change_note').notNull().default(''),
    /** Engineering basis (inputs and results of the load study), frozen at publish. */
    basis: jsonb('basis').$type<Record<string, unknown> | null>(),
    studyId: uuid('study_id'),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    publishedBy: uuid('published_by').references(() => users.id),
    publishedAt: timestamp('published_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('design_revisions_design_letter').on(t.partDesignId, t.letter),
    // A design's latest revision, read for every row of the catalogue.
    index('design_revisions_design_created').on(t.partDesignId, t.createdAt),
  ],
);
