import {
  matchMutation,
  useMutationState,
  useQueryClient,
  type Mutation,
  type QueryClient,
} from '@tanstack/react-query';
import { useCallback, useMemo, useSyncExternalStore } from 'react';
import {
  countHoles,
  tickHolesInput,
  type FindingDetail,
  type FindingInput,
  type Hole,
  type StepInput,
  type StepPerformer,
  type TickHolesInput,
  type TravelerDetail,
  type WorkSession,
  type WorkStartInput,
  type WorkStopInput,
} from '@/db/contracts';
import { api, ApiError, errorMessage, signedInPersonId } from '@/lib/api-client';
import { forgetPhotos } from '@/lib/kept-photos';
import { findingFormData, keptIdsOf, type DraftPhoto } from '@/lib/photo-form-data';
import { readJson, removeKey, storageKeys, writeJson } from '@/lib/storage';
import { buildKeys } from './builds';
import type { FindingDraft } from '../use-finding-draft';
import { findingKeys } from './findings';
import { invalidateAll } from './mutations';
import { travelerDetailPath, travelerKeys, type TravelerStep } from './travelers';

/**
 * What the builder does at the bench without needing signal: ticking holes, a step done or undone, work
 * started and stopped, and a finding flagged (its photos kept on the device by lib/kept-photos). Each is
 * a mutation on TanStack Query's own machinery, kept on the device until the server has it
 * (lib/query-client.ts persists the unsent ones), stamped with the moment it was done on the device and
 * with the person who did it, shown at once, and sent in the order made, in one queue for every part. An action goes only as its maker's: one that finds its maker signed out when its turn
 * comes is set aside on the device under that person (`keptFor`) and handed back to the queue when they
 * sign in again, neither sent as the next person's work nor holding up theirs.
 */

function recount(detail: TravelerDetail, holes: Hole[]): TravelerDetail {
  const c = countHoles(holes);
  return { ...detail, holes, holesDone: c.done, holesAwaitingInspector: c.awaiting };
}

/** The change a tick makes on the client before the server answers: only pending ↔ installed move. */
export function applyTick(detail: TravelerDetail, input: TickHolesInput): TravelerDetail {
  const ids = new Set(input.holeIds);
  const holes = detail.holes.map((h) =>
    ids.has(h.holeId) && (h.status === 'pending' || h.status === 'installed') ? { ...h, status: input.status } : h,
  );
  return recount(detail, holes);
}

function mergeHoles(detail: TravelerDetail, changed: Hole[]): TravelerDetail {
  const byId = new Map(changed.map((h) => [h.holeId, h]));
  const holes = detail.holes.map((h) => byId.get(h.holeId) ?? h);
  return recount(detail, holes);
}

/** Who did the work, as the chooser above the steps says (the builder when left out). */
type Credit = { by?: StepPerformer; byName?: string };
/** A tick kept by an earlier version has no `kind`. */
type TickBody = TickHolesInput & { kind?: 'tick' };
type StepBody = Credit & { kind: 'step'; stepId: string; done: boolean };
type WorkBody = (Credit & { kind: 'work-start' }) | { kind: 'work-stop' };
/**
 * A finding sent without signal: its fields and its photos as the draft kept them (on the web, the id of
 * their bytes on the device: lib/kept-photos.web.ts), so the queue carries no photo itself.
 */
type FindingBody = { kind: 'finding'; input: FindingInput; photos: DraftPhoto[] };
/**
 * Where, when and whose: the part, the moment the action was done on the device (sent as `doneAt`), the
 * id of the person signed in then, and the action's own id on this device (both absent on ticks kept by
 * an earlier version).
 */
type Kept = { travelerId: string; at: string; personId?: string; id?: string };

/** One action as it travels and is kept on the device. */
export type BenchAction = (TickBody | StepBody | WorkBody | FindingBody) & Kept;
export type TickVariables = TickBody & Kept;
type TickResult = { holes: Hole[] };
export const isTick = (a: BenchAction): a is TickVariables => a.kind === undefined || a.kind === 'tick';
type ActionResult = TickResult | TravelerDetail | FindingDetail;
/**
 * What an action changed, as it was before, to undo that action alone if it is refused (kept small: it is
 * stored with the action). `before` is a tick's holes; `step` and `running` the other kinds'.
 */
type ActionContext = { before: Hole[]; step?: TravelerStep; running?: WorkSession | null };

/**
 * Sends one action: exactly what its route's contract takes. `doneAt` is the moment it was done on the
 * device; `sentAt`, read as it leaves, lets the server tell a late action from a device clock that is off.
 */
async function sendAction(a: BenchAction): Promise<ActionResult> {
  const now = signedInPersonId();
  // The session is still being read from the device (native): wait, rather than set the action aside.
  if (a.personId && now === undefined) throw new ApiError(0, 'session_loading', 'reading the session');
  if (a.personId && a.personId !== now) throw new MakerAway();
  const times = { doneAt: a.at, sentAt: new Date().toISOString() };
  const credit = (c: Credit) => ({ ...(c.by ? { by: c.by } : {}), ...(c.byName ? { byName: c.byName } : {}) });
  const base = travelerDetailPath(a.travelerId);
  switch (a.kind) {
    case 'step':
      return api.post<TravelerDetail>(`${base}/steps/${encodeURIComponent(a.stepId)}`, {
        done: a.done,
        ...credit(a),
        ...times,
      } satisfies StepInput);
    case 'work-start':
      return api.post<TravelerDetail>(`${base}/work/start`, { ...credit(a), ...times } satisfies WorkStartInput);
    case 'work-stop':
      return api.post<TravelerDetail>(`${base}/work/stop`, times satisfies WorkStopInput);
    case 'finding':
      return api.upload<FindingDetail>('/api/findings', await findingFormData(a.input, a.photos));
    default:
      return api.post<TickResult>(`${base}/holes`, {
        holeIds: a.holeIds,
        status: a.status,
        ...times,
      } satisfies TickHolesInput);
  }
}

/** The reader's session as it shows before the server has it. */
const unsentSession = (a: Credit & Kept): WorkSession => ({
  id: 'unsent',
  personName: '',
  by: a.by ?? 'builder',
  byName: a.byName ?? null,
  startedAt: a.at,
  endedAt: null,
  entered: false,
});

const withRunning = (d: TravelerDetail, running: WorkSession | null): TravelerDetail =>
  d.work ? { ...d, work: { ...d.work, running } } : d;

const withStep = (d: TravelerDetail, step: TravelerStep): TravelerDetail => ({
  ...d,
  steps: d.steps.map((s) => (s.id === step.id ? step : s)),
});

/** What an action changes on the client before the server answers. */
export function applyAction(d: TravelerDetail, a: BenchAction): TravelerDetail {
  switch (a.kind) {
    case 'step': {
      const step = d.steps.find((s) => s.id === a.stepId);
      if (!step) return d;
      const credit = a.done ? { by: a.by ?? 'builder', byName: a.byName ?? null } : { by: null, byName: null };
      return withStep(d, { ...step, doneAt: a.done ? a.at : null, ...credit });
    }
    case 'work-start':
      return withRunning(d, d.work?.running ?? unsentSession(a));
    case 'work-stop':
      return withRunning(d, null);
    case 'finding':
      return d; // the part shows it waiting (the notices); its holes change once the server has it
    default:
      return applyTick(d, a);
  }
}

/** What an action changes, as it stands now: kept with it to undo it alone. */
function beforeAction(d: TravelerDetail, a: BenchAction): ActionContext {
  switch (a.kind) {
    case 'step':
      return { before: [], step: d.steps.find((s) => s.id === a.stepId) };
    case 'work-start':
    case 'work-stop':
      return { before: [], running: d.work?.running ?? null };
    case 'finding':
      return { before: [] };
    default: {
      const ids = new Set(a.holeIds);
      return { before: d.holes.filter((h) => ids.has(h.holeId)) };
    }
  }
}

/** Undoes one refused action, keeping every other made meanwhile. */
function undoAction(d: TravelerDetail, ctx: ActionContext): TravelerDetail {
  if (ctx.step) return withStep(d, ctx.step);
  if (ctx.running !== undefined) return withRunning(d, ctx.running);
  return ctx.before.length ? mergeHoles(d, ctx.before) : d;
}

/** Its maker is not the one signed in: the action is set aside for them, never sent, never refused. */
class MakerAway extends Error {
  constructor() {
    super('waiting for the person who did this to sign in on this device');
  }
}

/**
 * Worth another try later: no signal, the server down, or a sign-in to renew first. A refusal is final;
 * so is a server that keeps failing on this one action (a fault, not a passing load): tried for some
 * minutes, then refused, so it cannot hold up the queue behind it for good.
 */
const SERVER_FAULT_TRIES = 20;
export const worthWaiting = (count: number, e: unknown) =>
  e instanceof ApiError && (e.isNetwork || e.status === 401 || (e.status >= 500 && count < SERVER_FAULT_TRIES));
/** Tries while the browser says there is signal but the server cannot be reached are spaced up to this. */
const RETRY_CAP_MS = 15_000;
/** How long a refused action's message stays for the bench to read, unless dismissed. */
const REFUSAL_KEPT_MS = 30 * 60_000;
/** The most actions set aside for one person, and refusals remembered: far beyond a day at the bench. */
const KEPT_MAX = 5000;
const REFUSALS_MAX = 20;

type Refusal = { message: string; travelerId: string; personId?: string; at: number };
/**
 * Refusals, remembered here for the bench to show rather than read off the failed mutations: those have
 * no observer once the screen that made them is gone, and the cache may drop them soon after they fail.
 */
let refusals: Refusal[] = [];
const refusalListeners = new Set<() => void>();
function setRefusals(next: Refusal[]) {
  refusals = next;
  refusalListeners.forEach((l) => l());
}
const subscribeRefusals = (l: () => void) => {
  refusalListeners.add(l);
  return () => void refusalListeners.delete(l);
};
function remember(a: BenchAction, e: unknown, outcome = 'was taken back') {
  const r = {
    message: `Not saved: ${errorMessage(e)} ${actionWords(a)} ${outcome}.`,
    travelerId: a.travelerId,
    personId: a.personId,
    at: Date.now(),
  };
  setRefusals([...refusals.filter((x) => Date.now() - x.at < REFUSAL_KEPT_MS), r].slice(-REFUSALS_MAX));
}

/**
 * The holes of a queued finding are already under one: most likely this very finding, which reached the
 * server while its answer was lost, and went again from the queue. Not raised twice, nor put back.
 */
const alreadyRaised = (e: unknown) => e instanceof ApiError && e.status === 409 && !!e.fields?.holeIds;

/**
 * A refused finding goes back to its maker's form on this device, photos and all, to be put right and sent
 * again: unless they have begun another on that part meanwhile, which is not overwritten. The message
 * says which.
 */
async function backInForm(a: FindingBody & Kept, e: unknown): Promise<void> {
  if (alreadyRaised(e)) {
    remember(a, e, "was not raised again: see the part's findings");
    void forgetPhotos(keptIdsOf(a.photos));
    return;
  }
  const key = storageKeys.findingDraft(a.personId ?? null, a.travelerId);
  try {
    if (await readJson(key)) {
      remember(a, e, 'could not go back in its form, where a finding begun since is kept: flag it again');
      return;
    }
    const { holeIds, kind, note, measurements } = a.input;
    await writeJson(key, {
      values: { holeIds, kind, note, measurements },
      photos: a.photos,
      savedAt: a.at,
    } satisfies FindingDraft);
    remember(a, e, 'is back in its form');
  } catch {
    remember(a, e, 'could not be kept on this device: flag it again');
  }
}

/** Writes to one person's set-aside actions, one at a time (each reads what the last one wrote). */
let keeping: Promise<unknown> = Promise.resolve();
const inTurn = <T>(work: () => Promise<T>): Promise<T> => {
  const next = keeping.then(work, work);
  keeping = next.catch(() => undefined);
  return next;
};

const readKept = async (personId: string) => {
  const kept = await readJson<BenchAction[]>(storageKeys.keptFor(personId));
  return Array.isArray(kept)
    ? kept.filter((a) => a && a.personId === personId && typeof a.travelerId === 'string')
    : [];
};

/**
 * Sets an action aside on the device for its maker, after those set aside before it (once: by its id).
 * Should the device refuse to store it, the bench is told rather than the action lost without a word.
 */
const keepForMaker = (a: BenchAction & { personId: string }) =>
  inTurn(async () => {
    const kept = await readKept(a.personId);
    if (a.id && kept.some((k) => k.id === a.id)) return;
    await writeJson(storageKeys.keptFor(a.personId), [...kept, a].slice(-KEPT_MAX));
  }).catch((e: unknown) => remember(a, new Error(`it could not be kept on this device (${errorMessage(e)}).`)));

/**
 * Ids of actions found set aside when their maker signed in: only these touch the device's storage when
 * they settle, not every tick.
 */
const foundKept = new Set<string>();

/** Forgets an action set aside for its maker once it has gone through the queue again. */
const settledFromKept = (a: BenchAction) =>
  a.personId && a.id && foundKept.delete(a.id)
    ? inTurn(async () => {
        const kept = await readKept(a.personId!);
        if (!kept.some((k) => k.id === a.id)) return;
        const rest = kept.filter((k) => k.id !== a.id);
        await (rest.length
          ? writeJson(storageKeys.keptFor(a.personId!), rest)
          : removeKey(storageKeys.keptFor(a.personId!)));
      }).catch(() => undefined)
    : undefined;

/**
 * When a person signs in (after the device's kept queue is restored): the actions set aside for them go
 * back into the queue in their order, each but once (by its id: one kept in both places goes once). Each
 * stays set aside until it has gone through, so closing the app meanwhile loses nothing.
 */
export function resumeKeptFor(qc: QueryClient, personId: string): Promise<void> {
  return inTurn(async () => {
    const queued = new Set(
      qc
        .getMutationCache()
        .getAll()
        .filter(isUnsentAction)
        .map((m) => (m.state.variables as BenchAction | undefined)?.id),
    );
    for (const a of (await readKept(personId)).slice(0, KEPT_MAX)) {
      if (a.id) foundKept.add(a.id);
      if (a.id && queued.has(a.id)) continue;
      queueAction(qc, a).catch(() => undefined);
    }
  });
}

/** An action not yet through to the server: on its way, waiting for signal, or for a new sign-in. */
export const isUnsentAction = (m: Mutation) =>
  matchMutation({ mutationKey: travelerKeys.benchActions(), status: 'pending' }, m);

/** Made by the person signed in now (or by someone unknown, before actions knew their maker): shown to them. */
const isMine = (a: BenchAction | undefined): a is BenchAction =>
  !!a && (!a.personId || a.personId === signedInPersonId());

function unsentActions(qc: QueryClient, travelerId: string, except?: BenchAction): BenchAction[] {
  return qc
    .getMutationCache()
    .findAll({ mutationKey: travelerKeys.benchActionsOf(travelerId), status: 'pending' })
    .map((m) => m.state.variables as BenchAction | undefined)
    .filter((v): v is BenchAction => isMine(v) && v !== except);
}

/** The server's copy of a part with the actions not yet through counted in, oldest first. */
export function withUnsentActions(detail: TravelerDetail, qc: QueryClient, except?: BenchAction): TravelerDetail {
  return unsentActions(qc, detail.id, except).reduce((d, a) => applyAction(d, a), detail);
}

/**
 * The bench's actions, registered once on the query client under their key, so an action kept on the
 * device finds its way to the server after a reload too. Shown at once (optimistic); refused, only that
 * action is taken back. Without signal TanStack Query pauses it (its online manager) and sends it when
 * the signal returns; with signal but no server it tries again, spaced out.
 */
export function registerBenchActions(qc: QueryClient): void {
  qc.setMutationDefaults(travelerKeys.benchActions(), benchActionOptions(qc));
}

function benchActionOptions(qc: QueryClient) {
  return {
    mutationFn: (a: BenchAction) => sendAction(a),
    // One queue for every part: actions reach the server in the order they were made (a start before its stop).
    scope: { id: 'ticks' },
    retry: worthWaiting,
    retryDelay: (n: number) => Math.min(RETRY_CAP_MS, 1000 * 2 ** n),
    onMutate: async (a: BenchAction): Promise<ActionContext> => {
      const key = travelerKeys.detail(a.travelerId);
      await qc.cancelQueries({ queryKey: key });
      const now = qc.getQueryData<TravelerDetail>(key);
      if (!now) return { before: [] };
      qc.setQueryData<TravelerDetail>(key, applyAction(now, a));
      return beforeAction(now, a);
    },
    onError: (e: unknown, a: BenchAction, ctx: ActionContext | undefined) => {
      // Not a refusal: its maker signed out meanwhile (what they saw went with their session).
      if (e instanceof MakerAway && a.personId) return keepForMaker({ ...a, personId: a.personId });
      if (a.kind === 'finding') return backInForm(a, e);
      remember(a, e);
      const key = travelerKeys.detail(a.travelerId);
      const now = qc.getQueryData<TravelerDetail>(key);
      if (now && ctx) qc.setQueryData<TravelerDetail>(key, undoAction(now, ctx));
    },
    onSuccess: (data: unknown, a: BenchAction) => {
      if (a.kind === 'finding') {
        void invalidateAll(qc, [findingKeys.lists()]);
        // Not waited for: the action must settle (and leave the device's queue) before a reload could send it again.
        void forgetPhotos(keptIdsOf(a.photos));
        return;
      }
      const key = travelerKeys.detail(a.travelerId);
      const now = qc.getQueryData<TravelerDetail>(key);
      if (!now || !data) return;
      // A tick answers with its holes; the other actions with the part, onto which those still unsent go again.
      if (isTick(a))
        qc.setQueryData<TravelerDetail>(
          key,
          withUnsentActions(mergeHoles(now, (data as TickResult).holes ?? []), qc, a),
        );
      else qc.setQueryData<TravelerDetail>(key, withUnsentActions(data as TravelerDetail, qc, a));
    },
    // A burst of taps refetches once, after the last one. Not waited for: the queue moves on meanwhile,
    // and a refetch paused by a lost signal must not hold the next action.
    onSettled: (_d: unknown, e: unknown, a: BenchAction) => {
      if (e instanceof MakerAway) return;
      void settledFromKept(a);
      if (unsentActions(qc, a.travelerId).length > 1) return;
      void invalidateAll(qc, [travelerKeys.detail(a.travelerId), travelerKeys.list(), buildKeys.all]);
    },
  };
}

/** Sends the unsent actions restored from the device, in their order (paused or not when they were kept). */
export function resumeUnsentActions(qc: QueryClient): Promise<unknown> {
  const cache = qc.getMutationCache();
  const notPaused = cache.getAll().filter((m) => isUnsentAction(m) && !m.state.isPaused);
  return Promise.all([qc.resumePausedMutations(), ...notPaused.map((m) => m.continue().catch(() => undefined))]);
}

/** Ticks an earlier version of the app kept under a key of its own: handed to the query client once, in order. */
export async function adoptEarlierTicks(qc: QueryClient): Promise<void> {
  const old = await readJson<unknown[]>(storageKeys.oldOfflineTicks);
  if (!Array.isArray(old)) return;
  for (const x of old.slice(0, 5000)) {
    const t = x as Partial<TickVariables>;
    const parsed = tickHolesInput.safeParse(t);
    if (!parsed.success || typeof t.travelerId !== 'string' || typeof t.at !== 'string') continue;
    queueAction(qc, { ...parsed.data, travelerId: t.travelerId, at: t.at }).catch(() => undefined);
  }
  await removeKey(storageKeys.oldOfflineTicks);
}

/** Puts one action in the queue (the same options as the registered defaults: tests make their own clients). */
function queueAction(qc: QueryClient, a: BenchAction): Promise<ActionResult> {
  return qc
    .getMutationCache()
    .build(qc, { ...benchActionOptions(qc), mutationKey: travelerKeys.benchActionsOf(a.travelerId) })
    .execute(a);
}

/** Unique on this device: the time and a random part (crypto.randomUUID is not on every phone's browser). */
const newActionId = () => `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;

/** An action as made now on this device, by the person signed in. */
function stamped(body: TickBody | StepBody | WorkBody | FindingBody, travelerId: string): BenchAction {
  const personId = signedInPersonId() ?? undefined;
  return { ...body, travelerId, at: new Date().toISOString(), id: newActionId(), ...(personId ? { personId } : {}) };
}

const isWork = (kind: BenchAction['kind']) => kind === 'work-start' || kind === 'work-stop';

/**
 * One kind of action on one part: `mutate` takes what the kind needs, stamps it with the device's time and
 * the person signed in, and queues it. Not tied to the screen: an action goes on after the part is
 * closed. `onError` hears of a refusal while the screen is open (the notices show it too).
 */
function useBenchAction<I>(travelerId: string, body: (input: I) => TickBody | StepBody | WorkBody) {
  const qc = useQueryClient();
  const mutate = useCallback(
    (input: I, opts?: { onError?: (e: Error) => void }) => {
      const action = stamped(body(input), travelerId);
      // A second tap on Start (or Stop) before the first is through would only be refused.
      if (isWork(action.kind) && unsentActions(qc, travelerId).at(-1)?.kind === action.kind) return;
      queueAction(qc, action).catch((e: Error) => {
        if (!(e instanceof MakerAway)) opts?.onError?.(e);
      });
    },
    [qc, travelerId, body],
  );
  // Stable between renders: the holes' press handlers depend on it.
  return useMemo(() => ({ mutate }), [mutate]);
}

const tickBody = (input: TickHolesInput): TickBody => ({ holeIds: input.holeIds, status: input.status });
const stepBody = (input: Omit<StepBody, 'kind'>): StepBody => ({ kind: 'step', ...input });
const startBody = (input: Credit): WorkBody => ({ kind: 'work-start', ...input });
const stopBody = (): WorkBody => ({ kind: 'work-stop' });

/** Ticking holes on one part: the holes and their new state. */
export const useTravelerTickMutation = (travelerId: string) => useBenchAction(travelerId, tickBody);
/** A step done or undone, saying whose work it was. */
export const useTravelerStepMutation = (travelerId: string) => useBenchAction(travelerId, stepBody);
/** Starts a work session on the part now, as the builder's or the named help's work. */
export const useWorkStartMutation = (travelerId: string) => useBenchAction(travelerId, startBody);
/** Stops the person's running session now. */
export const useWorkStopMutation = (travelerId: string) => useBenchAction<void>(travelerId, stopBody);

/**
 * A finding the server could not be reached for, put in the bench's queue: it goes when the signal
 * returns, in turn with the ticks made before it. Its photos must be kept on the device already
 * (lib/kept-photos); they are let go once the server has it, and a refusal puts it back in its form.
 */
export function useQueueFinding() {
  const qc = useQueryClient();
  return useCallback(
    (input: FindingInput, photos: DraftPhoto[]) => {
      queueAction(qc, stamped({ kind: 'finding', input, photos }, input.travelerId)).catch(() => undefined);
    },
    [qc],
  );
}

/** Holes named in a message: the first eight, then how many more. */
const listed = (ids: string[]) => `${ids.slice(0, 8).join(', ')}${ids.length > 8 ? ` and ${ids.length - 8} more` : ''}`;

/** The action in words, for the message when it is refused. */
function actionWords(a: BenchAction): string {
  switch (a.kind) {
    case 'step':
      return a.done ? 'The step marked done' : 'The step marked not done';
    case 'work-start':
      return 'The start of work';
    case 'work-stop':
      return 'The stop of work';
    case 'finding':
      return `The finding on ${listed(a.input.holeIds)}`;
    default: {
      return `The tick of ${listed(a.holeIds)}`;
    }
  }
}

/**
 * The actions that could not get through yet (no signal, the server down, a sign-in to renew), on one
 * part or, without `travelerId`, on every part; and the last refusal of one, with its part, for the bench
 * to show. Dismissing forgets those refusals. Only the signed-in person's own are counted.
 */
export function useBenchQueue(travelerId?: string): {
  waiting: BenchAction[];
  refused: { message: string; travelerId: string } | null;
  dismissRefused: () => void;
} {
  const key = travelerId ? travelerKeys.benchActionsOf(travelerId) : travelerKeys.benchActions();
  const waiting = useMutationState({
    filters: {
      mutationKey: key,
      status: 'pending',
      predicate: (m) => isMine(m.state.variables as BenchAction) && (m.state.isPaused || m.state.failureCount > 0),
    },
    select: (m) => m.state.variables as BenchAction,
  });
  const all = useSyncExternalStore(subscribeRefusals, () => refusals);
  const shown = useCallback(
    (r: Refusal) =>
      (!travelerId || r.travelerId === travelerId) &&
      (!r.personId || r.personId === signedInPersonId()) &&
      Date.now() - r.at < REFUSAL_KEPT_MS,
    [travelerId],
  );
  const last = all.filter(shown).at(-1);
  const dismissRefused = useCallback(() => setRefusals(refusals.filter((r) => !shown(r))), [shown]);
  return {
    waiting,
    refused: last ? { message: last.message, travelerId: last.travelerId } : null,
    dismissRefused,
  };
}
