import { createHash } from 'node:crypto';
import request from 'supertest';
import { csvRow } from '@/server/build-log/build-log-csv';
import { auth, demoApp, demoRibs, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(90000);

let t: TestApp;
let tok: Tokens;
let outsider: string;
let buildId: string;
let innerId: string;
let outerId: string;

type Link = { seq: number; source: 'b' | 'f' | 't'; eventId: string; hash: string };

const sql = async <T = Record<string, unknown>>(text: string, params: unknown[] = []) =>
  (await t.database.pool.query(text, params)).rows as T[];

const links = (build = buildId) =>
  sql<Link>('select seq, source, event_id as "eventId", hash from log_chain where build_id = $1 order by seq', [build]);
const chain = (token = tok.builder) => request(t.app).get(`/api/builds/${buildId}/log/chain`).set(auth(token));

/** A stored timestamp as PostgreSQL prints it in UTC ("2026-12-03 12:17:36.1234", fraction trimmed), padded to microseconds. */
const utcText = (pgText: string | null) => {
  if (pgText === null) return '';
  const [date, time] = pgText.split(' ');
  const [whole, frac = ''] = time.split('.');
  return `${date}T${whole}.${frac.padEnd(6, '0')}Z`;
};
const field = (v: unknown) => (v === null || v === undefined ? '' : String(v));

/**
 * Every event of the build with its canonical text, assembled here from the raw columns as documented
 * in server/build-log/README.md ("Hash chain"): source letter, the columns in table order, nulls empty,
 * jsonb as PostgreSQL prints it, times UTC to the microsecond, joined by U+001F.
 */
async function canonicalTexts(build = buildId): Promise<Map<string, string>> {
  const ts = (col: string) => `(${col} at time zone 'UTC')::text`;
  const logColumns = `e.actor_id::text as actor, e.kind, e.detail::text as detail, ${ts('e.created_at')} as created,
    ${ts('e.done_at')} as done, e.clock_offset_ms as offset`;
  const bench = await sql(
    `select 't' as source, e.id::text, e.traveler_id::text as owner, ${logColumns}
       from traveler_events e join travelers tr on tr.id = e.traveler_id where tr.build_id = $1
     union all
     select 'b', e.id::text, e.build_id::text, ${logColumns} from build_events e where e.build_id = $1`,
    [build],
  );
  const findings = await sql(
    `select e.id::text, e.finding_id::text as owner, e.actor_id::text as actor, e.action::text as action,
       e.actor_place::text as place, e.from_status::text as "from", e.to_status::text as "to",
       e.disposition::text as disposition, e.note, ${ts('e.created_at')} as created
     from finding_events e join findings f on f.id = e.finding_id join travelers tr on tr.id = f.traveler_id
     where tr.build_id = $1`,
    [build],
  );
  const out = new Map<string, string>();
  for (const r of bench)
    out.set(
      `${r.source}:${r.id}`,
      [
        r.source,
        r.id,
        r.owner,
        r.actor,
        r.kind,
        r.detail,
        utcText(r.created as string),
        utcText(r.done as string),
        r.offset,
      ]
        .map(field)
        .join('\u001f'),
    );
  for (const r of findings)
    out.set(
      `f:${r.id}`,
      [
        'f',
        r.id,
        r.owner,
        r.actor,
        r.action,
        r.place,
        r.from,
        r.to,
        r.disposition,
        r.note,
        utcText(r.created as string),
      ]
        .map(field)
        .join('\u001f'),
    );
  return out;
}

/** SHA-256 as FIPS 180-4 defines it, from Node's crypto (OpenSSL): the outside reference for the database's sha256(). */
const sha256Hex = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

/** The exported CSV's shape (RFC 4180, BOM, CRLF) with the two columns the check reads, and the closing chain-head row. */
function exportCsv(rows: { entryId: string; hash: string }[], head: string): Buffer {
  const lines = [
    csvRow(['Date', 'What happened', 'Entry', 'Entry hash']),
    ...rows.map((r) => csvRow(['2026-12-03', 'Installed hole U-10, with "quotes", and a comma.', r.entryId, r.hash])),
    csvRow(['', `Chain head: ${head}`, '', '']),
  ];
  return Buffer.from(`\uFEFF${lines.join('\r\n')}\r\n`, 'utf8');
}
const checkFile = (file: Buffer | null, token = tok.builder, name = 'log.csv', fieldName = 'file') => {
  const req = request(t.app).post(`/api/builds/${buildId}/log/check`).set(auth(token));
  return file ? req.attach(fieldName, file, { filename: name, contentType: 'text/csv' }) : req;
};
const storedRows = async () => (await links()).map((l) => ({ entryId: `${l.source}:${l.eventId}`, hash: l.hash }));

/** Runs `fn` with one of the table's triggers off, as a superuser tampering with the database would. */
async function withTriggerOff(table: string, trigger: string, fn: () => Promise<unknown>) {
  await sql(`alter table ${table} disable trigger ${trigger}`);
  try {
    await fn();
  } finally {
    await sql(`alter table ${table} enable trigger ${trigger}`);
  }
}

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  outsider = (await t.outsiders()).builder;
  ({ innerId, outerId, buildId } = await demoRibs(t, tok.builder));
});

const pendingHoles = async (travelerId: string) =>
  (
    (await request(t.app).get(`/api/travelers/${travelerId}`).set(auth(tok.builder))).body.holes as {
      holeId: string;
      status: string;
    }[]
  )
    .filter((h) => h.status === 'pending')
    .map((h) => h.holeId);

describe('the build log hash chain', () => {
  it('links every build, finding and bench event in order, seq 1…n, each hash recomputed here from the stored fields', async () => {
    // New events of each kind written through the API, on top of the demo's (a build event, a tick, a step).
    const note = await request(t.app)
      .patch(`/api/builds/${buildId}`)
      .set(auth(tok.supplier))
      .send({ kitSerial: 'NK2-0147', note: 'Fuselage kit ships in spring' });
    expect(note.status).toBe(200);
    const [hole] = await pendingHoles(innerId);
    const tick = await request(t.app)
      .post(`/api/travelers/${innerId}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: [hole], status: 'installed' });
    expect(tick.status).toBe(200);

    const stored = await links();
    expect(stored.map((l) => l.seq)).toEqual(stored.map((_, i) => i + 1));
    expect(new Set(stored.map((l) => l.source))).toEqual(new Set(['b', 'f', 't']));
    const texts = await canonicalTexts();
    // Every event has exactly one link, and every link an event.
    expect(stored.map((l) => `${l.source}:${l.eventId}`).sort()).toEqual([...texts.keys()].sort());
    let prev = '';
    for (const l of stored) {
      const expected = sha256Hex(`${prev}\u001e${texts.get(`${l.source}:${l.eventId}`)}`);
      expect({ seq: l.seq, hash: l.hash }).toEqual({ seq: l.seq, hash: expected });
      prev = l.hash;
    }
    // An outside check of the helper itself: FIPS 180-4's "abc" example (Appendix B.1).
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');

    const res = await chain();
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      length: stored.length,
      head: { seq: stored.length, hash: stored.at(-1)!.hash },
      ok: true,
      breaks: [],
    });
  });

  it('keeps one gapless chain when two parts of the build are ticked at the same time', async () => {
    const before = (await links()).length;
    const inner = (await pendingHoles(innerId)).slice(0, 5);
    const outer = (await pendingHoles(outerId)).slice(0, 5);
    expect([inner.length, outer.length]).toEqual([5, 5]);
    const ticks = [...inner.map((h) => [innerId, h]), ...outer.map((h) => [outerId, h])].map(([part, holeId]) =>
      request(t.app)
        .post(`/api/travelers/${part}/holes`)
        .set(auth(tok.builder))
        .send({ holeIds: [holeId], status: 'installed' }),
    );
    expect((await Promise.all(ticks)).map((r) => r.status)).toEqual(Array(10).fill(200));
    const stored = await links();
    expect(stored.length).toBe(before + 10);
    expect(stored.map((l) => l.seq)).toEqual(stored.map((_, i) => i + 1));
    const res = await chain();
    expect(res.body).toMatchObject({ ok: true, breaks: [], length: before + 10 });
  });

  it('makes a second writer of the same build wait for the first to commit, so both links follow each other', async () => {
    // Two open transactions, one bench event each on the two parts: the second insert must wait (its link
    // reads the first's), not take the same seq and fail when the first commits.
    const [a, b] = [await t.database.pool.connect(), await t.database.pool.connect()];
    const insert = (part: string) =>
      `insert into traveler_events (traveler_id, actor_id, kind, detail)
       select '${part}', actor_id, 'step_done', '{"seq":1}'::jsonb from traveler_events limit 1`;
    try {
      await a.query('begin');
      await b.query('begin');
      await a.query(insert(innerId));
      const second = b.query(insert(outerId));
      const end = Date.now() + 5000;
      let waiting = 0;
      while (!waiting && Date.now() < end) {
        [{ waiting }] = await sql<{ waiting: number }>(
          `select count(*)::int as waiting from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'`,
        );
      }
      expect(waiting).toBe(1);
      await a.query('commit');
      await second;
      await b.query('commit');
    } finally {
      await a.query('rollback').catch(() => undefined);
      await b.query('rollback').catch(() => undefined);
      a.release();
      b.release();
    }
    const stored = await links();
    expect(stored.map((l) => l.seq)).toEqual(stored.map((_, i) => i + 1));
    expect((await chain()).body).toMatchObject({ ok: true, length: stored.length });
  });

  it('refuses to edit or delete a log entry in place: a correction is a new entry', async () => {
    for (const table of ['traveler_events', 'finding_events', 'build_events']) {
      const [{ id }] = await sql<{ id: string }>(`select id from ${table} limit 1`);
      await expect(sql(`update ${table} set created_at = now() where id = $1`, [id])).rejects.toThrow(
        /log entries are never edited: a correction is a new entry/,
      );
      await expect(sql(`delete from ${table} where id = $1`, [id])).rejects.toThrow(
        /log entries are never deleted or edited: a correction is a new entry/,
      );
    }
    expect((await chain()).body.ok).toBe(true);
  });

  it('hides the chain and the file check of a build from someone who may not see it (404) and from no one signed in (401)', async () => {
    expect((await chain(outsider)).status).toBe(404);
    const file = exportCsv(await storedRows(), 'x');
    const res = await checkFile(file, outsider);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    // The upload of a build one may not see is not even read: 404, not "too large".
    const big = await checkFile(Buffer.alloc(20 * 1024 * 1024 + 1, 'a'), outsider);
    expect(big.status).toBe(404);
    expect((await request(t.app).get(`/api/builds/${buildId}/log/chain`)).status).toBe(401);
    expect((await request(t.app).post(`/api/builds/${buildId}/log/check`)).status).toBe(401);
  });

  it('matches an exported CSV row by row, and names a row whose hash was altered and an entry it does not have', async () => {
    const rows = await storedRows();
    const head = rows.at(-1)!.hash;
    const same = await checkFile(exportCsv(rows, head), tok.inspector);
    expect(same.status).toBe(200);
    expect(same.body).toEqual({
      rowsRead: rows.length,
      matching: rows.length,
      differing: [],
      differingCount: 0,
      notInDatabase: [],
      notInDatabaseCount: 0,
      breaks: [],
    });

    // The export itself, as downloaded: every entry matches, and its closing chain-head row is not an entry.
    const exported = await request(t.app)
      .get(`/api/builds/${buildId}/log.csv`)
      .set(auth(tok.builder))
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(exported.status).toBe(200);
    const again = await checkFile(exported.body as Buffer);
    expect(again.body).toMatchObject({ rowsRead: rows.length, matching: rows.length, differingCount: 0 });
    expect(again.body.notInDatabase).toEqual([]);

    const altered = rows.map((r, i) => (i === 3 ? { ...r, hash: sha256Hex('not what was written') } : r));
    const stranger = { entryId: 't:00000000-0000-4000-8000-000000000000', hash: head };
    const res = await checkFile(exportCsv([...altered, stranger], head));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      rowsRead: rows.length + 1,
      matching: rows.length - 1,
      differing: [{ entryId: rows[3].entryId, fileHash: altered[3].hash, storedHash: rows[3].hash }],
      differingCount: 1,
      notInDatabase: [stranger.entryId],
      notInDatabaseCount: 1,
      breaks: [],
    });

    // Long files are read in batches and their lists capped at 50, with whole counts beside them.
    const repeated = Array.from({ length: 60 }, () => rows.map((r) => ({ ...r, hash: sha256Hex(r.hash) }))).flat();
    const strangers = Array.from({ length: 60 }, (_, i) => ({
      entryId: `f:00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
      hash: head,
    }));
    const long = await checkFile(exportCsv([...repeated, ...strangers], head));
    expect(long.status).toBe(200);
    expect(long.body).toMatchObject({
      rowsRead: repeated.length + 60,
      matching: 0,
      differingCount: repeated.length,
      notInDatabase: strangers.slice(0, 50).map((s) => s.entryId),
      notInDatabaseCount: 60,
    });
    expect(repeated.length).toBeGreaterThan(1000);
    expect(long.body.differing).toHaveLength(50);
    expect(long.body.differing[0]).toEqual({
      entryId: rows[0].entryId,
      fileHash: repeated[0].hash,
      storedHash: rows[0].hash,
    });
  });

  it('answers a clear 400 for no file, a file that is not a CSV, or a CSV without the entry hash columns', async () => {
    const none = await checkFile(null);
    expect(none.status).toBe(400);
    expect(none.body.error).toMatchObject({
      message: expect.stringMatching(/attach the exported log/),
      fields: { file: 'no file' },
    });
    const wrongField = await checkFile(exportCsv([], 'x'), tok.builder, 'log.csv', 'photos');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.message).toMatch(/as the "file" field/);
    // PNG's signature (ISO/IEC 15948 §5.2) then a NUL: binary, not text.
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect((await checkFile(png, tok.builder, 'photo.png')).body.error.fields).toEqual({ file: 'not a CSV' });
    const unclosed = await checkFile(Buffer.from('Entry,Entry hash\r\n"t:abc,def\r\n'));
    expect(unclosed.status).toBe(400);
    expect(unclosed.body.error.message).toMatch(/^the file is not a CSV that can be read/);
    const latin1 = await checkFile(Buffer.from([0x45, 0x6e, 0x74, 0x72, 0x79, 0xe9, 0x0d, 0x0a]));
    expect(latin1.body.error.fields).toEqual({ file: 'not UTF-8 text' });
    const noColumns = await checkFile(Buffer.from('Date,What happened\r\n2026-12-03,Ticked\r\n'));
    expect(noColumns.status).toBe(400);
    expect(noColumns.body.error.message).toMatch(/no "Entry" and "Entry hash" columns/);
    expect((await checkFile(Buffer.alloc(0))).body.error.fields).toEqual({ file: 'empty' });
    const tooLarge = await checkFile(Buffer.alloc(20 * 1024 * 1024 + 1, 'a'));
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error.message).toMatch(/larger than 20 MB/);
  });

  it('names exactly the row that was changed behind the guard, then the one that was deleted, then one never linked', async () => {
    const stored = await links();
    const target = stored.find((l) => l.source === 't' && l.seq > 1 && l.seq < stored.length)!;
    const [{ detail }] = await sql<{ detail: string }>(
      'select detail::text as detail from traveler_events where id = $1',
      [target.eventId],
    );
    await withTriggerOff('traveler_events', 'traveler_events_no_update', () =>
      sql(`update traveler_events set detail = detail || '{"holeIds":["U-99"]}' where id = $1`, [target.eventId]),
    );
    const changed = await chain();
    expect(changed.body).toMatchObject({ ok: false, length: stored.length });
    expect(changed.body.breaks).toEqual([{ seq: target.seq, entryId: `t:${target.eventId}`, problem: 'changed' }]);
    // The stored chain's breaks come with a file check too.
    const file = await checkFile(exportCsv(await storedRows(), 'x'));
    expect(file.body.breaks).toEqual(changed.body.breaks);
    // Put back as it was, the row checks again: the hash is of the content, nothing else.
    await withTriggerOff('traveler_events', 'traveler_events_no_update', () =>
      sql('update traveler_events set detail = $2::jsonb where id = $1', [target.eventId, detail]),
    );
    expect((await chain()).body).toMatchObject({ ok: true, breaks: [] });

    await withTriggerOff('traveler_events', 'traveler_events_no_delete', () =>
      sql('delete from traveler_events where id = $1', [target.eventId]),
    );
    expect((await chain()).body.breaks).toEqual([
      { seq: target.seq, entryId: `t:${target.eventId}`, problem: 'missing' },
    ]);

    let sneaked = '';
    await withTriggerOff('traveler_events', 'traveler_events_chain', async () => {
      const [row] = await sql<{ id: string }>(
        `insert into traveler_events (traveler_id, actor_id, kind, detail)
         select traveler_id, actor_id, kind, detail from traveler_events where traveler_id = $1 limit 1 returning id`,
        [innerId],
      );
      sneaked = row.id;
    });
    expect((await chain()).body.breaks).toEqual([
      { seq: target.seq, entryId: `t:${target.eventId}`, problem: 'missing' },
      { seq: null, entryId: `t:${sneaked}`, problem: 'unchained' },
    ]);

    // However many breaks there are, the answer lists 50.
    await withTriggerOff('traveler_events', 'traveler_events_chain', () =>
      sql(
        `insert into traveler_events (traveler_id, actor_id, kind, detail)
         select $1, actor_id, kind, detail from traveler_events, generate_series(1, 55) where id = $2`,
        [innerId, sneaked],
      ),
    );
    const many = (await chain()).body;
    expect(many.breaks).toHaveLength(50);
    expect(many.breaks[0].problem).toBe('missing');
  });

  it('still deletes a whole build: its events of every kind and its chain go with it', async () => {
    // Through the API: a fresh build (people added, so build events) is deleted whole.
    const kit = (await request(t.app).get('/api/kits').set(auth(tok.supplier))).body.items[0];
    const made = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
      kitModelId: kit.id,
      kitSerial: 'NK2-0500',
      builderEmail: 'tobias@benchwork.example',
      inspectorEmail: 'priya@checkpoint.example',
    });
    expect(made.status).toBe(201);
    expect((await links(made.body.id)).length).toBeGreaterThan(0);
    expect((await request(t.app).delete(`/api/builds/${made.body.id}`).set(auth(tok.supplier))).status).toBe(204);
    expect(await links(made.body.id)).toEqual([]);

    // The demo build has bench and finding events too (the API refuses to delete a build with work on it).
    const kinds = (await links()).map((l) => l.source);
    expect(new Set(kinds)).toEqual(new Set(['b', 'f', 't']));
    await sql('delete from builds where id = $1', [buildId]);
    expect(await links()).toEqual([]);
    expect(await canonicalTexts()).toEqual(new Map());
  });
});
