/**
 * Notices to shipped kits: effectivity resolved when issued (serial range edges, revision boundaries,
 * built or not yet built), one mail per person through the queue (a refusing relay retried), each build's
 * answer in its log, the supplier's view across builds, and who may do what.
 */
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { noticeMails } from '@/db/schema';
import { createMailer } from '@/server/mail/transport';
import { noticeMailWorker } from '@/server/jobs/notice-mail-worker';
import { jpeg } from '../helpers/photos';
import { logPdfText } from '../helpers/pdf-text';
import { parseCsv } from '../helpers/csv';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { DEMO_USERS } from '@/server/dev/seed';
import {
  MAX_COMPLIANCE_PHOTOS,
  MAX_NOTICE_FILES,
  type NoticeBuildAnswer,
  type NoticeDetail,
  type NoticeSummary,
} from '@/db/contracts';

jest.setTimeout(90000);

let t: TestApp;
let tok: Tokens;
let kitModelId: string;
let outerDesignId: string;
let innerDesignId: string;
/** Build ids by kit serial. */
const builds: Record<string, string> = {};

const ship = async (kitSerial: string) => {
  const res = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
    kitModelId,
    kitSerial,
    builderEmail: DEMO_USERS.builder.email,
    inspectorEmail: DEMO_USERS.inspector.email,
  });
  expect(res.status).toBe(201);
  builds[kitSerial] = res.body.id;
};

const issue = (
  token: string,
  fields: Record<string, unknown>,
  files: { buf: Buffer; name: string; type: string }[] = [],
) => {
  let req = request(t.app).post('/api/notices').set(auth(token));
  const body: Record<string, unknown> = {
    kitModelId,
    level: 'mandatory',
    title: 'Check the flange bend radius',
    body: 'Look at the flange bend radius at the nose before riveting; send a photo of the gauge on it.',
    reaches: 'all',
    ...fields,
  };
  for (const [k, v] of Object.entries(body)) req = req.field(k, typeof v === 'string' ? v : JSON.stringify(v));
  for (const f of files) req = req.attach('files', f.buf, { filename: f.name, contentType: f.type });
  return req;
};

/** The kit serials a notice reached, as the supplier sees them. */
const reached = (n: NoticeDetail) => n.builds.map((b) => b.kitSerial).sort();

const partOf = async (buildId: string, partNumber: string) => {
  const parts = (await request(t.app).get('/api/travelers').query({ limit: 100 }).set(auth(tok.builder))).body
    .items as { id: string; partNumber: string; buildId: string; letter: string }[];
  return parts.find((p) => p.buildId === buildId && p.partNumber === partNumber)!;
};

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  kitModelId = (await request(t.app).get('/api/kits').set(auth(tok.supplier))).body.items[0].id;
  const designs = (await request(t.app).get('/api/designs').query({ kitModelId }).set(auth(tok.supplier))).body
    .items as { id: string; partNumber: string }[];
  outerDesignId = designs.find((d) => d.partNumber === 'W-105')!.id;
  innerDesignId = designs.find((d) => d.partNumber === 'W-104')!.id;
  const demo = (await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items as {
    id: string;
    kitSerial: string;
  }[];
  builds['NK2-0147'] = demo.find((b) => b.kitSerial === 'NK2-0147')!.id;
  // Shipped after revision B of the outboard rib: their W-105 follows B, the demo build's follows A.
  for (const s of ['NK2-0149', 'NK2-0150', 'NK2-0160', 'NK2-0161']) await ship(s);
  // Work on NK2-0160's inboard rib: that part is built (being built), the others are not started.
  const inner = await partOf(builds['NK2-0160'], 'W-104');
  const tick = await request(t.app)
    .post(`/api/travelers/${inner.id}/holes`)
    .set(auth(tok.builder))
    .send({ holeIds: ['U-01'], status: 'installed' });
  expect(tick.status).toBe(200);
});

describe('effectivity, resolved when the notice is issued', () => {
  it('takes both ends of a serial range and nothing past them', async () => {
    // Serial ranges are inclusive at both ends (common practice for kit serial effectivity).
    const res = await issue(tok.supplier, { serialFrom: 'NK2-0150', serialTo: 'NK2-0160' });
    expect(res.status).toBe(201);
    expect(reached(res.body)).toEqual(['NK2-0150', 'NK2-0160']);
  });

  it('compares serial numbers, not text: NK2-150 to NK2-160 is the same range', async () => {
    const res = await issue(tok.supplier, { serialFrom: 'nk2-150', serialTo: 'NK2-160' });
    expect(res.status).toBe(201);
    expect(reached(res.body)).toEqual(['NK2-0150', 'NK2-0160']);
  });

  it('reaches only the parts made from the named revision: A of W-105 is on the demo build alone', async () => {
    const res = await issue(tok.supplier, { parts: [{ partDesignId: outerDesignId, letters: ['A'] }] });
    expect(res.body.error).toBeUndefined();
    expect(reached(res.body)).toEqual(['NK2-0147']);
    expect(
      res.body.builds[0].parts.map((p: { partNumber: string; letter: string }) => `${p.partNumber} ${p.letter}`),
    ).toEqual(['W-105 A']);
    const b = await issue(tok.supplier, { parts: [{ partDesignId: outerDesignId, letters: ['B'] }] });
    expect(reached(b.body)).toEqual(['NK2-0149', 'NK2-0150', 'NK2-0160', 'NK2-0161']);
  });

  it('tells parts with work recorded from parts not yet started', async () => {
    const started = await issue(tok.supplier, {
      parts: [{ partDesignId: innerDesignId, letters: [] }],
      reaches: 'started',
    });
    // The demo build's inboard rib has work on it from the demo's own bench.
    expect(reached(started.body)).toEqual(['NK2-0147', 'NK2-0160']);
    const fresh = await issue(tok.supplier, {
      parts: [{ partDesignId: innerDesignId, letters: [] }],
      reaches: 'not_started',
      serialFrom: 'NK2-0150',
      serialTo: 'NK2-0161',
    });
    expect(reached(fresh.body)).toEqual(['NK2-0150', 'NK2-0161']);
  });

  it('refuses a range that is half given, backwards, or of two different stems, and unknown revisions', async () => {
    const half = await issue(tok.supplier, { serialFrom: 'NK2-0150' });
    expect(half.status).toBe(400);
    expect(half.body.error.fields.serialTo).toMatch(/both ends/);
    const backwards = await issue(tok.supplier, { serialFrom: 'NK2-0160', serialTo: 'NK2-0150' });
    expect(backwards.body.error.fields.serialTo).toMatch(/comes before/);
    const stems = await issue(tok.supplier, { serialFrom: 'NK2-0150', serialTo: 'XK-0160' });
    expect(stems.body.error.fields.serialTo).toMatch(/same letters/);
    const letter = await issue(tok.supplier, { parts: [{ partDesignId: outerDesignId, letters: ['Q'] }] });
    expect(letter.status).toBe(400);
    expect(letter.body.error.message).toMatch(/no published revision Q/);
  });

  it('is the supplier’s alone to issue, and only for its own kit models', async () => {
    expect((await issue(tok.builder, {})).status).toBe(403);
    const other = await t.addUser('supplier', 'notices.other@elsewhere.example');
    const res = await issue(await t.signIn('notices.other@elsewhere.example'), {});
    expect(other).toBeTruthy();
    expect(res.status).toBe(404);
  });
});

describe('mail through the queue', () => {
  it('mails each person on the reached builds once, naming all their builds, and a refused mail is sent again', async () => {
    const before = t.smtp.messages.length;
    // The relay refuses the first mail: the queue retries it after its back-off.
    t.smtp.refuseNext(1);
    const res = await issue(tok.supplier, {
      title: 'Deburr the lightening holes again',
      serialFrom: 'NK2-0150',
      serialTo: 'NK2-0160',
      level: 'recommended',
    });
    expect(res.status).toBe(201);
    const subject = (m: { subject: string }) => m.subject.includes('Deburr the lightening holes again');
    await t.waitForMail((m) => subject(m) && m.to.includes(DEMO_USERS.builder.email), 45000);
    await t.waitForMail((m) => subject(m) && m.to.includes(DEMO_USERS.inspector.email), 45000);
    const mails = t.smtp.messages.slice(before).filter(subject);
    expect(mails.map((m) => m.to.join()).sort()).toEqual([DEMO_USERS.inspector.email, DEMO_USERS.builder.email].sort());
    expect(mails[0].subject).toContain('NK2-0150, NK2-0160');
    expect(mails[0].text).toContain(`/builds/notices/${res.body.id}`);

    // A job run again (a worker that died after sending) sends nothing more.
    // The worker records a mail just after the relay takes it: wait for both records, not only the mails.
    const sent = await t.waitUntil(async () => {
      const rows = await t.database.db.select().from(noticeMails).where(eq(noticeMails.noticeId, res.body.id));
      return rows.length >= 2 ? rows : undefined;
    }, 10000);
    expect(sent).toHaveLength(2);
    const worker = noticeMailWorker({
      db: t.database.db,
      mailer: createMailer(t.config.smtp),
      publicUrl: t.config.publicUrl,
    });
    await worker({ noticeId: res.body.id, userId: sent[0].userId });
    await new Promise((r) => setTimeout(r, 300));
    expect(t.smtp.messages.slice(before).filter(subject)).toHaveLength(2);
  });
});

describe('answers, in the build log and across builds', () => {
  let notice: NoticeDetail;
  const buildId = () => builds['NK2-0147'];

  beforeAll(async () => {
    const png = await jpeg('#358');
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');
    const res = await issue(
      tok.supplier,
      { title: 'Rivet pitch at the nose of W-105', parts: [{ partDesignId: outerDesignId, letters: ['A'] }] },
      [
        { buf: png, name: 'nose.jpg', type: 'image/jpeg' },
        { buf: pdf, name: 'sketch.pdf', type: 'application/pdf' },
      ],
    );
    expect(res.status).toBe(201);
    notice = res.body;
  });

  it('keeps the supplier’s photo and PDF, each behind a signed link', async () => {
    expect(notice.files.map((f) => `${f.kind} ${f.name}`)).toEqual(['photo nose.jpg', 'pdf sketch.pdf']);
    const detail = (await request(t.app).get(`/api/notices/${notice.id}`).set(auth(tok.builder))).body as NoticeDetail;
    const pdf = await request(t.app).get(detail.files[1].url);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toMatch(/application\/pdf/);
    expect(pdf.headers['content-disposition']).toMatch(/attachment/);
    const photo = await request(t.app).get(detail.files[0].thumbUrl!);
    expect(photo.headers['content-type']).toMatch(/image\/jpeg/);
  });

  it('refuses a fifth file in the words of a notice (four files, as "files"), not of a finding', async () => {
    const pdf = { buf: Buffer.from('%PDF-1.4\n%%EOF\n'), name: 'sheet.pdf', type: 'application/pdf' };
    const res = await issue(tok.supplier, {}, Array(MAX_NOTICE_FILES + 1).fill(pdf));
    expect([res.status, res.body.error.message]).toEqual([
      400,
      `attach at most ${MAX_NOTICE_FILES} files, as the "files" field`,
    ]);
  });

  it('refuses a file that is neither a photo nor a PDF, and keeps nothing of that notice', async () => {
    const count = async () =>
      ((await request(t.app).get('/api/notices').query({ kitModelId }).set(auth(tok.supplier))).body.items as unknown[])
        .length;
    const before = await count();
    const res = await issue(tok.supplier, {}, [
      { buf: Buffer.from('MZ not a picture'), name: 'tool.exe', type: 'image/jpeg' },
    ]);
    expect(res.status).toBe(415);
    expect(res.body.error.fields.files).toMatch(/neither a photo nor a PDF/);
    expect(await count()).toBe(before);
  });

  it('shows on the build and on the part it reached, for the builder', async () => {
    const onBuild = (await request(t.app).get('/api/notices').query({ buildId: buildId() }).set(auth(tok.builder))).body
      .items as NoticeSummary[];
    expect(onBuild.find((n) => n.id === notice.id)?.build).toMatchObject({ kitSerial: 'NK2-0147', status: 'open' });
    const outer = await partOf(buildId(), 'W-105');
    const inner = await partOf(buildId(), 'W-104');
    const onOuter = (await request(t.app).get('/api/notices').query({ travelerId: outer.id }).set(auth(tok.builder)))
      .body.items as NoticeSummary[];
    const onInner = (await request(t.app).get('/api/notices').query({ travelerId: inner.id }).set(auth(tok.builder)))
      .body.items as NoticeSummary[];
    expect(onOuter.map((n) => n.id)).toContain(notice.id);
    expect(onInner.map((n) => n.id)).not.toContain(notice.id);
  });

  it('is acknowledged once by someone on the build; an outsider may not see it', async () => {
    const outsiders = await t.outsiders();
    const hidden = await request(t.app).get(`/api/notices/${notice.id}`).set(auth(outsiders.builder));
    expect(hidden.status).toBe(404);
    const ack = await request(t.app)
      .post(`/api/notices/${notice.id}/builds/${buildId()}/acknowledge`)
      .set(auth(tok.inspector))
      .send({});
    expect(ack.status).toBe(200);
    expect(ack.body).toMatchObject({ status: 'acknowledged', acknowledgedByName: DEMO_USERS.inspector.name });
    const again = await request(t.app)
      .post(`/api/notices/${notice.id}/builds/${buildId()}/acknowledge`)
      .set(auth(tok.builder))
      .send({});
    expect(again.status).toBe(409);
  });

  it('takes what was done from the builders only, with a note and a photo, into the build log', async () => {
    const answer = (token: string, fields: Record<string, string>, photo = false) => {
      let req = request(t.app).post(`/api/notices/${notice.id}/builds/${buildId()}/compliance`).set(auth(token));
      for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
      return photo
        ? jpeg('#a53').then((b) => req.attach('photos', b, { filename: 'done.jpg', contentType: 'image/jpeg' }))
        : req;
    };
    const byInspector = await answer(tok.inspector, { outcome: 'done', note: 'Looked fine' });
    expect(byInspector.status).toBe(403);
    let fivePhotos = request(t.app)
      .post(`/api/notices/${notice.id}/builds/${buildId()}/compliance`)
      .set(auth(tok.builder))
      .field('outcome', 'done')
      .field('note', 'Pitch at the nose checked');
    for (let i = 0; i <= MAX_COMPLIANCE_PHOTOS; i++)
      fivePhotos = fivePhotos.attach('photos', await jpeg(), { filename: `p${i}.jpg`, contentType: 'image/jpeg' });
    const tooMany = await fivePhotos;
    expect([tooMany.status, tooMany.body.error.message]).toEqual([
      400,
      `attach at most ${MAX_COMPLIANCE_PHOTOS} photos, as the "photos" field`,
    ]);
    const noNote = await answer(tok.builder, { outcome: 'done' });
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.fields.note).toBeTruthy();
    const done = await answer(tok.builder, { outcome: 'done', note: 'Pitch at the nose checked, 0.75 in' }, true);
    expect(done.status).toBe(200);
    const body = done.body as NoticeBuildAnswer;
    expect(body).toMatchObject({
      status: 'done',
      note: 'Pitch at the nose checked, 0.75 in',
      answeredByName: DEMO_USERS.builder.name,
    });
    expect(body.photos).toHaveLength(1);

    const log = await request(t.app)
      .get(`/api/builds/${buildId()}/log`)
      .query({ kind: 'notices' })
      .set(auth(tok.builder));
    const texts = (log.body.items as { text: string; note?: string; photos?: unknown[] }[]).map((e) => e.text);
    expect(texts).toContain(
      `Recorded notice ${notice.number}, “Rivet pitch at the nose of W-105” as done, with 1 photo.`,
    );
    expect(texts).toContain(`Acknowledged notice ${notice.number}, “Rivet pitch at the nose of W-105”.`);
    expect(texts).toContain(
      `The supplier issued notice ${notice.number}, “Rivet pitch at the nose of W-105” (mandatory). It reaches 1 part of this build.`,
    );
    const entry = (log.body.items as { text: string; photos?: unknown[] }[]).find((e) =>
      e.text.startsWith('Recorded notice'),
    );
    expect(entry?.photos).toHaveLength(1);
  });

  it('prints the notice and its answer in the PDF summary, and the answer with its photo link in the CSV', async () => {
    // Text extracted with a PDF text library (tests/helpers/pdf-text.ts), not our own renderer.
    const text = await logPdfText(t.app, buildId(), tok.builder);
    expect(text).toContain('NOTICES FROM THE SUPPLIER AND WHAT WAS DONE');
    expect(text).toMatch(/\d+ notices; 1 of those listed answered\./);
    expect(text).toContain(`Notice ${notice.number} (mandatory), Rivet pitch at the nose of W-105`);
    expect(text).toMatch(/done .* by Tobias Fenn: Pitch at the nose checked, 0\.75 in/);
    const csv = await request(t.app).get(`/api/builds/${buildId()}/log.csv`).set(auth(tok.builder));
    const rows = parseCsv(csv.text);
    const head = rows[0];
    const row = rows.find((r) => r.some((c) => c.startsWith('Recorded notice')))!;
    expect(row[head.indexOf('Kind')]).toBe('Notice answered');
    expect(row.some((c) => /\/api\/photos\/[0-9a-f-]+\/full\?/.test(c))).toBe(true);
  });

  it('shows the supplier every build’s answer with counts', async () => {
    const detail = (await request(t.app).get(`/api/notices/${notice.id}`).set(auth(tok.supplier))).body as NoticeDetail;
    expect(detail.counts).toMatchObject({ builds: 1, done: 1, open: 0 });
    expect(detail.builds[0]).toMatchObject({ kitSerial: 'NK2-0147', status: 'done', allowed: [] });
    expect(detail.builds[0].photos[0].thumbUrl).toBeTruthy();
    const list = (await request(t.app).get('/api/notices').query({ kitModelId }).set(auth(tok.supplier))).body
      .items as NoticeSummary[];
    expect(list[0].id).toBe(notice.id);
  });

  it('records "does not apply" with its reason, and refuses photos with it', async () => {
    const wide = await issue(tok.supplier, {
      title: 'Primer batch recall',
      serialFrom: 'NK2-0149',
      serialTo: 'NK2-0149',
    });
    const url = `/api/notices/${wide.body.id}/builds/${builds['NK2-0149']}/compliance`;
    const withPhoto = await request(t.app)
      .post(url)
      .set(auth(tok.builder))
      .field('outcome', 'not_applicable')
      .field('reason', 'Primer from another batch')
      .attach('photos', await jpeg(), { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(withPhoto.status).toBe(400);
    const ok = await request(t.app)
      .post(url)
      .set(auth(tok.builder))
      .send({ outcome: 'not_applicable', reason: 'Primer from another batch' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ status: 'not_applicable', reason: 'Primer from another batch', note: null });
  });
});
