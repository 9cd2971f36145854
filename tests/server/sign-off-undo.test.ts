import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { allowedPartActions, checkPartAction, NOTE_MIN_LENGTH, type BuildPlace, type PartFacts } from '@/db/contracts';
import { smallKits } from '../fixtures/rib-revision';
import { publishSmallKit, shipBuild, workPart } from '../helpers/small-kit';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(240000);

let t: TestApp;
let tok: Tokens;
let outsider: { builder: string; inspector: string; supplier: string };
let kitId: string;
let n = 0;
/** Bounded: each round ships a build of its own. */
const ROUNDS = 6;
const REASON = 'shop head on U-02 found cracked at the final walk-round';

demoApp((s) => ({ t, tok, outsiders: outsider } = s), { outsiders: true });
beforeAll(async () => {
  kitId = await publishSmallKit(t, tok.supplier, smallKits.withdrawal);
});

type Part = { id: string; buildId: string; kitSerial: string; stepId: string };

/** A fresh part, every hole installed and its step done, signed off by the demo inspector. */
async function signedPart(sign = true): Promise<Part> {
  const kitSerial = `WD-${String(++n).padStart(3, '0')}`;
  const { buildId, travelerId: id } = await shipBuild(t, tok.supplier, kitId, kitSerial);
  const { stepId } = await workPart(t, tok.builder, id);
  if (sign)
    expect((await request(t.app).post(`/api/travelers/${id}/sign-off`).set(auth(tok.inspector))).status).toBe(200);
  return { id, buildId, kitSerial, stepId };
}

const withdraw = (token: string, id: string, body: unknown = { reason: REASON }) =>
  request(t.app)
    .post(`/api/travelers/${id}/sign-off/withdraw`)
    .set(auth(token))
    .send(body as object);
const part = async (id: string, token = tok.inspector) =>
  (await request(t.app).get(`/api/travelers/${id}`).set(auth(token))).body;
const logOf = async (p: Part, query: Record<string, string> = {}) =>
  (await request(t.app).get(`/api/builds/${p.buildId}/log`).query(query).set(auth(tok.builder))).body.items as {
    kind: string;
    group: string;
    text: string;
    note?: string;
    actorName: string;
  }[];
const withdrawalMails = (kitSerial: string) =>
  t.smtp.messages.filter((m) => m.subject.includes(`[${kitSerial}]`) && m.subject.includes('Sign-off withdrawn'));

describe('the rule: who may withdraw a sign-off, and when (every place × part state)', () => {
  const ready: PartFacts = {
    holes: { installed: 3 },
    stepsOpen: 0,
    pointsUnstamped: 0,
    openFindings: 0,
    signedOff: false,
    replaced: false,
  };
  const signed = { ...ready, signedOff: true };
  const places: BuildPlace[] = ['builder', 'inspector', 'design_authority', 'none'];
  // Expected codes follow the brief: only the one who may sign off (an inspector) takes it back, only from a signed-off, unreplaced part.
  it.each([
    ...places.map((p) => ['signed off', p, p === 'inspector' ? null : 403, signed] as const),
    ...places.map((p) => ['not signed off', p, p === 'inspector' ? 409 : 403, ready] as const),
    ...places.map(
      (p) => ['signed off then replaced', p, p === 'inspector' ? 409 : 403, { ...signed, replaced: true }] as const,
    ),
  ])('%s, by %s → %s', (_state, place, code, facts) => {
    expect(checkPartAction(facts, 'withdraw-sign-off', place)?.code ?? null).toBe(code);
    expect(allowedPartActions(facts, place).includes('withdraw-sign-off')).toBe(code === null);
  });
});

describe('withdrawing a sign-off', () => {
  it('reopens the part, keeps the sign-off in the log beside the withdrawal with its reason, and mails the builder once', async () => {
    const p = await signedPart();
    // A signed-off part takes no new finding: withdrawing is the inspector's one move on it.
    expect((await part(p.id)).allowedActions).toEqual(['withdraw-sign-off']);
    expect((await part(p.id, tok.builder)).allowedActions).not.toContain('withdraw-sign-off');

    const res = await withdraw(tok.inspector, p.id);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ signedOff: false, signedOffAt: null, signedOffByName: null });
    expect(res.body.allowedActions).toContain('sign-off');
    expect(res.body.allowedActions).not.toContain('withdraw-sign-off');
    expect((await part(p.id, tok.builder)).allowedActions).toEqual(expect.arrayContaining(['tick', 'step']));

    const log = await logOf(p);
    const withdrawal = log.find((e) => e.text.startsWith('Withdrew the sign-off'));
    const signOffEntry = log.find((e) => e.kind === 'signed_off');
    expect(signOffEntry).toBeDefined();
    expect(withdrawal).toMatchObject({
      kind: 'sign_off_withdrawn',
      group: 'sign_off',
      note: REASON,
      actorName: expect.any(String),
    });
    expect(log.indexOf(withdrawal!)).toBeLessThan(log.indexOf(signOffEntry!)); // newest first
    // Filtering by sign-off shows both: a sign-off is never shown without its withdrawal.
    const filtered = await logOf(p, { kind: 'sign_off' });
    expect(filtered.map((e) => (e.text.startsWith('Withdrew') ? 'withdrawn' : e.kind))).toEqual([
      'withdrawn',
      'signed_off',
    ]);

    const mail = await t.waitForMail((m) => withdrawalMails(p.kitSerial).includes(m));
    expect(mail.to).toEqual([DEMO_USERS.builder.email]);
    expect(mail.text).toContain(`Why: ${REASON}`);
    expect(mail.text).toContain(`/travelers/${p.id}`);
    // The queue has done its one job: nothing more comes, and the inspector who withdrew is not mailed.
    await new Promise((r) => setTimeout(r, 1500));
    expect(withdrawalMails(p.kitSerial)).toHaveLength(1);

    // The part can be signed off again, and that is a third entry.
    expect((await request(t.app).post(`/api/travelers/${p.id}/sign-off`).set(auth(tok.inspector))).status).toBe(200);
    expect((await logOf(p, { kind: 'sign_off' })).map((e) => e.kind)).toEqual([
      'signed_off',
      'sign_off_withdrawn',
      'signed_off',
    ]);
  });

  it(`a double submit withdraws once under the part's lock: one entry, one mail (${ROUNDS} rounds)`, async () => {
    const parts: Part[] = [];
    for (let i = 0; i < ROUNDS; i++) {
      const p = await signedPart();
      parts.push(p);
      const [a, b] = await Promise.all([withdraw(tok.inspector, p.id), withdraw(tok.inspector, p.id)]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      expect([a, b].find((r) => r.status === 409)!.body.error.message).toMatch(/not signed off/);
      expect((await logOf(p)).filter((e) => e.text.startsWith('Withdrew'))).toHaveLength(1);
    }
    for (const p of parts) await t.waitForMail((m) => withdrawalMails(p.kitSerial).includes(m));
    await new Promise((r) => setTimeout(r, 1500));
    for (const p of parts) expect(withdrawalMails(p.kitSerial)).toHaveLength(1);
  });

  describe('refusals leave the part, its log and the mail as they were', () => {
    const cases: [string, () => string, unknown, number, RegExp | Record<string, unknown>][] = [
      ['the builder', () => tok.builder, { reason: REASON }, 403, /only an inspector/],
      ['the kit supplier (design authority)', () => tok.supplier, { reason: REASON }, 403, /only an inspector/],
      ['an admin', () => tok.admin, { reason: REASON }, 403, /only an inspector/],
      ['an inspector of another build', () => outsider.inspector, { reason: REASON }, 404, /traveler/],
      ['no reason', () => tok.inspector, {}, 400, { reason: expect.any(String) }],
      [
        `a reason under ${NOTE_MIN_LENGTH} characters`,
        () => tok.inspector,
        { reason: ' ok ' },
        400,
        { reason: expect.stringMatching(/why/) },
      ],
      [
        'a reason over 1000 characters',
        () => tok.inspector,
        { reason: 'x'.repeat(1001) },
        400,
        { reason: expect.stringMatching(/1000/) },
      ],
      [
        'a reason with a control character',
        () => tok.inspector,
        { reason: 'cracked\u0007head' },
        400,
        { reason: expect.stringMatching(/control/) },
      ],
    ];
    it.each(cases)('%s → refused', async (_who, token, body, status, says) => {
      const p = await signedPart();
      const before = await part(p.id);
      const res = await withdraw(token(), p.id, body);
      expect(res.status).toBe(status);
      if (says instanceof RegExp) expect(res.body.error.message).toMatch(says);
      else expect(res.body.error.fields).toEqual(says);
      const after = await part(p.id);
      expect([after.signedOff, after.signedOffAt, after.signedOffByName]).toEqual([
        true,
        before.signedOffAt,
        before.signedOffByName,
      ]);
      expect((await logOf(p)).filter((e) => e.text.startsWith('Withdrew'))).toHaveLength(0);
      await new Promise((r) => setTimeout(r, 1000));
      expect(withdrawalMails(p.kitSerial)).toHaveLength(0);
    });

    it('a part that is not signed off → 409, saying so', async () => {
      const p = await signedPart(false);
      const res = await withdraw(tok.inspector, p.id);
      expect([res.status, res.body.error.message]).toEqual([409, expect.stringMatching(/not signed off/)]);
      expect((await part(p.id)).signedOff).toBe(false);
      expect((await logOf(p)).filter((e) => e.text.startsWith('Withdrew'))).toHaveLength(0);
    });
  });
});

describe(`a withdrawal racing the bench and a new sign-off under the part's lock (${ROUNDS} rounds each)`, () => {
  it('a tick lands only after the withdrawal, never on a signed-off part', async () => {
    const seen = { tickFirst: 0, withdrawFirst: 0 };
    for (let i = 0; i < ROUNDS; i++) {
      const p = await signedPart();
      const [w, tick] = await Promise.all([
        withdraw(tok.inspector, p.id),
        request(t.app)
          .post(`/api/travelers/${p.id}/holes`)
          .set(auth(tok.builder))
          .send({ holeIds: ['U-02'], status: 'pending' }),
      ]);
      // The withdrawal always lands; the tick either came first (refused: the part was signed off) or after it.
      expect(w.status).toBe(200);
      expect([200, 409]).toContain(tick.status);
      const d = await part(p.id);
      expect(d.signedOff).toBe(false);
      expect(d.holes.find((h: { holeId: string }) => h.holeId === 'U-02').status).toBe(
        tick.status === 200 ? 'pending' : 'installed',
      );
      if (tick.status === 200) {
        const kinds = (await logOf(p)).map((e) => (e.text.startsWith('Withdrew') ? 'withdrawn' : e.kind));
        expect(kinds.indexOf('holes_pending')).toBeLessThan(kinds.indexOf('withdrawn')); // newest first: the tick is later
        seen.withdrawFirst++;
      } else {
        expect(tick.body.error.message).toMatch(/signed off/);
        seen.tickFirst++;
      }
    }
    expect(seen.tickFirst + seen.withdrawFirst).toBe(ROUNDS);
  });

  it('a new sign-off racing the withdrawal ends signed off exactly when it was accepted', async () => {
    for (let i = 0; i < ROUNDS; i++) {
      const p = await signedPart();
      const [w, s] = await Promise.all([
        withdraw(tok.inspector, p.id),
        request(t.app).post(`/api/travelers/${p.id}/sign-off`).set(auth(tok.inspector)),
      ]);
      expect(w.status).toBe(200);
      expect([200, 409]).toContain(s.status);
      const d = await part(p.id);
      expect(d.signedOff).toBe(s.status === 200);
      const signOffs = (await logOf(p, { kind: 'sign_off' })).length;
      expect(signOffs).toBe(s.status === 200 ? 3 : 2);
    }
  });
});

describe('QR labels through the travelers API', () => {
  it('carry kit model, supplier, part, revision, serial and short code; one part for its builder, a whole build for the supplier', async () => {
    const p = await signedPart(false);
    const one = await request(t.app).get('/api/travelers/labels').query({ travelerId: p.id }).set(auth(tok.builder));
    expect(one.status).toBe(200);
    expect(one.body).toHaveLength(1);
    expect(one.body[0]).toMatchObject({
      travelerId: p.id,
      kitModelCode: 'WD-1',
      kitModelName: 'Withdrawal kit',
      supplierName: expect.any(String),
      partNumber: 'WD-R1',
      letter: 'A',
      kitSerial: p.kitSerial,
      shortCode: expect.stringMatching(/^[A-Z0-9]{3}-[A-Z0-9]{3}$/),
      serial: expect.any(String),
      url: expect.stringMatching(/^http:\/\/pitchcard\.test:\d+\/t\//),
      qrDataUrl: expect.stringMatching(/^data:image\/png;base64,/),
    });
    expect(one.body[0].supplierName.length).toBeGreaterThan(0);
    expect((await part(p.id, tok.builder)).labelAllowed).toBe(true);
    expect((await part(p.id, tok.inspector)).labelAllowed).toBe(false);
    const all = await request(t.app).get('/api/travelers/labels').query({ buildId: p.buildId }).set(auth(tok.supplier));
    expect([all.status, all.body.map((l: { travelerId: string }) => l.travelerId)]).toEqual([200, [p.id]]);
  });

  it.each([
    ['the builder, a whole build', () => tok.builder, (p: Part) => ({ buildId: p.buildId }), 403],
    ['the inspector, one part', () => tok.inspector, (p: Part) => ({ travelerId: p.id }), 403],
    ['a builder of another build', () => outsider.builder, (p: Part) => ({ travelerId: p.id }), 404],
    ['another supplier, a whole build', () => outsider.supplier, (p: Part) => ({ buildId: p.buildId }), 404],
    [
      'anyone, with both a build and a part',
      () => tok.supplier,
      (p: Part) => ({ buildId: p.buildId, travelerId: p.id }),
      400,
    ],
  ] as const)('refuses %s', async (_who, token, query, status) => {
    const p = await signedPart(false);
    expect((await request(t.app).get('/api/travelers/labels').query(query(p)).set(auth(token()))).status).toBe(status);
  });
});

describe('labels with a loopback public address', () => {
  let local: TestApp;
  let tokens: Tokens;
  demoApp((s) => ({ t: local, tok: tokens } = s), { env: { PUBLIC_URL: 'http://localhost:8080' } });

  it('are refused with how to set the address, even for one part', async () => {
    const parts = (await request(local.app).get('/api/travelers').set(auth(tokens.builder))).body.items;
    const res = await request(local.app)
      .get('/api/travelers/labels')
      .query({ travelerId: parts[0].id })
      .set(auth(tokens.builder));
    expect([res.status, res.body.error.message]).toEqual([409, expect.stringMatching(/phone cannot open.*PUBLIC_URL/)]);
  });
});
