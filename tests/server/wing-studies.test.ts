import request from 'supertest';
import { DEMO_STUDY_INPUTS, DEMO_WING_INPUTS } from '@/server/dev/demo-inputs';
import { STUDY_SUMMARY_KEYS } from '../fixtures/study-summary';
import { auth, demoAppWithKit, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
let otherSupplier: string;
let kitModelId: string;
/** The wing study this file makes (the demo's wing, as a supplier would send it). */
let wing: { id: string; result: any; revision: number; recommended: Choice | null };
let ribStudyId: string;
let designIds: Record<string, string>;
type Choice = { gaugeIn: number; rivet: string };
const same = (a: Choice) => (b: Choice) => Math.abs(a.gaugeIn - b.gaugeIn) < 1e-9 && a.rivet === b.rivet;

demoAppWithKit((s) => ({ t, tok, kitModelId } = s));
beforeAll(async () => {
  otherSupplier = await t.addUser('supplier', 'other.supplier@elsewhere.example');
  const res = await request(t.app)
    .post('/api/studies')
    .set(auth(tok.supplier))
    .send({ kind: 'wing', kitModelId, name: 'Wing, ten ribs', inputs: DEMO_WING_INPUTS });
  if (res.status !== 201) throw new Error(`the wing study was refused: ${JSON.stringify(res.body)}`);
  wing = res.body;
  const list = (await request(t.app).get('/api/studies').set(auth(tok.supplier))).body.items as {
    id: string;
    kind: string;
  }[];
  ribStudyId = list.find((s) => s.kind === 'rib')!.id;
  const designs = (await request(t.app).get('/api/designs').set(auth(tok.supplier))).body.items as {
    id: string;
    partNumber: string;
  }[];
  designIds = Object.fromEntries(designs.map((d) => [d.partNumber, d.id]));
});

const post = (body: object, token = tok.supplier) => request(t.app).post('/api/studies').set(auth(token)).send(body);
const apply = (id: string, body: object, token = tok.supplier) =>
  request(t.app).post(`/api/studies/${id}/apply`).set(auth(token)).send(body);
/** Applies `choice` (a gauge and rivet of the wing study's) for its skin panel `panel` to skin part W-201. */
const applyToSkin = (panel: string, choice: object, token = tok.supplier) =>
  apply(wing.id, { partDesignId: designIds['W-201'], ...choice, target: { kind: 'skin', name: panel } }, token);

describe('a whole-wing study', () => {
  it('computes every rib and every skin panel between neighbouring ribs, and says it is a wing', () => {
    expect(wing).toMatchObject({ kind: 'wing', revision: 1 });
    expect(wing.result.ribs.map((r: { name: string }) => r.name)).toEqual(DEMO_WING_INPUTS.ribs.map((r) => r.name));
    // Nine bays between ten ribs, an upper and a lower panel each (counting).
    expect(wing.result.skins).toHaveLength(18);
    expect(wing.recommended).toEqual(wing.result.trade.recommendedUniform);
  });

  it("grades each rib's section lift by Schrenk: cl/CL = ½(1 + 4/π·√(1−η²)) on a rectangular wing, 1.1294 at the root rib (η = 0.15)", () => {
    // O. Schrenk, NACA TM 948: the mean of the planform (c/c̄ = 1 for a rectangle) and the ellipse of equal
    // area (4/π·√(1−η²)), over the local chord.
    const half = DEMO_WING_INPUTS.planform.spanIn / 2;
    const schrenk = (eta: number) => 0.5 * (1 + (4 / Math.PI) * Math.sqrt(1 - eta * eta));
    for (const rib of wing.result.ribs) expect(rib.clRatio).toBeCloseTo(schrenk(rib.stationIn / half), 3);
    expect(wing.result.ribs[0].stationIn / half).toBeCloseTo(0.15, 9);
    expect(wing.result.ribs[0].clRatio).toBeCloseTo(1.1294, 3);
    // A rectangle's chord is the same at every rib (definition of the planform).
    for (const rib of wing.result.ribs) expect(rib.chordIn).toBe(54);
  });

  it('refuses a rib beyond the half-span, naming it from the request root', async () => {
    const ribs = DEMO_WING_INPUTS.ribs.map((r, i) => (i === 9 ? { ...r, stationIn: 170 } : r));
    const res = await post({ kind: 'wing', kitModelId, name: 'bad', inputs: { ...DEMO_WING_INPUTS, ribs } });
    expect(res.status).toBe(400);
    // 170 in is past the 160 in half-span of a 320 in span (geometry).
    expect(res.body.error.fields['inputs.ribs.9.stationIn']).toMatch(/beyond the 160 in half-span/);
  });

  it("passes on the engine's refusal of two ribs of one name as inputs.ribs.3.name", async () => {
    const ribs = DEMO_WING_INPUTS.ribs.map((r, i) => (i === 3 ? { ...r, name: DEMO_WING_INPUTS.ribs[2].name } : r));
    const res = await post({ kind: 'wing', kitModelId, name: 'bad', inputs: { ...DEMO_WING_INPUTS, ribs } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['inputs.ribs.3.name']).toMatch(/two ribs are called "W-103"/);
  });

  it('passes on the engine naming an unknown skin rivet as inputs.skin.rivetCandidates.0', async () => {
    const res = await post({
      kind: 'wing',
      kitModelId,
      name: 'bad',
      inputs: { ...DEMO_WING_INPUTS, skin: { ...DEMO_WING_INPUTS.skin, rivetCandidates: ['NOSUCH-9'] } },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['inputs.skin.rivetCandidates.0']);
  });

  it('keeps its kind: a rib study body for it is refused with 409, a wing body makes revision 2', async () => {
    const rib = await request(t.app)
      .put(`/api/studies/${wing.id}`)
      .set(auth(tok.supplier))
      .send({ kitModelId, name: 'Wing, ten ribs', inputs: DEMO_STUDY_INPUTS });
    expect(rib.status).toBe(409);
    expect(rib.body.error.fields.kind).toMatch(/wing/);
    const next = await request(t.app)
      .put(`/api/studies/${wing.id}`)
      .set(auth(tok.supplier))
      .send({ kind: 'wing', kitModelId, name: 'Wing, ten ribs', inputs: { ...DEMO_WING_INPUTS, maxZones: 3 } });
    expect(next.status).toBe(200);
    expect(next.body).toMatchObject({ kind: 'wing', revision: 2, inputs: { maxZones: 3 } });
    const first = await request(t.app).get(`/api/studies/${wing.id}?revision=1`).set(auth(tok.supplier));
    expect(first.body).toMatchObject({ kind: 'wing', revision: 1, inputs: { maxZones: 4 } });
    wing = next.body;
  });

  it('lists rib and wing studies with their kind and headline choice, without their results', async () => {
    const res = await request(t.app).get('/api/studies').set(auth(tok.supplier));
    expect(res.status).toBe(200);
    const mine = res.body.items.find((s: { id: string }) => s.id === wing.id);
    expect(mine).toMatchObject({ kind: 'wing', revision: 2, recommended: wing.result.trade.recommendedUniform });
    const demoWing = res.body.items.find((s: { name: string }) => s.name.startsWith('Whole wing'));
    expect(demoWing.kind).toBe('wing');
    const rib = res.body.items.find((s: { id: string }) => s.id === ribStudyId);
    const ribDetail = (await request(t.app).get(`/api/studies/${ribStudyId}`).set(auth(tok.supplier))).body;
    expect(rib).toMatchObject({ kind: 'rib', recommended: ribDetail.result.recommended });
    for (const s of res.body.items) expect(Object.keys(s).sort()).toEqual(STUDY_SUMMARY_KEYS);
  });
});

describe('applying a wing study to a part design', () => {
  it("writes rib W-105's recommended candidate into a draft of the rib part: the rib's chord, its flange lines and zones", async () => {
    const rib = wing.result.ribs.find((r: { name: string }) => r.name === 'W-105');
    const pick: Choice = rib.study.recommended;
    const res = await apply(wing.id, {
      partDesignId: designIds['W-105'],
      ...pick,
      target: { kind: 'rib', name: 'W-105' },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      status: 'draft',
      gaugeIn: pick.gaugeIn,
      rivetSpec: pick.rivet,
      chordIn: rib.chordIn,
      studyId: wing.id,
    });
    const candidate = rib.study.candidates.find(same(pick));
    // The rib's own line codes stay (U, L), not the study's initials (UF, LF): hole ids keep meaning the same hole.
    expect(rib.study.lines.map((l: { holePrefix: string }) => l.holePrefix)).toEqual(['UF', 'LF']);
    expect(res.body.lines.map((l: { code: string }) => l.code)).toEqual(['U', 'L']);
    res.body.lines.forEach((line: any, i: number) => {
      expect(line.zones.map((z: { pitchIn: number }) => z.pitchIn)).toEqual(
        candidate.lines[i].zones.map((z: { pitchIn: number }) => z.pitchIn),
      );
      expect(line.startIn).toBeCloseTo(rib.study.lines[i].fromStationIn, 3);
      // The zones tile the line from its start to its length (the revision contract).
      expect(line.zones[0].fromIn).toBe(0);
      expect(line.zones.at(-1).toIn).toBeCloseTo(line.lengthIn, 6);
    });
    expect(res.body.basis).toMatchObject({
      kind: 'wing',
      studyRevision: 2,
      target: { kind: 'rib', name: 'W-105', stationIn: rib.stationIn },
    });
  });

  it("refuses a rib candidate whose zones the wing did not keep, pointing to the rib's and the wing's choices", async () => {
    const rib = wing.result.ribs.find((r: { name: string }) => r.name === 'W-105');
    const other = rib.study.candidates.find((c: any) => c.feasible && c.lines.length === 0);
    const res = await apply(wing.id, {
      partDesignId: designIds['W-105'],
      gaugeIn: other.gaugeIn,
      rivet: other.rivet,
      target: { kind: 'rib', name: 'W-105' },
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/recommended candidate .* one-for-all choice/);
  });

  it('writes the root upper panel into the skin part: front spar, rear spar and both rib lines, as the flat rows of a panel', async () => {
    const panel = wing.result.skins.find(
      (s: { surface: string; innerRib: string }) => s.surface === 'upper' && s.innerRib === 'W-101',
    );
    const pick: Choice = panel.recommended;
    const res = await applyToSkin(panel.name, pick);
    expect(res.status).toBe(200);
    // The demo's draft A is written over, not a new letter.
    expect(res.body).toMatchObject({
      status: 'draft',
      letter: 'A',
      gaugeIn: pick.gaugeIn,
      rivetSpec: pick.rivet,
      studyId: wing.id,
    });
    expect(res.body.lines.map((l: { code: string }) => l.code)).toEqual(['FS', 'RS', 'IR', 'OR']);
    // A countersunk rivet's edge distance is at least 2.5 D (FAA AC 43.13-1B 4-58); MS20426 dash numbers are
    // the diameter in 32nds of an inch (common practice): the stored, rounded figure must not undercut it.
    const d = Number(pick.rivet.match(/AD(\d+)$/)![1]) / 32;
    expect(res.body.edgeDistanceIn).toBeGreaterThanOrEqual(2.5 * d);
    for (const line of res.body.lines) expect(line).toMatchObject({ surface: 'flat', startIn: 0 });
    // The spar lines run the bay between ribs at 24 and 38.5 in: 14.5 in (geometry).
    expect(res.body.lines[0].lengthIn).toBeCloseTo(14.5, 3);
    expect(res.body.lines[1].lengthIn).toBeCloseTo(14.5, 3);
    const candidate = panel.candidates.find(same(pick));
    res.body.lines.forEach((line: any, i: number) => {
      expect(line.lengthIn).toBeCloseTo(candidate.lines[i].lengthIn, 3);
      expect(line.zones.map((z: { pitchIn: number }) => z.pitchIn)).toEqual(
        candidate.lines[i].zones.map((z: { pitchIn: number }) => z.pitchIn),
      );
      expect(line.zones.at(-1).toIn).toBeCloseTo(line.lengthIn, 6);
    });
    expect(res.body.basis.target).toMatchObject({
      kind: 'skin',
      name: panel.name,
      innerStationIn: 24,
      outerStationIn: 38.5,
    });
  });

  it('refuses a skin candidate that does not carry the load, with its reasons', async () => {
    const panel = wing.result.skins.find((s: any) => s.candidates.some((c: any) => !c.feasible));
    const bad = panel.candidates.find((c: any) => !c.feasible);
    const res = await applyToSkin(panel.name, { gaugeIn: bad.gaugeIn, rivet: bad.rivet });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain(bad.reasons[0]);
  });

  it('asks which rib or panel when the target is left out', async () => {
    const res = await apply(wing.id, { partDesignId: designIds['W-201'], ...wing.result.trade.recommendedUniform });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.target).toBeTruthy();
  });

  it('refuses a rib target written to a skin panel part, and a skin target written to a rib part', async () => {
    const rib = wing.result.ribs[0];
    const toSkin = await apply(wing.id, {
      partDesignId: designIds['W-201'],
      ...rib.study.recommended,
      target: { kind: 'rib', name: rib.name },
    });
    expect(toSkin.status).toBe(409);
    expect(toSkin.body.error.fields.partDesignId).toMatch(/rib/);
    const panel = wing.result.skins[0];
    const toRib = await apply(wing.id, {
      partDesignId: designIds['W-104'],
      ...panel.recommended,
      target: { kind: 'skin', name: panel.name },
    });
    expect(toRib.status).toBe(409);
    expect(toRib.body.error.fields.partDesignId).toMatch(/skin_panel/);
  });

  it("refuses a skin candidate whose zones the wing did not keep, pointing to the panel's recommended one", async () => {
    const panel = wing.result.skins.find((s: any) => s.candidates.some((c: any) => c.feasible && c.lines.length === 0));
    const other = panel.candidates.find((c: any) => c.feasible && c.lines.length === 0);
    const res = await applyToSkin(panel.name, { gaugeIn: other.gaugeIn, rivet: other.rivet });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain(
      `recommended candidate (${panel.recommended.gaugeIn} in with ${panel.recommended.rivet})`,
    );
  });

  it('answers 404 for a rib or panel the study does not have', async () => {
    const rib = await apply(wing.id, {
      partDesignId: designIds['W-104'],
      ...wing.result.trade.recommendedUniform,
      target: { kind: 'rib', name: 'W-999' },
    });
    expect(rib.status).toBe(404);
    const panel = await applyToSkin('W-101–W-110 upper', wing.result.skins[0].recommended);
    expect(panel.status).toBe(404);
  });
});

describe("a rib study candidate's holes on demand", () => {
  it('recomputes a candidate the study stored without holes: its zones as stored, holes at the zone pitch', async () => {
    const detail = (await request(t.app).get(`/api/studies/${ribStudyId}`).set(auth(tok.supplier))).body;
    const stored = detail.result.candidates.find((c: any) => c.feasible && !c.holesStored && c.rivet === 'MS20470AD4');
    expect(stored.lines.every((l: { holes: unknown[] }) => l.holes.length === 0)).toBe(true);
    const res = await request(t.app)
      .get(`/api/studies/${ribStudyId}/candidate`)
      .query({ gaugeIn: stored.gaugeIn, rivet: stored.rivet, revision: 1 })
      .set(auth(tok.supplier));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ gaugeIn: stored.gaugeIn, rivet: stored.rivet, feasible: true });
    res.body.lines.forEach((line: any, i: number) => {
      expect(line.zones.map((z: { pitchIn: number; count: number }) => [z.pitchIn, z.count])).toEqual(
        stored.lines[i].zones.map((z: { pitchIn: number; count: number }) => [z.pitchIn, z.count]),
      );
      expect(line.holes.length).toBe(line.zones.reduce((n: number, z: { count: number }) => n + z.count, 0));
      // Neighbouring holes no closer than 3D (1/8 in rivet: 0.375 in) and no farther than their zone's
      // pitch (FAA AC 43.13-1B 4-58, minimum rivet spacing 3D).
      for (let k = 1; k < line.holes.length; k++) {
        const gap = line.holes[k].alongIn - line.holes[k - 1].alongIn;
        expect(gap).toBeGreaterThanOrEqual(0.375 - 1e-3);
        expect(gap).toBeLessThanOrEqual(line.zones[line.holes[k].zone].pitchIn + 1e-3);
      }
    });
  });

  it('answers 404 for a gauge the study did not have, and 409 for a wing study', async () => {
    const missing = await request(t.app)
      .get(`/api/studies/${ribStudyId}/candidate?gaugeIn=0.071&rivet=PULLED-4`)
      .set(auth(tok.supplier));
    expect(missing.status).toBe(404);
    const ofWing = await request(t.app)
      .get(`/api/studies/${wing.id}/candidate?gaugeIn=0.02&rivet=PULLED-4`)
      .set(auth(tok.supplier));
    expect(ofWing.status).toBe(409);
    expect(ofWing.body.error.message).toMatch(/stores zones; apply it/);
  });

  it('refuses a gauge that is not a number, naming it', async () => {
    const res = await request(t.app)
      .get(`/api/studies/${ribStudyId}/candidate?gaugeIn=thin&rivet=PULLED-4`)
      .set(auth(tok.supplier));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.gaugeIn).toMatch(/number/);
  });
});

describe('who may see and use a wing study', () => {
  /** Asks for a candidate of the demo rib study, as `token`. */
  const ribCandidate = (token: string) =>
    request(t.app).get(`/api/studies/${ribStudyId}/candidate?gaugeIn=0.02&rivet=PULLED-4`).set(auth(token));
  /** Applies the wing's first skin panel's recommendation to skin part W-201, as `token`. */
  const applyFirstSkin = (token: string) =>
    applyToSkin(wing.result.skins[0].name, wing.result.skins[0].recommended, token);

  it("hides one supplier's study from another: 404 to read, list, revise, ask a candidate of or apply", async () => {
    expect((await request(t.app).get(`/api/studies/${wing.id}`).set(auth(otherSupplier))).status).toBe(404);
    expect((await request(t.app).get('/api/studies').set(auth(otherSupplier))).body.items).toEqual([]);
    expect(
      (
        await request(t.app)
          .put(`/api/studies/${wing.id}`)
          .set(auth(otherSupplier))
          .send({ kind: 'wing', kitModelId, name: 'x', inputs: DEMO_WING_INPUTS })
      ).status,
    ).toBe(404);
    expect((await ribCandidate(otherSupplier)).status).toBe(404);
    expect((await applyFirstSkin(otherSupplier)).status).toBe(404);
  });

  it('keeps wing studies from builders: 403', async () => {
    expect((await post({ kind: 'wing', kitModelId, name: 'x', inputs: DEMO_WING_INPUTS }, tok.builder)).status).toBe(
      403,
    );
    expect((await request(t.app).get(`/api/studies/${wing.id}`).set(auth(tok.builder))).status).toBe(403);
    expect((await ribCandidate(tok.builder)).status).toBe(403);
    expect((await applyFirstSkin(tok.builder)).status).toBe(403);
  });
});
