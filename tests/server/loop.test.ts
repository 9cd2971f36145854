import request from 'supertest';
import { jpeg as greyJpeg } from '../helpers/photos';
import { DEMO_USERS } from '@/server/dev/seed';
import { flangeLine, ribRevision } from '../fixtures/rib-revision';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
demoApp((s) => ({ t, tok } = s));

const jpeg = () => greyJpeg('#888');

// The rib's revision in 0.020 in, with a lower flange at 2 in pitch as well.
const loopRevision = {
  ...ribRevision,
  gaugeIn: 0.02,
  lines: [...ribRevision.lines, flangeLine('L', 30, [{ fromIn: 0, toIn: 30, pitchIn: 2 }])],
};

describe('the main loop through the API', () => {
  let kitId: string;
  let revisionId: string;
  let buildId: string;
  let travelerId: string;
  let findingId: string;

  it('lets the supplier create a kit model and a rib design as draft revision A', async () => {
    const kit = await request(t.app).post('/api/kits').set(auth(tok.supplier)).send({
      code: 'TK-9',
      name: 'Test kit',
      weightLb: 1200,
      wingAreaSqFt: 110,
      meanChordIn: 50,
      stallSpeedKeas: 45,
      category: 'normal',
      airfoil: 'NACA 2412',
    });
    expect(kit.status).toBe(201);
    kitId = kit.body.id;
    const design = await request(t.app)
      .post('/api/designs')
      .set(auth(tok.supplier))
      .send({
        design: { kitModelId: kitId, partNumber: 'R-1', name: 'Test rib', kind: 'rib' },
        revision: loopRevision,
      });
    expect(design.status).toBe(201);
    expect(design.body.revisions[0]).toMatchObject({ letter: 'A', status: 'draft' });
    revisionId = design.body.revisions[0].id;
  });

  it('publishes revision A, after which it can no longer be edited', async () => {
    const pub = await request(t.app).post(`/api/revisions/${revisionId}/publish`).set(auth(tok.supplier)).send({});
    expect(pub.status).toBe(200);
    expect(pub.body).toMatchObject({ status: 'published', publishedByName: DEMO_USERS.supplier.name });
    const edit = await request(t.app)
      .patch(`/api/revisions/${revisionId}`)
      .set(auth(tok.supplier))
      .send({ ...loopRevision, gaugeIn: 0.032 });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toMatch(/can no longer be changed/);
  });

  it('ships a build with a traveler per published part, each with its own serial, token and short code', async () => {
    const res = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
      kitModelId: kitId,
      kitSerial: 'TK9-0001',
      builderEmail: DEMO_USERS.builder.email.toUpperCase(),
      inspectorEmail: DEMO_USERS.inspector.email,
    });
    expect(res.status).toBe(201);
    buildId = res.body.id;
    expect(res.body.travelerCount).toBe(1);
    const labels = await request(t.app).get(`/api/travelers/labels?buildId=${buildId}`).set(auth(tok.supplier));
    expect(labels.status).toBe(200);
    expect(labels.body[0].qrDataUrl).toMatch(/^data:image\/png;base64,/);
    expect(labels.body[0].shortCode).toMatch(/^[A-Z0-9]{3}-[A-Z0-9]{3}$/);
    travelerId = labels.body[0].travelerId;
    // The builder opens it by the QR url and by the short code typed loosely.
    const byUrl = await request(t.app)
      .get('/api/travelers/lookup')
      .query({ code: labels.body[0].url })
      .set(auth(tok.builder));
    expect(byUrl.body).toEqual({ id: travelerId });
    const typed = labels.body[0].shortCode.replace('-', '').toLowerCase();
    const byCode = await request(t.app).get('/api/travelers/lookup').query({ code: typed }).set(auth(tok.builder));
    expect(byCode.body).toEqual({ id: travelerId });
  });

  it('places holes from the schedule: edge distance at both ends, no space wider than its zone pitch', async () => {
    const res = await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(tok.builder));
    expect(res.status).toBe(200);
    const upper = res.body.holes.filter((h: { line: string }) => h.line === 'U');
    expect(upper[0].stationIn).toBeCloseTo(0.25);
    expect(upper[upper.length - 1].stationIn).toBeCloseTo(29.75);
    for (let i = 1; i < upper.length; i++) {
      const gap = upper[i].stationIn - upper[i - 1].stationIn;
      expect(gap).toBeLessThanOrEqual((upper[i - 1].stationIn < 10 - 1e-9 ? 1 : 2) + 1e-9);
    }
    expect(res.body.steps).toHaveLength(2);
    expect(res.body.approvedByName).toBe(DEMO_USERS.supplier.name);
  });

  it('ticks a run of holes installed and counts progress', async () => {
    const res = await request(t.app)
      .post(`/api/travelers/${travelerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['U-01', 'U-02', 'U-03'], status: 'installed' });
    expect(res.status).toBe(200);
    expect(res.body.holes.every((h: { status: string }) => h.status === 'installed')).toBe(true);
    const list = await request(t.app).get('/api/travelers').set(auth(tok.builder));
    expect(list.body.items.find((x: { id: string }) => x.id === travelerId).holesDone).toBe(3);
  });

  it('raises a finding on a suspect hole with a photo and mails the inspector with part, hole, kind, link and thumbnail', async () => {
    const res = await raiseFinding(t, tok.builder, {
      travelerId,
      holeIds: ['U-04'],
      kind: 'hole_cracked',
      note: 'hairline crack at the edge',
    }).attach('photos', await jpeg(), { filename: 'crack.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    findingId = res.body.id;
    expect(res.body.photos).toHaveLength(1);
    expect(res.body.events[0]).toMatchObject({
      action: 'raise',
      toStatus: 'raised',
      actorName: DEMO_USERS.builder.name,
      actorPlace: 'builder',
    });
    expect(res.body.allowedActions).toEqual([]);
    const mail = await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes('R-1') && m.subject.includes('U-04'),
    );
    expect(mail.text).toContain('Crack at the hole');
    expect(mail.text).toContain(`/findings/${findingId}`);
    expect(mail.attachments).toBe(1);
    const photo = await request(t.app).get(res.body.photos[0].thumbUrl);
    expect(photo.status).toBe(200);
    expect(photo.type).toBe('image/jpeg');
  });

  it('lets the inspector disposition it in one request; the builder sees it on the traveler and gets a mail', async () => {
    const queue = await request(t.app).get('/api/findings?status=open').set(auth(tok.inspector));
    expect(queue.body.items.map((f: { id: string }) => f.id)).toContain(findingId);
    const seen = await request(t.app).get(`/api/findings/${findingId}`).set(auth(tok.inspector));
    expect(seen.body.allowedActions).toEqual(['disposition', 'not-a-defect']);
    const res = await request(t.app)
      .post(`/api/findings/${findingId}/disposition`)
      .set(auth(tok.inspector))
      .send({ disposition: 'rework', note: 'drill out and set the same rivet again' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'work_ordered', disposition: 'rework' });
    const traveler = await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(tok.builder));
    expect(traveler.body.findings[0]).toMatchObject({ id: findingId, disposition: 'rework' });
    expect(traveler.body.holes.find((h: { holeId: string }) => h.holeId === 'U-04').status).toBe('held');
    await t.waitForMail((m) => m.to.includes(DEMO_USERS.builder.email) && m.subject.includes('Disposition: Rework'));
  });

  it('keeps every change as an event, through work done with a photo and accepted, which closes it', async () => {
    const done = await request(t.app)
      .post(`/api/findings/${findingId}/report-done`)
      .set(auth(tok.builder))
      .field('note', 'drilled out, same AD4 set again')
      .attach('photos', await jpeg(), { filename: 'done.jpg', contentType: 'image/jpeg' });
    expect(done.status).toBe(200);
    expect(done.body.photos.map((p: { stage: string }) => p.stage)).toEqual(['found', 'work']);
    await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes('Rework done: to inspect'),
    );
    const closed = await request(t.app)
      .post(`/api/findings/${findingId}/accept`)
      .set(auth(tok.inspector))
      .send({ note: 'good' });
    expect(closed.body).toMatchObject({ status: 'closed', closure: 'accepted', allowedActions: [] });
    expect(closed.body.events.map((e: { action: string }) => e.action)).toEqual([
      'raise',
      'disposition',
      'report-done',
      'accept',
    ]);
    const traveler = await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(tok.inspector));
    expect(traveler.body.holes.find((h: { holeId: string }) => h.holeId === 'U-04').status).toBe('accepted');
  });
});
