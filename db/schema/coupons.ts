import { type AnyPgColumn, date, index, pgEnum, pgTable, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { couponOutcomes } from '../contracts/coupons';
import { organizations } from './organizations';
import { users } from './users';

export const couponOutcome = pgEnum('coupon_outcome', couponOutcomes);

/**
 * A supplier's test of one fastener in a flange coupon; allowables are derived from these. A recorded
 * test is never edited: a correction is a new row (with its reason) and the old one points to it, kept
 * as it was. Only rows nobody has superseded feed the engine.
 */
export const couponTests = pgTable(
  'coupon_tests',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organizationId: uuid('organization_id')
      .notNull()
      .references(() => organizations.id),
    material: text('material').notNull(),
    gaugeIn: real('gauge_in').notNull(),
    couponWidthIn: real('coupon_width_in').notNull(),
    rivetSpec: text('rivet_spec').notNull(),
    loadLb: real('load_lb').notNull(),
    outcome: couponOutcome('outcome').notNull(),
    note: text('note').notNull().default(''),
    photoKey: text('photo_key'),
    testedOn: date('tested_on').notNull(),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** Why this row corrects an earlier one (empty for a first record). */
    correctionReason: text('correction_reason').notNull().default(''),
    supersededById: uuid('superseded_by_id').references((): AnyPgColumn => couponTests.id),
    supersededAt: timestamp('superseded_at', { withTimezone: true }),
  },
  (t) => [
    // The record's order (material, gauge, rivet, load, when, id): its first columns serve the engine's per-material read too.
    index('coupon_tests_org_order').on(
      t.organizationId,
      t.material,
      t.gaugeIn,
      t.rivetSpec,
      t.loadLb,
      t.createdAt,
      t.id,
    ),
    // What an entry corrected: the correction chain is walked from the entry that corrected it.
    index('coupon_tests_superseded_by').on(t.supersededById),
  ],
);
