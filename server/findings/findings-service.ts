import {
  checkRaise,
  decide,
  flaggableHoleStatuses,
  measuresOfKind,
  NOTE_MIN_LENGTH,
  noteRequired,
  restoredHoleStatus,
  allowedActions,
  type FindingAction,
  type FindingActionInput,
  type FindingDetail,
  type FindingInput,
  type FindingSummary,
  type HoleStatus,
  type FindingListQuery,
  type Measurements,
  type Page,
  type RepairRecord,
} from '../../db/contracts';
import { withTransaction, type Db } from '../../db';
import type { AppContext } from '../context';
import { placeOnBuild } from '../builds/builds-repository';
import { couponsForEngine } from '../coupons/coupons-repository';
import { findRivetByCallout, nextRivetSize, repairCheck, type RepairCheckResult } from '../engineering';
import { badRequest, conflict, HttpError, notFound } from '../http-error';
import { decodeCursor, pageOf } from '../pagination';
import { withStoredPhotos, type UploadedPhoto } from '../photos/uploads';
import {
  currentRevisionOf,
  findTravelerParts,
  insertTraveler,
  listTravelers,
  lockTraveler,
  replacementSerial,
} from '../travelers/travelers-repository';
import {
  findFinding,
  findTravelerBrief,
  holesOf,
  insertFinding,
  insertFindingEvent,
  insertFindingPhotos,
  listEvents,
  listFindingPage,
  listFindingRows,
  markTravelerReplaced,
  openFindingsOf,
  setHoleStatus,
  updateFinding,
  type FindingOrder,
  type FindingPageRow,
  type FindingRow,
} from './findings-repository';
import { oversizeOptions, rivetOfCallout } from './oversize-options';

type Deps = Pick<AppContext, 'db' | 'pool' | 'storage' | 'signer' | 'mailQueue'>;
const refused = (r: { code: 403 | 409; message: string }) =>
  new HttpError(r.code, r.code === 403 ? 'forbidden' : 'conflict', r.message);

export const findingsService = ({ db, pool, storage, signer, mailQueue }: Deps) => {
  /** The list's row and the detail's head alike: the first photo (oldest, then by id) is the thumbnail. */
  const summary = (
    r: Omit<FindingPageRow, 'at' | 'photoCount' | 'firstPhotoId'>,
    photoCount: number,
    firstPhotoId: string | null,
    viewerId: string,
  ): FindingSummary => ({
    id: r.id,
    travelerId: r.travelerId,
    serial: r.serial,
    partNumber: r.partNumber,
    kitSerial: r.kitSerial,
    buildId: r.buildId,
    holeIds: r.holeIds,
    kind: r.kind,
    status: r.status,
    disposition: r.disposition,
    closure: r.closure,
    raisedByName: r.raisedByName,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    photoCount,
    thumbUrl: firstPhotoId ? signer.sign(firstPhotoId, 'thumb', viewerId) : null,
  });

  async function visibleRow(user: Express.User, id: string) {
    const [row] = await listFindingRows(db, user, { id });
    if (!row) throw notFound('finding');
    return row;
  }

  /** Every hole of the finding in its layout: its line and its neighbours on it. */
  async function holesInContext(q: Db, travelerId: string, holeIds: string[]) {
    const all = await holesOf(q, travelerId);
    return holeIds.map((id) => {
      const h = all.find((x) => x.holeId === id)!;
      const onLine = all.filter((x) => x.line === h.line);
      const at = onLine.findIndex((x) => x.holeId === id);
      return {
        holeId: id,
        line: h.line,
        stationIn: h.stationIn,
        status: h.status,
        prevStationIn: onLine[at - 1]?.stationIn ?? null,
        nextStationIn: onLine[at + 1]?.stationIn ?? null,
      };
    });
  }

  async function detail(user: Express.User, id: string): Promise<FindingDetail> {
    const row = await visibleRow(user, id);
    const [parts, events, place, holesCtx] = await Promise.all([
      findTravelerParts(db, row.travelerId),
      listEvents(db, id),
      placeOnBuild(db, user, row.buildId),
      holesInContext(db, row.travelerId, row.holeIds),
    ]);
    const rev = parts!.revision;
    const rivet = rivetOfCallout(rev.rivetSpec);
    const replacement = parts!.traveler.replacedById ? await findTravelerBrief(db, parts!.traveler.replacedById) : null;
    return {
      ...summary(row, row.photos.length, row.photos[0]?.id ?? null, user.id),
      note: row.note,
      dispositionNote: row.dispositionNote,
      measurements: row.measurements,
      repair: row.repair,
      photos: row.photos.map((p) => ({
        id: p.id,
        width: p.width,
        height: p.height,
        url: signer.sign(p.id, 'full', user.id),
        thumbUrl: signer.sign(p.id, 'thumb', user.id),
        stage: p.eventId ? 'work' : 'found',
        eventId: p.eventId,
      })),
      events: events.map((e) => ({ ...e, createdAt: e.createdAt.toISOString() })),
      place,
      allowedActions: allowedActions(factsOf(row), place),
      replacement: replacement ? { travelerId: replacement.id, serial: replacement.serial } : null,
      context: {
        holes: holesCtx,
        edgeDistanceIn: rev.edgeDistanceIn,
        drillDiameterIn: rev.drillDiameterIn,
        rivetSpec: rev.rivetSpec,
        rivetDiameterIn: rivet?.nominalDiameterIn ?? null,
        countersunk: rivet?.countersunk ?? false,
        gaugeIn: rev.gaugeIn,
        material: rev.material,
        oversizeOptions: oversizeOptions(rev.rivetSpec),
      },
    };
  }

  /**
   * The inspector's check of a repair with a larger rivet, over every hole of the finding: layout from
   * the traveler, measured edge distance and hole size where the finding has them, loads from the
   * revision's engineering basis, pull-through from the supplier's coupons.
   */
  async function runRepairCheck(row: FindingRow, proposedSpec?: string): Promise<RepairCheckResult> {
    const parts = (await findTravelerParts(db, row.travelerId))!;
    const rev = parts.revision;
    const current = findRivetByCallout(rev.rivetSpec);
    const proposed = proposedSpec ?? nextRivetSize(current)?.code;
    if (!proposed) throw conflict(`${current.code} is the largest rivet of its family: repair with a doubler or scrap`);
    const ctx = await holesInContext(db, row.travelerId, row.holeIds);
    const m = row.measurements;
    return repairCheck({
      rivetSpec: current.code,
      proposedSpec: proposed,
      gaugeIn: rev.gaugeIn,
      material: rev.material,
      holes: ctx.map((h) => {
        const basis = findBasisHole(rev.basis, h.holeId);
        return {
          holeId: h.holeId,
          stationIn: h.stationIn,
          neighbourStationsIn: [h.prevStationIn, h.nextStationIn] as [number | null, number | null],
          edgeDistanceIn: rev.edgeDistanceIn,
          measured: {
            ...(m.edgeDistanceIn !== undefined ? { edgeDistanceIn: m.edgeDistanceIn } : {}),
            ...(m.holeDiameterIn !== undefined ? { holeDiameterIn: m.holeDiameterIn } : {}),
          },
          ...(basis
            ? { appliedLimitTensionLb: basis.appliedLimitLb, appliedLimitShearLb: basis.appliedLimitShearLb }
            : {}),
        };
      }),
      // The kit's supplier tested the coupons; the inspector reads them through the build they are on.
      coupons: await couponsForEngine(db, parts.kit.organizationId, rev.material),
    });
  }

  /** Checks a decision's words before anything is locked: a missing note or repair scheme is a 400 naming the field. */
  async function prepareDecision(
    row: FindingRow,
    action: FindingAction,
    input: FindingActionInput & { note: string },
    photoCount: number,
  ) {
    if (noteRequired[action] && (input.note ?? '').length < NOTE_MIN_LENGTH)
      throw badRequest('say why, in a few words', { note: 'say why, in a few words' });
    if (action === 'report-done' && photoCount === 0)
      throw badRequest('attach at least one photo of the finished work', { photos: 'attach at least one photo' });
    if (action !== 'report-done' && photoCount > 0)
      throw badRequest('photos go with the finding or with the work done', { photos: 'not taken with this step' });
    if (action !== 'disposition' && action !== 'amend') return { repair: undefined };
    if (!input.disposition) throw badRequest('choose a disposition', { disposition: 'choose a disposition' });
    if (input.disposition !== 'repair') return { repair: null };
    if (!input.repairScheme)
      throw badRequest('say how the repair is made', { repairScheme: 'choose how the repair is made' });
    let check: RepairCheckResult | null = null;
    let rivetSpec: string | null = null;
    if (input.repairScheme === 'oversize_rivet') {
      check = await runRepairCheck(row, input.repairRivetSpec);
      rivetSpec = check.inputs.proposedSpec;
      if (!check.pass && (input.overrideReason ?? '').length < NOTE_MIN_LENGTH) {
        throw badRequest(
          `the repair check fails: ${check.reasons.join('; ')}. Say why you choose it anyway, or choose another repair`,
          {
            overrideReason: 'the check fails: say why you choose this repair anyway',
          },
        );
      }
    }
    const repair: RepairRecord = {
      scheme: input.repairScheme,
      rivetSpec,
      check: check
        ? { pass: check.pass, reasons: check.reasons, alternative: check.alternative, newDrill: check.newDrill }
        : null,
      overrideReason: check && !check.pass ? (input.overrideReason ?? null) : null,
    };
    return { repair };
  }

  return {
    detail,
    repairCheck: async (user: Express.User, id: string, proposedSpec?: string) =>
      runRepairCheck(await visibleRow(user, id), proposedSpec),

    /**
     * Every finding of one traveler the reader may see, newest first, for the traveler's own page: a
     * part's findings are few (its holes bound them), so this one is not paged. Same statement as a page.
     */
    async list(user: Express.User, filter: { travelerId: string }): Promise<FindingSummary[]> {
      const rows = await listFindingPage(db, user, { travelerId: filter.travelerId }, 'newest', null, null);
      return rows.map((r) => summary(r, r.photoCount, r.firstPhotoId, user.id));
    },

    /** One page of the findings the reader may see; the cursor names its order, so it cannot be carried over to the other one. */
    async page(user: Express.User, q: FindingListQuery): Promise<Page<FindingSummary>> {
      const after = readCursor(q.cursor, q.order);
      const rows = await listFindingPage(db, user, q, q.order, after, q.limit);
      const page = pageOf(rows, q.limit, (r) => [q.order, r.at, r.id]);
      return { items: page.items.map((r) => summary(r, r.photoCount, r.firstPhotoId, user.id)), next: page.next };
    },

    /**
     * Raises a finding on suspect holes with photos: the builder at the bench, the inspector, or the
     * supplier's engineer on a visit. The finding, its photos, its event, the holes and the mail job
     * commit together or not at all, with the part's lock held.
     */
    async create(user: Express.User, input: FindingInput & { measurements?: Measurements }, files: UploadedPhoto[]) {
      const [traveler] = await listTravelers(db, user, { id: input.travelerId });
      if (!traveler) throw notFound('traveler');
      const measurements = input.measurements ?? {};
      const allowed = measuresOfKind[input.kind];
      const stray = Object.keys(measurements).filter((k) => !(allowed as readonly string[]).includes(k));
      if (stray.length)
        throw badRequest(
          `${stray.join(', ')} is not measured for this kind`,
          Object.fromEntries(stray.map((k) => [`measurements.${k}`, 'not measured for this kind'])),
        );
      if (files.length === 0)
        throw badRequest('attach at least one photo of the hole', { photos: 'attach at least one photo' });
      const holeIds = [...new Set(input.holeIds)];

      const id = await withStoredPhotos(storage, files, (keys) =>
        withTransaction(pool, async (tx) => {
          const locked = await lockTraveler(tx.db, traveler.id);
          const place = await placeOnBuild(tx.db, user, locked.buildId);
          const ok = checkRaise(place, locked.signedOffAt !== null || locked.replacedById !== null);
          if (!ok.ok) throw refused(ok);
          const found = await holesOf(tx.db, traveler.id, holeIds);
          const missing = holeIds.filter((h) => !found.some((f) => f.holeId === h));
          if (missing.length)
            throw badRequest(`no hole ${missing.join(', ')} on this traveler`, {
              holeIds: `unknown hole ${missing.join(', ')}`,
            });
          const busy = found.filter((h) => !flaggableHoleStatuses.includes(h.status));
          if (busy.length)
            throw conflict(`hole ${busy.map((h) => h.holeId).join(', ')} already has an open finding`, {
              holeIds: 'already under a finding',
            });
          const finding = await insertFinding(tx.db, {
            travelerId: traveler.id,
            holeIds,
            kind: input.kind,
            note: input.note,
            measurements,
            raisedBy: user.id,
            holesBefore: Object.fromEntries(found.map((h) => [h.holeId, h.status])),
          });
          await insertFindingPhotos(
            tx.db,
            keys.map((k) => ({ ...k, findingId: finding.id, uploadedBy: user.id })),
          );
          await setHoleStatus(tx.db, traveler.id, holeIds, 'flagged', user.id);
          const event = await insertFindingEvent(tx.db, {
            findingId: finding.id,
            actorId: user.id,
            action: 'raise',
            actorPlace: place,
            toStatus: 'raised',
            note: input.note,
          });
          await mailQueue.enqueue(tx, { eventId: event.id });
          return finding.id;
        }),
      );
      return detail(user, id);
    },

    /**
     * One decision, one request: the rules module says whether it is allowed and what it does; this
     * applies it inside one unit of work with the part's lock held, so a double submit or a racing
     * change finds the finding already moved and is refused with 409.
     */
    async act(
      user: Express.User,
      id: string,
      action: FindingAction,
      input: FindingActionInput & { note: string },
      files: UploadedPhoto[],
    ) {
      const row = await visibleRow(user, id);
      const { repair } = await prepareDecision(row, action, input, files.length);
      await withStoredPhotos(storage, files, (keys) =>
        withTransaction(pool, async (tx) => {
          const t = await lockTraveler(tx.db, row.travelerId);
          const f = await findFinding(tx.db, id);
          const place = await placeOnBuild(tx.db, user, t.buildId);
          const d = decide(
            factsOf({ ...f, signedOffAt: t.signedOffAt, replacedById: t.replacedById }),
            action,
            place,
            input.disposition,
          );
          if (!d.ok) throw refused(d);

          await updateFinding(tx.db, id, {
            status: d.status,
            disposition: d.disposition,
            closure: d.closure,
            ...(action === 'disposition' || action === 'amend'
              ? { dispositionNote: input.note, repair: repair ?? null }
              : {}),
            ...(action === 'refuse' ? { dispositionNote: null, repair: null } : {}),
            ...(action === 'report-done' ? { workReportedAt: new Date() } : {}),
          });
          await applyHoleEffect(tx.db, f, d.holes, user.id);
          const event = await insertFindingEvent(tx.db, {
            findingId: id,
            actorId: user.id,
            action,
            actorPlace: place,
            fromStatus: f.status,
            toStatus: d.status,
            disposition: action === 'disposition' || action === 'amend' ? d.disposition : null,
            note: input.note,
          });
          await insertFindingPhotos(
            tx.db,
            keys.map((k) => ({ ...k, findingId: id, eventId: event.id, uploadedBy: user.id })),
          );
          if (d.mail.length) await mailQueue.enqueue(tx, { eventId: event.id });
          if (d.replacePart) await replacePart(tx.db, t, d.replacePart, d.closure!, id, user.id, place);
        }),
      );
      return detail(user, id);
    },
  };
};

// created_at as PostgreSQL prints a timestamptz (microseconds, zone offset), and a uuid: a cursor carrying
// anything else is refused here rather than left for the database to fail on.
const PG_TIMESTAMPTZ = /^(\d{4})-(\d{2})-(\d{2}) ([01]\d|2[0-3]):[0-5]\d:[0-5]\d(\.\d{1,6})?[+-]\d{2}(:\d{2}){0,2}$/;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A real calendar day too (no 31 February), which PostgreSQL would refuse with an error of its own. */
function isPgTimestamp(at: string): boolean {
  const m = PG_TIMESTAMPTZ.exec(at);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const day = new Date(Date.UTC(y, mo - 1, d));
  return day.getUTCFullYear() === y && day.getUTCMonth() === mo - 1 && day.getUTCDate() === d;
}

/** The key after which a page starts: [order, created_at text, id], checked against the order asked for. */
function readCursor(cursor: string | undefined, order: FindingOrder): [string, string] | null {
  const key = decodeCursor(cursor, ['string', 'string', 'string']);
  if (!key) return null;
  const [of, at, id] = key as [string, string, string];
  if (of !== order || !isPgTimestamp(at) || !UUID.test(id)) {
    throw badRequest('cursor is not one this list gave: start again from the first page', {
      cursor: 'not a cursor of this list',
    });
  }
  return [at, id];
}

/** The rules' view of a finding row and its part. */
function factsOf(r: {
  status: FindingRow['status'];
  disposition: FindingRow['disposition'];
  workReportedAt: Date | null;
  signedOffAt: Date | null;
  replacedById: string | null;
}) {
  return {
    status: r.status,
    disposition: r.disposition,
    workReported: r.workReportedAt !== null,
    partClosed: r.signedOffAt !== null || r.replacedById !== null,
  };
}

async function applyHoleEffect(
  tx: Db,
  f: { travelerId: string; holeIds: string[]; holesBefore: Record<string, HoleStatus> },
  effect: import('../../db/contracts').HoleEffect,
  userId: string,
) {
  if (!effect) return;
  if (effect.to !== 'restore') return setHoleStatus(tx, f.travelerId, f.holeIds, effect.to, userId);
  // Back to what each hole was before the flag; grouped so each status is one statement.
  const byStatus = new Map<HoleStatus, string[]>();
  for (const h of f.holeIds) {
    const s = restoredHoleStatus(f.holesBefore[h] ?? 'installed', effect.acceptInstalled);
    byStatus.set(s, [...(byStatus.get(s) ?? []), h]);
  }
  for (const [s, ids] of byStatus) await setHoleStatus(tx, f.travelerId, ids, s, userId);
}

/**
 * Scrap or return to supplier: the build gets a replacement traveler for the same part, made to the
 * part's current published revision; the old one stays in the record, marked, and its other open
 * findings close with it (the part they were on is gone).
 */
async function replacePart(
  tx: Db,
  old: Awaited<ReturnType<typeof lockTraveler>>,
  reason: 'scrap' | 'return_to_supplier',
  closure: NonNullable<FindingRow['closure']>,
  findingId: string,
  userId: string,
  place: import('../../db/contracts').BuildPlace,
) {
  const revision = await currentRevisionOf(tx, old.revisionId);
  const serial = await replacementSerial(tx, old);
  const fresh = await insertTraveler(tx, { buildId: old.buildId, serial, revision, replacesId: old.id });
  await markTravelerReplaced(tx, old.id, fresh.id, reason, userId, serial);
  for (const other of await openFindingsOf(tx, old.id)) {
    if (other.id === findingId) continue;
    await updateFinding(tx, other.id, { status: 'closed', closure });
    await insertFindingEvent(tx, {
      findingId: other.id,
      actorId: userId,
      action: 'part-replaced',
      actorPlace: place,
      fromStatus: other.status,
      toStatus: 'closed',
      note: `The part was replaced by ${serial}.`,
    });
  }
}

/** The computed hole of a revision's load-study basis with this id, if the revision has one. */
function findBasisHole(
  basis: Record<string, unknown> | null,
  holeId: string,
): { appliedLimitLb: number; appliedLimitShearLb: number } | null {
  const lines = (
    basis?.candidate as
      { lines?: { holes?: { id: string; appliedLimitLb: number; appliedLimitShearLb: number }[] }[] } | undefined
  )?.lines;
  for (const line of lines ?? []) {
    const hole = line.holes?.find((h) => h.id === holeId);
    if (hole) return hole;
  }
  return null;
}
