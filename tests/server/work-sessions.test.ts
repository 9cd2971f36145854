/**
 * Hours at the bench: a session started and stopped on a part, hours entered afterwards, help named;
 * the part's and the build's sums by who, and the log's entries dated when the work was done. Sums
 * are checked against hours worked out by hand.
 */
import request from 'supertest';
import { logPdfText } from '../helpers/pdf-text';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let outerId: string;
let innerId: string;
let buildId: string;
const H = 3_600_000;

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  ({ innerId, outerId, buildId } = await demoRibs(t, tok.builder));
});

const post = (id: string, what: string, body: Record<string, unknown>, token = tok.builder) =>
  request(t.app).post(`/api/travelers/${id}/work/${what}`).set(auth(token)).send(body);

describe('hours at the bench', () => {
  it('times a session from its start on the device to its stop', async () => {
    const start = new Date(Date.now() - 2.5 * H);
    const started = await post(outerId, 'start', { doneAt: start.toISOString(), sentAt: new Date().toISOString() });
    expect(started.status).toBe(200);
    expect(started.body.work.running).toMatchObject({ by: 'builder', startedAt: start.toISOString(), endedAt: null });
    // One running session per person and part.
    const again = await post(outerId, 'start', {});
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/^you have a session running on this part since /);
    const stopped = await post(outerId, 'stop', {});
    expect(stopped.status).toBe(200);
    expect(stopped.body.work.running).toBeNull();
    // 2.5 h, to the second the request took.
    expect(stopped.body.work.totalHours).toBeCloseTo(2.5, 1);
    expect((await post(outerId, 'stop', {})).status).toBe(409);
  });

  it('stops a forgotten session at the hours given, and refuses one that ran past a long day', async () => {
    const start = new Date(Date.now() - 20 * H).toISOString();
    expect((await post(innerId, 'start', { doneAt: start })).status).toBe(200);
    const tooLong = await post(innerId, 'stop', {});
    expect(tooLong.status).toBe(409);
    expect(tooLong.body.error.message).toBe(
      'this session has run 20 hours: give the hours actually worked (at most 16)',
    );
    const ok = await post(innerId, 'stop', { hours: 3 });
    expect(ok.status).toBe(200);
    expect(ok.body.work.recent[0]).toMatchObject({
      startedAt: start,
      endedAt: new Date(Date.parse(start) + 3 * H).toISOString(),
      entered: false,
    });
  });

  it('takes hours entered afterwards, naming help, and refuses what cannot be', async () => {
    const day = new Date(Date.now() - 48 * H);
    day.setUTCMinutes(0, 0, 0);
    const helper = await post(outerId, 'hours', {
      startedAt: day.toISOString(),
      hours: 1.25,
      by: 'helper',
      byName: 'Sam Ortiz',
    });
    expect(helper.status).toBe(200);
    const unnamed = await post(outerId, 'hours', { startedAt: day.toISOString(), hours: 1, by: 'commercial' });
    expect(unnamed.status).toBe(400);
    expect(unnamed.body.error.fields.byName).toBe('say who helped: a helper’s or a shop’s name');
    for (const [body, field] of [
      [{ startedAt: day.toISOString(), hours: 17 }, 'hours'],
      [{ startedAt: day.toISOString(), hours: 0 }, 'hours'],
      [{ startedAt: day.toISOString(), hours: 1.0001 }, 'hours'],
      [{ startedAt: '2026-11-03', hours: 1 }, 'startedAt'],
      [{ startedAt: new Date(Date.now() - 0.5 * H).toISOString(), hours: 2 }, 'startedAt'],
    ] as const) {
      const res = await post(outerId, 'hours', body);
      expect([res.status, Object.keys(res.body.error.fields ?? {})]).toEqual([400, [field]]);
    }
    // Only a builder of the build keeps its hours; someone outside it does not see the part.
    expect((await post(outerId, 'hours', { startedAt: day.toISOString(), hours: 1 }, tok.inspector)).status).toBe(403);
    expect((await post(outerId, 'hours', { startedAt: day.toISOString(), hours: 1 }, outsiders.builder)).status).toBe(
      404,
    );
  });

  it('sums the build’s hours by who (worked by hand: 2.5 + 3 for the builder, 1.25 for the helper)', async () => {
    const res = await request(t.app).get(`/api/builds/${buildId}/hours`).set(auth(tok.supplier));
    expect(res.status).toBe(200);
    const rows = res.body as { who: string; by: string; hours: number }[];
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ by: 'builder' });
    expect(rows[0].hours).toBeCloseTo(5.5, 1);
    expect(rows[1]).toEqual({ who: 'Sam Ortiz', by: 'helper', hours: 1.25 });
    expect((await request(t.app).get(`/api/builds/${buildId}/hours`).set(auth(outsiders.builder))).status).toBe(404);
  });

  it('writes each into the log, dated when the work was done', async () => {
    const log = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ kind: 'work_started,work_stopped,hours_entered' })
      .set(auth(tok.builder));
    const texts = (log.body.items as { text: string }[]).map((e) => e.text);
    expect(texts).toContain('Entered 1 h 15 min worked on the part by a helper, Sam Ortiz.');
    expect(texts).toContain('Stopped work on the part (3 h).');
    expect(texts.filter((x) => x === 'Started work on the part.')).toHaveLength(2);
    const entered = (log.body.items as { text: string; at: string; receivedAt: string }[]).find((e) =>
      e.text.startsWith('Entered'),
    )!;
    expect(Date.parse(entered.receivedAt) - Date.parse(entered.at)).toBeGreaterThan(47 * H);
  });

  it('prints the summary figures in the PDF, read back with a PDF text library', async () => {
    const text = await logPdfText(t.app, buildId, tok.builder);
    // Hours by who: the builder 2.5 h timed + 3 h given at stop = 5 h 30 min; the helper 1 h 15 min; 6 h 45 min in all.
    expect(text).toMatch(/Tobias Fenn: 5 h 30 min/);
    expect(text).toContain('Sam Ortiz (a helper): 1 h 15 min');
    expect(text).toContain('In all: 6 h 45 min');
    // The demo's one done step (deburr, the builder's fabrication) is the build's only credited step: 100 %.
    expect(text).toMatch(/The build 1 0 0 0 0 0 \d+ 100 %/);
    expect(text).toContain('0 of 2 parts signed off.');
    // The demo's one finding, still open.
    expect(text).toContain('1 finding; 1 of those listed still open.');
    expect(text).toMatch(/W-104 U-09 · Elongated hole · raised \d{4}-\d{2}-\d{2}/);
  });
});
