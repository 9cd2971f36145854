import { count, eq, isNull, type SQL } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import request from 'supertest';
import {
  allowedCouponActions,
  allowedKitActions,
  checkBuildAction,
  COUPON_GAUGE_TOLERANCE_IN,
  couponBacks,
  kitChangeReasonRefusal,
  type BuildWork,
  type CouponTest,
} from '@/db/contracts';
import {
  buildEvents,
  builds,
  couponTests,
  designRevisions,
  kitModelChanges,
  kitModels,
  partDesigns,
  travelers,
} from '@/db/schema';
import { DEMO_COUPONS } from '@/server/dev/demo-inputs';
import { couponsForEngine } from '@/server/coupons/coupons-repository';
import { GAUGE_MATCH_TOLERANCE_IN } from '@/server/engineering/coupons';
import { flangeLine, ribRevision as standardRevision } from '../fixtures/rib-revision';
import { auth, demoApp, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
let other: Outsiders;
let supplierOrg: string;

demoApp((s) => ({ t, tok, outsiders: other } = s), { outsiders: true });
beforeAll(async () => {
  supplierOrg = (await request(t.app).get('/api/auth/me').set(auth(tok.supplier))).body.organizationId;
});

/** Rows of a table, counted by the database: a refusal must leave every one of them in place. */
const rows = async (table: PgTable, where?: SQL): Promise<number> =>
  (await t.database.db.select({ n: count() }).from(table).where(where))[0].n;

const kitBody = (over: Record<string, unknown> = {}) => ({
  code: 'TMP-1',
  name: 'Temporary trainer',
  weightLb: 1200,
  wingAreaSqFt: 110,
  meanChordIn: 50,
  stallSpeedKeas: 45,
  cruiseSpeedKeas: 110,
  category: 'normal',
  airfoil: 'NACA 2412',
  ...over,
});
// The standard rib's revision at one pitch all along, with no steps and no change note.
const ribRevision = (over: Record<string, unknown> = {}) => ({
  ...standardRevision,
  lines: [flangeLine('U', 30, [{ fromIn: 0, toIn: 30, pitchIn: 1 }])],
  steps: [],
  changeNote: '',
  ...over,
});

/** What the supplier reads at `path`. */
const supplierGet = async (path: string) => (await request(t.app).get(path).set(auth(tok.supplier))).body;
/** The first item of the supplier's list at `path` that `pick` chooses. */
const supplierItem = async <T extends { id: string }>(path: string, pick: (item: T) => boolean): Promise<T> =>
  ((await supplierGet(path)).items as T[]).find(pick)!;
const demoKit = () => supplierItem<{ id: string; code: string }>('/api/kits', (k) => k.code === 'NK-2');
/** The supplier's new rib design of the kit: draft revision A of the one-pitch rib. */
const postRib = (kitModelId: string, partNumber: string, name: string) =>
  request(t.app)
    .post('/api/designs')
    .set(auth(tok.supplier))
    .send({ design: { kitModelId, partNumber, name, kind: 'rib' }, revision: ribRevision() });
const designOf = (partNumber: string) =>
  supplierItem<{ id: string; partNumber: string }>('/api/designs', (d) => d.partNumber === partNumber);

describe('the rules read as tables (db/contracts)', () => {
  it('keeps the coupon gauge tolerance equal to the engine’s', () => {
    expect(COUPON_GAUGE_TOLERANCE_IN).toBe(GAUGE_MATCH_TOLERANCE_IN);
  });

  it('says a test backs a study-made revision of its rivet at its gauge or thinner, recorded before publishing', () => {
    const at = '2026-10-14T12:00:00Z';
    const rev = { rivetSpec: 'PULLED-4', gaugeIn: 0.02, publishedAt: at, fromStudy: true };
    const test = { rivetSpec: 'pulled-4 ', gaugeIn: 0.02, createdAt: '2026-10-14T11:00:00Z' };
    expect(couponBacks(test, rev)).toBe(true);
    // 0.050 and 0.051 in are one stock gauge (ENGINEERING.md, stock gauges: common practice).
    expect(couponBacks({ ...test, gaugeIn: 0.051 }, { ...rev, gaugeIn: 0.05 })).toBe(true);
    expect(couponBacks({ ...test, gaugeIn: 0.05 }, { ...rev, gaugeIn: 0.051 })).toBe(true);
    // The fallback cap reads tests of the same rivet in a thicker gauge (server/engineering/allowables.ts).
    expect(couponBacks({ ...test, gaugeIn: 0.025 }, rev)).toBe(true);
    expect(couponBacks({ ...test, gaugeIn: 0.016 }, rev)).toBe(false);
    expect(couponBacks({ ...test, rivetSpec: 'MS20470AD4' }, rev)).toBe(false);
    expect(couponBacks({ ...test, createdAt: '2026-10-14T13:00:00Z' }, rev)).toBe(false);
    expect(couponBacks(test, { ...rev, fromStudy: false })).toBe(false);
  });

  it('offers correct and delete on a current test, correct only when it backs a revision, nothing on a corrected entry', () => {
    expect(allowedCouponActions({ superseded: false, backs: [] })).toEqual(['correct', 'delete']);
    expect(allowedCouponActions({ superseded: false, backs: ['W-1 revision A'] })).toEqual(['correct']);
    expect(allowedCouponActions({ superseded: true, backs: [] })).toEqual([]);
  });

  it('offers delete on a kit only while nothing relies on it, and asks why its numbers change once something does', () => {
    const none = { studies: 0, publishedParts: 0, builds: 0 };
    expect(allowedKitActions(none)).toEqual(['edit', 'delete']);
    for (const r of [
      { ...none, studies: 1 },
      { ...none, publishedParts: 1 },
      { ...none, builds: 1 },
    ]) {
      expect(allowedKitActions(r)).toEqual(['edit']);
      expect(kitChangeReasonRefusal(r, ['weightLb'], '')).toMatch(/say why/);
      expect(kitChangeReasonRefusal(r, ['weightLb'], 'heavier engine')).toBeNull();
      expect(kitChangeReasonRefusal(r, ['name'], '')).toBeNull();
    }
    expect(kitChangeReasonRefusal(none, ['weightLb'], '')).toBeNull();
  });

  it('lets only the shipping supplier change a build, and only its note once work is recorded', () => {
    const idle: BuildWork = { holesWorked: 0, stepsDone: 0, findings: 0, signedOff: 0, logEntries: 0 };
    const mine = { role: 'supplier' as const, organizationId: 'org-a' };
    const build = { organizationId: 'org-a' };
    expect(checkBuildAction(mine, build, idle, 'delete')).toBeNull();
    expect(checkBuildAction(mine, build, idle, 'change-serial')).toBeNull();
    for (const w of [{ holesWorked: 1 }, { stepsDone: 1 }, { findings: 1 }, { signedOff: 1 }, { logEntries: 1 }]) {
      expect(checkBuildAction(mine, build, { ...idle, ...w }, 'delete')?.code).toBe(409);
      expect(checkBuildAction(mine, build, { ...idle, ...w }, 'change-serial')?.code).toBe(409);
      expect(checkBuildAction(mine, build, { ...idle, ...w }, 'edit-note')).toBeNull();
    }
    expect(checkBuildAction({ role: 'supplier', organizationId: 'org-b' }, build, idle, 'edit-note')?.code).toBe(403);
    expect(checkBuildAction({ role: 'builder', organizationId: null }, build, idle, 'delete')?.code).toBe(403);
  });
});

describe('kit models: edit with history, delete while nothing relies on them', () => {
  it('refuses to delete the demo kit, naming its published parts, build and studies, and leaves every row', async () => {
    const kit = await demoKit();
    const detail = (await request(t.app).get(`/api/kits/${kit.id}`).set(auth(tok.supplier))).body;
    expect(detail.allowedActions).toEqual(['edit']);
    expect(detail.reliance).toMatchObject({ publishedParts: 2, builds: 1 });
    const before = [await rows(kitModels), await rows(partDesigns), await rows(designRevisions)];
    const res = await request(t.app).delete(`/api/kits/${kit.id}`).set(auth(tok.supplier));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/2 part designs with published revisions, 1 shipped build, 2 load studies/);
    expect([await rows(kitModels), await rows(partDesigns), await rows(designRevisions)]).toEqual(before);
  });

  it('asks why the numbers of a relied-on kit change, then keeps the old and new values in its history', async () => {
    const kit = await demoKit();
    const full = (await request(t.app).get(`/api/kits/${kit.id}`).set(auth(tok.supplier))).body;
    const body = {
      code: full.code,
      name: full.name,
      weightLb: 1350,
      wingAreaSqFt: full.wingAreaSqFt,
      meanChordIn: full.meanChordIn,
      stallSpeedKeas: full.stallSpeedKeas,
      cruiseSpeedKeas: full.cruiseSpeedKeas,
      category: full.category,
      airfoil: full.airfoil,
    };
    const bare = await request(t.app).patch(`/api/kits/${kit.id}`).set(auth(tok.supplier)).send(body);
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields.reason).toBeDefined();
    expect((await t.database.db.select().from(kitModels).where(eq(kitModels.id, kit.id)))[0].weightLb).toBe(1320);
    expect(await rows(kitModelChanges)).toBe(0);

    const res = await request(t.app)
      .patch(`/api/kits/${kit.id}`)
      .set(auth(tok.supplier))
      .send({ ...body, reason: 'Heavier engine option' });
    expect(res.status).toBe(200);
    expect(res.body.weightLb).toBe(1350);
    expect(res.body.changes).toHaveLength(1);
    expect(res.body.changes[0]).toMatchObject({
      reason: 'Heavier engine option',
      before: { weightLb: 1320 },
      after: { weightLb: 1350 },
      changedByName: 'Maren Holt',
    });
    // Only what changed is recorded.
    expect(Object.keys(res.body.changes[0].before)).toEqual(['weightLb']);
    // A name needs no reason: nothing was computed from it.
    const renamed = await request(t.app)
      .patch(`/api/kits/${kit.id}`)
      .set(auth(tok.supplier))
      .send({ ...body, name: 'NK-2 Quillon trainer' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.changes[0]).toMatchObject({
      before: { name: full.name },
      after: { name: 'NK-2 Quillon trainer' },
    });
  });

  it('edits and deletes a kit nothing relies on, its draft-only part going with it', async () => {
    const made = await request(t.app).post('/api/kits').set(auth(tok.supplier)).send(kitBody());
    expect(made.status).toBe(201);
    const design = await postRib(made.body.id, 'T-1', 'Test rib');
    expect(design.status).toBe(201);
    const edited = await request(t.app)
      .patch(`/api/kits/${made.body.id}`)
      .set(auth(tok.supplier))
      .send(kitBody({ code: 'TMP-2', weightLb: 1250 }));
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ code: 'TMP-2', weightLb: 1250, allowedActions: ['edit', 'delete'] });
    expect(edited.body.changes[0].before).toEqual({ code: 'TMP-1', weightLb: 1200 });
    // Another kit's code is refused.
    expect(
      (
        await request(t.app)
          .patch(`/api/kits/${made.body.id}`)
          .set(auth(tok.supplier))
          .send(kitBody({ code: 'NK-2' }))
      ).status,
    ).toBe(409);

    const del = await request(t.app).delete(`/api/kits/${made.body.id}`).set(auth(tok.supplier));
    expect(del.status).toBe(204);
    expect(await rows(kitModels, eq(kitModels.id, made.body.id))).toBe(0);
    expect(await rows(partDesigns, eq(partDesigns.id, design.body.id))).toBe(0);
    expect(await rows(designRevisions, eq(designRevisions.partDesignId, design.body.id))).toBe(0);
    expect(await rows(kitModelChanges, eq(kitModelChanges.kitModelId, made.body.id))).toBe(0);
  });

  it('hides a kit from another supplier (404) and refuses other roles (403), changing nothing', async () => {
    const kit = await demoKit();
    const before = JSON.stringify(await t.database.db.select().from(kitModels).where(eq(kitModels.id, kit.id)));
    expect((await request(t.app).get(`/api/kits/${kit.id}`).set(auth(other.supplier))).status).toBe(404);
    expect(
      (
        await request(t.app)
          .patch(`/api/kits/${kit.id}`)
          .set(auth(other.supplier))
          .send(kitBody({ reason: 'mine now' }))
      ).status,
    ).toBe(404);
    expect((await request(t.app).delete(`/api/kits/${kit.id}`).set(auth(other.supplier))).status).toBe(404);
    for (const who of [tok.builder, tok.inspector]) {
      expect(
        (
          await request(t.app)
            .patch(`/api/kits/${kit.id}`)
            .set(auth(who))
            .send(kitBody({ reason: 'x y z' }))
        ).status,
      ).toBe(403);
      expect((await request(t.app).delete(`/api/kits/${kit.id}`).set(auth(who))).status).toBe(403);
    }
    expect(JSON.stringify(await t.database.db.select().from(kitModels).where(eq(kitModels.id, kit.id)))).toBe(before);
  });
});

describe('coupon tests: corrected by a new entry, deleted only when no published schedule may rest on them', () => {
  const list = async () =>
    (await request(t.app).get('/api/coupons').set(auth(tok.supplier))).body.items as CouponTest[];
  type Recorded = Pick<CouponTest, 'material' | 'gaugeIn' | 'rivetSpec' | 'outcome' | 'testedOn'>;
  /** A test recorded as `c` was, 1 in wide, but for `over` (a correction adds its reason). */
  const recordedAs = (c: Recorded, over: Record<string, unknown>) => ({
    material: c.material,
    gaugeIn: c.gaugeIn,
    couponWidthIn: 1,
    rivetSpec: c.rivetSpec,
    outcome: c.outcome,
    testedOn: c.testedOn,
    ...over,
  });
  /** A new test, 1 in wide, recorded by the supplier. */
  const record = (test: Omit<Recorded, 'outcome'> & { loadLb: number; outcome: string }) =>
    request(t.app)
      .post('/api/coupons')
      .set(auth(tok.supplier))
      .send({ couponWidthIn: 1, ...test });
  /** The supplier corrects test `c` with a new entry, `body`. */
  const correct = (c: { id: string }, body: object) =>
    request(t.app).post(`/api/coupons/${c.id}/corrections`).set(auth(tok.supplier)).send(body);

  it('corrects a test with a new entry: the old one kept as recorded and marked, the engine reading only the new one', async () => {
    const old = (await list()).find((c) => c.gaugeIn === 0.02 && c.loadLb === 30)!;
    expect(old.allowedActions).toEqual(['correct', 'delete']);
    const before = await rows(couponTests);
    const res = await correct(
      old,
      recordedAs(old, {
        couponWidthIn: old.couponWidthIn,
        loadLb: 25,
        note: old.note,
        reason: 'Load cell read 30 lb with the tare left on: 25 lb applied',
      }),
    );
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ loadLb: 25, correctionReason: expect.stringMatching(/tare/), correctedBy: null });
    expect(await rows(couponTests)).toBe(before + 1);
    const kept = (await list()).find((c) => c.id === old.id)!;
    expect(kept).toMatchObject({
      loadLb: 30,
      allowedActions: [],
      correctedBy: { id: res.body.id, byName: 'Maren Holt', reason: expect.stringMatching(/tare/) },
    });

    // The engine and the allowables read the current entries only.
    const engine = await couponsForEngine(t.database.db, supplierOrg, '6061-T6');
    expect(engine).toHaveLength(DEMO_COUPONS.length);
    expect(
      engine
        .filter((c) => c.gaugeIn === 0.02)
        .map((c) => c.loadLb)
        .sort((a, b) => a - b),
    ).toEqual([13.5, 20, 25]);
    // Ultimate: the highest load carried without failure, slight deformation allowed (ENGINEERING.md step 6,
    // 14 CFR 23.305): 25 lb now; 30 lb had the corrected entry still counted.
    const groups = (await request(t.app).get('/api/coupons/allowables').set(auth(tok.supplier))).body as {
      gaugeIn: number;
      ultimateLb: number;
      limitLb: number;
      tests: unknown[];
    }[];
    const g = groups.find((x) => x.gaugeIn === 0.02)!;
    expect([g.limitLb, g.ultimateLb, g.tests.length]).toEqual([13.5, 25, 3]);

    // A corrected entry is not corrected (or deleted) again: the current one is.
    const again = await correct(old, recordedAs(old, { loadLb: 26, reason: 'again' }));
    expect(again.status).toBe(409);
    expect((await request(t.app).delete(`/api/coupons/${old.id}`).set(auth(tok.supplier))).status).toBe(409);
    expect(await rows(couponTests)).toBe(before + 1);
  });

  it('asks why a test is corrected', async () => {
    const c = (await list()).find((x) => x.correctedBy === null)!;
    const res = await correct(c, recordedAs(c, { loadLb: 5 }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.reason).toBeDefined();
  });

  it('refuses to delete a test a published study-made revision may rest on, naming it; deletes one recorded after', async () => {
    // The demo rib study's PULLED-4 candidate, applied to a new part and published.
    const ribStudy = await supplierItem<{ id: string; kind: string }>('/api/studies', (s) => s.kind === 'rib');
    const study = await supplierGet(`/api/studies/${ribStudy.id}`);
    const candidate = study.result.candidates.find(
      (c: { rivet: string; feasible: boolean }) => c.rivet === 'PULLED-4' && c.feasible,
    );
    const kit = await demoKit();
    const design = (await postRib(kit.id, 'W-190', 'Coupon-backed rib')).body;
    // A test of the candidate's own rivet and gauge, on record before the revision is published.
    const pulled4 = { material: '6061-T6', gaugeIn: candidate.gaugeIn, rivetSpec: 'PULLED-4' };
    const backing = await record({ ...pulled4, loadLb: 12, outcome: 'no_deformation', testedOn: '2026-10-15' });
    expect(backing.body.allowedActions).toEqual(['correct', 'delete']);
    const applied = await request(t.app)
      .post(`/api/studies/${study.id}/apply`)
      .set(auth(tok.supplier))
      .send({ partDesignId: design.id, gaugeIn: candidate.gaugeIn, rivet: 'PULLED-4' });
    expect(applied.status).toBe(200);
    expect(
      (await request(t.app).post(`/api/revisions/${applied.body.id}/publish`).set(auth(tok.supplier)).send({})).status,
    ).toBe(200);
    const later = await record({ ...pulled4, loadLb: 14, outcome: 'slight_deformation', testedOn: '2026-10-16' });

    const now = await list();
    const b = now.find((c) => c.id === backing.body.id)!;
    expect(b.backs).toContain('W-190 revision A');
    expect(b.allowedActions).toEqual(['correct']);
    const before = await rows(couponTests);
    const refused = await request(t.app).delete(`/api/coupons/${b.id}`).set(auth(tok.supplier));
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/W-190 revision A/);
    expect(await rows(couponTests)).toBe(before);

    // Corrected, the record still backs it: the correction cannot be deleted either.
    const corrected = await request(t.app).post(`/api/coupons/${b.id}/corrections`).set(auth(tok.supplier)).send({
      material: b.material,
      gaugeIn: b.gaugeIn,
      couponWidthIn: 1,
      rivetSpec: 'PULLED-4',
      loadLb: 11,
      outcome: 'no_deformation',
      testedOn: b.testedOn,
      reason: 'misread dial',
    });
    expect(corrected.status).toBe(201);
    expect(corrected.body.backs).toContain('W-190 revision A');
    expect((await request(t.app).delete(`/api/coupons/${corrected.body.id}`).set(auth(tok.supplier))).status).toBe(409);

    // Recorded after publishing, the other test backs nothing and goes.
    expect(now.find((c) => c.id === later.body.id)!.allowedActions).toEqual(['correct', 'delete']);
    expect((await request(t.app).delete(`/api/coupons/${later.body.id}`).set(auth(tok.supplier))).status).toBe(204);
    expect(await rows(couponTests, eq(couponTests.id, later.body.id))).toBe(0);
  });

  it('deletes a corrected test whole: the current entry and the entries it corrected', async () => {
    const made = (
      await record({
        material: '2024-T3',
        gaugeIn: 0.032,
        rivetSpec: 'MS20470AD3',
        loadLb: 40,
        outcome: 'no_deformation',
        testedOn: '2026-10-15',
      })
    ).body;
    const fixed = (await correct(made, recordedAs(made, { loadLb: 45, reason: 'typo' }))).body;
    const before = await rows(couponTests);
    expect((await request(t.app).delete(`/api/coupons/${fixed.id}`).set(auth(tok.supplier))).status).toBe(204);
    expect(await rows(couponTests)).toBe(before - 2);
  });

  it('hides a test from another supplier (404) and refuses other roles (403), changing nothing', async () => {
    const c = (await list()).find((x) => x.correctedBy === null && x.allowedActions.includes('delete'))!;
    const body = recordedAs(c, { loadLb: 5, reason: 'not mine' });
    const before = [await rows(couponTests), await rows(couponTests, isNull(couponTests.supersededById))];
    expect(
      (await request(t.app).post(`/api/coupons/${c.id}/corrections`).set(auth(other.supplier)).send(body)).status,
    ).toBe(404);
    expect((await request(t.app).delete(`/api/coupons/${c.id}`).set(auth(other.supplier))).status).toBe(404);
    for (const who of [tok.builder, tok.inspector]) {
      expect((await request(t.app).post(`/api/coupons/${c.id}/corrections`).set(auth(who)).send(body)).status).toBe(
        403,
      );
      expect((await request(t.app).delete(`/api/coupons/${c.id}`).set(auth(who))).status).toBe(403);
    }
    expect([await rows(couponTests), await rows(couponTests, isNull(couponTests.supersededById))]).toEqual(before);
  });
});

describe('builds: the shipping supplier corrects the note always, the serial and the build itself while no work is recorded', () => {
  const ship = async (kitSerial: string) => {
    const kit = await demoKit();
    const res = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
      kitModelId: kit.id,
      kitSerial,
      builderEmail: 'tobias@benchwork.example',
      inspectorEmail: 'priya@checkpoint.example',
    });
    expect(res.status).toBe(201);
    return res.body.id as string;
  };

  it('renames a fresh build’s serial (its travelers’ too), keeps the change as an event, and deletes it whole', async () => {
    const id = await ship('NK2-0200');
    const page = (await request(t.app).get(`/api/builds/${id}`).set(auth(tok.supplier))).body;
    expect(page.allowedActions).toEqual(['edit-note', 'change-serial', 'delete']);
    const res = await request(t.app)
      .patch(`/api/builds/${id}`)
      .set(auth(tok.supplier))
      .send({ kitSerial: 'NK2-0201', note: 'Wing kit only; fuselage follows' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ kitSerial: 'NK2-0201', note: 'Wing kit only; fuselage follows' });
    const serials = (
      await t.database.db.select({ serial: travelers.serial }).from(travelers).where(eq(travelers.buildId, id))
    ).map((r) => r.serial);
    expect(serials.length).toBeGreaterThan(0);
    expect(serials.every((s) => s.startsWith('NK2-0201-'))).toBe(true);
    const events = await t.database.db.select().from(buildEvents).where(eq(buildEvents.buildId, id));
    expect(events.find((e) => e.kind === 'serial_changed')?.detail).toEqual({ from: 'NK2-0200', to: 'NK2-0201' });
    expect(events.find((e) => e.kind === 'note_changed')?.detail).toEqual({
      from: '',
      to: 'Wing kit only; fuselage follows',
    });
    // The builder sees nothing to change.
    expect((await request(t.app).get(`/api/builds/${id}`).set(auth(tok.builder))).body.allowedActions).toEqual([]);

    expect((await request(t.app).delete(`/api/builds/${id}`).set(auth(tok.supplier))).status).toBe(204);
    expect(await rows(builds, eq(builds.id, id))).toBe(0);
    expect(await rows(travelers, eq(travelers.buildId, id))).toBe(0);
  });

  it('refuses to rename or delete the demo build, where work is recorded, but takes a new note', async () => {
    const [demo] = (await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items.filter(
      (b: { kitSerial: string }) => b.kitSerial === 'NK2-0147',
    );
    const page = (await request(t.app).get(`/api/builds/${demo.id}`).set(auth(tok.supplier))).body;
    expect(page.allowedActions).toEqual(['edit-note']);
    // The demo (server/dev/seed.ts): U-01…U-08 ticked, U-09 flagged, the first step done, one finding.
    expect(page.fixedBecause).toMatch(/9 holes worked, 1 step done, 1 finding/);
    const before = [await rows(builds), await rows(travelers)];
    const renamed = await request(t.app)
      .patch(`/api/builds/${demo.id}`)
      .set(auth(tok.supplier))
      .send({ kitSerial: 'NK2-9999' });
    expect(renamed.status).toBe(409);
    expect(renamed.body.error.message).toMatch(/work is recorded on this build/);
    const deleted = await request(t.app).delete(`/api/builds/${demo.id}`).set(auth(tok.supplier));
    expect(deleted.status).toBe(409);
    expect([await rows(builds), await rows(travelers)]).toEqual(before);
    expect((await t.database.db.select().from(builds).where(eq(builds.id, demo.id)))[0].kitSerial).toBe('NK2-0147');
    // The serial as it stands, sent back by a form with a new note, is not a change of serial.
    const noted = await request(t.app)
      .patch(`/api/builds/${demo.id}`)
      .set(auth(tok.supplier))
      .send({ kitSerial: 'NK2-0147', note: 'Tail kit shipped 3 Nov' });
    expect(noted.status).toBe(200);
    expect(noted.body.note).toBe('Tail kit shipped 3 Nov');
  });

  it('hides a build from another supplier (404), refuses its builder and inspector (403), and changes nothing', async () => {
    const id = await ship('NK2-0300');
    const before = JSON.stringify(await t.database.db.select().from(builds).where(eq(builds.id, id)));
    expect((await request(t.app).patch(`/api/builds/${id}`).set(auth(other.supplier)).send({ note: 'x' })).status).toBe(
      404,
    );
    expect((await request(t.app).delete(`/api/builds/${id}`).set(auth(other.supplier))).status).toBe(404);
    for (const who of [tok.builder, tok.inspector]) {
      expect((await request(t.app).patch(`/api/builds/${id}`).set(auth(who)).send({ note: 'x' })).status).toBe(403);
      expect((await request(t.app).delete(`/api/builds/${id}`).set(auth(who))).status).toBe(403);
    }
    expect(JSON.stringify(await t.database.db.select().from(builds).where(eq(builds.id, id)))).toBe(before);
    expect(await rows(travelers, eq(travelers.buildId, id))).toBeGreaterThan(0);
  });
});

describe('draft revisions: discarded, never once published', () => {
  it('discards a draft after published revisions: the part keeps them', async () => {
    const w105 = await designOf('W-105');
    const draft = await request(t.app)
      .post(`/api/designs/${w105.id}/revisions`)
      .set(auth(tok.supplier))
      .send({ ...ribRevision(), changeNote: 'Try a wider pitch' });
    expect(draft.status).toBe(201);
    expect(draft.body.allowedActions).toEqual(['edit', 'publish', 'discard']);
    const res = await request(t.app).delete(`/api/revisions/${draft.body.id}`).set(auth(tok.supplier));
    expect(res.status).toBe(200);
    expect(
      res.body.revisions.map((r: { letter: string; status: string; allowedActions: string[] }) => [
        r.letter,
        r.status,
        r.allowedActions,
      ]),
    ).toEqual([
      ['B', 'published', []],
      ['A', 'superseded', []],
    ]);
  });

  it('discards the only revision of a part: the draft goes, the part stays, and a new revision starts again at A', async () => {
    const kit = await demoKit();
    const made = (await postRib(kit.id, 'W-191', 'Draft-only rib')).body;
    const res = await request(t.app).delete(`/api/revisions/${made.revisions[0].id}`).set(auth(tok.supplier));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ partNumber: 'W-191', revisions: [], publishedLetter: null });
    expect(await rows(partDesigns, eq(partDesigns.id, made.id))).toBe(1);
    const next = await request(t.app)
      .post(`/api/designs/${made.id}/revisions`)
      .set(auth(tok.supplier))
      .send({ ...ribRevision(), changeNote: 'Start over' });
    expect(next.body.letter).toBe('A');
  });

  it('refuses to discard or edit a published revision, to another supplier (404) and to other roles (403)', async () => {
    const w104 = await supplierGet(`/api/designs/${(await designOf('W-104')).id}`);
    const published = w104.revisions.find((r: { status: string }) => r.status === 'published');
    const before = await rows(designRevisions);
    const res = await request(t.app).delete(`/api/revisions/${published.id}`).set(auth(tok.supplier));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/published and can no longer be changed/);
    expect(
      (await request(t.app).patch(`/api/revisions/${published.id}`).set(auth(tok.supplier)).send(ribRevision())).status,
    ).toBe(409);
    expect(
      (await request(t.app).post(`/api/revisions/${published.id}/publish`).set(auth(tok.supplier)).send({})).status,
    ).toBe(409);

    const draft = (
      await request(t.app)
        .post(`/api/designs/${(await designOf('W-105')).id}/revisions`)
        .set(auth(tok.supplier))
        .send({ ...ribRevision(), changeNote: 'Another try' })
    ).body;
    const withDraft = await rows(designRevisions);
    expect(withDraft).toBe(before + 1);
    expect((await request(t.app).delete(`/api/revisions/${draft.id}`).set(auth(other.supplier))).status).toBe(404);
    for (const who of [tok.builder, tok.inspector])
      expect((await request(t.app).delete(`/api/revisions/${draft.id}`).set(auth(who))).status).toBe(403);
    expect(await rows(designRevisions)).toBe(withDraft);
    expect(await rows(designRevisions, eq(designRevisions.id, published.id))).toBe(1);
  });
});
