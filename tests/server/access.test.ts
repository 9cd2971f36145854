import jwt from 'jsonwebtoken';
import request from 'supertest';
import sharp from 'sharp';
import { DEMO_USERS } from '@/server/dev/seed';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let travelerId: string;
let findingId: string;
let photoUrl: string;

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  ({ innerId: travelerId } = await demoRibs(t, tok.builder));
  const open = await request(t.app).get('/api/findings?status=open').set(auth(tok.builder));
  findingId = open.body.items[0].id;
  photoUrl = (await request(t.app).get(`/api/findings/${findingId}`).set(auth(tok.builder))).body.photos[0].url;
});

describe('sign-in', () => {
  it('answers 401 to a wrong password without saying whether the address exists', async () => {
    const wrong = await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_USERS.builder.email, password: 'nope' });
    const unknown = await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@nowhere.example', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('refuses a request with no token, a forged token and an expired token', async () => {
    expect((await request(t.app).get('/api/travelers')).status).toBe(401);
    const forged = jwt.sign({}, 'another-secret-entirely', { subject: 'x', algorithm: 'HS256' });
    expect((await request(t.app).get('/api/travelers').set(auth(forged))).status).toBe(401);
    const me = await request(t.app).get('/api/auth/me').set(auth(tok.builder));
    const expired = jwt.sign({ exp: Math.floor(Date.now() / 1000) - 10 }, t.config.jwtSecret, {
      subject: me.body.id,
      algorithm: 'HS256',
    });
    const res = await request(t.app).get('/api/travelers').set(auth(expired));
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it('refuses a token signed with another algorithm', async () => {
    const me = await request(t.app).get('/api/auth/me').set(auth(tok.builder));
    const none = jwt.sign({}, '', { subject: me.body.id, algorithm: 'none' });
    expect((await request(t.app).get('/api/travelers').set(auth(none))).status).toBe(401);
  });
});

describe('role boundaries', () => {
  it('keeps another builder away from this build, its traveler, finding and holes', async () => {
    expect((await request(t.app).get('/api/travelers').set(auth(outsiders.builder))).body).toEqual({
      items: [],
      next: null,
    });
    expect((await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(outsiders.builder))).status).toBe(404);
    expect((await request(t.app).get(`/api/findings/${findingId}`).set(auth(outsiders.builder))).status).toBe(404);
    const tick = await request(t.app)
      .post(`/api/travelers/${travelerId}/holes`)
      .set(auth(outsiders.builder))
      .send({ holeIds: ['L-01'], status: 'installed' });
    expect(tick.status).toBe(404);
    const flag = await raiseFinding(t, outsiders.builder, {
      travelerId,
      holeIds: ['L-02'],
      kind: 'hole_burrs',
      note: 'not mine',
    }).attach(
      'photos',
      await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } })
        .png()
        .toBuffer(),
      'x.png',
    );
    expect(flag.status).toBe(404);
  });

  it('keeps an inspector not assigned to the build away from its findings', async () => {
    expect((await request(t.app).get('/api/findings').set(auth(outsiders.inspector))).body).toEqual({
      items: [],
      next: null,
    });
    const res = await request(t.app)
      .post(`/api/findings/${findingId}/disposition`)
      .set(auth(outsiders.inspector))
      .send({ disposition: 'scrap', note: 'not mine' });
    expect(res.status).toBe(404);
  });

  it("keeps another supplier away from this supplier's kits, designs and builds", async () => {
    expect((await request(t.app).get('/api/kits').set(auth(outsiders.supplier))).body).toEqual({
      items: [],
      next: null,
    });
    expect((await request(t.app).get('/api/designs').set(auth(outsiders.supplier))).body).toEqual({
      items: [],
      next: null,
    });
    expect((await request(t.app).get('/api/builds').set(auth(outsiders.supplier))).body).toEqual({
      items: [],
      next: null,
    });
    const designs = await request(t.app).get('/api/designs').set(auth(tok.supplier));
    expect(
      (await request(t.app).get(`/api/designs/${designs.body.items[0].id}`).set(auth(outsiders.supplier))).status,
    ).toBe(404);
  });

  it("shows the supplier where findings cluster on a part across builds, and no one else's", async () => {
    const designs = await request(t.app).get('/api/designs').set(auth(tok.supplier));
    const rib = designs.body.items.find((d: { partNumber: string }) => d.partNumber === 'W-104');
    const res = await request(t.app).get(`/api/designs/${rib.id}/finding-clusters`).set(auth(tok.supplier));
    expect(res.status).toBe(200);
    expect(res.body[0]).toMatchObject({
      letter: 'A',
      holeId: 'U-09',
      count: 1,
      builds: 1,
      open: 1,
      kinds: { hole_elongated: 1 },
    });
    expect(
      (await request(t.app).get(`/api/designs/${rib.id}/finding-clusters`).set(auth(outsiders.supplier))).status,
    ).toBe(404);
    expect((await request(t.app).get(`/api/designs/${rib.id}/finding-clusters`).set(auth(tok.builder))).status).toBe(
      403,
    );
  });

  it('answers 403 when the role may not do a thing at all', async () => {
    expect((await request(t.app).get('/api/kits').set(auth(tok.builder))).status).toBe(403);
    expect(
      (
        await request(t.app)
          .post(`/api/findings/${findingId}/disposition`)
          .set(auth(tok.builder))
          .send({ disposition: 'use_as_is', note: 'looks fine to me' })
      ).status,
    ).toBe(403);
    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${travelerId}/holes`)
          .set(auth(tok.inspector))
          .send({ holeIds: ['L-01'], status: 'installed' })
      ).status,
    ).toBe(403);
    expect((await request(t.app).post('/api/builds').set(auth(tok.inspector)).send({})).status).toBe(403);
  });

  it('serves a photo only through a valid signed link', async () => {
    expect((await request(t.app).get(photoUrl)).status).toBe(200);
    expect((await request(t.app).get(photoUrl.replace(/sig=[^&]+/, 'sig=forged'))).status).toBe(403);
    expect((await request(t.app).get(photoUrl.replace(/exp=\d+/, 'exp=1000'))).status).toBe(403);
  });
});
