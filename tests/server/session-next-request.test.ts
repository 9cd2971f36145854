import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { Page, TravelerSummary } from '@/db/contracts';
import { auth, demoApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let admin: string;
let partId: string;
let hole: string;
let builder: string;

demoApp(
  (s) =>
    ({
      t,
      tok: { admin, builder },
    } = s),
);
beforeAll(async () => {
  const parts = (await request(t.app).get('/api/travelers?q=W-104').set(auth(builder))).body as Page<TravelerSummary>;
  partId = parts.items[0].id;
  hole = (await request(t.app).get(`/api/travelers/${partId}`).set(auth(builder))).body.holes.find(
    (h: { status: string }) => h.status === 'pending',
  ).holeId;
});

/**
 * The part's page and the tick load the person once per request, from the database: whatever ended a
 * sign-in (deactivation, "sign out everywhere", a new role) is refused on the very next request, even
 * right after a request that was served (common practice for revocable sessions: no grace period).
 */
describe('a sign-in ended is refused on the very next request', () => {
  const detail = (token: string) => request(t.app).get(`/api/travelers/${partId}`).set(auth(token));
  const tick = (token: string, status: 'installed' | 'pending') =>
    request(t.app)
      .post(`/api/travelers/${partId}/holes`)
      .set(auth(token))
      .send({ holeIds: [hole], status });

  it('after deactivation', async () => {
    const token = await t.signIn(DEMO_USERS.builder.email);
    const me = (await request(t.app).get('/api/auth/me').set(auth(token))).body;
    expect((await detail(token)).status).toBe(200);
    expect((await tick(token, 'installed')).status).toBe(200);
    expect((await request(t.app).patch(`/api/people/${me.id}`).set(auth(admin)).send({ active: false })).status).toBe(
      200,
    );
    expect((await detail(token)).status).toBe(401);
    expect((await tick(token, 'pending')).status).toBe(401);
    expect((await request(t.app).get('/api/travelers').set(auth(token))).status).toBe(401);
    await request(t.app).patch(`/api/people/${me.id}`).set(auth(admin)).send({ active: true });
    // The old token stays ended after reactivation: its session version is gone.
    expect((await detail(token)).status).toBe(401);
  });

  it('after "sign out everywhere"', async () => {
    const token = await t.signIn(DEMO_USERS.builder.email);
    const other = await t.signIn(DEMO_USERS.builder.email);
    expect((await detail(token)).status).toBe(200);
    expect((await tick(other, 'pending')).status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-out-everywhere').set(auth(token))).status).toBe(204);
    expect((await tick(other, 'installed')).status).toBe(401);
    expect((await detail(token)).status).toBe(401);
  });

  it('after a change of role', async () => {
    const token = await t.signIn(DEMO_USERS.inspector.email);
    const me = (await request(t.app).get('/api/auth/me').set(auth(token))).body;
    expect((await detail(token)).status).toBe(200);
    expect((await request(t.app).patch(`/api/people/${me.id}`).set(auth(admin)).send({ role: 'builder' })).status).toBe(
      200,
    );
    expect((await detail(token)).status).toBe(401);
    await request(t.app).patch(`/api/people/${me.id}`).set(auth(admin)).send({ role: 'inspector' });
  });
});
