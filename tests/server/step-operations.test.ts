/**
 * Steps as operations: each step has a kind and says whose work it was; an inspection point holds the
 * later steps until an inspector of the build stamps it. Through the API on the demo's inboard rib
 * (W-104), whose step 2 (the fit check before riveting) is an inspection point.
 */
import request from 'supertest';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let innerId: string;
let buildId: string;
type Step = {
  id: string;
  seq: number;
  kind: string;
  inspectionPoint: boolean;
  doneAt: string | null;
  by: string | null;
  byName: string | null;
  stampedAt: string | null;
  stampedByName: string | null;
};

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  ({ innerId, buildId } = await demoRibs(t, tok.builder));
});

const part = async (token = tok.builder) =>
  (await request(t.app).get(`/api/travelers/${innerId}`).set(auth(token))).body;
const stepOf = async (seq: number): Promise<Step> => (await part()).steps.find((s: Step) => s.seq === seq);
const setStep = (seq: number, body: Record<string, unknown>, token = tok.builder) =>
  stepOf(seq).then((s) => request(t.app).post(`/api/travelers/${innerId}/steps/${s.id}`).set(auth(token)).send(body));
const stamp = (seq: number, token: string) =>
  stepOf(seq).then((s) => request(t.app).post(`/api/travelers/${innerId}/steps/${s.id}/stamp`).set(auth(token)));

describe('steps as operations', () => {
  it('carry the kind and inspection point the revision gave them', async () => {
    const steps = (await part()).steps as Step[];
    expect(steps.map((s) => [s.seq, s.kind, s.inspectionPoint])).toEqual([
      [1, 'deburr', false],
      [2, 'inspect', true],
      [3, 'rivet', false],
      [4, 'rivet', false],
      [5, 'inspect', false],
    ]);
    // The demo's first step was done by the builder before steps said whose work they were.
    expect(steps[0]).toMatchObject({ by: 'builder', byName: null });
  });

  it('do the inspection point, then refuse the step after it until it is stamped', async () => {
    const done = await setStep(2, { done: true });
    expect(done.status).toBe(200);
    expect(done.body.readiness.reasons).toContain('1 inspection point not stamped');
    expect(done.body.allowedActions).not.toContain('stamp');
    const early = await setStep(3, { done: true });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toBe(
      'step 2 is an inspection point: an inspector stamps it before later steps are done',
    );
    expect((await stepOf(3)).doneAt).toBeNull();
  });

  it('take the stamp only from an inspector of this build', async () => {
    expect((await stamp(2, tok.builder)).status).toBe(403);
    expect((await stamp(2, tok.supplier)).status).toBe(403);
    // An inspector of another build does not see the part at all.
    expect((await stamp(2, outsiders.inspector)).status).toBe(404);
    expect((await stepOf(2)).stampedAt).toBeNull();
    const ok = await stamp(2, tok.inspector);
    expect(ok.status).toBe(200);
    expect(ok.body.steps[1]).toMatchObject({ stampedByName: expect.any(String), stampedAt: expect.any(String) });
    expect(ok.body.readiness.reasons).not.toContain('1 inspection point not stamped');
    expect((await stamp(2, tok.inspector)).status).toBe(409);
    // Stamped, the point stays done.
    const undo = await setStep(2, { done: false });
    expect(undo.status).toBe(409);
    expect(undo.body.error.message).toBe('step 2 was stamped by an inspector: it stays done');
  });

  it('record whose work a step was, naming help, and write it in the log', async () => {
    const unnamed = await setStep(3, { done: true, by: 'helper' });
    expect(unnamed.status).toBe(400);
    expect(unnamed.body.error.fields.byName).toBe('say who helped: a helper’s or a shop’s name');
    const wrong = await setStep(3, { done: true, by: 'neighbour' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('by');
    const ok = await setStep(3, { done: true, by: 'helper', byName: 'Sam Ortiz' });
    expect(ok.status).toBe(200);
    expect(ok.body.steps[2]).toMatchObject({ by: 'helper', byName: 'Sam Ortiz', doneAt: expect.any(String) });
    const log = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ kind: 'step_done,step_stamped' })
      .set(auth(tok.builder));
    const texts = (log.body.items as { text: string }[]).map((e) => e.text);
    expect(texts).toContain('Step 3 done by a helper, Sam Ortiz: Rivet upper flange');
    expect(texts).toContain('Stamped inspection point step 2: Cleco rib to spar and skin; check flange fit');
    // Undone, the credit goes with it.
    const undone = await setStep(3, { done: false });
    expect(undone.body.steps[2]).toMatchObject({ by: null, byName: null, doneAt: null });
  });
});

describe('the build’s fabrication-and-assembly table', () => {
  it('sums the live parts’ steps by whose work they were (worked by hand from the steps above)', async () => {
    expect((await setStep(3, { done: true, by: 'commercial', byName: 'Harlow Sheet Metal' })).status).toBe(200);
    const res = await request(t.app).get(`/api/builds/${buildId}/fabrication`).set(auth(tok.builder));
    expect(res.status).toBe(200);
    const inner = res.body.parts.find((p: { partNumber: string }) => p.partNumber === 'W-104');
    // W-104: step 1 deburr (builder: fabrication), step 2 fit check (an inspection: nobody's), step 3 rivet
    // (commercial help), steps 4–5 not done → 1 of 2 credited steps the builder's.
    expect(inner).toMatchObject({
      credited: { builder_fabrication: 1, builder_assembly: 0, helper: 0, commercial: 1, kit_supplier: 0 },
      creditedTotal: 2,
      inspections: 1,
      notDone: 2,
      builderShare: 0.5,
    });
    expect(res.body.total.creditedTotal).toBe(2);
    expect(res.body.total.builderShare).toBe(0.5);
    expect((await request(t.app).get(`/api/builds/${buildId}/fabrication`).set(auth(outsiders.builder))).status).toBe(
      404,
    );
  });
});

describe('revision steps through the designs API', () => {
  it('take bare text as a step of kind other, and refuse a kind the trade list does not have', async () => {
    const designs = await request(t.app).get('/api/designs').set(auth(tok.supplier));
    const designId = (designs.body.items as { id: string; partNumber: string }[]).find(
      (d) => d.partNumber === 'W-104',
    )!.id;
    const detail = (await request(t.app).get(`/api/designs/${designId}`).set(auth(tok.supplier))).body;
    const latest = detail.revisions[0];
    const body = {
      material: latest.material,
      gaugeIn: latest.gaugeIn,
      rivetSpec: latest.rivetSpec,
      drillSize: latest.drillSize,
      drillDiameterIn: latest.drillDiameterIn,
      edgeDistanceIn: latest.edgeDistanceIn,
      chordIn: latest.chordIn,
      lines: latest.lines,
      changeNote: 'Steps with kinds',
    };
    const bad = await request(t.app)
      .post(`/api/designs/${designId}/revisions`)
      .set(auth(tok.supplier))
      .send({ ...body, steps: [{ text: 'Weld it', kind: 'weld' }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/kind is one of lay_out, drill/);
    const ok = await request(t.app)
      .post(`/api/designs/${designId}/revisions`)
      .set(auth(tok.supplier))
      .send({ ...body, steps: ['Deburr', { text: 'Check fit', kind: 'inspect', inspectionPoint: true }] });
    expect(ok.status).toBe(201);
    expect(ok.body.steps).toEqual([
      { text: 'Deburr', kind: 'other', inspectionPoint: false },
      { text: 'Check fit', kind: 'inspect', inspectionPoint: true },
    ]);
  });
});
