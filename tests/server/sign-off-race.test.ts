import request from 'supertest';
import sharp from 'sharp';
import { smallKits } from '../fixtures/rib-revision';
import { publishSmallKit, shipBuild, workPart } from '../helpers/small-kit';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

jest.setTimeout(240000);

let t: TestApp;
let tok: Tokens;
let kitId: string;
let n = 0;
const ROUNDS = 20;

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  kitId = await publishSmallKit(t, tok.supplier, smallKits.race);
});

/** A fresh part with every hole installed and its step done: ready to sign off. */
async function readyPart() {
  const { travelerId: id } = await shipBuild(t, tok.supplier, kitId, `RC-${++n}`);
  return { id, ...(await workPart(t, tok.builder, id)) };
}

/** The invariant: a signed-off part has every hole done, every step done and no open finding. */
async function expectNeverSignedOffWithWorkOpen(id: string) {
  const d = (await request(t.app).get(`/api/travelers/${id}`).set(auth(tok.inspector))).body;
  if (!d.signedOff) return false;
  expect(d.holes.every((h: { status: string }) => h.status === 'installed' || h.status === 'accepted')).toBe(true);
  expect(d.steps.every((s: { doneAt: string | null }) => s.doneAt !== null)).toBe(true);
  expect(d.openFindings).toBe(0);
  return true;
}

const signOff = (id: string) => request(t.app).post(`/api/travelers/${id}/sign-off`).set(auth(tok.inspector));

describe(`a sign-off racing a change at the bench (${ROUNDS} rounds each)`, () => {
  it.each([
    [
      'un-ticking a hole',
      (p: { id: string }) =>
        request(t.app)
          .post(`/api/travelers/${p.id}/holes`)
          .set(auth(tok.builder))
          .send({ holeIds: ['U-02'], status: 'pending' }),
    ],
    [
      'undoing the step',
      (p: { id: string; stepId: string }) =>
        request(t.app).post(`/api/travelers/${p.id}/steps/${p.stepId}`).set(auth(tok.builder)).send({ done: false }),
    ],
    [
      'raising a finding',
      async (p: { id: string }) =>
        raiseFinding(t, tok.builder, {
          travelerId: p.id,
          holeIds: ['U-01'],
          kind: 'hole_cracked',
          note: 'crack at the edge',
        }).attach(
          'photos',
          await sharp({ create: { width: 16, height: 16, channels: 3, background: '#555' } })
            .jpeg()
            .toBuffer(),
          { filename: 'c.jpg', contentType: 'image/jpeg' },
        ),
    ],
  ] as const)('never ends signed off with work open when racing %s', async (_what, change) => {
    const outcomes = { signedOff: 0, changed: 0 };
    for (let i = 0; i < ROUNDS; i++) {
      const p = await readyPart();
      const [s, c] = await Promise.all([signOff(p.id), change(p)]);
      // Exactly one lands: the other is refused with a clear 409.
      const signed = s.status === 200;
      const changed = c.status === 200 || c.status === 201;
      expect(signed !== changed).toBe(true);
      if (signed) expect(c.status).toBe(409);
      else expect([s.status, s.body.error.message]).toEqual([409, expect.stringMatching(/not ready to sign off/)]);
      if (await expectNeverSignedOffWithWorkOpen(p.id)) outcomes.signedOff++;
      else outcomes.changed++;
    }
    expect(outcomes.signedOff + outcomes.changed).toBe(ROUNDS);
  });
});
