import request from 'supertest';
import { jpeg } from '../helpers/photos';
import { DEMO_USERS } from '@/server/dev/seed';
import { findingActions, type FindingAction } from '@/db/contracts';
import { findingMailWorker } from '@/server/jobs/finding-mail-worker';
import { createMailer } from '@/server/mail/transport';
import { FINDING_ACTION_OWNER } from '../fixtures/finding-owners';
import { smallKits } from '../fixtures/rib-revision';
import { publishSmallKit, shipBuild } from '../helpers/small-kit';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

jest.setTimeout(180000);

let t: TestApp;
let tok: Tokens;
let people: Record<
  'builder' | 'inspector' | 'supplier' | 'admin' | 'otherBuilder' | 'otherInspector' | 'otherSupplier',
  string
>;
let kitId: string;
let serialNo = 0;

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  const o = await t.outsiders();
  people = { ...tok, otherBuilder: o.builder, otherInspector: o.inspector, otherSupplier: o.supplier };
  kitId = await publishSmallKit(t, tok.supplier, smallKits.lifecycle);
});

/** Ships a fresh build of the small kit to the demo builder and inspector; returns its one traveler. */
async function ship(): Promise<{ buildId: string; travelerId: string; kitSerial: string }> {
  const kitSerial = `LC-${String(++serialNo).padStart(4, '0')}`;
  return { ...(await shipBuild(t, tok.supplier, kitId, kitSerial)), kitSerial };
}

async function raise(token: string, travelerId: string, holeIds: string[], extra: Record<string, string> = {}) {
  let r = raiseFinding(t, token, { travelerId, holeIds, kind: extra.kind ?? 'hole_elongated', note: 'looks oval' });
  if (extra.measurements) r = r.field('measurements', extra.measurements);
  return r.attach('photos', await jpeg(), { filename: 'h.jpg', contentType: 'image/jpeg' });
}

const act = (token: string, id: string, action: FindingAction, body: Record<string, unknown> = {}) =>
  request(t.app).post(`/api/findings/${id}/${action}`).set(auth(token)).send(body);

async function reportDone(id: string, token = tok.builder) {
  return request(t.app)
    .post(`/api/findings/${id}/report-done`)
    .set(auth(token))
    .field('note', 'drilled out and set again')
    .attach('photos', await jpeg(), { filename: 'done.jpg', contentType: 'image/jpeg' });
}

const finding = async (id: string) => (await request(t.app).get(`/api/findings/${id}`).set(auth(tok.inspector))).body;
const holeStatus = async (travelerId: string, holeId: string) =>
  (await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(tok.inspector))).body.holes.find(
    (h: { holeId: string }) => h.holeId === holeId,
  ).status;

/** Waits for the mail of one step to one person, then checks it came exactly once. */
async function mailedOnce(to: string, kitSerial: string, words: string) {
  const match = (m: { to: string[]; subject: string }) =>
    m.to.includes(to) && m.subject.includes(kitSerial) && m.subject.includes(words);
  await t.waitForMail(match);
  await new Promise((r) => setTimeout(r, 300));
  expect(t.smtp.messages.filter(match)).toHaveLength(1);
}
const notMailed = (to: string, kitSerial: string, words: string) =>
  expect(
    t.smtp.messages.filter((m) => m.to.includes(to) && m.subject.includes(kitSerial) && m.subject.includes(words)),
  ).toHaveLength(0);

describe('every path of a finding ends closed, with the part signed off or replaced', () => {
  it('rework: ordered, done with a photo, sent back once, done again, accepted; the part then signs off', async () => {
    const b = await ship();
    await request(t.app)
      .post(`/api/travelers/${b.travelerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['U-01', 'U-02', 'U-03', 'U-04', 'U-05'], status: 'installed' });
    const f = (await raise(tok.builder, b.travelerId, ['U-02'])).body;
    await mailedOnce(DEMO_USERS.inspector.email, b.kitSerial, 'Finding raised');
    expect(await holeStatus(b.travelerId, 'U-02')).toBe('flagged');
    expect(
      (await act(tok.inspector, f.id, 'disposition', { disposition: 'rework', note: 'drill out, same rivet' })).body,
    ).toMatchObject({ status: 'work_ordered' });
    await mailedOnce(DEMO_USERS.builder.email, b.kitSerial, 'Disposition: Rework');
    expect(await holeStatus(b.travelerId, 'U-02')).toBe('held');
    const noPhoto = await act(tok.builder, f.id, 'report-done', { note: 'done, trust me' });
    expect([noPhoto.status, noPhoto.body.error.fields]).toEqual([400, { photos: expect.any(String) }]);
    expect((await reportDone(f.id)).body).toMatchObject({ status: 'work_done' });
    expect(await holeStatus(b.travelerId, 'U-02')).toBe('reworked');
    await mailedOnce(DEMO_USERS.inspector.email, b.kitSerial, 'Rework done: to inspect');
    const back = await act(tok.inspector, f.id, 'send-back', { note: 'shop head too flat' });
    expect(back.body).toMatchObject({ status: 'work_ordered', allowedActions: [] });
    await mailedOnce(DEMO_USERS.builder.email, b.kitSerial, 'Work sent back');
    expect(await holeStatus(b.travelerId, 'U-02')).toBe('held');
    // Work has started: the disposition can no longer be amended.
    expect(
      (await act(tok.inspector, f.id, 'amend', { disposition: 'repair', repairScheme: 'doubler', note: 'x y z' }))
        .status,
    ).toBe(409);
    expect((await reportDone(f.id)).status).toBe(200);
    const closed = await act(tok.inspector, f.id, 'accept', {});
    expect(closed.body).toMatchObject({ status: 'closed', closure: 'accepted' });
    expect(closed.body.events.map((e: { action: string }) => e.action)).toEqual([
      'raise',
      'disposition',
      'report-done',
      'send-back',
      'report-done',
      'accept',
    ]);
    expect(closed.body.photos.map((p: { stage: string }) => p.stage)).toEqual(['found', 'work', 'work']);
    await mailedOnce(DEMO_USERS.builder.email, b.kitSerial, 'Work accepted');
    expect(await holeStatus(b.travelerId, 'U-02')).toBe('accepted');
    await request(t.app)
      .post(`/api/travelers/${b.travelerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['L-01', 'L-02', 'L-03', 'L-04', 'L-05'], status: 'installed' });
    const steps = (await request(t.app).get(`/api/travelers/${b.travelerId}`).set(auth(tok.builder))).body.steps;
    await request(t.app)
      .post(`/api/travelers/${b.travelerId}/steps/${steps[0].id}`)
      .set(auth(tok.builder))
      .send({ done: true });
    const ready = (await request(t.app).get(`/api/travelers/${b.travelerId}`).set(auth(tok.inspector))).body;
    expect(ready.allowedActions).toContain('sign-off');
    expect((await request(t.app).post(`/api/travelers/${b.travelerId}/sign-off`).set(auth(tok.inspector))).status).toBe(
      200,
    );
  });

  it('repair with the next-size rivet: a failed check needs a reason; the design authority is mailed, refuses, then approves a use as is', async () => {
    const b = await ship();
    const f = (await raise(tok.builder, b.travelerId, ['U-03'])).body;
    const check = await request(t.app).post(`/api/findings/${f.id}/repair-check`).set(auth(tok.inspector)).send({});
    // FAA AC 43.13-1B 4-57: AD4 → AD5 needs 2D = 0.3125 in of edge distance; the part has 0.25 in.
    expect(check.body).toMatchObject({ pass: false });
    const noReason = await act(tok.inspector, f.id, 'disposition', {
      disposition: 'repair',
      repairScheme: 'oversize_rivet',
      note: 'next size up',
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('overrideReason');
    expect((await finding(f.id)).status).toBe('raised');
    const noScheme = await act(tok.inspector, f.id, 'disposition', { disposition: 'repair', note: 'next size up' });
    expect(noScheme.body.error.fields).toHaveProperty('repairScheme');
    const rep = await act(tok.inspector, f.id, 'disposition', {
      disposition: 'repair',
      repairScheme: 'oversize_rivet',
      repairRivetSpec: 'MS20470AD5',
      note: 'next size up',
      overrideReason: 'measured edge is 0.33 in on the part',
    });
    expect(rep.body).toMatchObject({
      status: 'awaiting_approval',
      disposition: 'repair',
      repair: {
        scheme: 'oversize_rivet',
        rivetSpec: 'MS20470AD5',
        overrideReason: 'measured edge is 0.33 in on the part',
      },
    });
    expect(rep.body.repair.check.pass).toBe(false);
    const daMail =
      t.smtp.messages.find((m) => m.to.includes(DEMO_USERS.supplier.email) && m.subject.includes(b.kitSerial)) ??
      (await t.waitForMail((m) => m.to.includes(DEMO_USERS.supplier.email) && m.subject.includes(b.kitSerial)));
    expect(daMail.text).toContain('Chosen anyway because: measured edge is 0.33 in on the part');
    expect(daMail.text).toContain(`/findings/${f.id}`);
    // The builder waits; the inspector cannot approve their own departure.
    expect((await act(tok.inspector, f.id, 'approve', {})).status).toBe(403);
    expect((await reportDone(f.id)).status).toBe(409);
    const refused = await act(tok.supplier, f.id, 'refuse', { note: 'doubler instead' });
    expect(refused.body).toMatchObject({ status: 'raised', disposition: null, repair: null });
    expect(await holeStatus(b.travelerId, 'U-03')).toBe('flagged');
    await mailedOnce(DEMO_USERS.inspector.email, b.kitSerial, 'refused by the design authority');
    expect(
      (
        await act(tok.inspector, f.id, 'disposition', {
          disposition: 'use_as_is',
          note: 'within tolerance on reflection',
        })
      ).body.status,
    ).toBe('awaiting_approval');
    const approved = await act(tok.supplier, f.id, 'approve', { note: 'agreed' });
    expect(approved.body).toMatchObject({ status: 'closed', closure: 'use_as_is' });
    // A hole flagged before it was riveted goes back to pending: it still needs its rivet.
    expect(await holeStatus(b.travelerId, 'U-03')).toBe('pending');
    expect(
      approved.body.events.map((e: { action: string; actorPlace: string }) => `${e.action}/${e.actorPlace}`),
    ).toEqual([
      'raise/builder',
      'disposition/inspector',
      'refuse/design_authority',
      'disposition/inspector',
      'approve/design_authority',
    ]);
  });

  it('repair approved goes to work; before work the inspector may amend (an event records it)', async () => {
    const b = await ship();
    const f = (
      await raise(tok.builder, b.travelerId, ['L-02'], {
        kind: 'hole_edge_short',
        measurements: JSON.stringify({ edgeDistanceIn: 0.4 }),
      })
    ).body;
    expect(f.measurements).toEqual({ edgeDistanceIn: 0.4 });
    // With the measured 0.4 in of edge distance the next size fits: 2D of 5/32 = 0.3125 in (FAA AC 43.13-1B ch. 4).
    const rep = await act(tok.inspector, f.id, 'disposition', {
      disposition: 'repair',
      repairScheme: 'oversize_rivet',
      note: 'next size up',
    });
    expect(rep.status).toBe(200);
    expect(rep.body.repair).toMatchObject({ rivetSpec: 'MS20470AD5', overrideReason: null, check: { pass: true } });
    const amended = await act(tok.inspector, f.id, 'amend', {
      disposition: 'use_as_is',
      note: 'on reflection acceptable',
    });
    expect(amended.body).toMatchObject({ status: 'awaiting_approval', disposition: 'use_as_is', repair: null });
    const back = await act(tok.inspector, f.id, 'amend', {
      disposition: 'repair',
      repairScheme: 'doubler',
      note: 'doubler after all',
    });
    expect(back.body).toMatchObject({ disposition: 'repair', repair: { scheme: 'doubler', check: null } });
    expect((await act(tok.supplier, f.id, 'approve', {})).body).toMatchObject({
      status: 'work_ordered',
      allowedActions: [],
    });
    expect((await reportDone(f.id)).status).toBe(200);
    expect((await act(tok.inspector, f.id, 'accept', {})).body).toMatchObject({
      status: 'closed',
      closure: 'accepted',
    });
    expect((await finding(f.id)).events.map((e: { action: string }) => e.action)).toEqual([
      'raise',
      'disposition',
      'amend',
      'amend',
      'approve',
      'report-done',
      'accept',
    ]);
  });

  it('not a defect: closes with a note, holes back as they were; raised by the inspector, the builder is mailed', async () => {
    const b = await ship();
    await request(t.app)
      .post(`/api/travelers/${b.travelerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['U-04'], status: 'installed' });
    const f = (await raise(tok.inspector, b.travelerId, ['U-04', 'U-05'])).body;
    expect(f.events[0]).toMatchObject({ action: 'raise', actorPlace: 'inspector' });
    await mailedOnce(DEMO_USERS.builder.email, b.kitSerial, 'Finding raised');
    notMailed(DEMO_USERS.inspector.email, b.kitSerial, 'Finding raised');
    expect((await act(tok.inspector, f.id, 'not-a-defect', {})).status).toBe(400);
    const closed = await act(tok.inspector, f.id, 'not-a-defect', { note: 'tool mark only' });
    expect(closed.body).toMatchObject({ status: 'closed', closure: 'not_a_defect', disposition: null });
    expect(await holeStatus(b.travelerId, 'U-04')).toBe('installed');
    expect(await holeStatus(b.travelerId, 'U-05')).toBe('pending');
  });

  it('scrap: the build gets a replacement traveler with its own codes; the old part is marked, its other findings close, and the new one signs off', async () => {
    const b = await ship();
    const a = (await raise(tok.builder, b.travelerId, ['U-01'])).body;
    const other = (await raise(tok.supplier, b.travelerId, ['L-01'])).body;
    expect(other.events[0].actorPlace).toBe('design_authority');
    const scrapped = await act(tok.inspector, a.id, 'disposition', {
      disposition: 'scrap',
      note: 'cracked through the flange',
    });
    expect(scrapped.body).toMatchObject({ status: 'closed', closure: 'scrapped' });
    expect(scrapped.body.replacement.serial).toBe(`${b.kitSerial}-LC-R1-R1`);
    expect(await finding(other.id)).toMatchObject({ status: 'closed', closure: 'scrapped' });
    const old = (await request(t.app).get(`/api/travelers/${b.travelerId}`).set(auth(tok.builder))).body;
    expect(old).toMatchObject({ replacedBy: { id: scrapped.body.replacement.travelerId }, allowedActions: [] });
    expect(old.readiness.ready).toBe(false);
    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${b.travelerId}/holes`)
          .set(auth(tok.builder))
          .send({ holeIds: ['U-02'], status: 'installed' })
      ).status,
    ).toBe(409);
    expect((await raise(tok.builder, b.travelerId, ['U-03'])).status).toBe(409);
    const fresh = (
      await request(t.app).get(`/api/travelers/${scrapped.body.replacement.travelerId}`).set(auth(tok.builder))
    ).body;
    expect(fresh).toMatchObject({ replaces: { id: b.travelerId }, holesTotal: 10, holesDone: 0 });
    expect(fresh.shortCode).not.toBe(old.shortCode);
    const build = await request(t.app).get(`/api/builds/${b.buildId}`).set(auth(tok.builder));
    expect(build.body.travelers.map((x: { serial: string }) => x.serial).sort()).toEqual([
      `${b.kitSerial}-LC-R1`,
      `${b.kitSerial}-LC-R1-R1`,
    ]);
    await request(t.app)
      .post(`/api/travelers/${fresh.id}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: fresh.holes.map((h: { holeId: string }) => h.holeId), status: 'installed' });
    await request(t.app)
      .post(`/api/travelers/${fresh.id}/steps/${fresh.steps[0].id}`)
      .set(auth(tok.builder))
      .send({ done: true });
    expect((await request(t.app).post(`/api/travelers/${fresh.id}/sign-off`).set(auth(tok.inspector))).status).toBe(
      200,
    );
    const log = await request(t.app).get(`/api/builds/${b.buildId}/log`).set(auth(tok.builder));
    // The log answers in pages now (`items`, newest first): the replacement is on the first.
    expect(log.body.items.map((e: { kind: string }) => e.kind)).toContain('part_replaced');
  });

  it('return to supplier: the supplier is mailed and the build gets a replacement', async () => {
    const b = await ship();
    const f = (await raise(tok.builder, b.travelerId, ['L-03'], { kind: 'hole_mislocated' })).body;
    const r = await act(tok.inspector, f.id, 'disposition', {
      disposition: 'return_to_supplier',
      note: 'punched off the line at the factory',
    });
    expect(r.body).toMatchObject({ status: 'closed', closure: 'returned' });
    expect(r.body.replacement).not.toBeNull();
    await mailedOnce(DEMO_USERS.supplier.email, b.kitSerial, 'Disposition: Return to supplier');
    await mailedOnce(DEMO_USERS.builder.email, b.kitSerial, 'Disposition: Return to supplier');
  });
});

describe('who may move a finding, in each state (403 not theirs, 409 not now, 404 not on the build)', () => {
  type Setup = {
    name: string;
    make: (travelerId: string) => Promise<string>;
    allowed: Partial<Record<FindingAction, keyof typeof people>>;
  };
  const raiseOn = async (travelerId: string) => (await raise(tok.builder, travelerId, ['U-01'])).body.id as string;
  const then = async (id: string, steps: (() => Promise<unknown>)[]) => {
    for (const s of steps) await s();
    return id;
  };
  const setups: Setup[] = [
    { name: 'raised', make: raiseOn, allowed: { disposition: 'inspector', 'not-a-defect': 'inspector' } },
    {
      name: 'awaiting the design authority (repair)',
      make: async (tr) => {
        const id = await raiseOn(tr);
        return then(id, [
          () =>
            act(tok.inspector, id, 'disposition', { disposition: 'repair', repairScheme: 'doubler', note: 'doubler' }),
        ]);
      },
      allowed: { approve: 'supplier', refuse: 'supplier', amend: 'inspector' },
    },
    {
      name: 'work ordered (rework)',
      make: async (tr) => {
        const id = await raiseOn(tr);
        return then(id, [() => act(tok.inspector, id, 'disposition', { disposition: 'rework', note: 'redo it' })]);
      },
      allowed: { 'report-done': 'builder', amend: 'inspector' },
    },
    {
      name: 'work ordered again after a send-back',
      make: async (tr) => {
        const id = await raiseOn(tr);
        return then(id, [
          () => act(tok.inspector, id, 'disposition', { disposition: 'rework', note: 'redo it' }),
          () => reportDone(id),
          () => act(tok.inspector, id, 'send-back', { note: 'again' }),
        ]);
      },
      allowed: { 'report-done': 'builder' },
    },
    {
      name: 'work done',
      make: async (tr) => {
        const id = await raiseOn(tr);
        return then(id, [
          () => act(tok.inspector, id, 'disposition', { disposition: 'rework', note: 'redo it' }),
          () => reportDone(id),
        ]);
      },
      allowed: { accept: 'inspector', 'send-back': 'inspector' },
    },
    {
      name: 'closed',
      make: async (tr) => {
        const id = await raiseOn(tr);
        return then(id, [() => act(tok.inspector, id, 'not-a-defect', { note: 'fine' })]);
      },
      allowed: {},
    },
  ];
  const outsiders = new Set(['otherBuilder', 'otherInspector', 'otherSupplier']);
  const placeOf: Record<string, string> = {
    builder: 'builder',
    inspector: 'inspector',
    supplier: 'design_authority',
    admin: 'none',
  };
  // Who may take each step, written out by hand (the rules module is what is under test).
  const owner = FINDING_ACTION_OWNER;
  const body = (a: FindingAction) =>
    a === 'disposition' || a === 'amend' ? { disposition: 'use_as_is', note: 'a reason' } : { note: 'a reason' };

  it.each(setups.map((s) => [s.name, s] as const))('%s', async (_n, s) => {
    const b = await ship();
    const id = await s.make(b.travelerId);
    const before = await finding(id);
    for (const a of findingActions) {
      for (const who of Object.keys(people) as (keyof typeof people)[]) {
        if (s.allowed[a] === who) continue; // the allowed moves are walked in the paths above
        const res =
          a === 'report-done'
            ? await request(t.app)
                .post(`/api/findings/${id}/report-done`)
                .set(auth(people[who]))
                .field('note', 'done it')
                .attach('photos', await jpeg(), { filename: 'd.jpg', contentType: 'image/jpeg' })
            : await act(people[who], id, a, body(a));
        const expected = outsiders.has(who) ? 404 : placeOf[who] !== owner[a] ? 403 : 409;
        if (res.status !== expected)
          throw new Error(
            `${s.name}: ${a} by ${who} answered ${res.status} ${JSON.stringify(res.body)}, expected ${expected}`,
          );
      }
    }
    const after = await finding(id);
    expect(after).toMatchObject({ status: before.status, disposition: before.disposition });
    expect(after.events).toHaveLength(before.events.length);
    expect(after.photos).toHaveLength(before.photos.length);
    expect(after.allowedActions).toEqual(
      Object.keys(s.allowed).filter((a) => s.allowed[a as FindingAction] === 'inspector'),
    );
  });
});

describe('double submits and the mail worker', () => {
  it('takes one of two identical decisions sent at once and refuses the other with 409', async () => {
    const b = await ship();
    const f = (await raise(tok.builder, b.travelerId, ['U-04'])).body;
    const [x, y] = await Promise.all([
      act(tok.inspector, f.id, 'disposition', { disposition: 'rework', note: 'redo' }),
      act(tok.inspector, f.id, 'disposition', { disposition: 'rework', note: 'redo' }),
    ]);
    expect([x.status, y.status].sort()).toEqual([200, 409]);
    expect((await finding(f.id)).events).toHaveLength(2);
  });

  it('mails each person once per event even when the queue runs the job again', async () => {
    const b = await ship();
    const f = (await raise(tok.builder, b.travelerId, ['U-05'])).body;
    await mailedOnce(DEMO_USERS.inspector.email, b.kitSerial, 'Finding raised');
    const mailer = createMailer(t.config.smtp);
    try {
      await findingMailWorker({ db: t.database.db, mailer, storage: t.ctx.storage, publicUrl: t.config.publicUrl })({
        eventId: f.events[0].id,
      });
    } finally {
      mailer.close();
    }
    await new Promise((r) => setTimeout(r, 300));
    expect(
      t.smtp.messages.filter((m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes(b.kitSerial)),
    ).toHaveLength(1);
  });

  it('refuses a measurement the kind does not take, and one out of range, naming the field', async () => {
    const b = await ship();
    const wrong = await raise(tok.builder, b.travelerId, ['U-01'], {
      kind: 'hole_burrs',
      measurements: JSON.stringify({ holeDiameterIn: 0.13 }),
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty(['measurements.holeDiameterIn']);
    const big = await raise(tok.builder, b.travelerId, ['U-01'], {
      measurements: JSON.stringify({ holeDiameterIn: 9 }),
    });
    expect(big.status).toBe(400);
    const nul = await raiseFinding(t, tok.builder, {
      travelerId: b.travelerId,
      holeIds: ['U-01'],
      kind: 'hole_burrs',
      note: 'bad \u0000 note',
    }).attach('photos', await jpeg(), { filename: 'h.jpg', contentType: 'image/jpeg' });
    expect(nul.status).toBe(400);
    expect(nul.body.error.fields).toHaveProperty('note');
    expect((await request(t.app).get(`/api/findings?travelerId=${b.travelerId}`).set(auth(tok.builder))).body).toEqual({
      items: [],
      next: null,
    });
  });
});
