import { count } from 'drizzle-orm';
import { readdir } from 'node:fs/promises';
import request from 'supertest';
import sharp from 'sharp';
import { findingPhotos, findings, holes } from '@/db/schema';
import { flangeLine, ribRevision } from '../fixtures/rib-revision';
import { auth, demoApp, demoRibs, type TestApp, type Tokens } from '../helpers/test-app';
import { raiseFinding } from '../helpers/raise-finding';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let travelerId: string;
const png = () =>
  sharp({ create: { width: 16, height: 16, channels: 3, background: '#444' } })
    .png()
    .toBuffer();

async function savedCounts() {
  const [[f], [p], files] = await Promise.all([
    t.database.db.select({ n: count() }).from(findings),
    t.database.db.select({ n: count() }).from(findingPhotos),
    readdir(t.uploadsDir),
  ]);
  return { findings: f.n, photos: p.n, files: files.length };
}

/** A finding on `holeId` of the demo part, as the builder raises it: the test attaches what it sends. */
const raiseOn = (holeId: string) =>
  raiseFinding(t, tok.builder, { travelerId, holeIds: [holeId], kind: 'hole_oversize', note: 'looks big' });

/**
 * A rib design for the demo's first kit: the standard revision changed by `over`, its one line named
 * 'Upper' with these `zones`, and no steps (JSON leaves an undefined out).
 */
async function postRib(partNumber: string, name: string, over: object, zones: Parameters<typeof flangeLine>[2]) {
  const kits = await request(t.app).get('/api/kits').set(auth(tok.supplier));
  return request(t.app)
    .post('/api/designs')
    .set(auth(tok.supplier))
    .send({
      design: { kitModelId: kits.body.items[0].id, partNumber, name, kind: 'rib' },
      revision: {
        ...ribRevision,
        ...over,
        lines: [{ ...flangeLine('U', 30, zones), name: 'Upper' }],
        steps: undefined,
      },
    });
}

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  ({ innerId: travelerId } = await demoRibs(t, tok.builder));
});

describe('bad input gets a clear error and saves nothing', () => {
  it('answers 400 to a body that is not JSON', async () => {
    const res = await request(t.app)
      .post('/api/kits')
      .set(auth(tok.supplier))
      .set('Content-Type', 'application/json')
      .send('{"code": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('names every wrong field of a kit model', async () => {
    const res = await request(t.app).post('/api/kits').set(auth(tok.supplier)).send({
      code: '',
      name: 'x',
      weightLb: -5,
      wingAreaSqFt: 100,
      meanChordIn: 50,
      stallSpeedKeas: 60,
      cruiseSpeedKeas: 50,
      category: 'normal',
      airfoil: 'flat plate',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['airfoil', 'code', 'cruiseSpeedKeas', 'weightLb']);
    expect(res.body.error.fields.weightLb).toMatch(/greater than zero/);
    expect(res.body.error.fields.cruiseSpeedKeas).toMatch(/above the stall speed/);
  });

  it('refuses pitch zones with a gap and names the zone', async () => {
    // The standard revision with a gap between its zones.
    const res = await postRib('X-1', 'gappy', {}, [
      { fromIn: 0, toIn: 10, pitchIn: 1 },
      { fromIn: 12, toIn: 30, pitchIn: 2 },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['revision.lines.0.zones.1.fromIn']).toMatch(/without gaps/);
  });

  it('refuses a pitch under 3D and an edge distance under 2D for a catalogue rivet', async () => {
    // FAA AC 43.13-1B ch. 4: pitch ≥ 3D, edge distance ≥ 2D; MS20470AD4 is 1/8 in, so 0.375 and 0.25 in.
    // The standard revision too tight: 0.3 in pitch and 0.2 in edge distance.
    const res = await postRib('X-2', 'tight', { rivetSpec: 'MS20470AD4-4', edgeDistanceIn: 0.2 }, [
      { fromIn: 0, toIn: 10, pitchIn: 0.3 },
      { fromIn: 10, toIn: 30, pitchIn: 2 },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['revision.edgeDistanceIn']).toMatch(/0\.250 in/);
    expect(res.body.error.fields['revision.lines.0.zones.0.pitchIn']).toMatch(/0\.375 in \(3D\)/);
  });

  it('answers 415 to a file that is not an image, whatever it is called, and keeps nothing', async () => {
    const before = await savedCounts();
    const res = await raiseOn('L-03')
      .attach('photos', await png(), 'fine.png')
      .attach('photos', Buffer.from('%PDF-1.4 not a photo at all'), {
        filename: 'hole.jpg',
        contentType: 'image/jpeg',
      });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/hole\.jpg.*not a photo/);
    expect(await savedCounts()).toEqual(before);
  });

  it('answers 413 to a photo over 10 MB, and 400 to a seventh photo, each saying so', async () => {
    const res = await raiseOn('L-03').attach('photos', Buffer.alloc(10 * 1024 * 1024 + 10, 1), 'huge.jpg');
    expect([res.status, res.body.error.message]).toEqual([413, 'a photo is larger than 10 MB']);
    let seven = raiseOn('L-03');
    for (let i = 0; i < 7; i++) seven = seven.attach('photos', await png(), `p${i}.png`);
    const tooMany = await seven;
    expect([tooMany.status, tooMany.body.error.message]).toEqual([
      400,
      'attach at most 6 photos, as the "photos" field',
    ]);
  });

  it('answers 400 to a multipart body it cannot read (no boundary, cut short), naming the field, and keeps nothing', async () => {
    const before = await savedCounts();
    const send = (contentType: string, body: string) =>
      request(t.app).post('/api/findings').set(auth(tok.builder)).set('Content-Type', contentType).send(body);
    const cutShort = '--XX\r\nContent-Disposition: form-data; name="photos"; filename="a.png"\r\n\r\nhalf a fi';
    for (const res of [
      await send('multipart/form-data', 'garbage'),
      await send('multipart/form-data; boundary=XX', cutShort),
    ]) {
      expect([res.status, res.body.error.message, res.body.error.fields]).toEqual([
        400,
        'the upload could not be read: send it again',
        { photos: 'unreadable upload' },
      ]);
    }
    expect(await savedCounts()).toEqual(before);
  });

  it('rolls back photos and finding when a hole does not exist', async () => {
    const before = await savedCounts();
    const res = await raiseOn('Q-99').attach('photos', await png(), 'a.png');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.holeIds).toMatch(/Q-99/);
    expect(await savedCounts()).toEqual(before);
  });

  it('refuses a finding with no photo, naming the photos field', async () => {
    const res = await raiseOn('L-03');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.photos).toBeDefined();
  });

  it('refuses to tick a hole that is under a finding, and changes none of the run', async () => {
    const before = await t.database.db.select().from(holes);
    const res = await request(t.app)
      .post(`/api/travelers/${travelerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['U-09', 'U-10'], status: 'installed' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/U-09 \(flagged\)/);
    const after = await t.database.db.select().from(holes);
    expect(after.find((h) => h.holeId === 'U-10' && h.travelerId === travelerId)!.status).toBe(
      before.find((h) => h.holeId === 'U-10' && h.travelerId === travelerId)!.status,
    );
  });

  it('answers 400 naming the id when a path id is not an id', async () => {
    const res = await request(t.app).get('/api/travelers/not-an-id').set(auth(tok.builder));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.id).toBeDefined();
  });

  it('refuses a kit serial with a control character, naming the field, and ships nothing', async () => {
    const kitModelId = (await request(t.app).get('/api/kits').set(auth(tok.supplier))).body.items[0].id;
    const before = (await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items.length;
    const res = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
      kitModelId,
      kitSerial: 'NK2-\u00000999',
      builderEmail: 'tobias@benchwork.example',
      inspectorEmail: 'priya@checkpoint.example',
    });
    expect([res.status, Object.keys(res.body.error.fields)]).toEqual([400, ['kitSerial']]);
    expect((await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items).toHaveLength(before);
  });
});
