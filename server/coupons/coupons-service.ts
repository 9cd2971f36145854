import {
  allowedCouponActions,
  couponBacks,
  couponCorrectRefusal,
  couponDeleteRefusal,
  type CouponAllowance,
  type CouponTest,
  type Page,
  type PageQuery,
} from '../../db/contracts';
import { groupCouponAllowables } from '../engineering';
import { withTransaction, type Db } from '../../db';
import { organizationOf } from '../auth/organization';
import { conflict, HttpError, notFound } from '../http-error';
import {
  correctionChain,
  couponRowsUpTo,
  deleteCoupons,
  findCouponOrganization,
  insertCoupon,
  listPublishedRevisions,
  lockCoupon,
  markSuperseded,
  pageCoupons,
  type CouponRow,
} from './coupons-repository';

type CouponBody = Omit<
  CouponTest,
  'id' | 'createdAt' | 'createdByName' | 'correctionReason' | 'correctedBy' | 'backs' | 'allowedActions'
>;
type Entry = { rivetSpec: string; gaugeIn: number; createdAt: Date };
type PublishedRevision = Awaited<ReturnType<typeof listPublishedRevisions>>[number];

/**
 * Current tests the allowables are worked out from, at most: far above any supplier's record, and a
 * bound on what one request reads and groups.
 */
export const ALLOWABLES_MAX_TESTS = 5000;

/** The published revisions any entry of a test's record (the current one and those it corrected) may back. */
function backedBy(entries: Entry[], revisions: PublishedRevision[]): string[] {
  return revisions
    .filter((r) =>
      entries.some((e) => couponBacks(e, { ...r, publishedAt: r.publishedAt!, fromStudy: r.studyId !== null })),
    )
    .map((r) => `${r.partNumber} revision ${r.letter}`);
}

/** A row of the record as the API answers it: what corrected it, and what the reader may do with it. */
function serialise({
  supersededById,
  correctedAt,
  correctedReason,
  correctedByName,
  backs,
  ...c
}: CouponRow): CouponTest {
  const superseded = supersededById !== null;
  return {
    ...c,
    createdAt: new Date(c.createdAt).toISOString(),
    backs,
    correctedBy: superseded
      ? {
          id: supersededById,
          byName: correctedByName ?? '',
          at: correctedAt!.toISOString(),
          reason: correctedReason ?? '',
        }
      : null,
    allowedActions: allowedCouponActions({ superseded, backs }),
  };
}

export const couponsService = (db: Db) => {
  const list = async (
    user: Express.User,
    q: PageQuery & { material?: string; rivetSpec?: string },
  ): Promise<Page<CouponTest>> => {
    const page = await pageCoupons(db, organizationOf(user), q);
    return { items: page.items.map(serialise), next: page.next };
  };

  /** One entry as the list shows it. */
  const one = async (user: Express.User, id: string) =>
    serialise((await couponRowsUpTo(db, organizationOf(user), { id }, 1))[0]);

  /** The test, of the reader's organisation (another's is not revealed). */
  async function own(user: Express.User, id: string) {
    const organizationId = organizationOf(user);
    if ((await findCouponOrganization(db, id)) !== organizationId) throw notFound('coupon test');
    return organizationId;
  }

  return {
    list,
    /** The allowables exactly as a study will derive them (current entries only), grouped for the coupon table. */
    async allowables(user: Express.User): Promise<CouponAllowance[]> {
      const rows = await couponRowsUpTo(db, organizationOf(user), { current: true }, ALLOWABLES_MAX_TESTS);
      if (rows.length > ALLOWABLES_MAX_TESTS) {
        throw new HttpError(
          413,
          'too_large',
          `the allowables are worked out from at most ${ALLOWABLES_MAX_TESTS} current tests: this record holds more`,
        );
      }
      return groupCouponAllowables(rows.map(serialise));
    },
    async create(user: Express.User, body: CouponBody) {
      const id = await insertCoupon(db, { ...body, organizationId: organizationOf(user), createdBy: user.id });
      return one(user, id);
    },

    /**
     * A correction: a new entry with the test as it should have been and why; the old entry is kept as
     * recorded and marked corrected by it. Only the current entry of a test is corrected.
     */
    async correct(user: Express.User, id: string, input: CouponBody & { reason: string }) {
      const organizationId = await own(user, id);
      const { reason, ...body } = input;
      const newId = await withTransaction(db, async ({ db: tx }) => {
        const old = await lockCoupon(tx, id);
        const why = couponCorrectRefusal({ superseded: old.supersededById !== null });
        if (why) throw conflict(why);
        const made = await insertCoupon(tx, { ...body, organizationId, createdBy: user.id, correctionReason: reason });
        await markSuperseded(tx, id, made);
        return made;
      });
      return one(user, newId);
    },

    /** Deletes a test (its corrected entries with it) that no published revision may rest on; otherwise 409 naming them. */
    async remove(user: Express.User, id: string) {
      const organizationId = await own(user, id);
      await withTransaction(db, async ({ db: tx }) => {
        const chain = await correctionChain(tx, id);
        if (!chain.length) throw notFound('coupon test');
        const revisions = await listPublishedRevisions(tx, organizationId);
        const why = couponDeleteRefusal({
          superseded: chain[0].supersededById !== null,
          backs: backedBy(chain, revisions),
        });
        if (why) throw conflict(why);
        await deleteCoupons(
          tx,
          chain.map((c) => c.id),
        );
      });
    },
  };
};
