/**
 * Bench actions carry the time they were done on the device: a tick made without signal at T0 and sent
 * at T1 is dated T0 in the log, the CSV and the PDF, with the moment it arrived beside it; a device clock
 * far from the server's is flagged. The PDF's text is read with a PDF text library (pdf-parse).
 */
import request from 'supertest';
import { benchTime } from '@/server/travelers/device-time';
import { zonedDateTime } from '@/lib/zoned-time';
import { logPdfText } from '../helpers/pdf-text';
import { parseCsv } from '../helpers/csv';
import { auth, demoApp, demoRibs, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(60000);

const MIN = 60_000;

describe('benchTime (the device-time rule)', () => {
  const arrival = new Date('2026-11-03T15:00:00.000Z');

  it('keeps the device times and measures the clock offset as arrival minus the device’s time of sending', () => {
    // Device clock 90 s behind: it says it sent at 14:58:30 while the server received at 15:00:00.
    expect(benchTime({ doneAt: '2026-11-03T12:00:00.000Z', sentAt: '2026-11-03T14:58:30.000Z' }, arrival)).toEqual({
      doneAt: new Date('2026-11-03T12:00:00.000Z'),
      clockOffsetMs: 90_000,
    });
    // An offset written with its zone is the same instant (ISO 8601).
    expect(benchTime({ doneAt: '2026-11-03T13:00:00+01:00' }, arrival)).toEqual({
      doneAt: new Date('2026-11-03T12:00:00.000Z'),
      clockOffsetMs: null,
    });
    expect(benchTime({}, arrival)).toEqual({ doneAt: null, clockOffsetMs: null });
  });

  it('refuses work done after it was sent, a future time with no send time, and a clock weeks off', () => {
    expect(benchTime({ doneAt: '2026-11-03T14:00:01Z', sentAt: '2026-11-03T14:00:00Z' }, arrival)).toMatchObject({
      field: 'doneAt',
      message: expect.stringMatching(/after sentAt/),
    });
    expect(benchTime({ doneAt: '2026-11-03T15:06:00Z' }, arrival)).toMatchObject({ field: 'doneAt' });
    // Up to five minutes ahead is a clock, not a fault.
    expect(benchTime({ doneAt: '2026-11-03T15:04:00Z' }, arrival)).toHaveProperty('doneAt');
    expect(benchTime({ sentAt: '2026-10-01T15:00:00Z' }, arrival)).toMatchObject({
      field: 'sentAt',
      message: expect.stringMatching(/33 days off/),
    });
  });
});

describe('device time through the API', () => {
  let t: TestApp;
  let tok: Tokens;
  let buildId: string;
  let outerId: string;

  demoApp((s) => ({ t, tok } = s));
  beforeAll(async () => {
    ({ outerId, buildId } = await demoRibs(t, tok.builder));
  });

  const tick = (holeIds: string[], extra: Record<string, string> = {}) =>
    request(t.app)
      .post(`/api/travelers/${outerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds, status: 'installed', ...extra });

  // Whole seconds: the CSV's local time has seconds, the PDF minutes.
  const t0 = new Date(Math.floor((Date.now() - 3 * 3600_000) / 1000) * 1000);
  let offlineEntryId: string;

  it('dates an offline tick by when it was done, after an online tick made later but sent first', async () => {
    const holes = (await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder))).body.holes as {
      holeId: string;
    }[];
    expect((await tick([holes[0].holeId])).status).toBe(200);
    const sentAt = new Date().toISOString();
    const res = await tick([holes[1].holeId], { doneAt: t0.toISOString(), sentAt });
    expect(res.status).toBe(200);

    const log = await request(t.app).get(`/api/builds/${buildId}/log`).set(auth(tok.builder));
    const items = log.body.items as {
      id: string;
      at: string;
      receivedAt: string;
      clockOffsetMs: number | null;
      holeIds?: string[];
    }[];
    const offline = items.find((e) => e.holeIds?.[0] === holes[1].holeId)!;
    const online = items.find((e) => e.holeIds?.[0] === holes[0].holeId)!;
    expect(offline.at).toBe(t0.toISOString());
    expect(Date.parse(offline.receivedAt)).toBeGreaterThan(Date.parse(online.receivedAt));
    // Newest first by the time of the work: the offline tick (done three hours ago) lists after the online one.
    expect(items.indexOf(offline)).toBeGreaterThan(items.indexOf(online));
    // Same machine, same clock: the offset is the request's own transit, well under the flag.
    expect(Math.abs(offline.clockOffsetMs!)).toBeLessThan(MIN);
    expect(online.clockOffsetMs).toBeNull();
    offlineEntryId = offline.id;
  });

  it('prints the time done and the time received in the CSV', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.csv`)
      .query({ tz: 'UTC' })
      .set(auth(tok.builder))
      .buffer(true);
    const [header, ...rows] = parseCsv(res.text);
    const row = rows.find((r) => r[header.indexOf('Entry')] === offlineEntryId)!;
    expect(row[header.indexOf('Done (UTC)')]).toBe(t0.toISOString());
    expect(Date.parse(row[header.indexOf('Received (UTC)')])).toBeGreaterThan(t0.getTime() + 2 * 3600_000);
    expect(`${row[header.indexOf('Date done')]}T${row[header.indexOf('Time done')]}Z`).toBe(
      t0.toISOString().replace('.000Z', 'Z'),
    );
    expect(row[header.indexOf('Kind')]).toBe('Holes installed');
    expect(row[header.indexOf('Times')]).toMatch(/^Done on the device; received \d{4}-\d{2}-\d{2} \d{2}:\d{2}\.$/);
  });

  it('prints the time done in the PDF, with the moment it was received', async () => {
    const text = await logPdfText(t.app, buildId, tok.builder);
    const done = zonedDateTime(t0, 'UTC');
    expect(text).toContain(done.hm);
    expect(text).toMatch(/Done on the device; received \d{4}-\d{2}-\d{2} \d{2}:\d{2}\./);
  });

  it('flags a device clock far from the server’s, on the screen’s entry and in the CSV', async () => {
    const holes = (await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder))).body.holes as {
      holeId: string;
      status: string;
    }[];
    const next = holes.find((h) => h.status === 'pending')!.holeId;
    // A device clock 40 minutes ahead: it says it sent 40 minutes from now.
    const sentAt = new Date(Date.now() + 40 * MIN).toISOString();
    expect((await tick([next], { doneAt: sentAt, sentAt })).status).toBe(200);
    const log = await request(t.app).get(`/api/builds/${buildId}/log`).set(auth(tok.builder));
    const e = (log.body.items as { holeIds?: string[]; clockOffsetMs: number }[]).find((x) => x.holeIds?.[0] === next)!;
    expect(e.clockOffsetMs).toBeLessThan(-39 * MIN);
    const csv = await request(t.app).get(`/api/builds/${buildId}/log.csv`).set(auth(tok.builder)).buffer(true);
    const [header, ...rows] = parseCsv(csv.text);
    const row = rows.find((r) => r[header.indexOf('Holes')] === next)!;
    expect(row[header.indexOf('Times')]).toMatch(/Device clock (39|40) min ahead of the server’s/);
    expect(Number(row[header.indexOf('Device clock behind by (s)')])).toBeLessThan(-39 * 60);
  });

  it('refuses a faulty device time with the field named and changes nothing', async () => {
    const before = (await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder))).body.holes;
    const pending = (before as { holeId: string; status: string }[]).find((h) => h.status === 'pending')!.holeId;
    const late = await tick([pending], { doneAt: '2026-11-03T14:00:01Z', sentAt: '2026-11-03T14:00:00Z' });
    expect(late.status).toBe(400);
    expect(late.body.error.fields).toHaveProperty('doneAt');
    const garbled = await tick([pending], { doneAt: 'yesterday' });
    expect(garbled.status).toBe(400);
    expect(garbled.body.error.fields.doneAt).toMatch(/date and time with its offset/);
    const step = await request(t.app)
      .post(`/api/travelers/${outerId}/steps/${'00000000-0000-4000-8000-000000000000'}`)
      .set(auth(tok.builder))
      .send({ done: true, sentAt: '1999-12-31T23:59:59Z' });
    expect(step.status).toBe(400);
    const after = (await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder))).body.holes;
    expect(after).toEqual(before);
  });

  it('dates a step by the device too', async () => {
    const detail = (await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder))).body;
    const stepId = detail.steps.find((s: { doneAt: string | null }) => s.doneAt === null).id as string;
    const doneAt = new Date(Date.now() - 2 * 3600_000).toISOString();
    const res = await request(t.app)
      .post(`/api/travelers/${outerId}/steps/${stepId}`)
      .set(auth(tok.builder))
      .send({ done: true, doneAt, sentAt: new Date().toISOString() });
    expect(res.status).toBe(200);
    expect(res.body.steps.find((s: { id: string }) => s.id === stepId).doneAt).toBe(doneAt);
    const log = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ kind: 'step_done' })
      .set(auth(tok.builder));
    expect((log.body.items as { at: string }[]).map((e) => e.at)).toContain(doneAt);
  });
});
