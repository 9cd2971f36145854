import request from 'supertest';
import type { RibStudyInputValues } from '@/db/contracts';
import { DEMO_STUDY_INPUTS } from '@/server/dev/demo-inputs';
import { revisionInput } from '@/db/contracts';
import { checkLayout } from '@/server/designs/layout-check';
import { HttpError } from '@/server/http-error';
import { configureStudyPool, DEFAULT_STUDY_LIMITS, studyPoolLoad } from '@/server/studies/study-pool';
import { ribRevision, smallKitModel } from '../fixtures/rib-revision';
import { sixLines } from '../fixtures/rib-study';
import { auth, demoAppWithKit, type TestApp, type Tokens } from '../helpers/test-app';

// Issue 7: no request can exhaust the server. Each input below once killed it or answered 500; now
// each is a 400 that names the field with its whole path, and the server goes on serving.

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
let kitModelId: string;
demoAppWithKit((s) => ({ t, tok, kitModelId } = s));

type Inputs = RibStudyInputValues;
const postStudy = (inputs: unknown, name = 'exhaustion') =>
  request(t.app).post('/api/studies').set(auth(tok.supplier)).send({ kitModelId, name, inputs });
const withRib = (rib: Partial<Inputs['rib']>): Inputs => ({
  ...DEMO_STUDY_INPUTS,
  rib: { ...DEMO_STUDY_INPUTS.rib, ...rib },
});
const withKit = (kit: Partial<Inputs['kit']>): Inputs => ({
  ...DEMO_STUDY_INPUTS,
  kit: { ...DEMO_STUDY_INPUTS.kit, ...kit },
});

/** The request right after: the health check and a normal study both still answer. */
async function stillServes() {
  expect((await request(t.app).get('/api/health')).status).toBe(200);
  const normal = await postStudy(DEMO_STUDY_INPUTS, 'normal study');
  expect(normal.status).toBe(201);
  expect(normal.body.result.recommended).not.toBeNull();
}

const pick = (o: Record<string, unknown>, keys: string[]) => Object.fromEntries(keys.map((k) => [k, o[k]]));

function refused(res: request.Response, field: string, message: RegExp) {
  expect({ status: res.status, code: res.body.error?.code }).toEqual({ status: 400, code: 'invalid_input' });
  expect(res.body.error.fields?.[field]).toMatch(message);
}

let designNo = 0;
const postDesign = (revision: unknown) =>
  request(t.app)
    .post('/api/designs')
    .set(auth(tok.supplier))
    .send({ design: { kitModelId, partNumber: `EX-${++designNo}`, name: 'exhaustion rib', kind: 'rib' }, revision });

describe('a load study that once exhausted the server is a 400 naming the field, and the server goes on', () => {
  it.each([
    [
      'a pitch increment of 1e-12 in (the pitch grid had no bound: 2.2 GB, dead in 2.4 s)',
      { ...DEMO_STUDY_INPUTS, pitchIncrementIn: 1e-12 },
      'inputs.pitchIncrementIn',
      /between 0\.01 and 1 in/,
    ],
    [
      'a pitch increment of 1e-6 in (every request blocked for three minutes)',
      { ...DEMO_STUDY_INPUTS, pitchIncrementIn: 1e-6 },
      'inputs.pitchIncrementIn',
      /between 0\.01 and 1 in/,
    ],
    [
      'a rib chord of 1e6 in (out of memory after five minutes)',
      withRib({ chordIn: 1e6 }),
      'inputs.rib.chordIn',
      /between 4 and 300 in/,
    ],
    ['a rib chord of 1e308 in', withRib({ chordIn: 1e308 }), 'inputs.rib.chordIn', /between 4 and 300 in/],
    [
      'a rib spacing of 1e-300 in (accepted and saved with a recommendation)',
      withRib({ spacingIn: 1e-300 }),
      'inputs.rib.spacingIn',
      /between 2 and 60 in/,
    ],
    [
      'a mean chord of 1e300 in (blamed on the lift slope)',
      withKit({ meanChordIn: 1e300 }),
      'inputs.kit.meanChordIn',
      /between 10 and 300 in/,
    ],
  ] as [string, Inputs, string, RegExp][])('%s', async (_what, inputs, field, message) => {
    const res = await postStudy(inputs);
    refused(res, field, message);
    expect(Object.keys(res.body.error.fields).join(' ')).not.toMatch(/liftSlope/);
    await stillServes();
  });

  it('names the mean chord, not the lift slope, for a mean chord in range that makes no wing with its area', async () => {
    // 300 in on 10 ft² is an aspect ratio of 0.016: a plank, not a wing.
    const res = await postStudy(withKit({ meanChordIn: 300, wingAreaSqFt: 10, weightLb: 200 }));
    refused(res, 'inputs.kit.meanChordIn', /aspect ratio/);
    expect(Object.keys(res.body.error.fields)).not.toContain('inputs.kit.liftSlopePerRad');
    await stillServes();
  });

  it('refuses, naming the increment, a study inside every range whose pitch grid over its stations is over the work budget', async () => {
    // Six full-chord lines on a 300 in rib, an increment of 0.01 in up to 16D: millions of look-ups.
    const res = await postStudy({
      ...withRib({ chordIn: 300 }),
      lines: sixLines,
      gaugeCandidates: [0.032],
      rivetCandidates: ['MS20470AD4'],
      maxPitchDiameters: 16,
      pitchIncrementIn: 0.01,
    });
    refused(res, 'inputs.pitchIncrementIn', /at most 2,000,000: use an increment of at least/);
    await stillServes();
  });

  it('refuses, naming the longer candidate list, a study whose candidates would place more holes than the budget', async () => {
    const res = await postStudy({
      ...withRib({ chordIn: 200 }),
      lines: sixLines,
      gaugeCandidates: [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063, 0.071, 0.08, 0.09],
      rivetCandidates: ['PULLED-4', 'MS20470AD3', 'MS20470AD4'],
    });
    refused(res, 'inputs.gaugeCandidates', /holes in all; at most 50,000/);
    await stillServes();
  });

  it('names an engine refusal with the whole input path (inputs.lines.1.name)', async () => {
    const lines = [
      DEMO_STUDY_INPUTS.lines[0],
      { ...DEMO_STUDY_INPUTS.lines[1], name: DEMO_STUDY_INPUTS.lines[0].name },
    ];
    refused(await postStudy({ ...DEMO_STUDY_INPUTS, lines }), 'inputs.lines.1.name', /two lines are called/);
  });

  it('refuses a study name with a NUL character', async () => {
    refused(await postStudy(DEMO_STUDY_INPUTS, 'rib\u0000study'), 'name', /control character/);
    await stillServes();
  });
});

const postCoupon = (over: Record<string, unknown>) =>
  request(t.app)
    .post('/api/coupons')
    .set(auth(tok.supplier))
    .send({
      material: '6061-T6',
      gaugeIn: 0.025,
      couponWidthIn: 1,
      rivetSpec: 'PULLED-4',
      loadLb: 40,
      outcome: 'no_deformation',
      ...over,
    });

/** The standard revision with a rivet outside the catalogue, one zone at `pitchIn` along its line. */
const unknownRivetAt = (pitchIn: number) => ({
  ...ribRevision,
  rivetSpec: 'ACME-BLIND-4',
  lines: [{ ...ribRevision.lines[0], zones: [{ fromIn: 0, toIn: 30, pitchIn }] }],
});

/** One flat 390 in line a letter, at 0.5 in pitch (on a 400 in chord). */
const flatLines = (codes: string) =>
  codes.split('').map((code) => ({
    code,
    name: `Line ${code}`,
    surface: 'flat',
    startIn: 0,
    lengthIn: 390,
    zones: [{ fromIn: 0, toIn: 390, pitchIn: 0.5 }],
  }));

describe('kits, coupons and part revisions refuse the same way', () => {
  it('refuses a kit with a mean chord of 1e308 in', async () => {
    const res = await request(t.app)
      .post('/api/kits')
      .set(auth(tok.supplier))
      .send({ ...smallKitModel('EX-1', 'Exhaustion kit'), meanChordIn: 1e308 });
    refused(res, 'meanChordIn', /between 10 and 300 in/);
    await stillServes();
  });

  it('refuses a coupon test whose note carries a NUL character', async () => {
    const res = await postCoupon({ note: 'pulled\u0000clean', testedOn: '2026-10-14' });
    refused(res, 'note', /control character/);
    await stillServes();
  });

  it('refuses a kit name with half a surrogate pair, changing nothing, and keeps a whole one', async () => {
    // JSON carries a lone "\ud800" though it is no character; PostgreSQL refused it in the kit's change
    // record (a JSON column) with a 500. An emoji is a whole pair and stays welcome.
    const kitNow = async () => (await request(t.app).get(`/api/kits/${kitModelId}`).set(auth(tok.supplier))).body;
    const before = await kitNow();
    const change = (name: string) =>
      request(t.app)
        .patch(`/api/kits/${kitModelId}`)
        .set(auth(tok.supplier))
        .send({
          ...pick(before, Object.keys(smallKitModel('', ''))),
          cruiseSpeedKeas: before.cruiseSpeedKeas,
          name,
          reason: 'renamed',
        });
    refused(await change('Trainer \ud800'), 'name', /broken character/);
    refused(await change('\udc00 Trainer'), 'name', /broken character/);
    expect((await kitNow()).name).toBe(before.name);
    const whole = await change('Trainer \ud83d\ude80');
    expect([whole.status, whole.body.name]).toEqual([200, 'Trainer 🚀']);
  });

  it('refuses a coupon test dated 9999-12-31', async () => {
    const res = await postCoupon({ testedOn: '9999-12-31' });
    refused(res, 'testedOn', /future/);
  });

  it('refuses a revision with a chord of 1e308 in', async () => {
    refused(await postDesign({ ...ribRevision, chordIn: 1e308 }), 'revision.chordIn', /between 1 and 400 in/);
    await stillServes();
  });

  it('refuses a revision with a zone pitch of 1e-8 in (every shipment of its kit once killed the server)', async () => {
    // An unknown rivet once skipped the 3D rule: the contract's floor and 3 × the drill hold it now.
    refused(await postDesign(unknownRivetAt(1e-8)), 'revision.lines.0.zones.0.pitchIn', /between 0\.125 and 12 in/);
    await stillServes();
  });

  it('holds a rivet outside the catalogue to 3 × its drill for pitch', async () => {
    refused(
      await postDesign(unknownRivetAt(0.2)),
      'revision.lines.0.zones.0.pitchIn',
      /at least 0\.386 in \(3 × the 0\.1285 in drill\)/,
    );
  });

  it('refuses a revision whose zones would give more holes than the cap, naming the pitch to widen', async () => {
    // Eight 390 in lines at 0.5 in: about 6,250 holes, over the 5,000 a revision may have.
    const lines = flatLines('ABCDEFGH');
    const res = await postDesign({ ...ribRevision, chordIn: 400, lines });
    refused(res, 'revision.lines.0.zones.0.pitchIn', /at most 5,000/);
    await stillServes();
  });

  it('holds the hole cap in the contract itself, so the form says it before sending', () => {
    const lines = flatLines('ABCDEFGH');
    const parsed = revisionInput.safeParse({ ...ribRevision, chordIn: 400, lines });
    expect(parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`)).toEqual([
      expect.stringMatching(
        /^lines\.0\.zones\.0\.pitchIn: the zones give up to 6,256 holes; a revision has at most 5,000/,
      ),
    ]);
  });

  it('refuses to make a traveler from a revision stored before the checks, whose zones ask for millions of holes', () => {
    // checkLayout runs again when a build is shipped: a row written before the contract had its floor.
    const stored = unknownRivetAt(1e-8);
    expect(() => checkLayout(stored as Parameters<typeof checkLayout>[0])).toThrow(HttpError);
    const wide = {
      ...ribRevision,
      lines: 'ABCDEFGH'.split('').map((code) => ({
        ...ribRevision.lines[0],
        code,
        lengthIn: 390,
        zones: [{ fromIn: 0, toIn: 390, pitchIn: 0.5 }],
      })),
    };
    try {
      checkLayout(wide as Parameters<typeof checkLayout>[0]);
      throw new Error('expected a refusal');
    } catch (e) {
      expect((e as HttpError).status).toBe(400);
      expect((e as HttpError).fields).toEqual({
        'lines.0.zones.0.pitchIn': expect.stringMatching(/up to [\d,]+ holes; a revision has at most 5,000/),
      });
    }
  });

  it('takes a large revision under the cap', async () => {
    const lines = flatLines('ABCD');
    expect((await postDesign({ ...ribRevision, chordIn: 400, lines })).status).toBe(201);
  });
});

describe('studies run off the request thread', () => {
  afterEach(async () => {
    await configureStudyPool(DEFAULT_STUDY_LIMITS);
  });

  it('answers the health check while a heavy (but allowed) study is running', async () => {
    const heavy: Inputs = {
      ...withRib({ chordIn: 120 }),
      panels: 400,
      gaugeCandidates: [0.016, 0.02, 0.025, 0.032, 0.04, 0.05, 0.063, 0.071, 0.08, 0.09],
      rivetCandidates: [
        'PULLED-4',
        'MS20470AD3',
        'MS20470AD4',
        'MS20470AD5',
        'MS20470AD6',
        'MS20470AD8',
        'PULLED-5',
        'MS20426AD4',
      ],
    };
    let studyDone = false;
    const study = postStudy(heavy, 'heavy study').then((res) => {
      studyDone = true;
      return res;
    });
    // Wait until a study thread has it, then ask.
    for (let i = 0; i < 200 && studyPoolLoad().running === 0 && !studyDone; i++)
      await new Promise((r) => setTimeout(r, 25));
    expect(studyPoolLoad().running).toBe(1);
    const asked = Date.now();
    const health = await request(t.app).get('/api/health');
    const answeredInMs = Date.now() - asked;
    expect(health.status).toBe(200);
    expect(studyDone).toBe(false); // answered while the study was still in flight
    expect(answeredInMs).toBeLessThan(1000); // loose: a blocked thread would take the whole study
    expect((await study).status).toBe(201);
  });

  it('stops a study over its time limit with a 422 that says so, and runs the next one', async () => {
    await configureStudyPool({ runMs: 1 });
    const res = await postStudy(DEMO_STUDY_INPUTS);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'study_too_long', message: expect.stringMatching(/ran longer than/) });
    await configureStudyPool(DEFAULT_STUDY_LIMITS);
    await stillServes();
  });

  it('answers 503 when every study thread is busy and the queue is full', async () => {
    await configureStudyPool({ threads: 1, queue: 0 });
    const all = await Promise.all([1, 2, 3].map(() => postStudy(DEMO_STUDY_INPUTS)));
    const statuses = all.map((r) => r.status).sort();
    expect(statuses).toContain(201);
    expect(statuses).toContain(503);
    expect(all.find((r) => r.status === 503)!.body.error.code).toBe('busy');
    expect(all.find((r) => r.status === 503)!.headers['retry-after']).toBe('60');
    await configureStudyPool(DEFAULT_STUDY_LIMITS);
    await stillServes();
  });
});
