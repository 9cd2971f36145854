import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
let o: Outsiders;
type Who =
  | 'owner'
  | 'helper'
  | 'finalInspector'
  | 'adviser'
  | 'supplier'
  | 'admin'
  | 'removed'
  | 'otherBuilder'
  | 'otherInspector'
  | 'otherSupplier';
let people: Record<Who, string>;
let buildId: string;
let travelerId: string;
let findingId: string;
let removedPhotoUrl: string;

demoApp((s) => ({ t, tok, outsiders: o } = s), { outsiders: true });
beforeAll(async () => {
  const helper = await t.addUser('builder', 'hal.helper@shop.example');
  const adviser = await t.addUser('inspector', 'ada.adviser@checks.example');
  const removed = await t.addUser('builder', 'rex.removed@shop.example');
  buildId = (await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items[0].id;
  // The owner adds a helper and the one to be removed; the supplier adds a technical adviser.
  for (const [token, email, place] of [
    [tok.builder, 'hal.helper@shop.example', 'helper'],
    [tok.builder, 'rex.removed@shop.example', 'helper'],
    [tok.supplier, 'ada.adviser@checks.example', 'adviser'],
  ] as const) {
    const res = await request(t.app).post(`/api/builds/${buildId}/members`).set(auth(token)).send({ email, place });
    if (res.status !== 200) throw new Error(`add ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  ({ innerId: travelerId } = await demoRibs(t, tok.builder));
  findingId = (await request(t.app).get('/api/findings?status=open').set(auth(tok.builder))).body.items[0].id;
  removedPhotoUrl = (await request(t.app).get(`/api/findings/${findingId}`).set(auth(removed))).body.photos[0].url;
  const rexId = (await request(t.app).get(`/api/builds/${buildId}`).set(auth(tok.builder))).body.people.members.find(
    (m: { email: string }) => m.email === 'rex.removed@shop.example',
  ).userId;
  expect((await request(t.app).delete(`/api/builds/${buildId}/members/${rexId}`).set(auth(tok.builder))).status).toBe(
    200,
  );
  people = {
    owner: tok.builder,
    helper,
    finalInspector: tok.inspector,
    adviser,
    supplier: tok.supplier,
    admin: tok.admin,
    removed,
    otherBuilder: o.builder,
    otherInspector: o.inspector,
    otherSupplier: o.supplier,
  };
});

const onBuild: Who[] = ['owner', 'helper', 'finalInspector', 'adviser', 'supplier', 'admin'];
const everyone = (): Who[] => Object.keys(people) as Who[];

describe('who sees what of a build: members in every place, the supplier, the admin — and nobody else', () => {
  const reads = (): [string, string][] => [
    ['the build', `/api/builds/${buildId}`],
    ['its log', `/api/builds/${buildId}/log`],
    ['its log as CSV', `/api/builds/${buildId}/log.csv`],
    ['its log as PDF', `/api/builds/${buildId}/log.pdf`],
    ['a part', `/api/travelers/${travelerId}`],
    ['a finding', `/api/findings/${findingId}`],
  ];
  it.each(['the build', 'its log', 'its log as CSV', 'its log as PDF', 'a part', 'a finding'])('%s', async (what) => {
    const [, path] = reads().find(([w]) => w === what)!;
    for (const who of everyone()) {
      const res = await request(t.app).get(path).set(auth(people[who]));
      const expected = onBuild.includes(who) ? 200 : 404;
      if (res.status !== expected) throw new Error(`${what} for ${who}: ${res.status}, expected ${expected}`);
    }
  });

  it('photo links work for whoever may see the finding, and stop for someone taken off the build', async () => {
    for (const who of onBuild) {
      const url = (await request(t.app).get(`/api/findings/${findingId}`).set(auth(people[who]))).body.photos[0]
        .thumbUrl;
      expect((await request(t.app).get(url)).status).toBe(200);
    }
    expect((await request(t.app).get(removedPhotoUrl)).status).toBe(403);
    // A link made for one person does not open as another's.
    const mine = (await request(t.app).get(`/api/findings/${findingId}`).set(auth(people.helper))).body.photos[0]
      .thumbUrl as string;
    const rex = (await request(t.app).get('/api/auth/me').set(auth(people.otherBuilder))).body.id;
    expect((await request(t.app).get(mine.replace(/u=[0-9a-f-]+/, `u=${rex}`))).status).toBe(403);
  });
});

describe('what each place may do', () => {
  it('ticks: the builders (owner and helper) only', async () => {
    for (const who of everyone()) {
      const res = await request(t.app)
        .post(`/api/travelers/${travelerId}/holes`)
        .set(auth(people[who]))
        .send({ holeIds: ['L-01'], status: 'installed' });
      const expected = who === 'owner' || who === 'helper' ? 200 : onBuild.includes(who) ? 403 : 404;
      if (res.status !== expected) throw new Error(`tick by ${who}: ${res.status}, expected ${expected}`);
      if (res.status === 200)
        await request(t.app)
          .post(`/api/travelers/${travelerId}/holes`)
          .set(auth(people[who]))
          .send({ holeIds: ['L-01'], status: 'pending' });
    }
  });

  it('decides on a finding: the inspectors in either place (accept is not due yet: 409), builders 403, others 404', async () => {
    for (const who of everyone()) {
      const res = await request(t.app).post(`/api/findings/${findingId}/accept`).set(auth(people[who])).send({});
      const expected = who === 'finalInspector' || who === 'adviser' ? 409 : onBuild.includes(who) ? 403 : 404;
      if (res.status !== expected) throw new Error(`accept by ${who}: ${res.status}, expected ${expected}`);
    }
  });

  it('changes the build’s people: its supplier and its owner only', async () => {
    for (const who of everyone().filter((w) => w !== 'owner' && w !== 'supplier')) {
      const res = await request(t.app)
        .post(`/api/builds/${buildId}/members`)
        .set(auth(people[who]))
        .send({ email: 'zed.new@shop.example', place: 'helper', name: 'Zed' });
      const expected = onBuild.includes(who) ? 403 : 404;
      if (res.status !== expected) throw new Error(`add by ${who}: ${res.status}, expected ${expected}`);
    }
    const byOwner = await request(t.app)
      .post(`/api/builds/${buildId}/members`)
      .set(auth(people.owner))
      .send({ email: 'zed.new@shop.example', place: 'helper', name: 'Zed' });
    expect(byOwner.body.people.pending.map((p: { email: string }) => p.email)).toContain('zed.new@shop.example');
    const bySupplier = await request(t.app)
      .post(`/api/builds/${buildId}/members`)
      .set(auth(people.supplier))
      .send({ email: 'yan.new@checks.example', place: 'adviser', name: 'Yan' });
    expect(bySupplier.status).toBe(200);
    // An address with an account of another role cannot take a builder's place.
    const wrong = await request(t.app)
      .post(`/api/builds/${buildId}/members`)
      .set(auth(people.owner))
      .send({ email: 'other.inspector@elsewhere.example', place: 'helper' });
    expect([wrong.status, Object.keys(wrong.body.error.fields)]).toEqual([400, ['email']]);
  });

  it('keeps one owner: the owner cannot be removed; handing over makes the old owner a helper', async () => {
    const detail = (await request(t.app).get(`/api/builds/${buildId}`).set(auth(people.supplier))).body.people;
    const owner = detail.members.find((m: { place: string }) => m.place === 'owner');
    const helper = detail.members.find((m: { email: string }) => m.email === 'hal.helper@shop.example');
    expect(
      (await request(t.app).delete(`/api/builds/${buildId}/members/${owner.userId}`).set(auth(people.supplier))).status,
    ).toBe(409);
    expect(
      (
        await request(t.app)
          .post(`/api/builds/${buildId}/members`)
          .set(auth(people.supplier))
          .send({ email: 'x@y.example', place: 'owner' })
      ).status,
    ).toBe(409);
    const adviser = detail.members.find((m: { place: string }) => m.place === 'adviser');
    expect(
      (
        await request(t.app)
          .post(`/api/builds/${buildId}/owner`)
          .set(auth(people.owner))
          .send({ userId: adviser.userId })
      ).status,
    ).toBe(400);
    const handed = await request(t.app)
      .post(`/api/builds/${buildId}/owner`)
      .set(auth(people.owner))
      .send({ userId: helper.userId });
    expect(handed.status).toBe(200);
    const places = Object.fromEntries(
      handed.body.people.members.map((m: { email: string; place: string }) => [m.email, m.place]),
    );
    expect(places).toMatchObject({ 'hal.helper@shop.example': 'owner', [DEMO_USERS.builder.email]: 'helper' });
    // The old owner, now a helper, may no longer change the build's people; the new owner may.
    expect((await request(t.app).get(`/api/builds/${buildId}`).set(auth(people.owner))).body.people.allowed).toEqual(
      [],
    );
    expect((await request(t.app).get(`/api/builds/${buildId}`).set(auth(people.helper))).body.people.allowed).toEqual([
      'add',
      'remove',
      'hand-over',
    ]);
    const log = (await request(t.app).get(`/api/builds/${buildId}/log?kind=owner_changed`).set(auth(people.helper)))
      .body.items;
    expect(log[0].text).toContain('to hal.helper');
  });
});
