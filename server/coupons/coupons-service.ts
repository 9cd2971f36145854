import type { CouponAllowance, CouponTest } from '../../db/contracts';
import { groupCouponAllowables } from '../engineering';
import type { Db } from '../../db';
import { forbidden } from '../http-error';
import { insertCoupon, listCoupons } from './coupons-repository';

type CouponBody = Omit<CouponTest, 'id' | 'createdAt' | 'createdByName'>;

export const couponsService = (db: Db) => {
  const orgOf = (user: Express.User) => {
    if (!user.organizationId) throw forbidden('your account belongs to no organisation');
    return user.organizationId;
  };
  const list = async (user: Express.User, filter: { material?: string; rivetSpec?: string } = {}): Promise<CouponTest[]> =>
    (await listCoupons(db, orgOf(user), filter)).map((c) => ({ ...c, createdAt: c.createdAt.toISOString() }));
  return {
    list,
    /** The allowables exactly as a study will derive them, grouped for the coupon table. */
    async allowables(user: Express.User): Promise<CouponAllowance[]> {
      return groupCouponAllowables(await list(user));
    },
    async create(user: Express.User, body: CouponBody) {
      const id = await insertCoupon(db, { ...body, organizationId: orgOf(user), createdBy: user.id });
      return (await list(user)).find((c) => c.id === id)!;
    },
  };
};
