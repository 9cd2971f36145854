import type { KitModelInput } from '../../db/contracts';
import type { Db } from '../../db';
import { organizationOf } from '../auth/organization';
import { conflict, notFound } from '../http-error';
import { findKit, insertKit, listKits } from './kits-repository';

export const kitsService = (db: Db) => ({
  list: (user: Express.User) => listKits(db, organizationOf(user)),

  /** A kit of the user's own organisation, or 404 (another supplier's kit is not revealed). */
  async get(user: Express.User, id: string) {
    const kit = await findKit(db, id);
    if (!kit || (user.role !== 'admin' && kit.organizationId !== user.organizationId)) throw notFound('kit model');
    return kit;
  },

  async create(user: Express.User, input: Required<KitModelInput>) {
    const organizationId = organizationOf(user);
    const existing = await listKits(db, organizationId);
    if (existing.some((k) => k.code === input.code)) throw conflict(`kit code ${input.code} is already used`, { code: 'already used' });
    return insertKit(db, { ...input, cruiseSpeedKeas: input.cruiseSpeedKeas ?? null, organizationId });
  },
});
