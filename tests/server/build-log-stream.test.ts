import { sql } from 'drizzle-orm';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { binaryBody, pdfText } from '../helpers/pdf-text';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';
import { parseCsv } from '../helpers/csv';

jest.setTimeout(180000);

/**
 * A log longer than one export batch (1,000 rows) and than many pages: the cursor walk, the CSV and the
 * PDF must each hold every entry once, in the one order. Rows are written the way the product writes
 * them (a holes_installed bench event with its hole ids; a note_changed build event), in bulk.
 */
let t: TestApp;
let tok: Tokens;
let buildId: string;
let demoCount: number;
const HOLES = 2500;
const NOTES = 100;

type Entry = { id: string; at: string; kind: string; holeIds?: string[]; text: string };
const hole = (i: number) => `H${String(i).padStart(4, '0')}`;

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  buildId = (
    (await request(t.app).get('/api/builds').set(auth(tok.supplier))).body.items as { id: string; kitSerial: string }[]
  ).find((b) => b.kitSerial === 'NK2-0147')!.id;
  const first = await request(t.app).get(`/api/builds/${buildId}/log`).query({ limit: 100 }).set(auth(tok.builder));
  expect(first.body.next).toBeNull();
  demoCount = first.body.items.length;

  const db = t.database.db;
  const [{ traveler, actor }] = (
    await db.execute(sql`
    select t.id as traveler, u.id as actor from travelers t join part_designs p on true
      join design_revisions r on r.id = t.revision_id and r.part_design_id = p.id, users u
    where t.build_id = ${buildId} and p.part_number = 'W-104' and u.email = ${DEMO_USERS.builder.email}`)
  ).rows as { traveler: string; actor: string }[];
  // Three bench events share each second, and every 7th second a build event too: ties inside one source
  // and across sources, which the order breaks by source and id.
  await db.execute(sql`
    insert into traveler_events (traveler_id, actor_id, created_at, kind, detail)
    select ${traveler}::uuid, ${actor}::uuid, timestamptz '2026-10-01 08:00:00+00' + (i / 3) * interval '1 second', 'holes_installed',
      jsonb_build_object('holeIds', jsonb_build_array('H' || lpad(i::text, 4, '0')))
    from generate_series(1, ${HOLES}) i`);
  await db.execute(sql`
    insert into build_events (build_id, actor_id, created_at, kind, detail)
    select ${buildId}::uuid, ${actor}::uuid, timestamptz '2026-10-01 08:00:00+00' + (j * 7) * interval '1 second', 'note_changed',
      jsonb_build_object('from', '', 'to', 'N' || j)
    from generate_series(1, ${NOTES}) j`);
});

describe('a long build log', () => {
  let walked: Entry[] = [];

  it('walks page by page with the cursor, each entry once, newest first, ties in one stable order', async () => {
    let cursor: string | null = null;
    const total = demoCount + HOLES + NOTES;
    for (let page = 0; page < 100; page++) {
      const res: request.Response = await request(t.app)
        .get(`/api/builds/${buildId}/log`)
        .query({ limit: 100, ...(cursor ? { cursor } : {}) })
        .set(auth(tok.builder));
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBeLessThanOrEqual(100);
      // Only the first page names the build and its parts.
      expect('build' in res.body).toBe(page === 0);
      walked.push(...res.body.items);
      cursor = res.body.next;
      if (!cursor) break;
    }
    expect(cursor).toBeNull();
    expect(walked).toHaveLength(total);
    expect(new Set(walked.map((e) => e.id)).size).toBe(total);
    for (let i = 1; i < walked.length; i++) {
      const [a, b] = [walked[i - 1], walked[i]];
      expect(a.at >= b.at).toBe(true);
      // Seeded rows sit on whole seconds, so equal `at` is an equal instant: then source, then id, both descending.
      if (a.at === b.at && a.at.endsWith(':00.000Z') === b.at.endsWith(':00.000Z')) expect(a.id > b.id).toBe(true);
    }
    const holes = walked
      .filter((e) => e.holeIds?.length === 1 && e.holeIds[0].startsWith('H'))
      .map((e) => e.holeIds![0]);
    expect(new Set(holes)).toEqual(new Set(Array.from({ length: HOLES }, (_, i) => hole(i + 1))));
  });

  it('answers 400 for a cursor it did not give', async () => {
    const bad = [
      'not-a-cursor',
      Buffer.from('["2026-10-01T08:00:00.000000","t"]').toString('base64url'), // too short
      Buffer.from('["2026-10-01T08:00:00.000000","x","00000000-0000-0000-0000-000000000000"]').toString('base64url'), // no such source
      Buffer.from('["2026-10-01T08:00:00.000000","t","1; drop table builds"]').toString('base64url'), // not an id
      Buffer.from('["2026-13-45T08:00:00.000000","t","00000000-0000-0000-0000-000000000000"]').toString('base64url'), // no such day
      Buffer.from('["2026-10-01T08:00:00.000Z","00000000-0000-0000-0000-000000000000"]').toString('base64url'), // another list's
    ];
    for (const cursor of bad) {
      const res = await request(t.app).get(`/api/builds/${buildId}/log`).query({ cursor }).set(auth(tok.builder));
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('cursor');
    }
  });

  it('finds search words on a page far down the log', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log`)
      .query({ q: hole(2) })
      .set(auth(tok.builder));
    expect(res.status).toBe(200);
    expect(res.body.items.map((e: Entry) => e.text)).toEqual([`Installed hole ${hole(2)}.`]);
    expect(res.body.next).toBeNull();
  });

  it('streams a CSV that holds every entry once, oldest first, in the order of the pages reversed', async () => {
    const res = await request(t.app).get(`/api/builds/${buildId}/log.csv`).set(auth(tok.builder)).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="build-log-NK2-0147-/);
    const [header, ...lines] = parseCsv(res.text);
    expect(lines.every((r) => r.length === header.length)).toBe(true);
    const col = (name: string) => header.indexOf(name);
    // Every row is an entry but the last, which gives the chain's head.
    const rows = lines.filter((r) => r[col('Entry')] !== '');
    expect(rows).toHaveLength(walked.length);
    // Same entries, same order: the export reads the log forwards with the same tie-break the pages read backwards.
    const fromPages = [...walked].reverse();
    expect(rows.map((r) => [r[col('Entry')], r[col('Done (UTC)')], r[col('Holes')], r[col('What happened')]])).toEqual(
      fromPages.map((e) => [e.id, e.at, (e.holeIds ?? []).join(' '), e.text]),
    );
  });

  it('streams a PDF that holds every entry once, oldest first, with the count in its title block', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.pdf`)
      .set(auth(tok.builder))
      .buffer(true)
      .parse(binaryBody);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF/);
    const text = pdfText(pdf);
    const printed = [...text.matchAll(/Installed hole (H\d{4})\./g)].map((m) => m[1]);
    const fromPages = [...walked]
      .reverse()
      .filter((e) => e.holeIds?.length === 1 && e.holeIds[0].startsWith('H'))
      .map((e) => e.holeIds![0]);
    expect(printed).toEqual(fromPages);
    const notes = [...text.matchAll(/Changed the build's note to: (N\d+)/g)].map((m) => m[1]);
    expect(notes).toHaveLength(NOTES);
    expect(text).toContain(`${walked.length} in all`);
    expect(text).toContain(`End of log: ${walked.length} entries.`);
    // Pages are numbered as they are written (no page total: nothing holds every page to count them).
    const pages = (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
    expect(pages).toBeGreaterThan(20);
    expect(text).toContain(`Page ${pages}`);
    expect(text).not.toContain(`Page ${pages + 1}`);
  });

  it('answers a refused export as JSON before any byte of the file', async () => {
    const res = await request(t.app)
      .get(`/api/builds/${buildId}/log.pdf`)
      .query({ travelerId: '00000000-0000-4000-8000-000000000000' })
      .set(auth(tok.builder));
    expect(res.status).toBe(404);
    expect(res.headers['content-disposition']).toBeUndefined();
    expect(res.body.error.code).toBe('not_found');
  });
});
