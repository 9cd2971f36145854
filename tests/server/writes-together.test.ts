import { sql } from 'drizzle-orm';
import request from 'supertest';
import { users } from '@/db/schema';
import { DEMO_USERS, seedDemo } from '@/server/dev/seed';
import { startTestApp, type TestApp } from '../helpers/test-app';

/**
 * Writes that must happen together or not at all, and the demo loader that must never write twice.
 * Each failure is forced inside PostgreSQL (a trigger that refuses a write), so what is checked is what
 * the database kept, not what the code meant to do.
 */
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 90_000);
afterAll(() => t.close());

const STRONG = 'rivet-line-steady-73-pitch';
const countUsers = async () => (await t.database.db.select({ n: sql<number>`count(*)::int` }).from(users))[0].n;

describe('the demo loader', () => {
  it('loads nothing into a database that already has people, and says so', async () => {
    const before = await countUsers();
    expect(before).toBeGreaterThan(0);
    await expect(seedDemo(t.database, t.ctx.storage, t.mailQueue, t.config.jwtSecret)).resolves.toBe(false);
    expect(await countUsers()).toBe(before);
  });
});

describe('a password reset', () => {
  it('keeps its link usable when setting the password fails, since the two are one write', async () => {
    await request(t.app).post('/api/auth/forgot').send({ email: DEMO_USERS.builder.email }).expect(202);
    const mail = await t.waitForMail((m) => m.to.includes(DEMO_USERS.builder.email) && /reset/i.test(m.text));
    const token = /https?:\/\/\S+\/reset\/([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
    expect(token).toBeTruthy();

    // The password write fails inside the database: the link must not be used up by a reset that did nothing.
    await t.database.db.execute(sql`
      create function refuse_password() returns trigger language plpgsql as
        $$ begin raise exception 'password writes refused for this test'; end $$;
      create trigger refuse_password before update of password_hash on users
        for each row execute function refuse_password();`);
    try {
      const failed = await request(t.app).post('/api/auth/reset').send({ token, password: STRONG });
      expect(failed.status).toBeGreaterThanOrEqual(500);
    } finally {
      await t.database.db.execute(sql`
        drop trigger refuse_password on users;
        drop function refuse_password();`);
    }

    const retried = await request(t.app).post('/api/auth/reset').send({ token, password: STRONG });
    expect(retried.status).toBe(200);
  });
});
