/**
 * The running product's demo (server/index.ts seeds it with `notice`): beside the loop the tests share,
 * the supplier has issued a notice on the inboard rib, which the builder finds on the part, answers, and
 * sees in the build's log; a database that already has people gets nothing.
 */
import request from 'supertest';
import { DEMO_NOTICE, DEMO_USERS, seedDemo } from '@/server/dev/seed';
import { auth, demoRibs, startTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(90000);

let t: TestApp;
let builder: string;

beforeAll(async () => {
  t = await startTestApp({ seed: false });
  await expect(seedDemo(t.database, t.ctx.storage, t.mailQueue, t.config.jwtSecret, { notice: true })).resolves.toBe(
    true,
  );
  builder = await t.signIn(DEMO_USERS.builder.email);
}, 90_000);
afterAll(() => t.close());

describe("the running demo's notice", () => {
  it('reaches the inboard rib of the demo build and no other part', async () => {
    const { innerId, outerId, buildId } = await demoRibs(t, builder);
    const on = (travelerId: string) =>
      request(t.app).get('/api/notices').query({ travelerId }).set(auth(builder)).expect(200);
    const innerNotices = (await on(innerId)).body.items as { id: string; title: string; level: string }[];
    expect(innerNotices.map((n) => [n.title, n.level])).toEqual([[DEMO_NOTICE.title, DEMO_NOTICE.level]]);
    expect((await on(outerId)).body.items).toEqual([]);

    // The builder answers it, and both the notice and the answer are in the build's log.
    await request(t.app)
      .post(`/api/notices/${innerNotices[0].id}/builds/${buildId}/acknowledge`)
      .set(auth(builder))
      .send({})
      .expect(200);
    const log = (await request(t.app).get(`/api/builds/${buildId}/log`).set(auth(builder)).expect(200)).body.items as {
      kind: string;
    }[];
    expect(log.map((e) => e.kind)).toEqual(expect.arrayContaining(['notice_received', 'notice_acknowledged']));
  });

  it('is not issued again by a second start', async () => {
    await expect(seedDemo(t.database, t.ctx.storage, t.mailQueue, t.config.jwtSecret, { notice: true })).resolves.toBe(
      false,
    );
    const { innerId } = await demoRibs(t, builder);
    const notices = (await request(t.app).get('/api/notices').query({ travelerId: innerId }).set(auth(builder))).body
      .items as unknown[];
    expect(notices).toHaveLength(1);
  });
});
