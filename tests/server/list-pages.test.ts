import { eq } from 'drizzle-orm';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import type { RibStudyInputValues } from '@/db/contracts/studies';
import type { RibStudyResult } from '@/lib/engineering-results';
import {
  buildMembers,
  builds,
  couponTests,
  invitations,
  kitModels,
  loadStudies,
  loadStudyRevisions,
  organizations,
  partDesigns,
  users,
} from '@/db/schema';
import { hashPassword } from '@/server/auth/passwords';
import { STUDY_SUMMARY_KEYS } from '../fixtures/study-summary';
import { auth, demoApp, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(180000);

/*
 * Every list comes in pages walked by an opaque cursor (keyset pagination, common practice): walking a
 * list page by page must give each row exactly once, in the order one large page gives, also where rows
 * share their sort value (the id breaks the tie); who sees which rows must not change from page to page.
 */

let t: TestApp;
let tok: Tokens;
let other: { supplier: string; builder: string };
type Row = { id: string } & Record<string, unknown>;

/** The whole list, `limit` rows a page, following `next` (bounded: at most 200 pages). */
async function walk(path: string, token: string, limit: number): Promise<{ rows: Row[]; pages: number }> {
  const rows: Row[] = [];
  let cursor: string | null = null;
  for (let pages = 1; pages <= 200; pages++) {
    const sep = path.includes('?') ? '&' : '?';
    const res: request.Response = await request(t.app)
      .get(`${path}${sep}limit=${limit}${cursor ? `&cursor=${cursor}` : ''}`)
      .set(auth(token));
    if (res.status !== 200) throw new Error(`${path}: ${res.status} ${JSON.stringify(res.body)}`);
    expect(res.body.items.length).toBeLessThanOrEqual(limit);
    rows.push(...res.body.items);
    cursor = res.body.next;
    if (!cursor) return { rows, pages };
  }
  throw new Error(`${path}: more than 200 pages`);
}

/** Walked in small pages, the list is the one large page: same rows, same order, none twice. */
async function expectStableWalk(path: string, token: string, small = 3) {
  const whole = await walk(path, token, 100);
  expect(whole.pages).toBe(1);
  const paged = await walk(path, token, small);
  expect(paged.rows.map((r) => r.id)).toEqual(whole.rows.map((r) => r.id));
  expect(new Set(paged.rows.map((r) => r.id)).size).toBe(paged.rows.length);
  return paged;
}

const sameTime = new Date('2026-03-04T05:06:07.000Z');
let ids: {
  supplierOrg: string;
  supplier: string;
  builder: string;
  admin: string;
  kit: string;
  kit2: string;
  builderBuilds: string[];
  otherBuilds: string[];
  orgPeople: string[];
};

demoApp((s) => ({ t, tok } = s));
beforeAll(async () => {
  const o = await t.outsiders();
  other = { supplier: o.supplier, builder: o.builder };
  const db = t.database.db;
  const byEmail = async (email: string) => (await db.select().from(users).where(eq(users.email, email)))[0];
  const supplier = await byEmail(DEMO_USERS.supplier.email);
  const builder = await byEmail(DEMO_USERS.builder.email);
  const admin = await byEmail(DEMO_USERS.admin.email);
  const supplierOrg = supplier.organizationId!;
  const [kit] = await db.select().from(kitModels).where(eq(kitModels.organizationId, supplierOrg));
  const { id: _, createdAt: __, ...kitFields } = kit;
  const [kit2] = await db
    .insert(kitModels)
    .values({ ...kitFields, code: 'PAGE-2', name: 'Paging twin' })
    .returning();

  // Builds shipped in the same instant: the id alone orders them. The demo builder is on half of them.
  const shipped = await db
    .insert(builds)
    .values(
      Array.from({ length: 8 }, (_, i) => ({
        organizationId: supplierOrg,
        kitModelId: kit.id,
        kitSerial: `PAGE-${i}`,
        createdBy: supplier.id,
        createdAt: sameTime,
      })),
    )
    .returning();
  const builderBuilds = shipped.filter((_, i) => i % 2 === 0).map((b) => b.id);
  await db.insert(buildMembers).values(
    builderBuilds.map((buildId) => ({
      buildId,
      userId: builder.id,
      role: 'builder' as const,
      place: 'helper' as const,
      addedBy: supplier.id,
    })),
  );

  // Part designs with the same part number in two kits of one organisation.
  await db.insert(partDesigns).values(
    ['TIE-1', 'TIE-1', 'TIE-2', 'TIE-2'].map((partNumber, i) => ({
      kitModelId: i % 2 ? kit2.id : kit.id,
      partNumber,
      name: `Tied part ${i}`,
      kind: 'rib' as const,
    })),
  );

  // Studies changed in the same instant.
  for (let i = 0; i < 5; i++) {
    const [s] = await db
      .insert(loadStudies)
      .values({
        organizationId: supplierOrg,
        kitModelId: kit.id,
        name: `Same-time study ${i}`,
        createdBy: supplier.id,
        updatedAt: sameTime,
      })
      .returning();
    await db
      .insert(loadStudyRevisions)
      // Only the list's order is under test: the study's content is never read.
      .values({
        studyId: s.id,
        revision: 1,
        inputs: {} as RibStudyInputValues,
        result: {} as RibStudyResult,
        createdBy: supplier.id,
      });
  }

  // Coupon tests alike in every sorted column.
  await db.insert(couponTests).values(
    Array.from({ length: 7 }, () => ({
      organizationId: supplierOrg,
      material: '2024-T3',
      gaugeIn: 0.032,
      couponWidthIn: 1,
      rivetSpec: 'MS20470AD3',
      loadLb: 210,
      outcome: 'no_deformation' as const,
      testedOn: '2026-02-01',
      createdBy: supplier.id,
      createdAt: sameTime,
    })),
  );

  // People of one name, in the supplier's organisation and in another; organisations of one name.
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const [elsewhere] = await db
    .insert(organizations)
    .values(Array.from({ length: 4 }, () => ({ name: 'Same Name Works', kind: 'shop' as const })))
    .returning();
  const orgPeople = await db
    .insert(users)
    .values(
      Array.from({ length: 5 }, (_, i) => ({
        email: `same.${i}@northfold.example`,
        name: 'Sam Same',
        role: 'supplier' as const,
        organizationId: supplierOrg,
        passwordHash,
      })),
    )
    .returning();
  await db.insert(users).values(
    Array.from({ length: 3 }, (_, i) => ({
      email: `same.${i}@works.example`,
      name: 'Sam Same',
      role: 'builder' as const,
      organizationId: elsewhere.id,
      passwordHash,
    })),
  );

  // Invitations sent in the same instant, to the supplier's organisation and to another.
  const expiresAt = new Date(Date.now() + 24 * 3600_000);
  await db.insert(invitations).values(
    Array.from({ length: 6 }, (_, i) => ({
      email: `invited.${i}@example.com`,
      name: `Invited ${i}`,
      role: i % 2 ? ('builder' as const) : ('supplier' as const),
      organizationId: i % 2 ? elsewhere.id : supplierOrg,
      tokenHash: `paging-test-${i}`,
      invitedBy: admin.id,
      expiresAt,
      createdAt: sameTime,
    })),
  );

  const otherShipped = await db
    .select({ id: builds.id })
    .from(builds)
    .where(eq(builds.organizationId, (await byEmail('other.supplier@elsewhere.example')).organizationId!));
  ids = {
    supplierOrg,
    supplier: supplier.id,
    builder: builder.id,
    admin: admin.id,
    kit: kit.id,
    kit2: kit2.id,
    builderBuilds,
    otherBuilds: otherShipped.map((b) => b.id),
    orgPeople: orgPeople.map((p) => p.id),
  };
});

describe('GET /api/builds in pages', () => {
  it('walks every build once, newest first, builds of one instant by id; each reader sees only their builds on every page', async () => {
    const db = t.database.db;
    const all = await db.select({ id: builds.id, org: builds.organizationId }).from(builds);
    const admin = await expectStableWalk('/api/builds', tok.admin);
    expect(admin.rows.map((r) => r.id).sort()).toEqual(all.map((b) => b.id).sort());
    // Newest first (ISO times compare as text).
    const times = admin.rows.map((r) => r.createdAt as string);
    expect([...times].sort().reverse()).toEqual(times);

    const supplier = await expectStableWalk('/api/builds', tok.supplier);
    expect(supplier.rows.map((r) => r.id).sort()).toEqual(
      all
        .filter((b) => b.org === ids.supplierOrg)
        .map((b) => b.id)
        .sort(),
    );

    // The builder sees the builds they are on (the demo build and half the new ones), never the others.
    const mine = (
      await db.select({ id: buildMembers.buildId }).from(buildMembers).where(eq(buildMembers.userId, ids.builder))
    ).map((m) => m.id);
    const builder = await expectStableWalk('/api/builds', tok.builder, 2);
    expect(builder.rows.map((r) => r.id).sort()).toEqual([...mine].sort());
    for (const id of ids.builderBuilds) expect(builder.rows.map((r) => r.id)).toContain(id);

    expect((await walk('/api/builds', other.builder, 2)).rows).toEqual([]);
    expect((await walk('/api/builds', other.supplier, 2)).rows).toEqual([]);
  });

  it('joins each build’s people and counts in the page as the detail has them', async () => {
    const page = await walk('/api/builds', tok.supplier, 100);
    const demo = page.rows.find((r) => (r.travelerCount as number) > 0)!;
    const detail = (await request(t.app).get(`/api/builds/${demo.id}`).set(auth(tok.supplier))).body;
    expect(demo).toMatchObject({
      builders: detail.builders,
      inspectors: detail.inspectors,
      travelerCount: detail.travelers.length,
      holesTotal: detail.holesTotal,
      holesDone: detail.holesDone,
      openFindings: detail.openFindings,
    });
    const tied = page.rows.find((r) => r.id === ids.builderBuilds[0])!;
    expect(tied.builders).toEqual([
      { id: ids.builder, name: DEMO_USERS.builder.name, email: DEMO_USERS.builder.email },
    ]);
    expect(tied.createdAt).toBe(sameTime.toISOString());
  });
});

describe('supplier lists in pages', () => {
  it('designs: by part number across kits, tied numbers by id; one kit when asked; another supplier sees none', async () => {
    const all = await expectStableWalk('/api/designs', tok.supplier, 2);
    const numbers = all.rows.map((r) => r.partNumber as string);
    expect(numbers.filter((n) => n === 'TIE-1')).toHaveLength(2);
    const kitOnly = await expectStableWalk(`/api/designs?kitModelId=${ids.kit2}`, tok.supplier, 1);
    expect(kitOnly.rows.map((r) => r.partNumber)).toEqual(['TIE-1', 'TIE-2']);
    expect(kitOnly.rows.every((r) => r.kitModelId === ids.kit2)).toBe(true);
    expect((await walk('/api/designs', other.supplier, 2)).rows).toEqual([]);
    // The latest revision and the published letter come with each design (the demo's designs have published ones).
    expect(all.rows.some((r) => r.publishedLetter !== null && (r.latest as { letter: string } | null)?.letter)).toBe(
      true,
    );
  });

  it('studies: last changed first, those of one instant by id; summary columns only; another supplier sees none', async () => {
    const all = await expectStableWalk('/api/studies', tok.supplier, 2);
    expect(all.rows.filter((r) => String(r.name).startsWith('Same-time study'))).toHaveLength(5);
    for (const r of all.rows) expect(Object.keys(r).sort()).toEqual(STUDY_SUMMARY_KEYS);
    expect((await walk('/api/studies', other.supplier, 2)).rows).toEqual([]);
  });

  it('kits: by code; another supplier sees only its own', async () => {
    const all = await expectStableWalk('/api/kits', tok.supplier, 1);
    expect(all.rows.map((r) => r.id)).toContain(ids.kit2);
    expect(all.rows.every((r) => r.organizationId === ids.supplierOrg)).toBe(true);
    expect((await walk('/api/kits', other.supplier, 1)).rows).toEqual([]);
  });

  it('coupons: tests alike in every sorted column come once each; a material filter holds across pages; another supplier sees none', async () => {
    const all = await expectStableWalk('/api/coupons', tok.supplier, 2);
    expect(all.rows.filter((r) => r.material === '2024-T3' && r.loadLb === 210)).toHaveLength(7);
    const one = await expectStableWalk('/api/coupons?material=2024-T3', tok.supplier, 2);
    expect(one.rows.length).toBeGreaterThanOrEqual(7);
    expect(one.rows.every((r) => r.material === '2024-T3')).toBe(true);
    expect((await walk('/api/coupons', other.supplier, 2)).rows).toEqual([]);
  });

  it('coupon allowables stay an aggregate of current tests, bounded, not a page', async () => {
    const res = await request(t.app).get('/api/coupons/allowables').set(auth(tok.supplier));
    expect(res.status).toBe(200);
    expect(Array.isArray(res.body)).toBe(true);
    const group = res.body.find(
      (g: { material: string; rivetSpec: string }) => g.material === '2024-T3' && g.rivetSpec === 'MS20470AD3',
    );
    expect(group.tests.length).toBeGreaterThanOrEqual(7);
  });
});

describe('people lists in pages', () => {
  it('people: by name, namesakes by id; a lead engineer sees their organisation only, the admin everyone', async () => {
    const db = t.database.db;
    const everyone = await db.select({ id: users.id, org: users.organizationId }).from(users);
    const admin = await expectStableWalk('/api/people', tok.admin, 3);
    expect(admin.rows.map((r) => r.id).sort()).toEqual(everyone.map((u) => u.id).sort());
    const lead = await expectStableWalk('/api/people', tok.supplier, 2);
    expect(lead.rows.map((r) => r.id).sort()).toEqual(
      everyone
        .filter((u) => u.org === ids.supplierOrg)
        .map((u) => u.id)
        .sort(),
    );
    for (const id of ids.orgPeople) expect(lead.rows.map((r) => r.id)).toContain(id);
    expect((await request(t.app).get('/api/people?limit=2').set(auth(tok.builder))).status).toBe(403);
    const notLead = await t.signIn('same.0@northfold.example');
    expect((await request(t.app).get('/api/people?limit=2').set(auth(notLead))).status).toBe(403);
  });

  it('invitations: oldest first, one instant by id; a lead sees their organisation’s only', async () => {
    const admin = await expectStableWalk('/api/people/invitations', tok.admin, 2);
    expect(admin.rows.filter((r) => String(r.email).startsWith('invited.'))).toHaveLength(6);
    const lead = await expectStableWalk('/api/people/invitations', tok.supplier, 1);
    const invitedHere = lead.rows
      .filter((r) => String(r.email).startsWith('invited.'))
      .map((r) => r.email)
      .sort();
    expect(invitedHere).toEqual(['invited.0@example.com', 'invited.2@example.com', 'invited.4@example.com']);
    expect((await request(t.app).get('/api/people/invitations').set(auth(tok.builder))).status).toBe(403);
  });

  it('organisations: by name, namesakes by id, with their head counts; the admin only', async () => {
    const all = await expectStableWalk('/api/people/organizations', tok.admin, 2);
    const same = all.rows.filter((r) => r.name === 'Same Name Works');
    expect(same).toHaveLength(4);
    expect(same.map((r) => r.people).sort()).toEqual([0, 0, 0, 3]);
    const supplierOrg = all.rows.find((r) => r.id === ids.supplierOrg)!;
    const db = t.database.db;
    expect(supplierOrg.people).toBe(
      (await db.select({ id: users.id }).from(users).where(eq(users.organizationId, ids.supplierOrg))).length,
    );
    expect((await request(t.app).get('/api/people/organizations').set(auth(tok.supplier))).status).toBe(403);
  });
});

describe('the page query is checked', () => {
  const lists: [string, () => string][] = [
    ['/api/builds', () => tok.supplier],
    ['/api/designs', () => tok.supplier],
    ['/api/studies', () => tok.supplier],
    ['/api/kits', () => tok.supplier],
    ['/api/coupons', () => tok.supplier],
    ['/api/people', () => tok.admin],
    ['/api/people/invitations', () => tok.admin],
    ['/api/people/organizations', () => tok.admin],
  ];

  it.each(lists)(
    '%s refuses a made-up cursor, a cursor of another list and a page over 100 rows',
    async (path, token) => {
      const madeUp = await request(t.app).get(`${path}?cursor=bm90LWEtY3Vyc29y`).set(auth(token()));
      expect(madeUp.status).toBe(400);
      expect(madeUp.body.error.message).toMatch(/cursor is not one this list gave/);
      // A cursor of the coupon record (six values) fits no other list; the builds' (two) does not fit coupons.
      const foreignKey = path === '/api/coupons' ? ['x', 'y'] : ['a', 1, 'b', 2, 'c', 'd'];
      const foreign = await request(t.app)
        .get(`${path}?cursor=${Buffer.from(JSON.stringify(foreignKey)).toString('base64url')}`)
        .set(auth(token()));
      expect(foreign.status).toBe(400);
      const tooMany = await request(t.app).get(`${path}?limit=101`).set(auth(token()));
      expect(tooMany.status).toBe(400);
      expect(JSON.stringify(tooMany.body.error)).toMatch(/limit is at most 100/);
      const junk = await request(t.app)
        .get(`${path}?cursor=${encodeURIComponent('not/base64!')}`)
        .set(auth(token()));
      expect(junk.status).toBe(400);
    },
  );
});
