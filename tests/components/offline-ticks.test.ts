import { onlineManager, QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { persistQueryClient } from '@tanstack/react-query-persist-client';
import { act, createElement } from 'react';
import {
  stepInput,
  tickHolesInput,
  workStartInput,
  workStopInput,
  type TravelerDetail,
  type WorkSession,
} from '@/db/contracts';
import {
  isUnsentAction,
  resumeKeptFor,
  worthWaiting,
  useBenchQueue,
  useQueueFinding,
  useTravelerStepMutation,
  useTravelerTickMutation,
  useWorkStartMutation,
  useWorkStopMutation,
  withUnsentActions,
  type BenchAction,
  type TickVariables,
} from '@/hooks/queries/bench-actions';
import { ApiError, configureApiClient } from '@/lib/api-client';
import { travelerKeys } from '@/hooks/queries/travelers';
import { afterRestore, clearForNextPerson, makeQueryClient, persistOptions } from '@/lib/query-client';
import { storageKeys } from '@/lib/storage';
import { renderWeb } from './render-web';

/**
 * Ticks (and the bench's other actions: a step done, work started and stopped) made without signal, as tick mutations on TanStack Query's own machinery: paused by its online
 * manager, kept on the device by its persister (localStorage here, as in the browser) with the time each
 * was made on the device, restored into a new client as after a reload, and sent in the order made.
 */

const step = (id: string, seq: number) => ({ id, seq, doneAt: null, doneByName: null, by: null, byName: null });
const detail = (id: string) =>
  ({
    id,
    holes: [
      { holeId: 'U-01', line: 'U', seq: 1, stationIn: 0.25, status: 'pending' },
      { holeId: 'U-02', line: 'U', seq: 2, stationIn: 1.25, status: 'pending' },
    ],
    holesDone: 0,
    steps: [step('s1', 1), step('s2', 2)],
    work: { running: null, recent: [], totalHours: 0, byWho: [] },
  }) as unknown as TravelerDetail;

jest.setTimeout(30_000);

const original = global.fetch;
const clients: QueryClient[] = [];
const stops: (() => void)[] = [];
afterEach(() => {
  global.fetch = original;
  stops.splice(0).forEach((s) => s());
  clients.splice(0).forEach((c) => c.clear());
  onlineManager.setOnline(true);
  jest.useRealTimers();
  localStorage.clear();
  configureApiClient({ getPersonId: () => null });
});

const answer = (status: number, body: unknown) => ({
  ok: status < 400,
  status,
  text: async () => JSON.stringify(body),
});

type Sent = { travelerId: string; body: unknown };
/** Records what reaches it; `paths` gets each request's path after the part's id (holes, steps/s1, work/start…). */
function recordingServer(status = 200, body: unknown = { holes: [] }, paths: string[] = []): Sent[] {
  const sent: Sent[] = [];
  global.fetch = jest.fn(async (url: string, init?: { body?: string }) => {
    const b = JSON.parse(init!.body!);
    const parts = url.split('/');
    sent.push({ travelerId: decodeURIComponent(parts[3]), body: b });
    paths.push(parts.slice(4).join('/'));
    return answer(status, body);
  }) as never;
  return sent;
}
const noSignal = () => {
  global.fetch = jest.fn(async () => {
    throw new TypeError('Failed to fetch');
  }) as never;
};

/** A client as the app makes it, kept on the device as the app keeps it; restored like a reload. */
async function device(): Promise<QueryClient> {
  const qc = makeQueryClient();
  clients.push(qc);
  const [stop, restored] = persistQueryClient({ queryClient: qc, ...persistOptions() });
  stops.push(stop);
  await restored;
  await afterRestore(qc);
  return qc;
}

/** The bench's hooks for one part, mounted with react-dom as the web app mounts them. */
function tickHook(qc: QueryClient, travelerId: string) {
  const result = {} as {
    current: {
      tick: ReturnType<typeof useTravelerTickMutation>;
      step: ReturnType<typeof useTravelerStepMutation>;
      start: ReturnType<typeof useWorkStartMutation>;
      stop: ReturnType<typeof useWorkStopMutation>;
      queue: ReturnType<typeof useBenchQueue>;
      /** Every part's, as the bench shows them. */
      all: ReturnType<typeof useBenchQueue>;
      finding: ReturnType<typeof useQueueFinding>;
    };
  };
  function Probe() {
    result.current = {
      tick: useTravelerTickMutation(travelerId),
      step: useTravelerStepMutation(travelerId),
      start: useWorkStartMutation(travelerId),
      stop: useWorkStopMutation(travelerId),
      queue: useBenchQueue(travelerId),
      all: useBenchQueue(),
      finding: useQueueFinding(),
    };
    return null;
  }
  const { unmount } = renderWeb(createElement(QueryClientProvider, { client: qc }, createElement(Probe)));
  return { result, unmount };
}

/** A device with no signal, part t1 open on the bench. */
async function offlineBench() {
  onlineManager.setOnline(false);
  const qc = await device();
  qc.setQueryData(travelerKeys.detail('t1'), detail('t1'));
  return { qc, hook: tickHook(qc, 't1') };
}

/** Ticks at a given moment of the device's clock (only Date is faked; timers run for real). */
function at(iso: string) {
  jest.useFakeTimers({
    now: new Date(iso),
    doNotFake: [
      'setTimeout',
      'clearTimeout',
      'setInterval',
      'clearInterval',
      'setImmediate',
      'clearImmediate',
      'nextTick',
      'queueMicrotask',
      'performance',
      'hrtime',
    ],
  });
}

/** A tick of one hole on `hook`'s part at a moment of the device's clock (which stays faked: see `at`). */
function tickAt(hook: ReturnType<typeof tickHook>, iso: string, holeId: string, status: 'installed' | 'pending') {
  at(iso);
  act(() => hook.result.current.tick.mutate({ holeIds: [holeId], status }));
}

const until = async (ok: () => boolean, what: string) => {
  for (let i = 0; i < 200 && !ok(); i++) await act(() => new Promise((r) => setTimeout(r, 25)));
  if (!ok()) throw new Error(`timed out waiting until ${what}`);
};

const keptOnDevice = () => {
  const raw = localStorage.getItem(storageKeys.queryCache);
  const kept = raw ? (JSON.parse(raw).clientState.mutations as { state: { variables: BenchAction } }[]) : [];
  return kept.map((m) => m.state.variables);
};

describe('ticks made without signal', () => {
  it('wait paused, show on their own part only, and are kept on the device in the order made', async () => {
    onlineManager.setOnline(false);
    const sent = recordingServer();
    const qc = await device();
    qc.setQueryData(travelerKeys.detail('t1'), detail('t1'));
    const one = tickHook(qc, 't1');
    const two = tickHook(qc, 't2');
    tickAt(one, '2026-11-03T14:05:09.000Z', 'U-01', 'installed');
    tickAt(two, '2026-11-03T14:06:00.000Z', 'U-02', 'installed');
    tickAt(one, '2026-11-03T14:07:30.000Z', 'U-02', 'installed');
    jest.useRealTimers();

    await until(() => one.result.current.queue.waiting.length === 2, 'both ticks of t1 wait');
    expect(two.result.current.queue.waiting).toHaveLength(1);
    expect(one.result.current.all.waiting.map((t) => t.travelerId)).toEqual(['t1', 't2', 't1']);
    expect(sent).toEqual([]);
    // Shown at once on the cached part, and counted in over the server's copy of any part.
    const shown = qc.getQueryData<TravelerDetail>(travelerKeys.detail('t1'))!;
    expect(shown.holes.map((h) => h.status)).toEqual(['installed', 'installed']);
    expect(withUnsentActions(detail('t1'), qc).holes.map((h) => h.status)).toEqual(['installed', 'installed']);
    expect(withUnsentActions(detail('t3'), qc).holes.map((h) => h.status)).toEqual(['pending', 'pending']);

    await until(() => keptOnDevice().length === 3, 'the persister has written them');
    expect((keptOnDevice() as TickVariables[]).map((t) => [t.travelerId, t.holeIds[0], t.at])).toEqual([
      ['t1', 'U-01', '2026-11-03T14:05:09.000Z'],
      ['t2', 'U-02', '2026-11-03T14:06:00.000Z'],
      ['t1', 'U-02', '2026-11-03T14:07:30.000Z'],
    ]);
    // A person signing out does not throw away work done at the bench.
    clearForNextPerson(qc);
    expect(qc.getMutationCache().getAll().filter(isUnsentAction)).toHaveLength(3);
  });

  it('survive a reload and are sent in the order made, with the time each was made, once the signal returns', async () => {
    onlineManager.setOnline(false);
    const first = await device();
    const hook = tickHook(first, 't1');
    tickAt(hook, '2026-11-03T09:00:00.000Z', 'U-01', 'installed');
    tickAt(hook, '2026-11-03T09:00:04.000Z', 'U-02', 'installed');
    tickAt(hook, '2026-11-03T09:01:00.000Z', 'U-01', 'pending');
    jest.useRealTimers();
    await until(() => keptOnDevice().length === 3, 'the persister has written them');
    // The tab closes: its client is gone, only the device's storage is left.
    hook.unmount();
    stops.splice(0).forEach((s) => s());
    clients.splice(0).forEach((c) => c.getMutationCache().clear());

    const sent = recordingServer();
    const reconnectedAt = Date.now();
    const second = await device();
    const again = tickHook(second, 't1');
    expect(second.getMutationCache().getAll().filter(isUnsentAction)).toHaveLength(3);
    // Each still carries the moment it was made on the device.
    expect((again.result.current.queue.waiting as TickVariables[]).map((t) => [t.holeIds[0], t.status, t.at])).toEqual([
      ['U-01', 'installed', '2026-11-03T09:00:00.000Z'],
      ['U-02', 'installed', '2026-11-03T09:00:04.000Z'],
      ['U-01', 'pending', '2026-11-03T09:01:00.000Z'],
    ]);
    expect(withUnsentActions(detail('t1'), second).holes.map((h) => h.status)).toEqual(['pending', 'installed']);
    expect(sent).toEqual([]);

    act(() => onlineManager.setOnline(true));
    await until(() => second.getMutationCache().getAll().filter(isUnsentAction).length === 0, 'all are through');
    // In the order made, each with exactly the fields of the API's contract (tickHolesInput): the moment it
    // was made as doneAt, and the moment it left (after the signal came back) as sentAt.
    const sentAt = expect.any(String);
    expect(sent).toEqual([
      {
        travelerId: 't1',
        body: { holeIds: ['U-01'], status: 'installed', doneAt: '2026-11-03T09:00:00.000Z', sentAt },
      },
      {
        travelerId: 't1',
        body: { holeIds: ['U-02'], status: 'installed', doneAt: '2026-11-03T09:00:04.000Z', sentAt },
      },
      { travelerId: 't1', body: { holeIds: ['U-01'], status: 'pending', doneAt: '2026-11-03T09:01:00.000Z', sentAt } },
    ]);
    for (const x of sent) {
      const b = x.body as { sentAt: string };
      expect(tickHolesInput.safeParse(b).success).toBe(true);
      expect(Date.parse(b.sentAt)).toBeGreaterThanOrEqual(reconnectedAt);
    }
    await until(() => keptOnDevice().length === 0, 'the device no longer keeps them');
  });

  it('keep trying while the server cannot be reached though the browser says there is signal', async () => {
    noSignal();
    const qc = await device();
    const hook = tickHook(qc, 't1');
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'installed' }));
    await until(() => hook.result.current.queue.waiting.length === 1, 'the tick waits');
    await until(() => keptOnDevice().length === 1, 'the tick is kept on the device');
    const sent = recordingServer();
    // The next try is spaced a second or two after the first failure.
    await until(() => sent.length === 1 && hook.result.current.queue.waiting.length === 0, 'the tick is through');
  });

  it('are taken back with a message when refused for good, but kept while a sign-in must be renewed', async () => {
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'installed' }));
    await until(() => hook.result.current.queue.waiting.length === 1, 'the tick waits');

    const renew = recordingServer(401, { error: { code: 'unauthorized', message: 'sign in first' } });
    act(() => onlineManager.setOnline(true));
    await until(() => renew.length === 1, 'the tick was tried');
    await act(() => new Promise((r) => setTimeout(r, 100)));
    expect(qc.getMutationCache().getAll().filter(isUnsentAction)).toHaveLength(1);
    expect(hook.result.current.queue.refused).toBeNull();

    const refusing = recordingServer(409, {
      error: { code: 'conflict', message: 'hole U-01 (flagged) is under a finding and cannot be ticked here' },
    });
    await until(() => refusing.length === 1 && hook.result.current.queue.refused !== null, 'the refusal shows');
    expect(hook.result.current.queue.refused?.message).toMatch(/^Not saved: hole U-01 \(flagged\) is under a finding/);
    // The mutation cache tells its observers on the next tick, the refusal store at once.
    await until(() => hook.result.current.queue.waiting.length === 0, 'the tick no longer waits');
    expect(qc.getQueryData<TravelerDetail>(travelerKeys.detail('t1'))!.holes[0].status).toBe('pending');
    act(() => hook.result.current.queue.dismissRefused());
    await until(() => hook.result.current.queue.refused === null, 'the message is dismissed');
  });

  it('kept by an earlier version under its own key are taken over once, in their order', async () => {
    localStorage.setItem(
      storageKeys.oldOfflineTicks,
      JSON.stringify([
        { id: 'a', travelerId: 't1', holeIds: ['U-02'], status: 'installed', at: '2026-11-02T10:00:00.000Z' },
        { id: 'b', travelerId: 't1', holeIds: [], status: 'installed', at: '2026-11-02T10:00:01.000Z' },
        { id: 'c', travelerId: 't2', holeIds: ['U-01'], status: 'installed', at: '2026-11-02T10:00:02.000Z' },
      ]),
    );
    const sent = recordingServer();
    const qc = await device();
    await until(() => sent.length === 2, 'both valid ticks are through');
    expect(sent.map((x) => [x.travelerId, x.body])).toEqual([
      [
        't1',
        { holeIds: ['U-02'], status: 'installed', doneAt: '2026-11-02T10:00:00.000Z', sentAt: expect.any(String) },
      ],
      [
        't2',
        { holeIds: ['U-01'], status: 'installed', doneAt: '2026-11-02T10:00:02.000Z', sentAt: expect.any(String) },
      ],
    ]);
    expect(localStorage.getItem(storageKeys.oldOfflineTicks)).toBeNull();
    expect(qc.getMutationCache().getAll().filter(isUnsentAction)).toHaveLength(0);
  });
});

const running = (qc: QueryClient, id = 't1'): WorkSession | null =>
  qc.getQueryData<TravelerDetail>(travelerKeys.detail(id))!.work!.running;
const stepDone = (qc: QueryClient, stepId: string, id = 't1') =>
  qc.getQueryData<TravelerDetail>(travelerKeys.detail(id))!.steps.find((s) => s.id === stepId)!.doneAt;

describe('steps and work made without signal', () => {
  it('show at once, survive a reload, and reach the server in the order made with the time each was done', async () => {
    const { qc: first, hook } = await offlineBench();
    at('2026-11-03T08:00:00.000Z');
    // Shown once the part's own fetch is set aside (onMutate awaits that).
    await act(async () => hook.result.current.start.mutate({ by: 'helper', byName: 'Ines at the next bench' }));
    expect(running(first)).toMatchObject({ startedAt: '2026-11-03T08:00:00.000Z', by: 'helper' });
    tickAt(hook, '2026-11-03T09:30:00.000Z', 'U-01', 'installed');
    at('2026-11-03T09:45:00.000Z');
    await act(async () => hook.result.current.step.mutate({ stepId: 's1', done: true, by: 'builder' }));
    expect(stepDone(first, 's1')).toBe('2026-11-03T09:45:00.000Z');
    at('2026-11-03T10:15:00.000Z');
    await act(async () => hook.result.current.stop.mutate());
    expect(running(first)).toBeNull();
    jest.useRealTimers();
    await until(() => keptOnDevice().length === 4, 'the persister has written all four');
    await until(() => hook.result.current.queue.waiting.length === 4, 'all four wait');

    // A reload with no signal: the server's copy of the part shows them as made.
    hook.unmount();
    stops.splice(0).forEach((s) => s());
    clients.splice(0).forEach((c) => c.getMutationCache().clear());
    const second = await device();
    // Mounted, as the app mounts its client: it hears the signal come back.
    tickHook(second, 't1');
    const server = withUnsentActions(detail('t1'), second);
    expect([server.holes[0].status, server.steps[0].doneAt, server.work!.running]).toEqual([
      'installed',
      '2026-11-03T09:45:00.000Z',
      null,
    ]);

    const paths: string[] = [];
    const sent = recordingServer(200, detail('t1'), paths);
    act(() => onlineManager.setOnline(true));
    await until(() => second.getMutationCache().getAll().filter(isUnsentAction).length === 0, 'all are through');
    expect(paths).toEqual(['work/start', 'holes', 'steps/s1', 'work/stop']);
    const bodies = sent.map((x) => x.body as { doneAt: string });
    expect(bodies.map((b) => b.doneAt)).toEqual([
      '2026-11-03T08:00:00.000Z',
      '2026-11-03T09:30:00.000Z',
      '2026-11-03T09:45:00.000Z',
      '2026-11-03T10:15:00.000Z',
    ]);
    // Each is exactly what its route's contract takes.
    expect(bodies[0]).toMatchObject({ by: 'helper', byName: 'Ines at the next bench' });
    expect(
      [workStartInput, tickHolesInput, stepInput, workStopInput].map((c, i) => c.safeParse(bodies[i]).success),
    ).toEqual([true, true, true, true]);
  });

  it('refused, take back only that action, with words that say which', async () => {
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-02'], status: 'installed' }));
    act(() => hook.result.current.start.mutate({}));
    act(() => hook.result.current.step.mutate({ stepId: 's2', done: true }));
    await until(() => hook.result.current.queue.waiting.length === 3, 'all three wait');

    const paths: string[] = [];
    // The tick and the start go through (the part as the server has it comes back); the step is refused.
    // The part's own fetch fails, so only the undo can take the step back.
    global.fetch = jest.fn(async (url: string, init?: { method?: string }) => {
      if (init?.method === 'GET') return answer(503, { error: { code: 'busy', message: 'busy' } });
      paths.push(url.split('/').slice(4).join('/'));
      if (url.includes('/steps/'))
        return answer(409, { error: { code: 'conflict', message: 'step 2 waits for the inspection point above it' } });
      return answer(200, url.endsWith('/holes') ? { holes: [] } : detail('t1'));
    }) as never;
    act(() => onlineManager.setOnline(true));
    await until(() => paths.length === 3 && hook.result.current.queue.refused !== null, 'the refusal shows');
    expect(hook.result.current.queue.refused).toEqual({
      message: 'Not saved: step 2 waits for the inspection point above it The step marked done was taken back.',
      travelerId: 't1',
    });
    // The bench hears of it too, with its part; dismissed there, it is gone from both.
    expect(hook.result.current.all.refused).toEqual(hook.result.current.queue.refused);
    act(() => hook.result.current.all.dismissRefused());
    await until(() => hook.result.current.queue.refused === null, 'dismissed on the bench, gone from the part');
    expect(stepDone(qc, 's2')).toBeNull();
  });
});

describe('the queue at the bench', () => {
  it('waits out no signal, a sign-in to renew and a busy server, but not a server that keeps failing', () => {
    const network = new ApiError(0, 'network', 'no signal');
    const server = new ApiError(500, 'internal', 'fault');
    expect([worthWaiting(1000, network), worthWaiting(1000, new ApiError(401, 'unauthorized', 'sign in'))]).toEqual([
      true,
      true,
    ]);
    expect([worthWaiting(19, server), worthWaiting(19, new ApiError(503, 'busy', 'busy'))]).toEqual([true, true]);
    expect([worthWaiting(20, server), worthWaiting(0, new ApiError(409, 'conflict', 'no'))]).toEqual([false, false]);
  });

  it("counts a later unsent action in over an earlier one's answer", async () => {
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'installed' }));
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'pending' }));
    await until(() => hook.result.current.queue.waiting.length === 2, 'both wait');
    // The first is answered; the second stays on its way.
    let calls = 0;
    global.fetch = jest.fn(async () => {
      calls++;
      if (calls > 1) return new Promise(() => undefined);
      return answer(200, { holes: [{ ...detail('t1').holes[0], status: 'installed' }] });
    }) as never;
    act(() => onlineManager.setOnline(true));
    await until(() => calls === 2, 'the second is on its way');
    expect(qc.getQueryData<TravelerDetail>(travelerKeys.detail('t1'))!.holes[0].status).toBe('pending');
  });

  it('takes a second tap on Start work as the first', async () => {
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.start.mutate({}));
    act(() => hook.result.current.start.mutate({}));
    act(() => hook.result.current.stop.mutate());
    act(() => hook.result.current.stop.mutate());
    await until(() => hook.result.current.queue.waiting.length === 2, 'one start and one stop wait');
    expect(
      qc
        .getMutationCache()
        .getAll()
        .filter(isUnsentAction)
        .map((m) => (m.state.variables as BenchAction).kind),
    ).toEqual(['work-start', 'work-stop']);
  });

  it('keeps a refusal for the bench after the screen that made the action has closed', async () => {
    const { hook } = await offlineBench();
    act(() => hook.result.current.step.mutate({ stepId: 's1', done: true }));
    await until(() => hook.result.current.queue.waiting.length === 1, 'the step waits');
    // The part's page closes; the bench (another part's hooks here) is what is open when the signal returns.
    hook.unmount();
    const bench = tickHook(clients[0], 't2');
    recordingServer(409, { error: { code: 'conflict', message: 'this part is signed off' } });
    act(() => onlineManager.setOnline(true));
    await until(() => bench.result.current.all.refused !== null, 'the bench shows it');
    expect(bench.result.current.all.refused).toEqual({
      message: 'Not saved: this part is signed off The step marked done was taken back.',
      travelerId: 't1',
    });
    act(() => bench.result.current.all.dismissRefused());
    await until(() => bench.result.current.all.refused === null, 'dismissed');
  });
});

describe('actions of a person who signed out with some unsent', () => {
  it('are set aside for that person, neither sent as the next nor holding up theirs, and go when they sign in again', async () => {
    let person: string | null = 'person-a';
    configureApiClient({ getPersonId: () => person });
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'installed' }));
    act(() => hook.result.current.start.mutate({}));
    await until(() => hook.result.current.queue.waiting.length === 2, "the first person's two wait");
    // Hidden from anyone else at once.
    person = null;
    expect(withUnsentActions(detail('t1'), qc).holes.map((h) => h.status)).toEqual(['pending', 'pending']);

    // The first person signs out with the signal still away; the next signs in on the same phone and
    // ticks as the signal comes back.
    clearForNextPerson(qc);
    person = 'person-b';
    const paths: string[] = [];
    const sent = recordingServer(200, detail('t1'), paths);
    act(() => onlineManager.setOnline(true));
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-02'], status: 'installed' }));
    await until(() => sent.length === 1, "the second person's tick is through");
    expect(sent[0].body).toMatchObject({ holeIds: ['U-02'] });
    // The first person's two were set aside on the device, in their order, and nothing of theirs is
    // left in the queue to hold it up or to show as refused.
    const kept = () => JSON.parse(localStorage.getItem(storageKeys.keptFor('person-a')) ?? '[]') as BenchAction[];
    await until(() => kept().length === 2, "the first person's two are set aside");
    expect(kept().map((a) => [a.kind ?? 'tick', a.personId])).toEqual([
      ['tick', 'person-a'],
      ['work-start', 'person-a'],
    ]);
    expect(qc.getMutationCache().getAll().filter(isUnsentAction)).toHaveLength(0);
    expect(hook.result.current.all.refused).toBeNull();
    expect(sent).toHaveLength(1);

    // Signed in again, theirs go in their order, and are no longer set aside.
    person = 'person-a';
    await act(() => resumeKeptFor(qc, 'person-a'));
    await until(() => sent.length === 3, "the first person's two are through");
    expect(paths).toEqual(['holes', 'holes', 'work/start']);
    expect(sent[1].body).toMatchObject({ holeIds: ['U-01'] });
    expect(localStorage.getItem(storageKeys.keptFor('person-a'))).toBeNull();
  });

  it('set aside and still in the queue (the app closed between the two) go once', async () => {
    let person: string | null | undefined = 'person-a';
    configureApiClient({ getPersonId: () => person });
    const { qc, hook } = await offlineBench();
    act(() => hook.result.current.tick.mutate({ holeIds: ['U-01'], status: 'installed' }));
    await until(() => hook.result.current.queue.waiting.length === 1, 'the tick waits');
    const [queued] = qc.getMutationCache().getAll().filter(isUnsentAction);
    localStorage.setItem(storageKeys.keptFor('person-a'), JSON.stringify([queued.state.variables]));
    // While the session is still being read, nothing is sent and nothing set aside.
    person = undefined;
    const sent = recordingServer();
    act(() => onlineManager.setOnline(true));
    await act(() => new Promise((r) => setTimeout(r, 300)));
    expect(sent).toEqual([]);
    await act(() => resumeKeptFor(qc, 'person-a'));
    await act(() => resumeKeptFor(qc, 'person-a'));
    person = 'person-a';
    await until(() => sent.length === 1 && localStorage.getItem(storageKeys.keptFor('person-a')) === null, 'it went');
    await act(() => new Promise((r) => setTimeout(r, 300)));
    expect(sent).toHaveLength(1);
  });
});

describe('a finding sent without signal', () => {
  const photo = { uri: 'data:image/jpeg;base64,AAAA', name: 'hole.jpg', type: 'image/jpeg', keptId: 'k1' };
  const input = {
    travelerId: 't1',
    holeIds: ['U-02'],
    kind: 'hole_elongated' as const,
    note: 'U-02 oval after deburring',
    measurements: {},
  };
  /** The server refuses the finding; a photo's data: URI reads back as bytes, as in the browser. */
  function refusingServer(posted: string[], error: unknown = { code: 'conflict', message: 'this part was replaced.' }) {
    global.fetch = jest.fn(async (url: string, init?: { method?: string; body?: unknown }) => {
      if (url.startsWith('data:')) return { blob: async () => new Blob(['jpeg']) };
      if (init?.method === 'POST') {
        posted.push(url);
        expect(init.body).toBeInstanceOf(FormData);
        return answer(409, { error });
      }
      return answer(503, { error: { code: 'busy', message: 'busy' } });
    }) as never;
  }
  const draftOf = (person: string) =>
    JSON.parse(localStorage.getItem(storageKeys.findingDraft(person, 't1')) ?? 'null') as {
      values: unknown;
      photos: unknown[];
      savedAt: string;
    } | null;

  /** Person A's finding on part t1, made with no signal and waiting in the queue. */
  async function findingWaiting() {
    configureApiClient({ getPersonId: () => 'person-a' });
    const { hook } = await offlineBench();
    // Refusals are remembered for the bench across screens: none left from another test.
    act(() => hook.result.current.all.dismissRefused());
    act(() => hook.result.current.finding(input, [photo]));
    await until(() => hook.result.current.queue.waiting.length === 1, 'the finding waits');
    return hook;
  }

  it('waits in the queue and on the device; refused, it is back in its maker’s form with its photos', async () => {
    const hook = await findingWaiting();
    expect(hook.result.current.queue.waiting[0]).toMatchObject({ kind: 'finding', input, photos: [photo] });
    await until(() => keptOnDevice().length === 1, 'it is kept on the device');
    expect(keptOnDevice()[0]).toMatchObject({ kind: 'finding', personId: 'person-a', photos: [photo] });

    const posted: string[] = [];
    refusingServer(posted);
    act(() => onlineManager.setOnline(true));
    await until(() => hook.result.current.queue.refused !== null, 'the refusal shows');
    expect(posted).toEqual(['/api/findings']);
    expect(hook.result.current.queue.refused!.message).toBe(
      'Not saved: this part was replaced. The finding on U-02 is back in its form.',
    );
    await until(() => draftOf('person-a') !== null, 'the draft is back');
    expect(draftOf('person-a')).toMatchObject({
      values: { holeIds: ['U-02'], kind: 'hole_elongated', note: 'U-02 oval after deburring', measurements: {} },
      photos: [photo],
    });
  });

  it('refused, does not overwrite a finding its maker began on that part meanwhile', async () => {
    const hook = await findingWaiting();
    const begun = { values: { holeIds: ['U-01'], note: 'begun meanwhile' }, photos: [], savedAt: 'x' };
    localStorage.setItem(storageKeys.findingDraft('person-a', 't1'), JSON.stringify(begun));
    refusingServer([]);
    act(() => onlineManager.setOnline(true));
    await until(() => hook.result.current.queue.refused !== null, 'the refusal shows');
    expect(hook.result.current.queue.refused!.message).toBe(
      'Not saved: this part was replaced. The finding on U-02 could not go back in its form, where a finding begun since is kept: flag it again.',
    );
    expect(draftOf('person-a')).toEqual(begun);
  });

  it('already raised (it reached the server while its answer was lost), is neither raised again nor put back', async () => {
    const hook = await findingWaiting();
    // The server's own words and field for holes already under a finding (server/findings/findings-service.ts).
    refusingServer([], {
      code: 'conflict',
      message: 'hole U-02 already has an open finding',
      fields: { holeIds: 'already under a finding' },
    });
    act(() => onlineManager.setOnline(true));
    await until(() => hook.result.current.queue.refused !== null, 'the message shows');
    expect(hook.result.current.queue.refused!.message).toBe(
      "Not saved: hole U-02 already has an open finding The finding on U-02 was not raised again: see the part's findings.",
    );
    await act(() => new Promise((r) => setTimeout(r, 50)));
    expect(draftOf('person-a')).toBeNull();
  });
});
