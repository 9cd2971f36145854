import { and, eq, inArray } from 'drizzle-orm';
import type { Disposition, FindingDetail, FindingInput, FindingSummary } from '../../db/contracts';
import { withTransaction } from '../../db';
import type { AppContext } from '../context';
import { findingEvents, findingPhotos, findings, holes } from '../../db/schema';
import { couponsForEngine } from '../coupons/coupons-repository';
import { findRivetByCallout, nextRivetSize, reworkCheck } from '../engineering';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http-error';
import { processPhoto } from '../photos/image-processing';
import { findTravelerParts, listTravelers } from '../travelers/travelers-repository';
import { mailAudience, nextState, RULES, type Action } from './finding-transitions';
import { oversizeOptions } from './oversize-options';
import { listEvents, listFindingRows, type FindingFilter } from './findings-repository';

type Deps = Pick<AppContext, 'db' | 'pool' | 'storage' | 'signer' | 'mailQueue'>;
type Row = Awaited<ReturnType<typeof listFindingRows>>[number];
export type UploadedPhoto = { buffer: Buffer; originalname: string };

export const findingsService = ({ db, pool, storage, signer, mailQueue }: Deps) => {
  const summary = (r: Row): FindingSummary => ({
    id: r.id, travelerId: r.travelerId, serial: r.serial, partNumber: r.partNumber, kitSerial: r.kitSerial, holeIds: r.holeIds,
    kind: r.kind, status: r.status, disposition: r.disposition, flaggedByName: r.flaggedByName,
    createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString(), photoCount: r.photos.length,
    thumbUrl: r.photos[0] ? signer.sign(r.photos[0].id, 'thumb') : null,
  });

  async function visibleRow(user: Express.User, id: string) {
    const [row] = await listFindingRows(db, user, { id });
    if (!row) throw notFound('finding');
    return row;
  }

  /** The first hole of a finding in its layout: its line, its neighbours and the revision it was made to. */
  async function holeInContext(row: Row) {
    const parts = (await findTravelerParts(db, row.travelerId))!;
    const lineHoles = await db.select().from(holes).where(eq(holes.travelerId, row.travelerId)).orderBy(holes.seq);
    const first = lineHoles.find((h) => h.holeId === row.holeIds[0])!;
    const onLine = lineHoles.filter((h) => h.line === first.line);
    const at = onLine.findIndex((h) => h.holeId === first.holeId);
    const context: FindingDetail['context'] = {
      line: first.line, stationIn: first.stationIn,
      prevStationIn: onLine[at - 1]?.stationIn ?? null, nextStationIn: onLine[at + 1]?.stationIn ?? null,
      edgeDistanceIn: parts.revision.edgeDistanceIn, drillDiameterIn: parts.revision.drillDiameterIn,
      rivetSpec: parts.revision.rivetSpec, gaugeIn: parts.revision.gaugeIn, material: parts.revision.material,
      oversizeOptions: oversizeOptions(parts.revision.rivetSpec),
    };
    return { parts, context };
  }

  async function detail(user: Express.User, id: string): Promise<FindingDetail> {
    const row = await visibleRow(user, id);
    const [{ context }, events] = await Promise.all([holeInContext(row), listEvents(db, id)]);
    return {
      ...summary(row), note: row.note, dispositionNote: row.dispositionNote,
      photos: row.photos.map((p) => ({ id: p.id, width: p.width, height: p.height, url: signer.sign(p.id, 'full'), thumbUrl: signer.sign(p.id, 'thumb') })),
      events: events.map((e) => ({ ...e, createdAt: e.createdAt.toISOString() })),
      context,
    };
  }

  /**
   * The inspector's check of drilling the hole out to a larger rivet: layout from the traveler, loads from
   * the revision's engineering basis where it has one, pull-through from the supplier's coupons.
   */
  async function reworkCheckFor(user: Express.User, id: string, proposedSpec?: string) {
    const row = await visibleRow(user, id);
    const { parts, context } = await holeInContext(row);
    const current = findRivetByCallout(context.rivetSpec);
    const proposed = proposedSpec ?? nextRivetSize(current)?.code;
    if (!proposed) throw conflict(`${current.code} is the largest rivet of its family: repair with a doubler or scrap`);
    const basisHole = findBasisHole(parts.revision.basis, row.holeIds[0]);
    return reworkCheck({
      rivetSpec: current.code, proposedSpec: proposed, holeStationIn: context.stationIn,
      neighbourStationsIn: [context.prevStationIn, context.nextStationIn], edgeDistanceIn: context.edgeDistanceIn,
      gaugeIn: context.gaugeIn, material: context.material,
      ...(basisHole ? { appliedLimitTensionLb: basisHole.appliedLimitLb, appliedLimitShearLb: basisHole.appliedLimitShearLb } : {}),
      // The kit's supplier tested the coupons; the inspector reads them through the build they are on.
      coupons: await couponsForEngine(db, parts.kit.organizationId, context.material),
    });
  }

  return {
    detail,
    reworkCheck: reworkCheckFor,

    async list(user: Express.User, filter: FindingFilter) {
      return (await listFindingRows(db, user, filter)).map(summary);
    },

    /**
     * Flags suspect holes with photos. Photos are checked and re-encoded before anything is written;
     * the finding, its photos, its event, the holes and the mail job commit together or not at all.
     */
    async create(user: Express.User, input: FindingInput, files: UploadedPhoto[]) {
      if (user.role !== 'builder') throw forbidden('only the builder flags holes');
      const [traveler] = await listTravelers(db, user, { id: input.travelerId });
      if (!traveler) throw notFound('traveler');
      if (traveler.signedOff) throw conflict('this part is signed off: no new findings');
      if (files.length === 0) throw badRequest('attach at least one photo of the hole', { photos: 'attach at least one photo' });
      const processed = [];
      for (const f of files) processed.push(await processPhoto(f.buffer, f.originalname));

      const holeIds = [...new Set(input.holeIds)];
      const stored: string[] = [];
      try {
        const keys: { fileKey: string; thumbKey: string; width: number; height: number }[] = [];
        for (const p of processed) {
          const fileKey = await storage.put(p.full, 'jpg'); stored.push(fileKey);
          const thumbKey = await storage.put(p.thumb, 'jpg'); stored.push(thumbKey);
          keys.push({ fileKey, thumbKey, width: p.width, height: p.height });
        }
        const id = await withTransaction(pool, async (tx) => {
          const found = await tx.db.select().from(holes)
            .where(and(eq(holes.travelerId, traveler.id), inArray(holes.holeId, holeIds))).for('update');
          const missing = holeIds.filter((h) => !found.some((f) => f.holeId === h));
          if (missing.length) throw badRequest(`no hole ${missing.join(', ')} on this traveler`, { holeIds: `unknown hole ${missing.join(', ')}` });
          const busy = found.filter((h) => h.status === 'flagged' || h.status === 'held');
          if (busy.length) throw conflict(`hole ${busy.map((h) => h.holeId).join(', ')} already has an open finding`, { holeIds: 'already flagged' });
          const [finding] = await tx.db.insert(findings).values({ ...input, holeIds, flaggedBy: user.id }).returning();
          await tx.db.insert(findingPhotos).values(keys.map((k) => ({ ...k, findingId: finding.id, uploadedBy: user.id })));
          await tx.db.update(holes).set({ status: 'flagged', updatedBy: user.id, updatedAt: new Date() })
            .where(and(eq(holes.travelerId, traveler.id), inArray(holes.holeId, holeIds)));
          const [event] = await tx.db.insert(findingEvents).values({ findingId: finding.id, actorId: user.id, toStatus: 'flagged', note: input.note }).returning();
          await mailQueue.enqueue(tx, { eventId: event.id });
          return finding.id;
        });
        return detail(user, id);
      } catch (err) {
        await Promise.all(stored.map((k) => storage.remove(k)));
        throw err;
      }
    },

    /** Moves a finding on by the rules table; the status guard in the UPDATE makes a double submit harmless. */
    async act(user: Express.User, id: string, action: Action, body: { note?: string; disposition?: Disposition }) {
      const row = await visibleRow(user, id);
      const rule = RULES[action];
      if (user.role !== rule.role) throw forbidden(`only the ${rule.role} may do this`);
      if (!rule.from.includes(row.status) || (rule.when && !rule.when(row.disposition, row.status))) {
        throw conflict(`the finding is ${row.status.replace('_', ' ')}${row.disposition ? ` (${row.disposition.replace(/_/g, ' ')})` : ''}: it cannot be moved this way now`);
      }
      const disposition = action === 'disposition' ? body.disposition! : row.disposition;
      const next = nextState(action, disposition);
      await withTransaction(pool, async (tx) => {
        const updated = await tx.db.update(findings).set({
          status: next.status, updatedAt: new Date(),
          ...(action === 'disposition' ? { disposition, dispositionNote: body.note ?? '' } : {}),
        }).where(and(eq(findings.id, id), eq(findings.status, row.status))).returning({ id: findings.id });
        if (!updated.length) throw new HttpError(409, 'conflict', 'someone else moved this finding on just now: reload it');
        if (next.holes) {
          await tx.db.update(holes).set({ status: next.holes, updatedBy: user.id, updatedAt: new Date() })
            .where(and(eq(holes.travelerId, row.travelerId), inArray(holes.holeId, row.holeIds)));
        }
        const [event] = await tx.db.insert(findingEvents).values({
          findingId: id, actorId: user.id, fromStatus: row.status, toStatus: next.status,
          disposition: action === 'disposition' ? disposition : null, note: body.note ?? '',
        }).returning();
        if (mailAudience(event.toStatus, event.disposition)) await mailQueue.enqueue(tx, { eventId: event.id });
      });
      return detail(user, id);
    },
  };
};

/** The computed hole of a revision's load-study basis with this id, if the revision has one. */
function findBasisHole(basis: Record<string, unknown> | null, holeId: string): { appliedLimitLb: number; appliedLimitShearLb: number } | null {
  const lines = (basis?.candidate as { lines?: { holes?: { id: string; appliedLimitLb: number; appliedLimitShearLb: number }[] }[] } | undefined)?.lines;
  for (const line of lines ?? []) {
    const hole = line.holes?.find((h) => h.id === holeId);
    if (hole) return hole;
  }
  return null;
}
