import request from 'supertest';
import { DEMO_STUDY_INPUTS } from '@/server/dev/demo-inputs';
import { auth, demoAppWithKit, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(90000);

let t: TestApp;
let tok: Tokens;
let kitModelId: string;
demoAppWithKit((s) => ({ t, tok, kitModelId } = s));

/** A study of the demo's first kit, posted by the supplier. */
const postStudy = (inputs: unknown, name = 'bad') =>
  request(t.app).post('/api/studies').set(auth(tok.supplier)).send({ kitModelId, name, inputs });
/** The supplier's first listed study, and its whole record. */
async function firstStudy() {
  const [study] = (await request(t.app).get('/api/studies').set(auth(tok.supplier))).body.items;
  return { study, detail: (await request(t.app).get(`/api/studies/${study.id}`).set(auth(tok.supplier))).body };
}

describe('load studies', () => {
  it('refuses a negative weight, naming the field', async () => {
    const res = await postStudy({ ...DEMO_STUDY_INPUTS, kit: { ...DEMO_STUDY_INPUTS.kit, weightLb: -1 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['inputs.kit.weightLb']).toMatch(/greater than zero/);
  });

  it('refuses a stall speed above the cruise speed', async () => {
    const res = await postStudy({ ...DEMO_STUDY_INPUTS, kit: { ...DEMO_STUDY_INPUTS.kit, stallSpeedKeas: 130 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['inputs.kit.cruiseSpeedKeas']).toMatch(/above the stall speed/);
  });

  it('refuses uploaded coordinates that cross themselves, with the engine naming the airfoil points', async () => {
    // A bow tie: the two "surfaces" cross at mid-chord.
    const points: [number, number][] = [];
    for (let i = 0; i <= 10; i++) points.push([1 - i / 10, 0.05 * Math.sin(Math.PI * (1 - i / 10)) * (i < 5 ? 1 : -1)]);
    for (let i = 1; i <= 10; i++) points.push([i / 10, 0.05 * Math.sin(Math.PI * (i / 10)) * (i < 5 ? -1 : 1)]);
    const res = await postStudy({ ...DEMO_STUDY_INPUTS, airfoil: { kind: 'coordinates', points } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['inputs.airfoil.points']).toMatch(/crosses itself/);
  });

  it('computes and stores a study with its trade table, and a change is a new revision', async () => {
    const res = await postStudy(DEMO_STUDY_INPUTS, 'Rib study');
    expect(res.status).toBe(201);
    expect(res.body.revision).toBe(1);
    expect(res.body.result.trade.length).toBe(18);
    expect(res.body.result.caution).toMatch(/aid only/i);
    const changed = await request(t.app)
      .put(`/api/studies/${res.body.id}`)
      .set(auth(tok.supplier))
      .send({ kitModelId, name: 'Rib study', inputs: { ...DEMO_STUDY_INPUTS, maxZones: 2 } });
    expect(changed.body.revision).toBe(2);
    const first = await request(t.app).get(`/api/studies/${res.body.id}?revision=1`).set(auth(tok.supplier));
    expect(first.body.inputs.maxZones).toBe(4);
  });

  it('applies the recommended gauge and rivet to a draft revision with the computed zones and the study as basis', async () => {
    const { study, detail } = await firstStudy();
    const designs = (await request(t.app).get('/api/designs').set(auth(tok.supplier))).body.items;
    const rib = designs.find((d: { partNumber: string }) => d.partNumber === 'W-104');
    const { gaugeIn, rivet } = detail.result.recommended;
    const res = await request(t.app)
      .post(`/api/studies/${study.id}/apply`)
      .set(auth(tok.supplier))
      .send({ partDesignId: rib.id, gaugeIn, rivet });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'draft', letter: 'B', gaugeIn, rivetSpec: rivet, studyId: study.id });
    const candidate = detail.result.candidates.find(
      (c: { gaugeIn: number; rivet: string }) => c.gaugeIn === gaugeIn && c.rivet === rivet,
    );
    expect(res.body.lines.map((l: { zones: unknown[] }) => l.zones.length)).toEqual(
      candidate.lines.map((l: { zones: unknown[] }) => l.zones.length),
    );
    expect(res.body.basis.studyRevision).toBe(detail.revision);
    // The study names its lines by their initials (UF, LF); the part's codes stay, so U-07 is the same hole in B as in A.
    expect(detail.result.lines.map((l: { holePrefix: string }) => l.holePrefix)).toEqual(['UF', 'LF']);
    expect(res.body.lines.map((l: { code: string }) => l.code)).toEqual(['U', 'L']);
  });

  it('refuses to apply a candidate that does not carry the load', async () => {
    const { study, detail } = await firstStudy();
    const bad = detail.result.candidates.find((c: { feasible: boolean }) => !c.feasible);
    const designs = (await request(t.app).get('/api/designs').set(auth(tok.supplier))).body.items;
    const res = await request(t.app)
      .post(`/api/studies/${study.id}/apply`)
      .set(auth(tok.supplier))
      .send({ partDesignId: designs[0].id, gaugeIn: bad.gaugeIn, rivet: bad.rivet });
    expect(res.status).toBe(409);
  });

  it('lists the coupon allowables a study uses: 0.020 in 13.5 lb limit, 30 lb ultimate; 0.016 in nothing (common practice)', async () => {
    const res = await request(t.app).get('/api/coupons/allowables').set(auth(tok.supplier));
    expect(res.status).toBe(200);
    const at = (g: number) => res.body.find((a: { gaugeIn: number }) => Math.abs(a.gaugeIn - g) < 1e-6);
    expect(at(0.02)).toMatchObject({ material: '6061-T6', rivetSpec: 'PULLED-4', limitLb: 13.5, ultimateLb: 30 });
    expect(at(0.016)).toMatchObject({ limitLb: 0, ultimateLb: 0 });
    expect(at(0.02).tests).toHaveLength(3);
  });

  it('uses a supplied Cp table instead of the panel method, and refuses a Cp above stagnation naming the row', async () => {
    // A flat plate's thin-airfoil jump, ΔCp = 4α√((1−x)/x) at CL = 2πα (thin-airfoil theory, from memory), split evenly.
    const alpha = 0.1;
    const rows = [0.1, 0.2, 0.3, 0.5, 0.7, 0.9].map((x): [number, number, number] => {
      const dcp = 4 * alpha * Math.sqrt((1 - x) / x);
      return [x, -dcp / 2, dcp / 2];
    });
    const cpTables = [{ cl: 2 * Math.PI * alpha, rows }];
    const res = await postStudy({ ...DEMO_STUDY_INPUTS, cpTables }, 'From a Cp table');
    expect(res.status).toBe(201);
    expect(
      res.body.result.conditions
        .filter((c: { clNeeded: number }) => c.clNeeded > 0)
        .every((c: { pressureSource: string }) => c.pressureSource === 'Cp table'),
    ).toBe(true);
    const bad = await postStudy({
      ...DEMO_STUDY_INPUTS,
      cpTables: [{ cl: 0.6, rows: rows.map((r, i) => (i === 2 ? [r[0], 1.5, r[2]] : r)) }],
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['inputs.cpTables.0.rows.2.1']).toMatch(/stagnation/);
  });

  it('keeps load studies from builders', async () => {
    expect((await request(t.app).get('/api/studies').set(auth(tok.builder))).status).toBe(403);
  });
});

describe('the rework check for an inspector', () => {
  it('fails AD4 → AD5 at the existing 0.25 in edge distance and offers the alternative', async () => {
    // FAA AC 43.13-1B 4-57: an oversize rivet needs 2D of the new diameter, 2 × 5/32 = 0.3125 in.
    const [finding] = (await request(t.app).get('/api/findings?status=open').set(auth(tok.inspector))).body.items;
    const res = await request(t.app).post(`/api/findings/${finding.id}/repair-check`).set(auth(tok.inspector)).send({});
    expect(res.status).toBe(200);
    expect(res.body.pass).toBe(false);
    expect(res.body.requiredEdgeIn).toBeCloseTo(0.3125, 4);
    expect(res.body.alternative).not.toBeNull();
    expect(res.body.caution).toMatch(/aid only/i);
  });
});
