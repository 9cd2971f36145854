import QRCode from 'qrcode';
import {
  allowedPartActions,
  checkPartAction,
  checkRevisionMove,
  checkStepChange,
  countHoles,
  MAX_SESSION_HOURS,
  mayPrintLabels,
  revisionMoveOf,
  signOffReadiness,
  stepCounts,
  type HoleStatus,
  type LabelsQuery,
  type MoveRevisionInput,
  type PartRecord,
  type Page,
  type PartAction,
  type PartFacts,
  type PartLabel,
  type StepChange,
  type WorkHoursChange,
  type WorkPhotosChange,
  type WorkStartChange,
  type WorkStopChange,
  type StepFact,
  type StepPerformer,
  type TickHolesInput,
  type TravelerDetail,
  type TravelerListQuery,
  type TravelerSummary,
} from '../../db/contracts';
import { withTransaction, type Db, type Tx } from '../../db';
import type { Pool } from 'pg';
import { placeOnBuild } from '../builds/builds-repository';
import { decodeCursor, pageOf } from '../pagination';
import type { AppContext } from '../context';
import { recipientsOf } from '../findings/findings-repository';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http-error';
import { rivetOfCallout } from '../findings/oversize-options';
import { isLoopbackUrl } from '../network/lan';
import { parseTravelerCode } from './codes';
import { benchTimeOf, type BenchTime } from './device-time';
import { withStoredPhotos, type UploadedPhoto } from '../photos/uploads';
import { endSession, findRunningSession, insertSession, insertWorkPhotos, readPartWork } from './work-repository';
import { partOutline } from './part-outline';
import { signOffWithdrawnMail } from './sign-off-mail';
import {
  clearSignOff,
  findUserName,
  insertTravelerEvent,
  listLabelRows,
  listTravelerPage,
  listTravelers,
  lockTraveler,
  lockVisibleTraveler,
  readPartFacts,
  readPartRecord,
  readRevisionStanding,
  readTravelerPage,
  remakeFromRevision,
  setHolesWithEvent,
  setStepDone,
  signOffTraveler,
  stampStep,
  type TravelerCursor,
} from './travelers-repository';

type FindingLister = (user: Express.User, filter: { travelerId: string }) => Promise<TravelerDetail['findings']>;
/** What reaches outside: the mail queue (withdrawal notices) and the address labels and mails carry. The seed runs without. */
type Outward = { mailQueue: AppContext['mailQueue']; publicUrl: string; storage: AppContext['storage'] };

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
   * the transaction, so a racing change either lands first or is refused here. The lock's own
   * statement also answers whether the person may see the part (404) and their place on its build;
   * the facts follow it in one statement (with `holeIds`, those holes as they stand).
   */
  async function underLock<T>(
    user: Express.User,
    id: string,
    action: PartAction,
    work: (
      tx: Db,
      locked: Awaited<ReturnType<typeof lockTraveler>>,
      unit: Tx,
      facts: Awaited<ReturnType<typeof readPartFacts>>,
    ) => Promise<T>,
    holeIds?: string[],
  ): Promise<T> {
    return withTransaction(pool, async (unit) => {
      const tx = unit.db;
      const mine = await lockVisibleTraveler(tx, user, id);
      if (!mine) throw notFound('traveler');
      const t = mine.traveler;
      const facts = await readPartFacts(tx, t, holeIds);
      const refusal = checkPartAction(facts, action, mine.place);
      if (refusal) throw new HttpError(refusal.code, refusal.code === 403 ? 'forbidden' : 'conflict', refusal.message);
      return work(tx, t, unit, facts);
    });
  }

  /** The part's page: one statement for the part, its holes, steps and the reader's place, one for its findings, side by side. */
  async function detail(user: Express.User, id: string): Promise<TravelerDetail> {
    const [row, travelerFindings, work] = await Promise.all([
      readTravelerPage(db, user, id),
      listFindings(user, { travelerId: id }),
      readPartWork(db, id, user.id),
    ]);
    if (!row) throw notFound('traveler');
    const { traveler, revision, design, kit, place } = row;
    const rivet = rivetOfCallout(revision.rivetSpec);
    const holeRows = row.holes;
    const iso = (t: string | null) => (t ? new Date(t).toISOString() : null);
    const stepRows = row.steps.map((s) => ({ ...s, doneAt: iso(s.doneAt), stampedAt: iso(s.stampedAt) }));
    const byStatus: Partial<Record<HoleStatus, number>> = {};
    for (const h of holeRows) byStatus[h.status] = (byStatus[h.status] ?? 0) + 1;
    const facts: PartFacts = {
      holes: byStatus,
      ...stepCounts(stepRows.map((s) => ({ ...s, done: s.doneAt !== null, stamped: s.stampedAt !== null }))),
      openFindings: row.openFindings,
      signedOff: traveler.signedOffAt !== null,
      replaced: traveler.replacedById !== null,
    };
    const counted = countHoles(holeRows);
    const record: PartRecord = {
      ...facts,
      steps: stepRows.map((s) => ({ done: s.doneAt !== null, stamped: s.stampedAt !== null })),
      ...row.recorded,
    };
    return {
      id: traveler.id,
      serial: traveler.serial,
      shortCode: traveler.shortCode,
      buildId: traveler.buildId,
      kitSerial: row.kitSerial,
      partNumber: design.partNumber,
      partName: design.name,
      kind: design.kind,
      letter: revision.letter,
      holesTotal: holeRows.length,
      holesDone: counted.done,
      holesAwaitingInspector: counted.awaiting,
      openFindings: row.openFindings,
      signedOff: facts.signedOff,
      newerRevision: row.newerRevision,
      replaced: traveler.replacedById ? { byId: traveler.replacedById, reason: traveler.replacedReason! } : null,
      replacesId: traveler.replacesId,
      material: revision.material,
      gaugeIn: revision.gaugeIn,
      rivetSpec: revision.rivetSpec,
      drillSize: revision.drillSize,
      drillDiameterIn: revision.drillDiameterIn,
      edgeDistanceIn: revision.edgeDistanceIn,
      chordIn: revision.chordIn,
      lines: revision.lines,
      rivetDiameterIn: rivet?.nominalDiameterIn ?? null,
      countersunk: rivet?.countersunk ?? false,
      outline: partOutline(design.kind, kit.airfoil, revision.chordIn),
      holes: holeRows,
      steps: stepRows,
      findings: travelerFindings,
      approvedByName: revision.publishedBy ? row.approvedByName : null,
      signedOffAt: traveler.signedOffAt?.toISOString() ?? null,
      signedOffByName: row.signedOffByName,
      place,
      allowedActions: allowedPartActions(facts, place),
      readiness: signOffReadiness(facts),
      replacedBy:
        traveler.replacedById && row.replacedBySerial
          ? { id: traveler.replacedById, serial: row.replacedBySerial }
          : null,
      replaces:
        traveler.replacesId && row.replacesSerial ? { id: traveler.replacesId, serial: row.replacesSerial } : null,
      labelAllowed: mayPrintLabels(place, user.role === 'admin', 'part'),
      work,
      revisionMove: revisionMoveOf(place, record, { letter: revision.letter, newerLetter: row.newerRevision }),
    };
  }

  /** One page of the parts the person may see, live ones first, by serial; filters and counts in SQL. */
  async function page(user: Express.User, q: TravelerListQuery): Promise<Page<TravelerSummary>> {
    const after = readCursor(q.cursor);
    const rows = await listTravelerPage(db, user, { show: q.show, text: q.q || undefined }, after, q.limit);
    return pageOf(rows, q.limit, (r) => [r.replaced ? 1 : 0, r.serial, r.id]);
  }

  return {
    /** Every part the person may see, unpaged (the seed and scripts); the API serves `page`. */
    list: (user: Express.User) => listTravelers(db, user),
    page,
    detail,

    async lookup(user: Express.User, code: string) {
      const parsed = parseTravelerCode(code);
      if (!parsed)
        throw badRequest('that is not a label code: type the six characters under the QR code, e.g. K7P-4QX', {
          code: 'not a label code',
        });
      const [t] = await listTravelers(db, user, parsed);
      if (!t) throw notFound('no part of your builds has this code: traveler');
      return { id: t.id };
    },

    /** Ticks holes installed (or back to pending). Holes under a finding are the inspector's, not the bench's. */
    async tickHoles(user: Express.User, id: string, input: TickHolesInput) {
      const ids = [...new Set(input.holeIds)];
      const when = benchTimeOf(input);
      return underLock(
        user,
        id,
        'tick',
        async (tx, _t, _unit, facts) => {
          const rows = facts.picked;
          const known = new Set(rows.map((r) => r.holeId));
          const missing = ids.filter((h) => !known.has(h));
          if (missing.length)
            throw badRequest(`no hole ${missing.join(', ')} on this traveler`, {
              holeIds: `unknown hole ${missing.join(', ')}`,
            });
          const from = input.status === 'installed' ? 'pending' : 'installed';
          const locked = rows.filter((r) => r.status !== from && r.status !== input.status);
          if (locked.length) {
            throw conflict(
              `hole ${locked.map((h) => `${h.holeId} (${h.status})`).join(', ')} is under a finding and cannot be ticked here`,
              { holeIds: 'under a finding' },
            );
          }
          const changed = await setHolesWithEvent(tx, id, user.id, ids, from, input.status, when);
          const byId = new Map(changed.map((c) => [c.holeId, c]));
          return { holes: rows.map((r) => byId.get(r.holeId) ?? r) };
        },
        ids,
      );
    },

    /**
     * A step done (saying who did the work) or undone, in the order the part's inspection points keep.
     * Answers with the part as it now stands: a step can change what may be done next and the readiness.
     */
    async setStep(user: Express.User, id: string, stepId: string, input: StepChange) {
      const { done } = input;
      const when = benchTimeOf(input);
      await underLock(user, id, 'step', async (tx, _t, _unit, facts) => {
        stepRule(facts.steps, stepId, done ? 'done' : 'undone');
        const credit = creditFrom(input);
        const step = await setStepDone(
          tx,
          id,
          stepId,
          done
            ? { recordedBy: user.id, at: when.doneAt, performer: credit.performer, performerName: credit.performerName }
            : null,
        );
        if (!step) throw notFound('step');
        await insertTravelerEvent(tx, {
          travelerId: id,
          actorId: user.id,
          kind: done ? 'step_done' : 'step_undone',
          detail: {
            seq: step.seq,
            text: step.text,
            kind: step.kind,
            ...(done ? credit.detail : {}),
          },
          ...when,
        });
      });
      return detail(user, id);
    },

    /** A work session on the part starts now (the device's time), the person's only running one on it. */
    async startWork(user: Express.User, id: string, input: WorkStartChange) {
      const when = benchTimeOf(input);
      await underLock(user, id, 'step', async (tx) => {
        const running = await findRunningSession(tx, id, user.id);
        if (running)
          throw conflict(
            `you have a session running on this part since ${running.startedAt.toISOString()}: stop it first`,
          );
        await addSession(tx, user, id, input, { startedAt: when.doneAt ?? new Date() }, 'work_started', {}, when);
      });
      return detail(user, id);
    },

    /** Ends the person's running session now, or after the hours given (a session the bench forgot to stop). */
    async stopWork(user: Express.User, id: string, input: WorkStopChange) {
      const when = benchTimeOf(input);
      await underLock(user, id, 'step', async (tx) => {
        const running = await findRunningSession(tx, id, user.id);
        if (!running) throw conflict('no session of yours is running on this part');
        const endedAt =
          input.hours !== undefined
            ? new Date(running.startedAt.getTime() + input.hours * 3_600_000)
            : (when.doneAt ?? new Date());
        const hours = (endedAt.getTime() - running.startedAt.getTime()) / 3_600_000;
        if (hours <= 0) throw conflict('the session would end before it began: give the hours worked');
        if (hours > MAX_SESSION_HOURS)
          throw conflict(
            `this session has run ${Math.floor(hours)} hours: give the hours actually worked (at most ${MAX_SESSION_HOURS})`,
            { hours: 'give the hours worked' },
          );
        await endSession(tx, running.id, endedAt);
        await insertTravelerEvent(tx, {
          travelerId: id,
          actorId: user.id,
          kind: 'work_stopped',
          detail: {
            hours: Math.round(hours * 100) / 100,
            startedAt: running.startedAt.toISOString(),
            by: running.by,
            ...(running.byName ? { byName: running.byName } : {}),
          },
          doneAt: endedAt,
          clockOffsetMs: when.clockOffsetMs,
        });
      });
      return detail(user, id);
    },

    /** Hours worked entered afterwards: dated in the log when the work began. */
    async enterHours(user: Express.User, id: string, input: WorkHoursChange) {
      const startedAt = new Date(input.startedAt);
      const endedAt = new Date(startedAt.getTime() + input.hours * 3_600_000);
      if (endedAt.getTime() > Date.now() + 5 * 60_000)
        throw badRequest('those hours end in the future: give when the work began', {
          startedAt: 'the hours would end in the future',
        });
      await underLock(user, id, 'step', async (tx) => {
        await addSession(tx, user, id, input, { startedAt, endedAt, entered: true }, 'hours_entered', {
          hours: input.hours,
        });
      });
      return detail(user, id);
    },

    /**
     * Photos of the work (of a step, a run of holes, or the part), stored before the part is locked and
     * removed again if the write is refused; one bench event carries them into the log.
     */
    async addWorkPhotos(user: Express.User, id: string, input: WorkPhotosChange, files: UploadedPhoto[]) {
      const { storage } = out();
      if (!files.length) throw badRequest('add at least one photo', { photos: 'add at least one photo' });
      const holeIds = [...new Set(input.holeIds)];
      await withStoredPhotos(storage, files, (keys) =>
        underLock(
          user,
          id,
          'step',
          async (tx, _t, _unit, facts) => {
            const step = input.stepId ? facts.steps.find((s) => s.id === input.stepId) : undefined;
            if (input.stepId && !step) throw notFound('step');
            const known = new Set(facts.picked.map((h) => h.holeId));
            const missing = holeIds.filter((h) => !known.has(h));
            if (missing.length)
              throw badRequest(`no hole ${missing.join(', ')} on this traveler`, {
                holeIds: `unknown hole ${missing.join(', ')}`,
              });
            const eventId = await insertTravelerEvent(tx, {
              travelerId: id,
              actorId: user.id,
              kind: 'photos_added',
              detail: {
                count: keys.length,
                ...(step ? { seq: step.seq } : {}),
                ...(holeIds.length ? { holeIds } : {}),
                ...(input.note ? { note: input.note } : {}),
              },
            });
            await insertWorkPhotos(
              tx,
              keys.map((k) => ({
                ...k,
                travelerId: id,
                eventId,
                stepId: input.stepId ?? null,
                holeIds,
                uploadedBy: user.id,
              })),
            );
          },
          holeIds,
        ),
      );
      return detail(user, id);
    },

    /** An inspector's stamp on a done inspection point: the steps after it may then be done. */
    async stampStep(user: Express.User, id: string, stepId: string) {
      await underLock(user, id, 'stamp', async (tx, _t, _unit, facts) => {
        stepRule(facts.steps, stepId, 'stamp');
        const step = await stampStep(tx, id, stepId, user.id);
        if (!step) throw notFound('step');
        await insertTravelerEvent(tx, {
          travelerId: id,
          actorId: user.id,
          kind: 'step_stamped',
          detail: { seq: step.seq, text: step.text, kind: step.kind },
        });
      });
      return detail(user, id);
    },

    /** The inspector's sign-off: the readiness rule, checked on the locked part inside the transaction that signs. */
    async signOff(user: Express.User, id: string) {
      await underLock(user, id, 'sign-off', async (tx) => {
        await signOffTraveler(tx, id, user.id);
        await insertTravelerEvent(tx, { travelerId: id, actorId: user.id, kind: 'signed_off', detail: {} });
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
        const signerName = locked.signedOffBy ? await findUserName(tx, locked.signedOffBy) : null;
        await clearSignOff(tx, id);
        await insertTravelerEvent(tx, {
          travelerId: id,
          actorId: user.id,
          kind: 'sign_off_withdrawn',
          detail: {
            reason,
            signedOffAt: locked.signedOffAt?.toISOString() ?? null,
            signedOffByName: signerName,
          },
        });
        // One job per builder: a retry after one mail server refusal does not send the others again.
        for (const to of await recipientsOf(tx, locked.buildId, ['builders'], user.id)) {
          await mailQueue.enqueue(unit, {
            message: signOffWithdrawnMail({
              to,
              kitSerial: part.kitSerial,
              partNumber: part.partNumber,
              partName: part.partName,
              letter: part.letter,
              serial: part.serial,
              actorName: user.name,
              reason,
              signedOffAt: locked.signedOffAt,
              link: `${publicUrl}/travelers/${id}`,
            }),
          });
        }
      });
      return detail(user, id);
    },

    /**
     * Moves a part on which no work is recorded to its design's newest published revision: its holes and
     * steps are made again from that revision, as a new part's would be, and the log says so. Checked by
     * the rules module on the locked part, so a racing move or a first tick either lands first or is
     * refused here. A started part keeps its revision: the supplier's notice carries the change to it.
     */
    async moveToRevision(user: Express.User, id: string, input: MoveRevisionInput) {
      const when = benchTimeOf(input);
      await withTransaction(pool, async (unit) => {
        const tx = unit.db;
        const mine = await lockVisibleTraveler(tx, user, id);
        if (!mine) throw notFound('traveler');
        const t = mine.traveler;
        const record = await readPartRecord(tx, t);
        const standing = await readRevisionStanding(tx, t.revisionId);
        const refusal = checkRevisionMove(mine.place, record, {
          letter: standing.letter,
          newerLetter: standing.newest?.letter ?? null,
        });
        if (refusal)
          throw new HttpError(refusal.code, refusal.code === 403 ? 'forbidden' : 'conflict', refusal.message);
        const to = standing.newest!;
        const holeCount = await remakeFromRevision(tx, id, to);
        await insertTravelerEvent(tx, {
          travelerId: id,
          actorId: user.id,
          kind: 'revision_changed',
          detail: { fromLetter: standing.letter, toLetter: to.letter, holes: holeCount },
          ...when,
        });
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
        throw forbidden(
          q.travelerId
            ? 'only a builder of this build or its kit supplier prints a part’s label'
            : 'only the kit supplier prints a whole build’s labels',
        );
      }
      // A label's link must open on a phone's own camera: an address of this machine's loopback would not.
      if (isLoopbackUrl(publicUrl)) {
        throw conflict(
          `labels would carry ${publicUrl}, which a phone cannot open: start Pitchcard in network mode (npm start -- --lan) or set PUBLIC_URL to the address phones reach this machine by, then print again`,
        );
      }
      const rows = await listLabelRows(db, q.travelerId ? { travelerId: q.travelerId } : { buildId: first.buildId });
      return Promise.all(
        rows.map(async ({ qrToken, ...r }) => {
          const url = `${publicUrl}/t/${qrToken}`;
          return {
            ...r,
            url,
            qrDataUrl: await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, scale: 8 }),
          };
        }),
      );
    },
  };
};

/** Whose work it was, as stored (help by name, the builder's own without) and as the log's detail says it. */
function creditFrom(c: { by: StepPerformer; byName?: string }) {
  const performerName = c.by === 'builder' ? null : (c.byName ?? null);
  return {
    performer: c.by,
    performerName,
    detail: { by: c.by, ...(performerName ? { byName: performerName } : {}) },
  };
}

/**
 * A session of work (started, or hours entered) with its log entry, dated when the work began: the
 * device's time of a start, the given start of hours entered afterwards.
 */
async function addSession(
  tx: Db,
  user: Express.User,
  travelerId: string,
  credit: { by: StepPerformer; byName?: string },
  times: { startedAt: Date; endedAt?: Date; entered?: boolean },
  kind: 'work_started' | 'hours_entered',
  detail: Record<string, unknown>,
  when: BenchTime = { doneAt: times.startedAt, clockOffsetMs: null },
) {
  const c = creditFrom(credit);
  await insertSession(tx, {
    travelerId,
    personId: user.id,
    performer: c.performer,
    performerName: c.performerName,
    ...times,
  });
  await insertTravelerEvent(tx, {
    travelerId,
    actorId: user.id,
    kind,
    detail: { ...detail, ...c.detail },
    doneAt: when.doneAt ?? times.startedAt,
    clockOffsetMs: when.clockOffsetMs,
  });
}

/** The step rules' refusal as the API's 409. */
function stepRule(steps: StepFact[], stepId: string, change: 'done' | 'undone' | 'stamp') {
  const refusal = checkStepChange(steps, stepId, change);
  if (refusal) throw conflict(refusal.message);
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The list's cursor: [0 live / 1 replaced, serial, id]; one whose parts are not of that form is refused before the database sees it. */
function readCursor(cursor: string | undefined): TravelerCursor | null {
  const key = decodeCursor(cursor, ['number', 'string', 'string']);
  if (!key) return null;
  const [rank, serial, id] = key as [number, string, string];
  if ((rank !== 0 && rank !== 1) || !UUID.test(id) || serial.length === 0) {
    throw badRequest('cursor is not one this list gave: start again from the first page', {
      cursor: 'not a cursor of this list',
    });
  }
  return [rank, serial, id];
}
