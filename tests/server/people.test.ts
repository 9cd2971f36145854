import jwt from 'jsonwebtoken';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
/** Long, unusual and not built from the person's name: what the strength package accepts. */
const STRONG = 'copper-ribs-tilt-44-quietly';

demoApp((s) => ({ t, tok } = s));

/** The one-time link in the latest mail to `to` whose subject has `words`: its path, and its token. */
async function linkIn(to: string, words: string, kind: 'invite' | 'reset') {
  const mail = await t.waitForMail((m) => m.to.includes(to) && m.subject.includes(words));
  const m = new RegExp(`https?://\\S+/${kind}/([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!m) throw new Error(`no ${kind} link in: ${mail.text}`);
  return m[1];
}

async function invited(email: string, body: Record<string, unknown>, by = tok.admin) {
  const res = await request(t.app)
    .post('/api/people/invitations')
    .set(auth(by))
    .send({ email, ...body });
  if (res.status !== 201) throw new Error(`invite ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return linkIn(email, 'invited', 'invite');
}

async function join(token: string, name: string, password = STRONG) {
  return request(t.app).post('/api/invitations/accept').send({ token, name, password });
}

describe('invitations: a mail with a one-time link where the person sets their own password', () => {
  it('joins an invited builder through the mail, once; a weak password is refused with the strength package’s advice', async () => {
    const token = await invited('nadia.new@shop.example', { name: 'Nadia New', role: 'builder' });
    const view = await request(t.app).get(`/api/invitations/${token}`);
    expect(view.body).toMatchObject({
      email: 'nadia.new@shop.example',
      role: 'builder',
      invitedByName: DEMO_USERS.admin.name,
    });
    const weak = await join(token, 'Nadia New', 'password123');
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toMatch(/too easy to guess/);
    const joined = await join(token, 'Nadia New');
    expect(joined.status).toBe(200);
    expect(joined.body.user).toMatchObject({ email: 'nadia.new@shop.example', role: 'builder' });
    expect((await request(t.app).get('/api/auth/me').set(auth(joined.body.token))).status).toBe(200);
    expect(
      (await request(t.app).post('/api/auth/sign-in').send({ email: 'nadia.new@shop.example', password: STRONG }))
        .status,
    ).toBe(200);
    // Single use.
    expect((await join(token, 'Nadia Again')).status).toBe(404);
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
  });

  it('refuses an address that already has an account, and a role the organisation does not hold', async () => {
    const dup = await request(t.app)
      .post('/api/people/invitations')
      .set(auth(tok.admin))
      .send({ email: DEMO_USERS.builder.email, name: 'X', role: 'builder' });
    expect(dup.status).toBe(409);
    const orgs = (await request(t.app).get('/api/people/organizations').set(auth(tok.admin))).body.items as {
      id: string;
      kind: string;
    }[];
    const supplierOrg = orgs.find((o) => o.kind === 'supplier')!;
    const wrong = await request(t.app)
      .post('/api/people/invitations')
      .set(auth(tok.admin))
      .send({ email: 'b@x.example', name: 'B', role: 'builder', organizationId: supplierOrg.id });
    expect([wrong.status, Object.keys(wrong.body.error.fields)]).toEqual([400, ['role']]);
  });

  it('refuses an address longer than any that can be delivered, with the same words at sign-in, invitation and shipping', async () => {
    // 254 characters is the most a delivered address can have (common practice); one more is refused.
    const long = `${'a'.repeat(64)}@${'b'.repeat(63)}.${'c'.repeat(63)}.${'d'.repeat(54)}.example`;
    expect(long.length).toBe(255);
    const words = /an e-mail address is at most 254 characters/;
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: long, password: 'whatever it is' });
    expect([signIn.status, signIn.body.error.fields?.email]).toEqual([400, expect.stringMatching(words)]);
    const invite = await request(t.app)
      .post('/api/people/invitations')
      .set(auth(tok.admin))
      .send({ email: long, name: 'Long Address', role: 'builder' });
    expect([invite.status, invite.body.error.fields?.email]).toEqual([400, expect.stringMatching(words)]);
    const kits = (await request(t.app).get('/api/kits').set(auth(tok.supplier))).body.items as { id: string }[];
    const ship = await request(t.app)
      .post('/api/builds')
      .set(auth(tok.supplier))
      .send({ kitModelId: kits[0].id, kitSerial: 'LONG-1', builderEmail: long, inspectorEmail: long });
    expect([ship.status, ship.body.error.fields?.builderEmail, ship.body.error.fields?.inspectorEmail]).toEqual([
      400,
      expect.stringMatching(words),
      expect.stringMatching(words),
    ]);
  });

  it('lets a supplier’s lead engineer invite engineers into their own organisation only; nobody else manages people', async () => {
    const me = (await request(t.app).get('/api/auth/me').set(auth(tok.supplier))).body;
    expect(me.lead).toBe(true);
    const engTwo = (
      await join(
        await invited(
          'eng.two@northfold.example',
          { name: 'Eng Two', role: 'supplier', organizationId: me.organizationId },
          tok.supplier,
        ),
        'Eng Two',
      )
    ).body;
    // An engineer who is not the lead manages nobody.
    expect(engTwo.user.lead).toBe(false);
    expect(
      (
        await request(t.app).post('/api/people/invitations').set(auth(engTwo.token)).send({
          email: 'eng.three@northfold.example',
          name: 'E3',
          role: 'supplier',
          organizationId: me.organizationId,
        })
      ).status,
    ).toBe(403);
    const other = await request(t.app)
      .post('/api/people/organizations')
      .set(auth(tok.admin))
      .send({ name: 'Other Kits', kind: 'supplier' });
    expect(other.status).toBe(201);
    expect(
      (
        await request(t.app)
          .post('/api/people/invitations')
          .set(auth(tok.supplier))
          .send({ email: 'x@other.example', name: 'X', role: 'supplier', organizationId: other.body.id })
      ).status,
    ).toBe(403);
    expect(
      (
        await request(t.app)
          .post('/api/people/invitations')
          .set(auth(tok.supplier))
          .send({ email: 'x@shop.example', name: 'X', role: 'builder' })
      ).status,
    ).toBe(403);
    for (const who of [tok.builder, tok.inspector]) {
      expect(
        (
          await request(t.app)
            .post('/api/people/invitations')
            .set(auth(who))
            .send({ email: 'y@shop.example', name: 'Y', role: 'builder' })
        ).status,
      ).toBe(403);
      expect((await request(t.app).get('/api/people').set(auth(who))).status).toBe(403);
    }
    const mine = (await request(t.app).get('/api/people').set(auth(tok.supplier))).body.items as {
      email: string;
      organizationId: string;
    }[];
    expect(mine.every((p) => p.organizationId === me.organizationId)).toBe(true);
    expect((await request(t.app).get('/api/people/organizations').set(auth(tok.supplier))).status).toBe(403);
  });
});

describe('passwords and sign-ins', () => {
  it('answers a forgotten password the same for a known and an unknown address, and mails only the known one', async () => {
    const known = await request(t.app).post('/api/auth/forgot').send({ email: DEMO_USERS.inspector.email });
    const unknown = await request(t.app).post('/api/auth/forgot').send({ email: 'nobody@nowhere.example' });
    expect([known.status, unknown.status]).toEqual([202, 202]);
    expect(known.body).toEqual(unknown.body);
    const resetToken = await linkIn(DEMO_USERS.inspector.email, 'new Pitchcard password', 'reset');
    await new Promise((r) => setTimeout(r, 500));
    expect(t.smtp.messages.some((m) => m.to.includes('nobody@nowhere.example'))).toBe(false);
    const before = await t.signIn(DEMO_USERS.inspector.email);
    // A weak try is refused with the advice and leaves the link working.
    const weak = await request(t.app).post('/api/auth/reset').send({ token: resetToken, password: 'password1234' });
    expect(weak.body.error.fields).toHaveProperty('password');
    const reset = await request(t.app).post('/api/auth/reset').send({ token: resetToken, password: STRONG });
    expect(reset.status).toBe(200);
    // The new password ends the sign-ins made with the old one.
    expect((await request(t.app).get('/api/auth/me').set(auth(before))).status).toBe(401);
    expect(
      (await request(t.app).post('/api/auth/sign-in').send({ email: DEMO_USERS.inspector.email, password: STRONG }))
        .status,
    ).toBe(200);
    expect(
      (await request(t.app).post('/api/auth/reset').send({ token: resetToken, password: STRONG })).body.error.fields,
    ).toHaveProperty('token');
    // Put the demo password back for the other tests, through the signed-in change.
    const back = await request(t.app)
      .post('/api/auth/change-password')
      .set(auth(reset.body.token))
      .send({ currentPassword: STRONG, newPassword: DEMO_PASSWORD });
    expect(back.status).toBe(200);
    tok.inspector = back.body.token;
  });

  it('changes a password only with the current one and a strong new one; other sign-ins end, this one goes on with its new token', async () => {
    const other = await t.signIn(DEMO_USERS.builder.email);
    const here = await t.signIn(DEMO_USERS.builder.email);
    expect(
      (
        await request(t.app)
          .post('/api/auth/change-password')
          .set(auth(here))
          .send({ currentPassword: 'wrong', newPassword: STRONG })
      ).body.error.fields,
    ).toHaveProperty('currentPassword');
    expect(
      (
        await request(t.app)
          .post('/api/auth/change-password')
          .set(auth(here))
          .send({ currentPassword: DEMO_PASSWORD, newPassword: 'password1234' })
      ).body.error.fields,
    ).toHaveProperty('newPassword');
    const ok = await request(t.app)
      .post('/api/auth/change-password')
      .set(auth(here))
      .send({ currentPassword: DEMO_PASSWORD, newPassword: STRONG });
    expect(ok.status).toBe(200);
    expect((await request(t.app).get('/api/travelers').set(auth(other))).status).toBe(401);
    expect((await request(t.app).get('/api/travelers').set(auth(ok.body.token))).status).toBe(200);
    const back = await request(t.app)
      .post('/api/auth/change-password')
      .set(auth(ok.body.token))
      .send({ currentPassword: STRONG, newPassword: DEMO_PASSWORD });
    tok.builder = back.body.token;
  });

  it('signs out everywhere: every token the person had is refused on its next request', async () => {
    const a = await t.signIn(DEMO_USERS.supplier.email);
    const b = await t.signIn(DEMO_USERS.supplier.email);
    expect((await request(t.app).post('/api/auth/sign-out-everywhere').set(auth(a))).status).toBe(204);
    expect((await request(t.app).get('/api/kits').set(auth(a))).status).toBe(401);
    expect((await request(t.app).get('/api/kits').set(auth(b))).status).toBe(401);
    tok.supplier = await t.signIn(DEMO_USERS.supplier.email);
  });

  it('refuses a token without an expiry, even when signed with our secret', async () => {
    const me = (await request(t.app).get('/api/auth/me').set(auth(tok.builder))).body;
    const { ver } = jwt.decode(tok.builder) as { ver: number };
    const forever = jwt.sign({ ver }, t.config.jwtSecret, { subject: me.id, algorithm: 'HS256' });
    const fresh = jwt.sign({ ver }, t.config.jwtSecret, { subject: me.id, algorithm: 'HS256', expiresIn: 60 });
    expect((await request(t.app).get('/api/travelers').set(auth(fresh))).status).toBe(200);
    expect((await request(t.app).get('/api/travelers').set(auth(forever))).status).toBe(401);
  });

  it('deactivating a person ends their sign-ins at once and refuses new ones with the usual words; reactivating lets them back', async () => {
    const token = await invited('dora.deact@shop.example', { name: 'Dora Deact', role: 'inspector' });
    const joined = (await join(token, 'Dora Deact')).body;
    expect((await request(t.app).get('/api/findings').set(auth(joined.token))).status).toBe(200);
    const off = await request(t.app)
      .patch(`/api/people/${joined.user.id}`)
      .set(auth(tok.admin))
      .send({ active: false });
    expect(off.body).toMatchObject({ active: false, allowed: expect.arrayContaining(['reactivate']) });
    expect((await request(t.app).get('/api/findings').set(auth(joined.token))).status).toBe(401);
    const refused = await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: 'dora.deact@shop.example', password: STRONG });
    expect(refused.status).toBe(401);
    expect(refused.body.error.message).toBe('e-mail or password is wrong');
    // Nobody changes themselves here, and a lead engineer cannot touch another organisation's people.
    expect(
      (await request(t.app).patch(`/api/people/${joined.user.id}`).set(auth(tok.supplier)).send({ active: true }))
        .status,
    ).toBe(404);
    await request(t.app).patch(`/api/people/${joined.user.id}`).set(auth(tok.admin)).send({ active: true });
    expect(
      (await request(t.app).post('/api/auth/sign-in').send({ email: 'dora.deact@shop.example', password: STRONG }))
        .status,
    ).toBe(200);
  });
});

describe('people on a build', () => {
  let kitId: string;
  beforeAll(async () => {
    kitId = (await request(t.app).get('/api/kits').set(auth(tok.supplier))).body.items[0].id;
  });

  it('ships to addresses with no account: both are invited, the build shows them as not joined, and joining makes them members', async () => {
    const res = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
      kitModelId: kitId,
      kitSerial: 'NK2-0900',
      builderEmail: 'owen.owner@home.example',
      builderName: 'Owen Owner',
      inspectorEmail: 'ines.insp@checks.example',
      inspectorName: 'Ines Insp',
    });
    expect(res.status).toBe(201);
    const detail = (await request(t.app).get(`/api/builds/${res.body.id}`).set(auth(tok.supplier))).body;
    expect(detail.people.members).toEqual([]);
    expect(detail.people.pending.map((p: { email: string; place: string }) => `${p.email}/${p.place}`).sort()).toEqual([
      'ines.insp@checks.example/final_inspector',
      'owen.owner@home.example/owner',
    ]);
    expect(detail.people.allowed).toEqual(['add', 'remove', 'hand-over']);
    const owner = (await join(await linkIn('owen.owner@home.example', 'NK2-0900', 'invite'), 'Owen Owner')).body;
    const inspector = (await join(await linkIn('ines.insp@checks.example', 'NK2-0900', 'invite'), 'Ines Insp')).body;
    expect((await request(t.app).get('/api/travelers').set(auth(owner.token))).body.items.length).toBeGreaterThan(0);
    expect((await request(t.app).get(`/api/builds/${res.body.id}`).set(auth(inspector.token))).status).toBe(200);
    const after = (await request(t.app).get(`/api/builds/${res.body.id}`).set(auth(owner.token))).body.people;
    expect(after.members.map((m: { place: string }) => m.place).sort()).toEqual(['final_inspector', 'owner']);
    expect(after.pending).toEqual([]);
    expect(after.allowed).toEqual(['add', 'remove', 'hand-over']);
    const log = (await request(t.app).get(`/api/builds/${res.body.id}/log?kind=people`).set(auth(owner.token))).body
      .items;
    expect(log.map((e: { kind: string }) => e.kind).sort()).toEqual([
      'member_invited',
      'member_invited',
      'member_joined',
      'member_joined',
    ]);
  });
});
