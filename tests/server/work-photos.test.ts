/**
 * Photos of the work: sent with what they show (a step, holes, the part), kept through the same photo
 * pipeline as a finding's, listed with their entry in the build log and its CSV, served through signed
 * links, and never taken by the sweep of orphaned files.
 */
import request from 'supertest';
import { jpeg } from '../helpers/photos';
import { sweepOrphanPhotos } from '@/server/jobs/photo-sweep';
import { parseCsv } from '../helpers/csv';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let innerId: string;
let buildId: string;
let firstStepId: string;

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  ({ innerId, buildId } = await demoRibs(t, tok.builder));
  firstStepId = (await request(t.app).get(`/api/travelers/${innerId}`).set(auth(tok.builder))).body.steps[0].id;
});

const upload = (token: string, fields: Record<string, string>, files = 1) => {
  let req = request(t.app).post(`/api/travelers/${innerId}/photos`).set(auth(token));
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return Promise.all(Array.from({ length: files }, jpeg)).then((bufs) => {
    bufs.forEach((b, i) => (req = req.attach('photos', b, { filename: `work-${i}.jpg`, contentType: 'image/jpeg' })));
    return req;
  });
};

describe('photos of the work', () => {
  let photoUrl: string;

  it('keeps two photos of step 1 with a few words, as one entry of the log', async () => {
    const res = await upload(
      tok.builder,
      { stepId: firstStepId, holeIds: 'U-01,U-02', note: 'Flanges fluted straight' },
      2,
    );
    expect(res.status).toBe(200);
    const log = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ kind: 'photos_added' })
      .set(auth(tok.builder));
    const [entry] = log.body.items as { text: string; note: string; photos: { url: string; thumbUrl: string }[] }[];
    expect(entry.text).toBe('Added 2 photos of the work on step 1, holes U-01, U-02.');
    expect(entry.note).toBe('Flanges fluted straight');
    expect(entry.photos).toHaveLength(2);
    photoUrl = entry.photos[0].url;
    const img = await request(t.app).get(photoUrl);
    expect(img.status).toBe(200);
    expect(img.headers['content-type']).toBe('image/jpeg');
    // A link is its person's: the same photo under another person's name fails its signature.
    const forged = photoUrl.replace(/u=[0-9a-f-]{36}/, `u=${outsiders.builder}`);
    expect((await request(t.app).get(forged)).status).toBe(403);
  });

  it('lists the photos’ links in the CSV row of their entry', async () => {
    const csv = await request(t.app).get(`/api/builds/${buildId}/log.csv`).set(auth(tok.builder)).buffer(true);
    const [header, ...rows] = parseCsv(csv.text);
    const row = rows.find((r) => r[header.indexOf('Kind')] === 'Work photos')!;
    expect(row[header.indexOf('Photos')].split(' ')).toHaveLength(2);
  });

  it('refuses what cannot be kept, with the field named, and keeps nothing of it', async () => {
    const none = await request(t.app)
      .post(`/api/travelers/${innerId}/photos`)
      .set(auth(tok.builder))
      .field('note', 'x');
    expect([none.status, none.body.error.fields]).toEqual([400, { photos: 'add at least one photo' }]);
    const hole = await upload(tok.builder, { holeIds: 'U-99' });
    expect([hole.status, hole.body.error.fields]).toEqual([400, { holeIds: 'unknown hole U-99' }]);
    expect((await upload(tok.builder, { stepId: '00000000-0000-4000-8000-000000000000' })).status).toBe(404);
    const text = await request(t.app)
      .post(`/api/travelers/${innerId}/photos`)
      .set(auth(tok.builder))
      .attach('photos', Buffer.from('not a photo'), { filename: 'notes.jpg', contentType: 'image/jpeg' });
    // Not an image: the photo pipeline's own refusal (unsupported media type).
    expect(text.status).toBe(415);
    expect((await upload(tok.inspector, {})).status).toBe(403);
    expect((await upload(outsiders.builder, {})).status).toBe(404);
    const log = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ kind: 'photos_added' })
      .set(auth(tok.builder));
    expect(log.body.items).toHaveLength(1);
  });

  it('is not swept as an orphan, and its files are still served after the sweep', async () => {
    const { removed } = await sweepOrphanPhotos({
      db: t.database.db,
      storage: t.ctx.storage,
      graceSeconds: 0,
      now: new Date(Date.now() + 3600_000),
    });
    // The refused uploads' files were removed as they were refused; nothing recorded goes.
    expect(removed).toEqual([]);
    expect((await request(t.app).get(photoUrl)).status).toBe(200);
  });
});
