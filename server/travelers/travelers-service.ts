import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import QRCode from 'qrcode';
import {
  allowedPartActions, checkPartAction, mayPrintLabels, signOffReadiness,
  type LabelsQuery, type PartAction, type PartLabel, type TickHolesInput, type TravelerDetail,
} from '../../db/contracts';
import { withTransaction, type Db, type Tx } from '../../db';
import type { Pool } from 'pg';
import { holes, travelerEvents, travelerSteps, travelers, users } from '../../db/schema';
import { placeOnBuild } from '../builds/build-access';
import type { AppContext } from '../context';
import { findTravelerBrief, recipientsOf } from '../findings/findings-repository';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http-error';
import { rivetOfCallout } from '../findings/oversize-options';
import { isLoopbackUrl } from '../network/lan';
import { parseTravelerCode } from './codes';
import { partOutline } from './part-outline';
import { signOffWithdrawnMail } from './sign-off-mail';
import { clearSignOff, findTravelerParts, listLabelRows, listTravelers, lockTraveler, readPartFacts } from './travelers-repository';

/**
 * When a bench event happened: the moment it is written, under the part's lock. The column's default is
 * the transaction's start, which puts a write that waited for the lock before the one it waited for.
 */
const underLockNow = () => sql`clock_timestamp()`;

type FindingLister = (user: Express.User, filter: { travelerId: string }) => Promise<TravelerDetail['findings']>;
/** What reaches outside: the mail queue (withdrawal notices) and the address labels and mails carry. The seed runs without. */
type Outward = { mailQueue: AppContext['mailQueue']; publicUrl: string };

export const travelersService = (db: Db, pool: Pool, listFindings: FindingLister, outward?: Outward) => {
  function out(): Outward {
    if (!outward) throw new Error('travelersService was made without its mail queue and public address');
    return outward;
  }

  async function visible(user: Express.User, id: string) {
    const [summary] = await listTravelers(db, user, { id });
    if (!summary) throw notFound('traveler');
    return summary;
  }

  /**
   * A write to the part under its lock: the rules module decides with the part as it stands inside
   * the transaction, so a racing change either lands first or is refused here.
   */
  async function underLock<T>(
    user: Express.User, id: string, action: PartAction,
    work: (tx: Db, locked: Awaited<ReturnType<typeof lockTraveler>>, unit: Tx) => Promise<T>,
  ): Promise<T> {
    await visible(user, id);
    return withTransaction(pool, async (unit) => {
      const tx = unit.db;
      const t = await lockTraveler(tx, id);
      const place = await placeOnBuild(tx, user, t.buildId);
      const facts = await readPartFacts(tx, t);
      const refusal = checkPartAction(facts, action, place);
      if (refusal) throw new HttpError(refusal.code, refusal.code === 403 ? 'forbidden' : 'conflict', refusal.message);
      return work(tx, t, unit);
    });
  }

  async function detail(user: Express.User, id: string): Promise<TravelerDetail> {
    const summary = await visible(user, id);
    const { traveler, revision, design, kit } = (await findTravelerParts(db, id))!;
    const rivet = rivetOfCallout(revision.rivetSpec);
    const [holeRows, stepRows, approver, signer, travelerFindings, place, facts, replacedBy, replaces] = await Promise.all([
      db.select({ holeId: holes.holeId, line: holes.line, seq: holes.seq, stationIn: holes.stationIn, status: holes.status })
        .from(holes).where(eq(holes.travelerId, id)).orderBy(asc(holes.line), asc(holes.seq)),
      db.select({ id: travelerSteps.id, seq: travelerSteps.seq, text: travelerSteps.text, doneAt: travelerSteps.doneAt, doneByName: users.name })
        .from(travelerSteps).leftJoin(users, eq(users.id, travelerSteps.doneBy)).where(eq(travelerSteps.travelerId, id)).orderBy(asc(travelerSteps.seq)),
      revision.publishedBy ? db.select({ name: users.name }).from(users).where(eq(users.id, revision.publishedBy)) : Promise.resolve([]),
      traveler.signedOffBy ? db.select({ name: users.name }).from(users).where(eq(users.id, traveler.signedOffBy)) : Promise.resolve([]),
      listFindings(user, { travelerId: id }),
      placeOnBuild(db, user, traveler.buildId),
      readPartFacts(db, traveler),
      traveler.replacedById ? findTravelerBrief(db, traveler.replacedById) : Promise.resolve(null),
      traveler.replacesId ? findTravelerBrief(db, traveler.replacesId) : Promise.resolve(null),
    ]);
    return {
      ...summary,
      material: revision.material, gaugeIn: revision.gaugeIn, rivetSpec: revision.rivetSpec, drillSize: revision.drillSize,
      drillDiameterIn: revision.drillDiameterIn, edgeDistanceIn: revision.edgeDistanceIn, chordIn: revision.chordIn, lines: revision.lines,
      rivetDiameterIn: rivet?.nominalDiameterIn ?? null, countersunk: rivet?.countersunk ?? false,
      outline: partOutline(design.kind, kit.airfoil, revision.chordIn),
      holes: holeRows,
      steps: stepRows.map((s) => ({ ...s, doneAt: s.doneAt?.toISOString() ?? null })),
      findings: travelerFindings,
      approvedByName: approver[0]?.name ?? null,
      signedOffAt: traveler.signedOffAt?.toISOString() ?? null, signedOffByName: signer[0]?.name ?? null,
      place, allowedActions: allowedPartActions(facts, place), readiness: signOffReadiness(facts),
      replacedBy, replaces,
      labelAllowed: mayPrintLabels(place, user.role === 'admin', 'part'),
    };
  }

  return {
    list: (user: Express.User) => listTravelers(db, user),
    detail,

    async lookup(user: Express.User, code: string) {
      const parsed = parseTravelerCode(code);
      if (!parsed) throw badRequest('that is not a label code: type the six characters under the QR code, e.g. K7P-4QX', { code: 'not a label code' });
      const [t] = await listTravelers(db, user, parsed);
      if (!t) throw notFound('no part of your builds has this code: traveler');
      return { id: t.id };
    },

    /** Ticks holes installed (or back to pending). Holes under a finding are the inspector's, not the bench's. */
    async tickHoles(user: Express.User, id: string, input: TickHolesInput) {
      const ids = [...new Set(input.holeIds)];
      return underLock(user, id, 'tick', async (tx) => {
        const rows = await tx.select().from(holes).where(and(eq(holes.travelerId, id), inArray(holes.holeId, ids)));
        const missing = ids.filter((h) => !rows.some((r) => r.holeId === h));
        if (missing.length) throw badRequest(`no hole ${missing.join(', ')} on this traveler`, { holeIds: `unknown hole ${missing.join(', ')}` });
        const from = input.status === 'installed' ? 'pending' : 'installed';
        const locked = rows.filter((r) => r.status !== from && r.status !== input.status);
        if (locked.length) {
          throw conflict(`hole ${locked.map((h) => `${h.holeId} (${h.status})`).join(', ')} is under a finding and cannot be ticked here`, { holeIds: 'under a finding' });
        }
        const changed = await tx.update(holes).set({ status: input.status, updatedBy: user.id, updatedAt: new Date() })
          .where(and(eq(holes.travelerId, id), inArray(holes.holeId, ids), eq(holes.status, from)))
          .returning({ holeId: holes.holeId, line: holes.line, seq: holes.seq, stationIn: holes.stationIn, status: holes.status });
        if (changed.length) {
          await tx.insert(travelerEvents).values({ travelerId: id, actorId: user.id, createdAt: underLockNow(), kind: `holes_${input.status}`, detail: { holeIds: changed.map((c) => c.holeId) } });
        }
        const all = rows.map((r) => changed.find((c) => c.holeId === r.holeId) ?? { holeId: r.holeId, line: r.line, seq: r.seq, stationIn: r.stationIn, status: r.status });
        return { holes: all };
      });
    },

    async setStep(user: Express.User, id: string, stepId: string, done: boolean) {
      return underLock(user, id, 'step', async (tx) => {
        const [step] = await tx.update(travelerSteps).set(done ? { doneAt: new Date(), doneBy: user.id } : { doneAt: null, doneBy: null })
          .where(and(eq(travelerSteps.id, stepId), eq(travelerSteps.travelerId, id))).returning();
        if (!step) throw notFound('step');
        await tx.insert(travelerEvents).values({ travelerId: id, actorId: user.id, createdAt: underLockNow(), kind: done ? 'step_done' : 'step_undone', detail: { seq: step.seq, text: step.text } });
        return { id: step.id, seq: step.seq, text: step.text, doneAt: step.doneAt?.toISOString() ?? null, doneByName: done ? user.name : null };
      });
    },

    /** The inspector's sign-off: the readiness rule, checked on the locked part inside the transaction that signs. */
    async signOff(user: Express.User, id: string) {
      await underLock(user, id, 'sign-off', async (tx) => {
        await tx.update(travelers).set({ signedOffAt: new Date(), signedOffBy: user.id }).where(eq(travelers.id, id));
        await tx.insert(travelerEvents).values({ travelerId: id, actorId: user.id, createdAt: underLockNow(), kind: 'signed_off', detail: {} });
      });
      return detail(user, id);
    },

    /**
     * Takes a sign-off back: the part is open again. The sign-off's own log entry stays; the withdrawal is
     * a new one with the reason, and every builder of the build is mailed in the same unit of work.
     */
    async withdrawSignOff(user: Express.User, id: string, reason: string) {
      const { mailQueue, publicUrl } = out();
      const part = await visible(user, id);
      await underLock(user, id, 'withdraw-sign-off', async (tx, locked, unit) => {
        const [signer] = locked.signedOffBy ? await tx.select({ name: users.name }).from(users).where(eq(users.id, locked.signedOffBy)) : [];
        await clearSignOff(tx, id);
        await tx.insert(travelerEvents).values({
          travelerId: id, actorId: user.id, createdAt: underLockNow(), kind: 'sign_off_withdrawn',
          detail: { reason, signedOffAt: locked.signedOffAt?.toISOString() ?? null, signedOffByName: signer?.name ?? null },
        });
        // One job per builder: a retry after one mail server refusal does not send the others again.
        for (const to of await recipientsOf(tx, locked.buildId, ['builders'], user.id)) {
          await mailQueue.enqueue(unit, {
            message: signOffWithdrawnMail({
              to, kitSerial: part.kitSerial, partNumber: part.partNumber, partName: part.partName, letter: part.letter, serial: part.serial,
              actorName: user.name, reason, signedOffAt: locked.signedOffAt, link: `${publicUrl}/travelers/${id}`,
            }),
          });
        }
      });
      return detail(user, id);
    },

    /** QR labels of a whole build (its supplier) or of one part (also its builder, to reprint a lost one). */
    async labels(user: Express.User, q: LabelsQuery): Promise<PartLabel[]> {
      const { publicUrl } = out();
      // What the person may not see is not there (404) before what they may not do (403).
      const [first] = await listTravelers(db, user, q.travelerId ? { id: q.travelerId } : { buildId: q.buildId });
      if (!first) throw notFound(q.travelerId ? 'traveler' : 'build with parts');
      const place = await placeOnBuild(db, user, first.buildId);
      if (!mayPrintLabels(place, user.role === 'admin', q.travelerId ? 'part' : 'build')) {
        throw forbidden(q.travelerId ? 'only a builder of this build or its kit supplier prints a part’s label' : 'only the kit supplier prints a whole build’s labels');
      }
      // A label's link must open on a phone's own camera: an address of this machine's loopback would not.
      if (isLoopbackUrl(publicUrl)) {
        throw conflict(`labels would carry ${publicUrl}, which a phone cannot open: start Pitchcard in network mode (npm start -- --lan) or set PUBLIC_URL to the address phones reach this machine by, then print again`);
      }
      const rows = await listLabelRows(db, q.travelerId ? { travelerId: q.travelerId } : { buildId: first.buildId });
      return Promise.all(rows.map(async ({ qrToken, ...r }) => {
        const url = `${publicUrl}/t/${qrToken}`;
        return { ...r, url, qrDataUrl: await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, scale: 8 }) };
      }));
    },
  };
};
