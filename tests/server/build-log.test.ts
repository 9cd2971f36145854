import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { MAX_PDF_THREADS, reservePdfThread } from '@/server/build-log/build-log-pdf-thread';
import { binaryBody, pdfText } from '../helpers/pdf-text';
import { auth, demoApp, demoRibs, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';
import { parseCsv } from '../helpers/csv';

jest.setTimeout(60000);

let t: TestApp;
let tok: Tokens;
let outsiders: Outsiders;
let buildId: string;
let innerId: string;
let outerId: string;
let findingId: string;

type Entry = {
  id: string;
  at: string;
  kind: string;
  actorName: string;
  holeIds?: string[];
  text: string;
  note?: string;
  findingId?: string;
  partNumber: string;
  photos?: { thumbUrl: string; url: string }[];
};
const kinds = (body: { items: Entry[] }) => body.items.map((e) => e.kind);
const log = (token: string, query: Record<string, string> = {}) =>
  request(t.app).get(`/api/builds/${buildId}/log`).query(query).set(auth(token));

demoApp((s) => ({ t, tok, outsiders } = s), { outsiders: true });
beforeAll(async () => {
  ({ innerId, outerId, buildId } = await demoRibs(t, tok.builder));
});

describe('the build log', () => {
  it('lists the demo ticks, the step and the flagged hole, newest first, with who did each', async () => {
    const res = await log(tok.builder);
    expect(res.status).toBe(200);
    expect(res.body.build).toMatchObject({ id: buildId, kitSerial: 'NK2-0147', supplierName: 'Northfold Kitworks' });
    expect(res.body.parts.map((p: { partNumber: string }) => p.partNumber)).toEqual(['W-104', 'W-105']);
    expect(kinds(res.body)).toEqual(['finding_raised', 'step_done', 'holes_installed', 'member_added', 'member_added']);
    const [flag, step, ticks] = res.body.items as Entry[];
    expect(ticks).toMatchObject({
      actorName: DEMO_USERS.builder.name,
      partNumber: 'W-104',
      holeIds: ['U-01', 'U-02', 'U-03', 'U-04', 'U-05', 'U-06', 'U-07', 'U-08'],
    });
    expect(ticks.text).toBe('Installed 8 holes: U-01 to U-08.');
    expect(step.text).toMatch(/^Step 1 done: Deburr all holes/);
    expect(flag).toMatchObject({
      holeIds: ['U-09'],
      note: 'Hole looks oval after deburring, about a drill size long fore and aft.',
    });
    expect(flag.text).toBe('Raised a finding on hole U-09: elongated hole.');
    findingId = flag.findingId!;
    expect(findingId).toBeTruthy();
    const entries = res.body.items as Entry[];
    for (let i = 1; i < entries.length; i++) expect(entries[i - 1].at >= entries[i].at).toBe(true);
    // Five entries fit one page: no cursor to a further one.
    expect(res.body.next).toBeNull();
    expect(entries.at(-1)!.kind).toBe('member_added');
  });

  it('carries the finding photo as a signed thumbnail and full-size link that load without a bearer header', async () => {
    const res = await log(tok.builder, { kind: 'findings' });
    const photo = res.body.items[0].photos[0];
    const thumb = await request(t.app).get(photo.thumbUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.type).toBe('image/jpeg');
    expect((await request(t.app).get(photo.url)).status).toBe(200);
  });

  it('shows the same log to the assigned inspector, the supplier and the admin', async () => {
    for (const token of [tok.inspector, tok.supplier, tok.admin]) {
      const res = await log(token);
      expect(res.status).toBe(200);
      expect(kinds(res.body)).toEqual([
        'finding_raised',
        'step_done',
        'holes_installed',
        'member_added',
        'member_added',
      ]);
    }
  });

  it('filters by kind family or kind, by part, by date and by search words', async () => {
    expect(kinds((await log(tok.builder, { kind: 'bench' })).body)).toEqual(['step_done', 'holes_installed']);
    expect(kinds((await log(tok.builder, { kind: 'findings' })).body)).toEqual(['finding_raised']);
    expect(kinds((await log(tok.builder, { kind: 'sign_off' })).body)).toEqual([]);
    expect(kinds((await log(tok.builder, { kind: 'holes_installed,finding_raised' })).body)).toEqual([
      'finding_raised',
      'holes_installed',
    ]);
    expect(kinds((await log(tok.builder, { travelerId: innerId })).body)).toHaveLength(3);
    expect(kinds((await log(tok.builder, { travelerId: outerId })).body)).toEqual([]);
    const today = new Date().toISOString().slice(0, 10);
    const tomorrow = new Date(Date.now() + 86400000).toISOString().slice(0, 10);
    const yesterday = new Date(Date.now() - 86400000).toISOString().slice(0, 10);
    expect(kinds((await log(tok.builder, { from: today, to: today })).body)).toHaveLength(5);
    expect(kinds((await log(tok.builder, { from: tomorrow })).body)).toEqual([]);
    expect(kinds((await log(tok.builder, { to: yesterday })).body)).toEqual([]);
    expect(kinds((await log(tok.builder, { from: new Date(Date.now() - 3600000).toISOString() })).body)).toHaveLength(
      5,
    );
    expect(kinds((await log(tok.builder, { kind: 'people' })).body)).toEqual(['member_added', 'member_added']);
    expect(kinds((await log(tok.builder, { q: 'u-09' })).body)).toEqual(['finding_raised']);
    expect(kinds((await log(tok.builder, { q: 'deburr step' })).body)).toEqual(['step_done']);
    // The parts list stays whole, so the picker can switch back.
    expect((await log(tok.builder, { travelerId: outerId })).body.parts).toHaveLength(2);
  });

  it('answers 400 naming the field for a bad date, a range that ends before it starts, or an unknown kind', async () => {
    const bad = await log(tok.builder, { from: '2026-13-45' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['from']);
    expect(bad.body.error.message).toMatch(/from/);
    expect((await log(tok.builder, { from: 'yesterday' })).body.error.fields).toHaveProperty('from');
    // Far-off days are refused by name rather than breaking the day arithmetic, and the server goes on.
    const far = await log(tok.builder, { to: '9999-12-31' });
    expect([far.status, Object.keys(far.body.error.fields)]).toEqual([400, ['to']]);
    expect((await log(tok.builder, { from: '0001-01-01T00:00:00Z' })).body.error.fields).toHaveProperty('from');
    expect((await log(tok.builder)).status).toBe(200);
    const backwards = await log(tok.builder, { from: '2026-11-05', to: '2026-11-01' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields).toHaveProperty('to');
    const kind = await log(tok.builder, { kind: 'bench,gossip' });
    expect(kind.status).toBe(400);
    expect(Object.keys(kind.body.error.fields)[0]).toMatch(/^kind/);
    const csv = await request(t.app)
      .get(`/api/builds/${buildId}/log.csv`)
      .query({ to: '31/12/2026' })
      .set(auth(tok.builder));
    expect(csv.status).toBe(400);
    expect(csv.body.error.fields).toHaveProperty('to');
  });

  it('keeps another builder, inspector or supplier out with 404 on the log and both exports', async () => {
    for (const token of [outsiders.builder, outsiders.inspector, outsiders.supplier]) {
      for (const suffix of ['log', 'log.csv', 'log.pdf']) {
        const res = await request(t.app).get(`/api/builds/${buildId}/${suffix}`).set(auth(token));
        expect(res.status).toBe(404);
        expect(res.body.error.code).toBe('not_found');
      }
    }
    // Nor can they reach it through a part of the build they cannot see.
    expect((await log(outsiders.builder, { travelerId: innerId })).status).toBe(404);
    expect((await request(t.app).get(`/api/builds/${buildId}/log.csv`)).status).toBe(401);
  });

  it('adds the disposition with its reason once the inspector decides', async () => {
    const res = await request(t.app)
      .post(`/api/findings/${findingId}/disposition`)
      .set(auth(tok.inspector))
      .send({ disposition: 'rework', note: 'Drill out to AD5, per the "oversize" sheet; check edge distance' });
    expect(res.status).toBe(200);
    const after = await log(tok.builder);
    expect(kinds(after.body)).toEqual([
      'finding_dispositioned',
      'finding_raised',
      'step_done',
      'holes_installed',
      'member_added',
      'member_added',
    ]);
    expect(after.body.items[0]).toMatchObject({
      actorName: DEMO_USERS.inspector.name,
      text: 'Dispositioned hole U-09: rework.',
      findingId,
    });
  });

  it('exports CSV: a header row, one row per entry oldest first, and a note with a comma and quotes read back whole', async () => {
    const res = await request(t.app).get(`/api/builds/${buildId}/log.csv`).set(auth(tok.builder)).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="build-log-NK2-0147-\d{4}-\d{2}-\d{2}\.csv"/,
    );
    const rows = parseCsv(res.text);
    const [header, ...lines] = rows;
    // The last line is no entry: it gives the log's hash chain head as the export began.
    const head = lines.at(-1)!;
    expect(head[header.indexOf('Entry')]).toBe('');
    expect(head[header.indexOf('What happened')]).toMatch(/^Chain head at export: link \d+, [0-9a-f]{64}$/);
    const all = lines.slice(0, -1);
    expect(all.every((r) => /^[0-9a-f]{64}$/.test(r[header.indexOf('Entry hash')]))).toBe(true);
    // The build's own entries (its people at shipping) come first; the part's follow.
    expect(all.slice(0, 2).map((r) => r[header.indexOf('Kind')])).toEqual(['Person added', 'Person added']);
    const body = all.slice(2);
    expect(header.slice(0, 9)).toEqual([
      'Date done',
      'Time done',
      'Time zone',
      'Done (UTC)',
      'Received (UTC)',
      'Device clock behind by (s)',
      'Who',
      'Role',
      'Kind',
    ]);
    expect(body.every((r) => r.length === header.length)).toBe(true);
    const col = (name: string) => header.indexOf(name);
    // Kinds in words, as the screen names them.
    expect(body.map((r) => r[col('Kind')])).toEqual([
      'Holes installed',
      'Step done',
      'Finding raised',
      'Dispositioned',
    ]);
    expect(body[3][col('Note')]).toBe('Drill out to AD5, per the "oversize" sheet; check edge distance');
    expect(body[0][col('Holes')]).toBe('U-01 U-02 U-03 U-04 U-05 U-06 U-07 U-08');
    // The photo as a link that opens without the app's sign-in (signed, on the product's public address).
    const link = body[2][col('Photos')];
    expect(link).toMatch(/^http:\/\/[^ ]+\/api\/photos\/[0-9a-f-]{36}\/full\?u=[0-9a-f-]{36}&exp=\d+&sig=[\w-]+$/);
    const photo = await request(t.app).get(new URL(link).pathname + new URL(link).search);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toMatch(/^image\//);
    // Valid about 30 days: the file is read later than a screen.
    const days = (Number(new URL(link).searchParams.get('exp')) * 1000 - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(29);
    expect(days).toBeLessThan(31);
    // The raw text quotes that field the RFC 4180 way.
    expect(res.text).toContain('"Drill out to AD5, per the ""oversize"" sheet; check edge distance"');
  });

  it('exports CSV with the same filters and in the reader’s time zone', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.csv`)
      .query({ kind: 'findings', tz: 'America/Denver' })
      .set(auth(tok.builder));
    const [header, ...lines] = parseCsv(res.text);
    const body = lines.filter((r) => r[header.indexOf('Entry')] !== '');
    expect(body.map((r) => r[header.indexOf('Kind')])).toEqual(['Finding raised', 'Dispositioned']);
    expect(body[0][header.indexOf('Time zone')]).toBe('America/Denver');
    const utc = new Date(body[0][header.indexOf('Done (UTC)')]);
    const local = `${body[0][header.indexOf('Date done')]}T${body[0][header.indexOf('Time done')]}`;
    const shift = (Date.parse(`${local}Z`) - Math.floor(utc.getTime() / 1000) * 1000) / 3600000;
    expect([-6, -7]).toContain(shift);
    expect(
      (await request(t.app).get(`/api/builds/${buildId}/log.csv`).query({ tz: 'Mars/Olympus' }).set(auth(tok.builder)))
        .body.error.fields,
    ).toHaveProperty('tz');
  });

  it('records a sign-off once every hole and step of a part is done', async () => {
    const part = await request(t.app).get(`/api/travelers/${outerId}`).set(auth(tok.builder));
    const holeIds = part.body.holes.map((h: { holeId: string }) => h.holeId);
    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${outerId}/holes`)
          .set(auth(tok.builder))
          .send({ holeIds, status: 'installed' })
      ).status,
    ).toBe(200);
    for (const s of part.body.steps) {
      expect(
        (
          await request(t.app)
            .post(`/api/travelers/${outerId}/steps/${s.id}`)
            .set(auth(tok.builder))
            .send({ done: true })
        ).status,
      ).toBe(200);
      // An inspection point is stamped before the next step may be done.
      if (s.inspectionPoint)
        expect(
          (await request(t.app).post(`/api/travelers/${outerId}/steps/${s.id}/stamp`).set(auth(tok.inspector))).status,
        ).toBe(200);
    }
    expect(
      (await request(t.app).post(`/api/travelers/${outerId}/sign-off`).set(auth(tok.inspector)).send({})).status,
    ).toBe(200);
    const res = await log(tok.supplier, { kind: 'sign_off' });
    // The inspector's stamp on the inspection point is a sign-off of its own, before the part's.
    expect(kinds(res.body)).toEqual(['signed_off', 'step_stamped']);
    expect(res.body.items[0]).toMatchObject({
      kind: 'signed_off',
      partNumber: 'W-105',
      actorName: DEMO_USERS.inspector.name,
    });
    const outer = await log(tok.supplier, { travelerId: outerId });
    expect(kinds(outer.body)[0]).toBe('signed_off');
    expect(outer.body.items.find((e: Entry) => e.kind === 'holes_installed').text).toMatch(
      new RegExp(`^Installed ${holeIds.length} holes: L-01 to L-\\d+, U-01 to U-\\d+\\.$`),
    );
  });

  it('answers 503 (before any byte) while every PDF thread place is taken, and makes the PDF again once one frees', async () => {
    // The app runs in this process: taking the places here is what two long exports in progress would do.
    const held = Array.from({ length: MAX_PDF_THREADS }, () => reservePdfThread());
    try {
      expect(held.every(Boolean)).toBe(true);
      const busy = await request(t.app).get(`/api/builds/${buildId}/log.pdf`).set(auth(tok.inspector));
      expect(busy.status).toBe(503);
      expect(busy.headers['retry-after']).toBe('60');
      expect(busy.headers['content-type']).toMatch(/json/);
      expect(busy.body.error.message).toMatch(/PDF logs are being made already: try again/);
      // The CSV has no thread and is not limited.
      expect((await request(t.app).get(`/api/builds/${buildId}/log.csv`).set(auth(tok.inspector))).status).toBe(200);
    } finally {
      held.forEach((release) => release?.());
    }
    const again = await request(t.app)
      .get(`/api/builds/${buildId}/log.pdf`)
      .set(auth(tok.inspector))
      .buffer(true)
      .parse(binaryBody);
    expect(again.status).toBe(200);
    // A refused or finished export gives its place back: all of them are free again.
    const all = Array.from({ length: MAX_PDF_THREADS }, () => reservePdfThread());
    expect(all.every(Boolean)).toBe(true);
    expect(reservePdfThread()).toBeNull();
    all.forEach((release) => release?.());
  });

  it('exports a PDF with the title block, the caution, every entry, the photo and page numbers', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.pdf`)
      .set(auth(tok.inspector))
      .buffer(true)
      .parse(binaryBody);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="build-log-NK2-0147-.*\.pdf"/);
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.toString('latin1')).toMatch(/\/Subtype \/Image/);
    const text = pdfText(pdf);
    for (const want of [
      'NK2-0147',
      'NK-2 Quillon two-seat trainer',
      'Northfold Kitworks',
      DEMO_USERS.builder.name,
      DEMO_USERS.inspector.name,
      'CAUTION',
      'not certification',
      'Installed 8 holes: U-01 to U-08.',
      'Raised a finding on hole U-09',
      'Signed the part off',
      'Page 1',
    ]) {
      expect(text).toContain(want);
    }
    // The title block's count (counted by PostgreSQL before the first entry is drawn) and the closing line agree with the listed log.
    const listed = (await log(tok.inspector, { limit: '100' })).body.items.length;
    expect(text).toContain(`${listed} in all`);
    expect(text).toContain(`End of log: ${listed} entries.`);
    expect(text).toContain('per the “oversize” sheet'.replace(/[“”]/g, '"'));
    expect(text.indexOf('Installed 8 holes')).toBeLessThan(text.indexOf('Dispositioned hole U-09'));
  });

  it('prints a filtered PDF that says it is filtered, and an empty one that says nothing matched', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.pdf`)
      .query({ kind: 'sign_off', from: '2001-01-01', to: '2001-01-02' })
      .set(auth(tok.builder))
      .buffer(true)
      .parse(binaryBody);
    expect(res.status).toBe(200);
    const text = pdfText(res.body as Buffer);
    expect(text).toContain('kinds: sign off');
    expect(text).toContain('No entries match these filters.');
  });
});
