import {
  allowedKitActions,
  kitChangeReasonRefusal,
  kitDeleteRefusal,
  kitFieldLabels,
  type KitChangeInput,
  type KitModelDetail,
  type KitModelInput,
  type PageQuery,
} from '../../db/contracts';
import { withTransaction, type Db } from '../../db';
import type { kitModels } from '../../db/schema';
import { organizationOf } from '../auth/organization';
import { badRequest, conflict, notFound } from '../http-error';
import {
  deleteKit,
  findKit,
  insertKit,
  insertKitChange,
  kitCodeTaken,
  kitReliance,
  listKitChanges,
  lockKit,
  pageKits,
  updateKit,
} from './kits-repository';

type KitRow = typeof kitModels.$inferSelect;
type KitFields = Omit<Required<KitModelInput>, 'cruiseSpeedKeas'> & { cruiseSpeedKeas: number | null };
const editable = Object.keys(kitFieldLabels) as (keyof KitFields)[];

export const kitsService = (db: Db) => {
  /** A kit of the user's own organisation, or 404 (another supplier's kit is not revealed). */
  async function get(user: Express.User, id: string) {
    const kit = await findKit(db, id);
    if (!kit || (user.role !== 'admin' && kit.organizationId !== user.organizationId)) throw notFound('kit model');
    return kit;
  }

  const clashError = (code: string) => conflict(`kit code ${code} is already used`, { code: 'already used' });

  return {
    list: (user: Express.User, q: PageQuery) => pageKits(db, organizationOf(user), q),

    get,

    /** The kit's own page: what relies on it, what the reader may do with it, and every change of its data. */
    async detail(user: Express.User, id: string): Promise<KitModelDetail> {
      const kit = await get(user, id);
      const [reliance, changes] = await Promise.all([kitReliance(db, id), listKitChanges(db, id)]);
      return {
        ...kit,
        createdAt: kit.createdAt.toISOString(),
        reliance,
        allowedActions: allowedKitActions(reliance),
        deleteRefusal: kitDeleteRefusal(reliance),
        changes: changes.map((c) => ({ ...c, createdAt: c.createdAt.toISOString() })),
      };
    },

    async create(user: Express.User, input: Required<KitModelInput>) {
      const organizationId = organizationOf(user);
      if (await kitCodeTaken(db, organizationId, input.code)) throw clashError(input.code);
      return insertKit(db, { ...input, cruiseSpeedKeas: input.cruiseSpeedKeas ?? null, organizationId });
    },

    /**
     * Changes the kit's name, code or numbers. Every change is kept with the old and new values of what
     * changed; once studies, published parts or builds rely on the kit a change of its numbers must say why.
     */
    async update(user: Express.User, id: string, input: Required<KitChangeInput>) {
      await get(user, id);
      const { reason, ...fields } = input;
      const next: KitFields = { ...fields, cruiseSpeedKeas: fields.cruiseSpeedKeas ?? null };
      await withTransaction(db, async ({ db: tx }) => {
        const kit = (await lockKit(tx, id)) as KitRow;
        const changed = editable.filter((f) => kit[f] !== next[f]);
        if (!changed.length) return;
        if (changed.includes('code') && (await kitCodeTaken(tx, kit.organizationId, next.code, id)))
          throw clashError(next.code);
        const why = kitChangeReasonRefusal(await kitReliance(tx, id), changed, reason);
        if (why) throw badRequest(why, { reason: 'say why the numbers change' });
        const pick = (row: Partial<KitFields>) => Object.fromEntries(changed.map((f) => [f, row[f] ?? null]));
        await updateKit(tx, id, Object.fromEntries(changed.map((f) => [f, next[f]])));
        await insertKitChange(tx, { kitModelId: id, changedBy: user.id, reason, before: pick(kit), after: pick(next) });
      });
      return this.detail(user, id);
    },

    /** Deletes a kit nothing relies on (its draft part designs go with it); otherwise 409 with what relies on it. */
    async remove(user: Express.User, id: string) {
      await get(user, id);
      await withTransaction(db, async ({ db: tx }) => {
        if (!(await lockKit(tx, id))) throw notFound('kit model');
        const why = kitDeleteRefusal(await kitReliance(tx, id, true));
        if (why) throw conflict(why);
        await deleteKit(tx, id);
      });
    },
  };
};
