import { QueryClient } from '@tanstack/react-query';
import type { TravelerDetail } from '@/db/contracts';
import { applyTick } from '@/hooks/queries/travelers';
import { dropTick, queueTick, readOutbox, withPendingTicks } from '@/lib/tick-outbox';
import { flushOutbox } from '@/hooks/use-tick-outbox';

const detail = (id: string) =>
  ({
    id,
    holes: [
      { holeId: 'U-01', line: 'U', seq: 1, stationIn: 0.25, status: 'pending' },
      { holeId: 'U-02', line: 'U', seq: 2, stationIn: 1.25, status: 'pending' },
    ],
    holesDone: 0,
  }) as unknown as TravelerDetail;

const original = global.fetch;
afterEach(async () => {
  global.fetch = original;
  for (const t of await readOutbox()) await dropTick(t.id);
});

const answer = (status: number, body: unknown) => ({
  ok: status < 400,
  status,
  text: async () => JSON.stringify(body),
});

describe('ticks made without signal', () => {
  it('stay on the device in the order made, and show on the traveler they belong to only', async () => {
    await queueTick('t1', { holeIds: ['U-01'], status: 'installed' });
    await queueTick('t2', { holeIds: ['U-02'], status: 'installed' });
    await queueTick('t1', { holeIds: ['U-02'], status: 'installed' });
    const pending = await readOutbox();
    expect(pending.map((p) => p.travelerId)).toEqual(['t1', 't2', 't1']);
    const shown = withPendingTicks(detail('t1'), pending, applyTick);
    expect(shown.holes.map((h) => h.status)).toEqual(['installed', 'installed']);
    expect(withPendingTicks(detail('t3'), pending, applyTick).holes.map((h) => h.status)).toEqual([
      'pending',
      'pending',
    ]);
  });

  it('are kept while there is still no signal, then sent in order once the server answers', async () => {
    await queueTick('t1', { holeIds: ['U-01'], status: 'installed' });
    await queueTick('t1', { holeIds: ['U-02'], status: 'installed' });
    const qc = new QueryClient();
    global.fetch = jest.fn(async () => {
      throw new TypeError('Failed to fetch');
    }) as never;
    await flushOutbox(qc);
    expect(await readOutbox()).toHaveLength(2);

    const sent: string[] = [];
    global.fetch = jest.fn(async (_url: string, init?: { body?: string }) => {
      sent.push(JSON.parse(init!.body!).holeIds[0]);
      return answer(200, { holes: [] });
    }) as never;
    await flushOutbox(qc);
    expect(sent).toEqual(['U-01', 'U-02']);
    expect(await readOutbox()).toHaveLength(0);
  });

  it('are dropped with a message when the server refuses them for good, but kept when sign-in must be renewed', async () => {
    await queueTick('t1', { holeIds: ['U-01'], status: 'installed' });
    const qc = new QueryClient();
    global.fetch = jest.fn(async () =>
      answer(401, { error: { code: 'unauthorized', message: 'sign in first' } }),
    ) as never;
    await flushOutbox(qc);
    expect(await readOutbox()).toHaveLength(1);
    global.fetch = jest.fn(async () =>
      answer(409, { error: { code: 'conflict', message: 'hole U-01 (flagged) is under a finding' } }),
    ) as never;
    await flushOutbox(qc);
    expect(await readOutbox()).toHaveLength(0);
  });
});
