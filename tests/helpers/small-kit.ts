import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { smallKitModel } from '../fixtures/rib-revision';
import { auth, type TestApp } from './test-app';

/**
 * A small kit of a test's own, shipped and worked through the API as the supplier and the builder would:
 * for the tests that need fresh parts, one per build, rather than the demo's.
 */

/** Throws with what the server said when a set-up request was refused: the test then fails at its cause. */
function expectStatus(res: request.Response, status: number, what: string) {
  if (res.status !== status) throw new Error(`${what} failed: ${res.status} ${JSON.stringify(res.body)}`);
}

/**
 * Makes the supplier's small kit model `code` with one rib design, `partNumber`, of `revision`, and
 * publishes that revision: every build shipped of the kit then has one traveler. Returns the kit's id.
 */
export async function publishSmallKit(
  t: TestApp,
  supplier: string,
  kit: { code: string; name: string; partNumber: string; partName: string; revision: object },
): Promise<string> {
  const made = await request(t.app).post('/api/kits').set(auth(supplier)).send(smallKitModel(kit.code, kit.name));
  expectStatus(made, 201, `making kit ${kit.code}`);
  const design = await request(t.app)
    .post('/api/designs')
    .set(auth(supplier))
    .send({
      design: { kitModelId: made.body.id, partNumber: kit.partNumber, name: kit.partName, kind: 'rib' },
      revision: kit.revision,
    });
  expectStatus(design, 201, `making design ${kit.partNumber}`);
  const published = await request(t.app)
    .post(`/api/revisions/${design.body.revisions[0].id}/publish`)
    .set(auth(supplier))
    .send({});
  expectStatus(published, 200, `publishing ${kit.partNumber}`);
  return made.body.id as string;
}

/** Ships a build of the kit, serial `kitSerial`, to the demo builder and inspector: its id and its one traveler's. */
export async function shipBuild(
  t: TestApp,
  supplier: string,
  kitModelId: string,
  kitSerial: string,
): Promise<{ buildId: string; travelerId: string }> {
  const res = await request(t.app).post('/api/builds').set(auth(supplier)).send({
    kitModelId,
    kitSerial,
    builderEmail: DEMO_USERS.builder.email,
    inspectorEmail: DEMO_USERS.inspector.email,
  });
  expectStatus(res, 201, `shipping ${kitSerial}`);
  const detail = await request(t.app).get(`/api/builds/${res.body.id}`).set(auth(supplier));
  return { buildId: res.body.id as string, travelerId: detail.body.travelers[0].id as string };
}

/** The builder installs every hole of the part but `except` and does its first step; returns that step's id. */
export async function workPart(t: TestApp, builder: string, travelerId: string, except: string[] = []) {
  const d = (await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(builder))).body;
  const holeIds = d.holes.map((h: { holeId: string }) => h.holeId).filter((h: string) => !except.includes(h));
  expectStatus(
    await request(t.app)
      .post(`/api/travelers/${travelerId}/holes`)
      .set(auth(builder))
      .send({ holeIds, status: 'installed' }),
    200,
    'installing the holes',
  );
  expectStatus(
    await request(t.app)
      .post(`/api/travelers/${travelerId}/steps/${d.steps[0].id}`)
      .set(auth(builder))
      .send({ done: true }),
    200,
    'doing the step',
  );
  return { stepId: d.steps[0].id as string };
}
