import type { CouponAllowance, CouponTest } from '../../db/contracts';
import { groupCouponAllowables } from '../engineering';
import type { Db } from '../../db';
import { organizationOf } from '../auth/organization';
import { insertCoupon, listCoupons } from './coupons-repository';

type CouponBody = Omit<CouponTest, 'id' | 'createdAt' | 'createdByName'>;

export const couponsService = (db: Db) => {
  const list = async (user: Express.User, filter: { material?: string; rivetSpec?: string } = {}): Promise<CouponTest[]> =>
    (await listCoupons(db, organizationOf(user), filter)).map((c) => ({ ...c, createdAt: c.createdAt.toISOString() }));
  return {
    list,
    /** The allowables exactly as a study will derive them, grouped for the coupon table. */
    async allowables(user: Express.User): Promise<CouponAllowance[]> {
      return groupCouponAllowables(await list(user));
    },
    async create(user: Express.User, body: CouponBody) {
      const id = await insertCoupon(db, { ...body, organizationId: organizationOf(user), createdBy: user.id });
      return (await list(user)).find((c) => c.id === id)!;
    },
  };
};
