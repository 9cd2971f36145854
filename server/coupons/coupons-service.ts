import {
  allowedCouponActions, couponBacks, couponCorrectRefusal, couponDeleteRefusal,
  type CouponAllowance, type CouponTest,
} from '../../db/contracts';
import { groupCouponAllowables } from '../engineering';
import type { Db } from '../../db';
import { organizationOf } from '../auth/organization';
import { conflict, notFound } from '../http-error';
import {
  correctionChain, deleteCoupons, findCouponOrganization, insertCoupon, listCoupons, listPublishedRevisions, lockCoupon, markSuperseded,
} from './coupons-repository';

type CouponBody = Omit<CouponTest, 'id' | 'createdAt' | 'createdByName' | 'correctionReason' | 'correctedBy' | 'backs' | 'allowedActions'>;
type Entry = { rivetSpec: string; gaugeIn: number; createdAt: Date };
type PublishedRevision = Awaited<ReturnType<typeof listPublishedRevisions>>[number];

/** The published revisions any entry of a test's record (the current one and those it corrected) may back. */
function backedBy(entries: Entry[], revisions: PublishedRevision[]): string[] {
  return revisions
    .filter((r) => entries.some((e) => couponBacks(e, { ...r, publishedAt: r.publishedAt!, fromStudy: r.studyId !== null })))
    .map((r) => `${r.partNumber} revision ${r.letter}`);
}

export const couponsService = (db: Db) => {
  const list = async (user: Express.User, filter: { material?: string; rivetSpec?: string } = {}): Promise<CouponTest[]> => {
    const organizationId = organizationOf(user);
    const [rows, revisions] = await Promise.all([listCoupons(db, organizationId, filter), listPublishedRevisions(db, organizationId)]);
    // Each corrected entry under the id of the entry that corrected it.
    const corrects = new Map(rows.filter((r) => r.supersededById).map((r) => [r.supersededById!, r]));
    return rows.map(({ supersededById, correctedAt, correctedReason, correctedByName, ...c }) => {
      // The record of one test: this entry and the ones it corrected, each one step back (bounded by the rows read).
      const entries: Entry[] = [c];
      for (let e = corrects.get(c.id); e && entries.length <= rows.length; e = corrects.get(e.id)) entries.push(e);
      const superseded = supersededById !== null;
      const backs = superseded ? [] : backedBy(entries, revisions);
      return {
        ...c, createdAt: c.createdAt.toISOString(), backs,
        correctedBy: superseded ? { id: supersededById, byName: correctedByName ?? '', at: correctedAt!.toISOString(), reason: correctedReason ?? '' } : null,
        allowedActions: allowedCouponActions({ superseded, backs }),
      };
    });
  };

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
      return groupCouponAllowables((await list(user)).filter((c) => c.correctedBy === null));
    },
    async create(user: Express.User, body: CouponBody) {
      const id = await insertCoupon(db, { ...body, organizationId: organizationOf(user), createdBy: user.id });
      return (await list(user)).find((c) => c.id === id)!;
    },

    /**
     * A correction: a new entry with the test as it should have been and why; the old entry is kept as
     * recorded and marked corrected by it. Only the current entry of a test is corrected.
     */
    async correct(user: Express.User, id: string, input: CouponBody & { reason: string }) {
      const organizationId = await own(user, id);
      const { reason, ...body } = input;
      const newId = await db.transaction(async (tx) => {
        const old = await lockCoupon(tx, id);
        const why = couponCorrectRefusal({ superseded: old.supersededById !== null });
        if (why) throw conflict(why);
        const made = await insertCoupon(tx, { ...body, organizationId, createdBy: user.id, correctionReason: reason });
        await markSuperseded(tx, id, made);
        return made;
      });
      return (await list(user)).find((c) => c.id === newId)!;
    },

    /** Deletes a test (its corrected entries with it) that no published revision may rest on; otherwise 409 naming them. */
    async remove(user: Express.User, id: string) {
      const organizationId = await own(user, id);
      await db.transaction(async (tx) => {
        const chain = await correctionChain(tx, id);
        if (!chain.length) throw notFound('coupon test');
        const revisions = await listPublishedRevisions(tx, organizationId);
        const why = couponDeleteRefusal({ superseded: chain[0].supersededById !== null, backs: backedBy(chain, revisions) });
        if (why) throw conflict(why);
        await deleteCoupons(tx, chain.map((c) => c.id));
      });
    },
  };
};
