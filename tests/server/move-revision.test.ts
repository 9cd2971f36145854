/**
 * Moving a part to the newest published revision of its design: only while no work is recorded on it,
 * only by its builders or the supplier who shipped it, with its holes and steps made again exactly as a
 * new part's, and a line in the log. A started part keeps its revision (the supplier's notice carries
 * the change to it).
 */
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { travelerEvents } from '@/db/schema';
import { checkRevisionMove, type PartRecord } from '@/db/contracts';
import { ribRevision, flangeLine } from '../fixtures/rib-revision';
import { publishSmallKit, shipBuild } from '../helpers/small-kit';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let kitId: string;
let designId: string;
let n = 0;

/**
 * The move kit's rib: one 6 in upper flange at 1 in pitch and two steps. Seven holes: from 0.25 in (the
 * edge distance) every inch to 5.25 in, and the last 0.25 in from the end.
 */
const moveRib = { ...ribRevision, chordIn: 10, lines: [flangeLine('U', 6, [{ fromIn: 0, toIn: 6, pitchIn: 1 }])] };
/** Its next revision: the same flange 2 in longer (nine holes the same way) and three steps. */
const longerFlange = {
  ...moveRib,
  lines: [flangeLine('U', 8, [{ fromIn: 0, toIn: 8, pitchIn: 1 }])],
  steps: ['Deburr', 'Cleco', 'Rivet'],
  changeNote: 'Flange 2 in longer to reach the new stiffener',
};

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  kitId = await publishSmallKit(t, tok.supplier, {
    code: 'MV-1',
    name: 'Move kit',
    partNumber: 'MV-R1',
    partName: 'Move rib',
    revision: moveRib,
  });
  const designs = await request(t.app).get(`/api/designs?kitModelId=${kitId}`).set(auth(tok.supplier));
  designId = designs.body.items[0].id;
});

const move = (id: string, token: string, body?: object) => {
  const req = request(t.app).post(`/api/travelers/${id}/revision`).set(auth(token));
  return body ? req.send(body) : req;
};
const part = async (id: string, token = tok.builder) =>
  (await request(t.app).get(`/api/travelers/${id}`).set(auth(token))).body;

/** The supplier publishes a new revision of the move rib: every part shipped before is then on an older one. */
async function supersede(revision: object = { ...moveRib, changeNote: 'Same rib, drawing redrawn' }) {
  const made = await request(t.app).post(`/api/designs/${designId}/revisions`).set(auth(tok.supplier)).send(revision);
  expect(made.status).toBe(201);
  const published = await request(t.app)
    .post(`/api/revisions/${made.body.id}/publish`)
    .set(auth(tok.supplier))
    .send({});
  expect(published.status).toBe(200);
  return made.body.letter as string;
}

/** A fresh part of a build of its own, on a revision that has since been superseded. */
async function oldPart(revision?: object) {
  const { travelerId } = await shipBuild(t, tok.supplier, kitId, `MV-${++n}`);
  const newer = await supersede(revision);
  return { id: travelerId, newer };
}

const revisionEvents = (id: string) =>
  t.database.db
    .select()
    .from(travelerEvents)
    .where(and(eq(travelerEvents.travelerId, id), eq(travelerEvents.kind, 'revision_changed')));

const placed = (holes: { holeId: string; line: string; seq: number; stationIn: number }[]) =>
  holes.map(({ holeId, line, seq, stationIn }) => ({ holeId, line, seq, stationIn }));

describe('moving an unstarted part to the newest revision', () => {
  it("moves the demo's outboard rib from A to B, its holes made from B's lines, and logs it", async () => {
    const { outerId } = await demoRibs(t, tok.builder);
    const before = await part(outerId);
    expect(before).toMatchObject({ letter: 'A', newerRevision: 'B', revisionMove: { allowed: true, started: false } });

    const doneAt = new Date(Date.now() - 60_000).toISOString();
    const res = await move(outerId, tok.builder, { doneAt, sentAt: new Date().toISOString() });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      id: outerId,
      letter: 'B',
      newerRevision: null,
      revisionMove: null,
      gaugeIn: 0.025,
    });
    // B keeps A's line codes (a new revision keeps its lines' codes), so the holes keep their ids.
    expect(new Set(res.body.holes.map((h: { line: string }) => h.line))).toEqual(
      new Set(res.body.lines.map((l: { code: string }) => l.code)),
    );
    expect(res.body.holes.map((h: { holeId: string }) => h.holeId)).toEqual(
      before.holes.map((h: { holeId: string }) => h.holeId),
    );
    expect(res.body.holes.every((h: { status: string }) => h.status === 'pending')).toBe(true);
    expect(res.body.steps.every((s: { doneAt: string | null }) => s.doneAt === null)).toBe(true);
    expect(await part(outerId)).toMatchObject({ letter: 'B', holesTotal: before.holesTotal });

    const [event, ...more] = await revisionEvents(outerId);
    expect(more).toHaveLength(0);
    expect(event.detail).toEqual({ fromLetter: 'A', toLetter: 'B', holes: before.holesTotal });
    expect(event.doneAt.toISOString()).toBe(doneAt);
  });

  it('makes the holes and steps again exactly as a new part of the new revision has them', async () => {
    const { id, newer } = await oldPart(longerFlange);
    const before = await part(id);
    expect(before.holesTotal).toBe(7);
    const res = await move(id, tok.builder);
    expect(res.status).toBe(200);
    expect(res.body.letter).toBe(newer);

    const fresh = await part((await shipBuild(t, tok.supplier, kitId, `MV-${++n}`)).travelerId);
    expect(fresh.letter).toBe(newer);
    expect(placed(res.body.holes)).toEqual(placed(fresh.holes));
    expect(res.body.holes).toHaveLength(9);
    expect(res.body.steps.map((s: { seq: number; text: string }) => [s.seq, s.text])).toEqual(
      fresh.steps.map((s: { seq: number; text: string }) => [s.seq, s.text]),
    );
    const [event] = await revisionEvents(id);
    expect(event.detail).toEqual({ fromLetter: before.letter, toLetter: newer, holes: 9 });
  });

  it('lets the supplier who shipped the build move it too (design authority)', async () => {
    const { id, newer } = await oldPart();
    const res = await move(id, tok.supplier);
    expect(res.status).toBe(200);
    expect(res.body.letter).toBe(newer);
  });
});

describe('refusals', () => {
  it('refuses a started part: it says what is recorded, and the part stays as it was', async () => {
    const { id } = await oldPart();
    const ticked = await request(t.app)
      .post(`/api/travelers/${id}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['U-01'], status: 'installed' });
    expect(ticked.status).toBe(200);
    const before = await part(id);
    expect(before.revisionMove).toEqual({ allowed: false, started: true });

    const res = await move(id, tok.builder);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/1 hole worked/);
    expect(res.body.error.message).toMatch(/started part follows the supplier's notice/);
    const after = await part(id);
    expect(after.letter).toBe(before.letter);
    expect(after.holes.find((h: { holeId: string }) => h.holeId === 'U-01').status).toBe('installed');
    expect(await revisionEvents(id)).toHaveLength(0);
  });

  it('counts hours entered and a step done as work recorded, on the page and in the refusal', async () => {
    const { id } = await oldPart();
    const hours = await request(t.app)
      .post(`/api/travelers/${id}/work/hours`)
      .set(auth(tok.builder))
      .send({ startedAt: new Date(Date.now() - 3 * 3_600_000).toISOString(), hours: 1 });
    expect(hours.status).toBe(200);
    const step = await request(t.app)
      .post(`/api/travelers/${id}/steps/${hours.body.steps[0].id}`)
      .set(auth(tok.builder))
      .send({ done: true });
    expect(step.status).toBe(200);
    expect(step.body.revisionMove).toEqual({ allowed: false, started: true });
    const res = await move(id, tok.supplier);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/\(1 step done, 1 work session\)/);
  });

  it('refuses an inspector of the build and an admin (no place to move it), and hides it from a builder of another build', async () => {
    const { id } = await oldPart();
    const before = await part(id, tok.inspector);
    expect(before.revisionMove).toEqual({ allowed: false, started: false });
    for (const token of [tok.inspector, tok.admin]) {
      const res = await move(id, token);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/only a builder of this build/);
    }
    expect((await move(id, outsiders.builder)).status).toBe(404);
    expect((await part(id)).letter).toBe(before.letter);
    expect(await revisionEvents(id)).toHaveLength(0);
  });

  it('refuses a part already on the newest revision', async () => {
    const { travelerId } = await shipBuild(t, tok.supplier, kitId, `MV-${++n}`);
    const { letter } = await part(travelerId);
    expect((await part(travelerId)).revisionMove).toBeNull();
    const res = await move(travelerId, tok.builder);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`this part already follows the newest revision ${letter}`);
  });

  it('refuses a device time that is not one', async () => {
    const { id } = await oldPart();
    const res = await move(id, tok.builder, { doneAt: 'yesterday' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('doneAt');
  });
});

describe('two moves of one part at once', () => {
  it('lands one: the other finds the part already on the newest revision', async () => {
    const { id, newer } = await oldPart(longerFlange);
    const answers = await Promise.all([move(id, tok.builder), move(id, tok.supplier)]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    expect(answers.find((a) => a.status === 409)!.body.error.message).toBe(
      `this part already follows the newest revision ${newer}`,
    );
    const after = await part(id);
    expect(after.letter).toBe(newer);
    expect(after.holes).toHaveLength(9);
    expect(after.steps).toHaveLength(3);
    expect(await revisionEvents(id)).toHaveLength(1);
  });
});

describe('the rule (db/contracts/travelers.ts checkRevisionMove)', () => {
  const unstarted: PartRecord = {
    holes: { pending: 7 },
    steps: [{ done: false, stamped: false }],
    findings: 0,
    workSessions: 0,
    workPhotos: 0,
    signedOff: false,
    replaced: false,
  };
  const revisions = { letter: 'A', newerLetter: 'B' };

  it('lets a builder and the design authority move an unstarted part, and no one else', () => {
    expect(checkRevisionMove('builder', unstarted, revisions)).toBeNull();
    expect(checkRevisionMove('design_authority', unstarted, revisions)).toBeNull();
    expect(checkRevisionMove('inspector', unstarted, revisions)?.code).toBe(403);
    expect(checkRevisionMove('none', unstarted, revisions)?.code).toBe(403);
  });

  it.each([
    ['a hole flagged', { holes: { pending: 6, flagged: 1 } }, '1 hole worked'],
    ['a step done', { steps: [{ done: true, stamped: false }] }, '1 step done'],
    ['a finding, even closed', { findings: 1 }, '1 finding'],
    ['a work session', { workSessions: 2 }, '2 work sessions'],
    ['a work photo', { workPhotos: 1 }, '1 work photo'],
    ['a sign-off', { signedOff: true }, 'its sign-off'],
    ['a replacement', { replaced: true }, 'its replacement'],
  ] as const)('refuses a part with %s, saying so', (_what, over, words) => {
    const refusal = checkRevisionMove('builder', { ...unstarted, ...over }, revisions);
    expect(refusal?.code).toBe(409);
    expect(refusal?.message).toContain(words);
  });
});
