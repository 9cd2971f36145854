import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { createDatabase, withTransaction, type Database } from '@/db';
import { users } from '@/db/schema';
import { DEMO_USERS } from '@/server/dev/seed';
import { lineOf, sourceFiles } from '../helpers/source-files';
import { auth, startTestApp, type TestApp } from '../helpers/test-app';

/**
 * Queries live in repositories, and only there (docs: /work/shared/ARCHITECTURE.md; the rule is ours,
 * the scan a plain text heuristic from common practice). A service composes repository calls inside one
 * unit of work (withTransaction, db/index.ts); a router does HTTP only. The scan looks at the text, not
 * the types, so it names what it looks for and keeps its exceptions few and explained.
 */
const root = path.join(__dirname, '..', '..');

/** Files that may run SQL of their own, each for a reason. */
const allowed: Record<string, string> = {
  // The unit-of-work helper itself: BEGIN / COMMIT / ROLLBACK and the raw SQL a unit of work hands out.
  'db/index.ts': 'the one unit-of-work helper',
  // visibleBuilds builds the visibility rule as a subquery that other statements embed; it never runs it.
  'server/builds/build-access.ts': 'builds a condition (a subquery), runs nothing',
  // The rate limiter's own store: makes its table once, under an advisory lock, on the pool's client.
  'server/middleware/rate-limit.ts': "the rate limiter's store table",
  // Start-up holds the migration lock while migrations run: no domain data.
  'server/start-up.ts': 'the migration lock',
};

/** Receivers that are a database client or a unit of work: db, tx, unit, database, conn, or a name ending in Db / Tx. */
const dbLike = /^(db|tx|trx|unit|database|conn)$|(Db|Tx)$/;
/** Raw pg: a query on a pool or a pooled client, or on anything with SQL written in as its text. */
const pgLike = /^(pool|client)$|(Pool|Client)$/;
const sqlText = /^\s*['"`]\s*(select|insert|update|delete|with|set|begin|commit|rollback|create|drop|alter|lock)\b/i;
const drizzleCall =
  /\b([A-Za-z_$][\w$]*)\s*\.\s*(select|selectDistinct|selectDistinctOn|insert|update|delete|execute|transaction)\s*\(/g;
const pgCall = /\b([A-Za-z_$][\w$]*)\s*\.\s*query\s*\(/g;
/** A statement written as raw SQL: sql`select …`, sql<T>`insert …` (a fragment like sql`true` only builds). */
const rawStatement = /\bsql\s*(?:<[^`]*?>)?\s*`\s*\(?\s*(select|insert|update|delete|with|lock|begin|commit)\b/gi;
/** The raw SQL of a unit of work (Tx.executeSql). */
const rawTxCall = /\bexecuteSql\s*\(/g;

/** Comments out, line breaks kept, so a line number still points at the line. */
function withoutComments(text: string): string {
  return text
    .replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, ' '))
    .replace(/(^|[^:'"`\\])\/\/.*$/gm, (_m, before: string) => before);
}

/** Every place in the text that runs SQL: `what` says which call. */
function queriesIn(source: string): { line: number; what: string }[] {
  const text = withoutComments(source);
  const found: { line: number; what: string }[] = [];
  for (const m of text.matchAll(drizzleCall)) {
    if (dbLike.test(m[1])) found.push({ line: lineOf(text, m.index), what: `${m[1]}.${m[2]}(` });
  }
  for (const m of text.matchAll(pgCall)) {
    if (pgLike.test(m[1]) || sqlText.test(text.slice(m.index + m[0].length)))
      found.push({ line: lineOf(text, m.index), what: `${m[1]}.query(` });
  }
  for (const m of text.matchAll(rawStatement)) found.push({ line: lineOf(text, m.index), what: `sql\`${m[1]}…\`` });
  for (const m of text.matchAll(rawTxCall)) found.push({ line: lineOf(text, m.index), what: 'executeSql(' });
  return found.sort((a, b) => a.line - b.line);
}

const scanned = () =>
  [
    ...sourceFiles(path.join(root, 'server'), (name) => /\.(ts|js)$/.test(name) && !name.endsWith('.d.ts')),
    path.join(root, 'db', 'index.ts'),
  ].map((file) => ({
    rel: path.relative(root, file).split(path.sep).join('/'),
    text: readFileSync(file, 'utf8'),
  }));

describe('queries live in repositories', () => {
  it('finds the calls it looks for, over line breaks, and passes what only builds SQL', () => {
    const sample = [
      'const [row] = await tx.db', //  1
      '  .select({ id: builds.id })', //  2
      'await db.insert(builds).values(v);', //  3
      'await unit.executeSql("select 1", []);', //  4
      'await deps.db.execute(sql`select 1`);', //  5
      'await pool.query("select 1");', //  6
      'return db.transaction(async (t) => t);', //  7
      'const cond = sql`true`;', //  8
      'const col = sql<number>`(select count(*) from holes)`;', //  9
      'res.json(await builds.update(req.user, id, body));', // 10
      "await lock.query(`set lock_timeout = '1s'`);", // 11
      '// db.select() in a comment is no query', // 12
      'r.delete("/:id", handler);', // 13
      "createHash('sha256').update(token);", // 14
      'const rows = await cache.query(key);', // 15
    ].join('\n');
    expect(queriesIn(sample)).toEqual([
      { line: 1, what: 'db.select(' },
      { line: 3, what: 'db.insert(' },
      { line: 4, what: 'executeSql(' },
      { line: 5, what: 'db.execute(' },
      { line: 5, what: 'sql`select…`' },
      { line: 6, what: 'pool.query(' },
      { line: 7, what: 'db.transaction(' },
      { line: 9, what: 'sql`select…`' },
      { line: 11, what: 'lock.query(' },
    ]);
  });

  it('runs no query outside a *-repository.ts file and the few files allowed, each named with its line', () => {
    const offenders: string[] = [];
    for (const { rel, text } of scanned()) {
      if (rel.endsWith('-repository.ts') || rel in allowed) continue;
      for (const q of queriesIn(text)) offenders.push(`${rel}:${q.line} ${q.what}`);
    }
    expect(offenders).toEqual([]);
  });

  it('keeps its allowed files real: each exists and still runs or builds SQL (else it leaves the list)', () => {
    const files = new Map(scanned().map((f) => [f.rel, f.text]));
    const stale = Object.keys(allowed).filter((rel) => !files.has(rel) || queriesIn(files.get(rel)!).length === 0);
    expect(stale).toEqual([]);
  });

  it('lets routers reach the database only through a service (no repository, schema, drizzle or unit of work)', () => {
    const offenders: string[] = [];
    for (const { rel, text } of scanned()) {
      if (!rel.endsWith('-router.ts')) continue;
      const imports = /\bfrom\s*['"]([^'"]+)['"]/g;
      for (const m of text.matchAll(imports)) {
        if (/-repository$|\/db(\/index)?$|\/db\/schema|^drizzle-orm|^pg$/.test(m[1]))
          offenders.push(`${rel}:${lineOf(text, m.index)} imports ${m[1]}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it('opens every unit of work one way: withTransaction, never drizzle’s own db.transaction()', () => {
    const offenders: string[] = [];
    for (const { rel, text } of scanned()) {
      for (const q of queriesIn(text)) if (q.what.endsWith('.transaction(')) offenders.push(`${rel}:${q.line}`);
    }
    expect(offenders).toEqual([]);
  });
});

describe('the unit of work (withTransaction)', () => {
  let database: Database;
  beforeAll(() => {
    if (!process.env.TEST_DATABASE_URL)
      throw new Error('TEST_DATABASE_URL is not set: npm test starts the test cluster');
    database = createDatabase(process.env.TEST_DATABASE_URL);
  });
  afterAll(() => database.close());

  it('opens on the pool or on its drizzle client, each work on one connection of its own', async () => {
    const backend = 'select pg_backend_pid() as pid';
    for (const on of [database.pool, database.db]) {
      const [a, b] = await withTransaction(on, async (tx) => [
        (await tx.executeSql(backend, [])).rows[0].pid,
        (await tx.db.execute(backend)).rows[0].pid,
      ]);
      expect(a).toBe(b);
    }
  });

  it('undoes everything the work did when it throws', async () => {
    const table = `uow_${randomBytes(4).toString('hex')}`;
    await expect(
      withTransaction(database.db, async (tx) => {
        await tx.executeSql(`create table ${table} (id int)`, []);
        throw new Error('the check refused');
      }),
    ).rejects.toThrow('the check refused');
    const { rows } = await database.pool.query('select to_regclass($1) as t', [table]);
    expect(rows[0].t).toBeNull();
  });

  it('refuses to open inside another unit of work (its client is a connection, not the pool)', async () => {
    await expect(withTransaction(database.db, (tx) => withTransaction(tx.db, async () => 1))).rejects.toThrow(
      /does not open inside another/,
    );
  });
});

describe('a check that guards a write reads the row locked, in the unit of work that writes', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  }, 120000);
  afterAll(() => t?.close());

  /** Waits (bounded) until a statement of this database waits for a row lock: the request has reached the row. */
  async function someoneWaitsForALock() {
    for (let i = 0; i < 200; i++) {
      const { rows } = await t.database.pool.query(
        `select count(*)::int as n from pg_stat_activity
         where datname = current_database() and wait_event_type = 'Lock' and query ilike '%"users"%'`,
      );
      if (rows[0].n > 0) return;
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error('no request came to wait for the row lock');
  }

  it('refuses to make a lead of an engineer who became a builder while the change waited', async () => {
    const leadToken = await t.signIn(DEMO_USERS.supplier.email);
    const me = (await request(t.app).get('/api/auth/me').set(auth(leadToken))).body;
    expect(me.lead).toBe(true);
    const [p] = await t.database.db
      .insert(users)
      .values({
        email: 'engineer.two@northfold.example',
        name: 'Engineer Two',
        role: 'supplier',
        organizationId: me.organizationId,
        passwordHash: 'not used',
      })
      .returning();

    // Another change of the same person, not yet committed, holds their row.
    const other = await t.database.pool.connect();
    try {
      await other.query('begin');
      await other.query(`update users set role = 'builder' where id = $1`, [p.id]);
      const change = request(t.app)
        .patch(`/api/people/${p.id}`)
        .set(auth(leadToken))
        .send({ lead: true })
        .then((r) => r);
      await someoneWaitsForALock();
      await other.query('commit');
      const res = await change;
      // A lead engineer manages their organisation's engineers, not builders: judged on the row as it now stands.
      expect(res.status).toBe(403);
    } finally {
      other.release();
    }
    const [after] = await t.database.db.select().from(users).where(eq(users.id, p.id));
    expect(after).toMatchObject({ role: 'builder', lead: false });
  });
});
