import request from 'supertest';
import { sql } from 'drizzle-orm';
import type { Page, TravelerSummary } from '@/db/contracts';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(120000);

let t: TestApp;
let tok: Tokens;
const EXTRA = 23;

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  // More parts on the demo build, written in one statement: they share one created_at to the microsecond,
  // the case where a list ordered by time alone would repeat or skip rows between pages.
  await t.database.db.execute(sql`
    insert into travelers (build_id, revision_id, serial, qr_token, short_code)
    select t.build_id, t.revision_id, t.serial || '-X' || lpad(n::text, 2, '0'), md5(random()::text || n), 'Z' || lpad(n::text, 5, '0')
    from (select * from travelers order by serial limit 1) t, generate_series(1, ${EXTRA}) n`);
  // One part replaced by another: it goes after every live part.
  await t.database.db.execute(sql`
    update travelers set replaced_by_id = (select id from travelers where serial like '%-X01'), replaced_reason = 'scrap', replaced_at = now()
    where serial like '%-X02'`);
});

async function walk(token: string, query: string, limit: number): Promise<{ rows: TravelerSummary[]; pages: number }> {
  const rows: TravelerSummary[] = [];
  let cursor: string | null = null;
  let pages = 0;
  // Bounded: never more pages than rows could fill.
  for (let i = 0; i < 200; i++) {
    const res = await request(t.app)
      .get(`/api/travelers?limit=${limit}${query}${cursor ? `&cursor=${cursor}` : ''}`)
      .set(auth(token));
    expect(res.status).toBe(200);
    const page = res.body as Page<TravelerSummary>;
    expect(page.items.length).toBeLessThanOrEqual(limit);
    rows.push(...page.items);
    pages++;
    if (!page.next) return { rows, pages };
    cursor = page.next;
  }
  throw new Error('the walk did not end within 200 pages');
}

/** Keyset order (common practice): live parts first, then serial, then id, compared as the database's C collation does (bytes). */
const byKey = (a: TravelerSummary, b: TravelerSummary) => {
  const ka = [a.replaced ? 1 : 0, a.serial, a.id] as const;
  const kb = [b.replaced ? 1 : 0, b.serial, b.id] as const;
  for (let i = 0; i < 3; i++) if (ka[i] !== kb[i]) return ka[i] < kb[i] ? -1 : 1;
  return 0;
};

describe('the travelers list in pages', () => {
  it('walks every part the builder may see exactly once, in a stable order, though their times are equal', async () => {
    const ids = await t.database.db.execute(
      sql`select count(*)::int as n, count(distinct created_at)::int as times from travelers`,
    );
    const { n, times } = ids.rows[0] as { n: number; times: number };
    expect(times).toBeLessThan(n); // the equal timestamps are really there

    const { rows, pages } = await walk(tok.builder, '', 4);
    expect(pages).toBeGreaterThan(3);
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
    expect(rows.length).toBe(n);
    expect(rows.map((r) => r.id)).toEqual([...rows].sort(byKey).map((r) => r.id));
    expect(rows[rows.length - 1].replaced).not.toBeNull();

    // The same rows whatever the page size: one page of 100 against pages of 4.
    const whole = await request(t.app).get('/api/travelers?limit=100').set(auth(tok.builder));
    expect(whole.body.next).toBeNull();
    expect((whole.body as Page<TravelerSummary>).items.map((r) => r.id)).toEqual(rows.map((r) => r.id));
  });

  it('counts progress in the database as the part’s own page does', async () => {
    const { rows } = await walk(tok.builder, '', 50);
    const w104 = rows.find((r) => r.partNumber === 'W-104' && !r.serial.includes('-X'))!;
    const detail = (await request(t.app).get(`/api/travelers/${w104.id}`).set(auth(tok.builder))).body;
    // What the list counts in the database, field by field, against the part's own page.
    const counted = [
      'id',
      'serial',
      'holesTotal',
      'holesDone',
      'holesAwaitingInspector',
      'openFindings',
      'signedOff',
      'newerRevision',
      'replaced',
    ] as const;
    const pick = (o: Record<string, unknown>) => Object.fromEntries(counted.map((k) => [k, o[k]]));
    expect(pick(detail)).toEqual(pick(w104));
    const { holesTotal, holesDone, holesAwaitingInspector, openFindings } = detail;
    expect(holesTotal).toBe(detail.holes.length);
    // The demo ticked eight holes installed and flagged one under a finding (server/dev/seed.ts).
    expect(holesDone).toBe(8);
    expect(holesAwaitingInspector).toBe(1);
    expect(openFindings).toBe(1);
  });

  it('filters in the database: show and search narrow every page', async () => {
    const all = (await walk(tok.builder, '', 100)).rows;
    const x = await walk(tok.builder, '&q=-x1', 3);
    expect(x.rows.map((r) => r.serial)).toEqual(
      all.filter((r) => r.serial.toLowerCase().includes('-x1')).map((r) => r.serial),
    );
    expect(x.rows.length).toBe(10); // -X10 … -X19
    // A % in the search is a character to find, not a wildcard.
    expect((await walk(tok.builder, '&q=%25', 10)).rows).toEqual([]);
    const open = await walk(tok.builder, '&show=open', 5);
    expect(open.rows.map((r) => r.id)).toEqual(all.filter((r) => !r.signedOff).map((r) => r.id));
    expect((await walk(tok.builder, '&show=signed', 5)).rows.map((r) => r.id)).toEqual(
      all.filter((r) => r.signedOff).map((r) => r.id),
    );
  });

  it('shows an outsider nothing, and the supplier the same parts as the builder', async () => {
    const outsider = await t.addUser('builder', 'pages.outsider@elsewhere.example');
    expect((await request(t.app).get('/api/travelers').set(auth(outsider))).body).toEqual({ items: [], next: null });
    const builder = (await walk(tok.builder, '', 100)).rows.map((r) => r.id);
    expect((await walk(tok.supplier, '', 7)).rows.map((r) => r.id)).toEqual(builder);
  });

  it('refuses a cursor it did not give, and a page over 100 rows, saying why', async () => {
    const made = Buffer.from(JSON.stringify([0, 'A', 'not-an-id'])).toString('base64url');
    for (const cursor of [
      'bm90LWpzb24',
      made,
      Buffer.from('[1,2]').toString('base64url'),
      'has spaces',
      Buffer.from(JSON.stringify([7, 'A', '00000000-0000-0000-0000-000000000000'])).toString('base64url'),
    ]) {
      const res = await request(t.app)
        .get(`/api/travelers?cursor=${encodeURIComponent(cursor)}`)
        .set(auth(tok.builder));
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/cursor/);
    }
    const big = await request(t.app).get('/api/travelers?limit=101').set(auth(tok.builder));
    expect(big.status).toBe(400);
    expect(big.body.error.message).toMatch(/limit is at most 100/);
    expect((await request(t.app).get('/api/travelers?limit=0').set(auth(tok.builder))).status).toBe(400);
    expect((await request(t.app).get('/api/travelers?show=some').set(auth(tok.builder))).status).toBe(400);
    // A NUL byte in the search once reached PostgreSQL, which refuses it in text: a 500.
    const nul = await request(t.app).get('/api/travelers?q=W%00').set(auth(tok.builder));
    expect([nul.status, nul.body.error.fields]).toEqual([
      400,
      { q: 'the search contains a control character: type plain text' },
    ]);
  });
});

describe('the bench tick, under the part’s lock in few statements', () => {
  it('ticks for the builder, refuses the inspector (403) and an outsider (404), and unknown holes (400)', async () => {
    const { rows } = await walk(tok.builder, '&q=W-104', 50);
    const part = rows.find((r) => !r.serial.includes('-X'))!;
    const before = (await request(t.app).get(`/api/travelers/${part.id}`).set(auth(tok.builder))).body;
    const pending = before.holes
      .filter((h: { status: string }) => h.status === 'pending')
      .slice(0, 2)
      .map((h: { holeId: string }) => h.holeId);
    const tick = await request(t.app)
      .post(`/api/travelers/${part.id}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: pending, status: 'installed' });
    expect(tick.status).toBe(200);
    expect(tick.body.holes.map((h: { status: string }) => h.status)).toEqual(['installed', 'installed']);
    const after = (await request(t.app).get(`/api/travelers/${part.id}`).set(auth(tok.builder))).body;
    expect(after.holesDone).toBe(before.holesDone + 2);
    const events = await t.database.db.execute(
      sql`select detail from traveler_events where traveler_id = ${part.id} and kind = 'holes_installed' order by created_at desc limit 1`,
    );
    expect((events.rows[0] as { detail: { holeIds: string[] } }).detail.holeIds.sort()).toEqual([...pending].sort());
    // Ticking the same holes again changes nothing and writes no event.
    const again = await request(t.app)
      .post(`/api/travelers/${part.id}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: pending, status: 'installed' });
    expect(again.status).toBe(200);
    const count = await t.database.db.execute(
      sql`select count(*)::int as n from traveler_events where traveler_id = ${part.id} and kind = 'holes_installed'`,
    );
    expect((count.rows[0] as { n: number }).n).toBe(2); // the seed's and this one

    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${part.id}/holes`)
          .set(auth(tok.inspector))
          .send({ holeIds: pending, status: 'pending' })
      ).status,
    ).toBe(403);
    const outsider = await t.addUser('builder', 'tick.outsider@elsewhere.example');
    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${part.id}/holes`)
          .set(auth(outsider))
          .send({ holeIds: pending, status: 'pending' })
      ).status,
    ).toBe(404);
    const unknown = await request(t.app)
      .post(`/api/travelers/${part.id}/holes`)
      .set(auth(tok.builder))
      .send({ holeIds: ['Q-99'], status: 'installed' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/no hole Q-99/);
    const flagged = before.holes.find((h: { status: string }) => h.status === 'flagged').holeId;
    expect(
      (
        await request(t.app)
          .post(`/api/travelers/${part.id}/holes`)
          .set(auth(tok.builder))
          .send({ holeIds: [flagged], status: 'installed' })
      ).status,
    ).toBe(409);
  });
});
