import request from 'supertest';
import { eq, sql } from 'drizzle-orm';
import { DEMO_USERS } from '@/server/dev/seed';
import { findingPhotos, findings, users } from '@/db/schema';
import { isOpenFinding, type FindingStatus, type FindingSummary } from '@/db/contracts';
import { auth, demoApp, type Outsiders, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(180000);

/**
 * GET /api/findings in pages: every finding once, in order, whatever the page size; the filters and
 * who-sees-what hold on every page; a cursor or a size it did not give is refused.
 */
let t: TestApp;
let tok: Tokens;
let other: Outsiders;
/** The demo build (demo builder and inspector) and a second build of the same kit (the other builder and inspector). */
let demo: { buildId: string; travelerIds: string[] };
let second: { buildId: string; travelerIds: string[] };
type Made = { id: string; at: string; buildId: string; travelerId: string; status: FindingStatus };
let made: Made[] = [];

const get = (token: string, query: string) => request(t.app).get(`/api/findings${query}`).set(auth(token));

/** Follows `next` to the end, at most `bound` pages, and returns every page's items. */
async function walk(token: string, query: Record<string, string | number>, bound = 60): Promise<FindingSummary[][]> {
  const pages: FindingSummary[][] = [];
  let cursor: string | null = null;
  for (let i = 0; i < bound; i++) {
    const qs = new URLSearchParams(
      Object.entries({ ...query, ...(cursor ? { cursor } : {}) }).map(([k, v]) => [k, String(v)]),
    ).toString();
    const res = await get(token, `?${qs}`);
    expect(res.status).toBe(200);
    pages.push(res.body.items);
    cursor = res.body.next;
    if (!cursor) return pages;
  }
  throw new Error(`more than ${bound} pages`);
}

async function travelersOf(buildId: string): Promise<string[]> {
  const res = await request(t.app).get(`/api/builds/${buildId}`).set(auth(tok.supplier));
  return res.body.travelers.map((tr: { id: string }) => tr.id);
}

/**
 * The list's order, written out here on its own: newest first by the time PostgreSQL keeps
 * (microseconds), ties by id. PostgreSQL orders uuids by their bytes, which is the order of their
 * lower-case hex text (common practice).
 */
const newestFirst = (a: Made, b: Made) => (a.at === b.at ? (a.id < b.id ? 1 : -1) : a.at < b.at ? 1 : -1);

demoApp((s) => ({ t, tok, outsiders: other } = s), { outsiders: true });
beforeAll(async () => {
  const kits = await request(t.app).get('/api/kits').set(auth(tok.supplier));
  const kitModelId = kits.body.items[0].id;
  const built = await request(t.app).post('/api/builds').set(auth(tok.supplier)).send({
    kitModelId,
    kitSerial: 'PG-0001',
    builderEmail: 'other.builder@elsewhere.example',
    inspectorEmail: 'other.inspector@elsewhere.example',
  });
  expect(built.status).toBe(201);
  const builds = await request(t.app).get('/api/builds').set(auth(tok.supplier));
  const demoBuild = builds.body.items.find((b: { kitSerial: string }) => b.kitSerial === 'NK2-0147');
  demo = { buildId: demoBuild.id, travelerIds: await travelersOf(demoBuild.id) };
  second = { buildId: built.body.id, travelerIds: await travelersOf(built.body.id) };

  // Findings written straight to the table so that many share one timestamp to the microsecond:
  // three instants, the second and third one microsecond apart, on both builds and in every state.
  const [raiser] = await t.database.db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, DEMO_USERS.builder.email));
  const instants = ['2026-11-01 10:00:00.123456+00', '2026-11-02 09:30:00.000001+00', '2026-11-02 09:30:00.000002+00'];
  const statuses: FindingStatus[] = ['raised', 'awaiting_approval', 'work_ordered', 'work_done', 'closed'];
  const values = [];
  for (let i = 0; i < 30; i++) {
    const onDemo = i % 3 !== 2;
    const travelerIds = onDemo ? demo.travelerIds : second.travelerIds;
    values.push({
      travelerId: travelerIds[i % travelerIds.length],
      holeIds: [`X-${i}`],
      kind: 'hole_elongated' as const,
      note: `made ${i}`,
      status: statuses[i % statuses.length],
      raisedBy: raiser.id,
      createdAt: sql`${instants[i % instants.length]}::timestamptz` as unknown as Date,
    });
  }
  await t.database.db.insert(findings).values(values);
  // Every finding there is (the seeded demo one too), as the database keeps it.
  const rows = await t.database.db.execute<{
    id: string;
    at: string;
    build_id: string;
    traveler_id: string;
    status: FindingStatus;
  }>(sql`
    select f.id, f.created_at::text as at, t.build_id, f.traveler_id, f.status from findings f join travelers t on t.id = f.traveler_id`);
  made = rows.rows.map((r) => ({
    id: r.id,
    at: r.at,
    buildId: r.build_id,
    travelerId: r.traveler_id,
    status: r.status,
  }));
  expect(made.length).toBe(31);
});

describe('GET /api/findings in pages', () => {
  it('walks every finding exactly once, newest first then by id, through findings that share a timestamp', async () => {
    const pages = await walk(tok.admin, { limit: 4 });
    const ids = pages.flat().map((f) => f.id);
    expect(pages.length).toBe(8);
    expect(pages.slice(0, -1).every((p) => p.length === 4)).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toEqual([...made].sort(newestFirst).map((m) => m.id));
  });

  it('walks oldest first with order=oldest, the same rows the other way', async () => {
    const ids = (await walk(tok.admin, { limit: 7, order: 'oldest' })).flat().map((f) => f.id);
    expect(ids).toEqual(
      [...made]
        .sort(newestFirst)
        .reverse()
        .map((m) => m.id),
    );
  });

  it('keeps the filters on every page: open findings of one build, and one state', async () => {
    const open = (await walk(tok.admin, { limit: 3, status: 'open', buildId: demo.buildId })).flat().map((f) => f.id);
    expect(open).toEqual(
      made
        .filter((m) => m.buildId === demo.buildId && isOpenFinding(m.status))
        .sort(newestFirst)
        .map((m) => m.id),
    );
    const waiting = (await walk(tok.admin, { limit: 2, status: 'awaiting_approval', order: 'oldest' }))
      .flat()
      .map((f) => f.id);
    expect(waiting).toEqual(
      made
        .filter((m) => m.status === 'awaiting_approval')
        .sort(newestFirst)
        .reverse()
        .map((m) => m.id),
    );
    const traveler = second.travelerIds[0];
    const onOne = (await walk(tok.admin, { limit: 2, travelerId: traveler })).flat().map((f) => f.id);
    expect(onOne).toEqual(
      made
        .filter((m) => m.travelerId === traveler)
        .sort(newestFirst)
        .map((m) => m.id),
    );
  });

  it('shows each person only the builds they have a place on, on every page', async () => {
    const expectSees = async (token: string, buildIds: string[]) => {
      const pages = await walk(token, { limit: 3 });
      const seen = pages.flat();
      expect(seen.every((f) => buildIds.includes(f.buildId))).toBe(true);
      expect(seen.map((f) => f.id)).toEqual(
        made
          .filter((m) => buildIds.includes(m.buildId))
          .sort(newestFirst)
          .map((m) => m.id),
      );
    };
    await expectSees(tok.builder, [demo.buildId]);
    await expectSees(tok.inspector, [demo.buildId]);
    await expectSees(other.builder, [second.buildId]);
    await expectSees(other.inspector, [second.buildId]);
    // The kits' supplier sees both builds; a supplier of other kits sees none.
    await expectSees(tok.supplier, [demo.buildId, second.buildId]);
    expect((await get(other.supplier, '')).body).toEqual({ items: [], next: null });
    // A filter naming a build the reader is not on gives nothing, not that build's findings.
    expect((await get(other.builder, `?buildId=${demo.buildId}`)).body).toEqual({ items: [], next: null });
  });

  it('gives each row its part, kit, holes, photo count and first photo as the thumbnail', async () => {
    const target = made.find((m) => m.buildId === second.buildId)!;
    const [raiser] = await t.database.db
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, DEMO_USERS.builder.email));
    const photo = (at: string, key: string) => ({
      findingId: target.id,
      fileKey: `${key}.jpg`,
      thumbKey: `${key}-t.jpg`,
      width: 64,
      height: 48,
      uploadedBy: raiser.id,
      createdAt: sql`${at}::timestamptz` as unknown as Date,
    });
    const inserted = await t.database.db
      .insert(findingPhotos)
      .values([photo('2026-11-03 08:00:00+00', 'later'), photo('2026-11-03 07:00:00+00', 'first')])
      .returning({ id: findingPhotos.id, fileKey: findingPhotos.fileKey });
    const first = inserted.find((p) => p.fileKey === 'first.jpg')!;
    const row = (await walk(tok.admin, { limit: 100, travelerId: target.travelerId }))
      .flat()
      .find((f) => f.id === target.id)!;
    expect(row).toMatchObject({
      kitSerial: 'PG-0001',
      buildId: second.buildId,
      travelerId: target.travelerId,
      holeIds: expect.any(Array),
      photoCount: 2,
    });
    expect(row.thumbUrl).toContain(`/api/photos/${first.id}/thumb`);
    expect(row.partNumber).toMatch(/^W-10[45]$/);
    // The traveler's own page lists the same finding the same way.
    const traveler = await request(t.app).get(`/api/travelers/${target.travelerId}`).set(auth(tok.supplier));
    expect(traveler.body.findings.find((f: FindingSummary) => f.id === target.id)).toMatchObject({ photoCount: 2 });
  });

  it('refuses a cursor it did not give with 400 and says to start again', async () => {
    const page = await get(tok.admin, '?limit=2');
    const enc = (v: unknown) => Buffer.from(JSON.stringify(v)).toString('base64url');
    const bad = [
      'not-a-cursor', // not base64 of JSON
      enc({ at: 'x' }), // JSON of another shape
      enc(['newest', 'yesterday', made[0].id]), // not a time
      enc(['newest', '2026-02-31 10:00:00+00', made[0].id]), // no such day (Gregorian calendar)
      enc(['newest', made[0].at, 'f-1']), // not an id
    ];
    for (const cursor of bad) {
      const res = await get(tok.admin, `?cursor=${cursor}`);
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/cursor/);
    }
    // A cursor of the newest-first list is not one of the oldest-first list.
    const crossed = await get(tok.admin, `?order=oldest&cursor=${page.body.next}`);
    expect(crossed.status).toBe(400);
    expect(crossed.body.error.message).toBe('cursor is not one this list gave: start again from the first page');
    expect((await get(tok.admin, '?cursor=%2B%2F%3D')).status).toBe(400);
  });

  it('refuses a page larger than 100 or smaller than 1', async () => {
    const big = await get(tok.admin, '?limit=101');
    expect(big.status).toBe(400);
    expect(JSON.stringify(big.body.error)).toContain('limit is at most 100');
    expect((await get(tok.admin, '?limit=0')).status).toBe(400);
    expect((await get(tok.admin, '?limit=100')).status).toBe(200);
  });
});
