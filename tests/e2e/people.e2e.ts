import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * People join through the screens alone, in Debian's headless Chromium against the real server,
 * PostgreSQL, job queue and SMTP fake: a supplier ships a build to two addresses with no account and
 * both join from their mails; the admin invites someone, who joins and is then deactivated, which ends
 * their sign-in at once; and a forgotten password is set anew from the reset mail.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;

// Strong by the server's strength package (several unrelated words and a number), and nobody's name.
const STRONG = 'copper-ribs-tilt-44-quietly';

const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();
const stamp = () => Date.now().toString(36).slice(-5);

servedWithBrowser((s) => ({ t, base, browser } = s));

/** An office screen, wide enough for two panes. */
async function widePage() {
  const context = await browser.newContext({ baseURL: base, viewport: { width: 1280, height: 900 } });
  return context.newPage();
}

async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/');
  await fillSignIn(page, email, password);
}

/** The path of the one-time link in the newest mail to `to` whose link goes to `kind` (`invite` or `reset`). */
async function linkIn(to: string, kind: 'invite' | 'reset'): Promise<string> {
  const mail = await t.waitForMail((m) => m.to.includes(to) && new RegExp(`/${kind}/`).test(m.text));
  const url = new RegExp(`https?://\\S+/${kind}/[A-Za-z0-9_-]+`).exec(mail.text);
  if (!url) throw new Error(`no ${kind} link in the mail to ${to}: ${mail.text}`);
  return new URL(url[0]).pathname;
}

/** Opens a mail's invitation link on a phone, sets a password and joins; the page is then signed in. */
async function join(path: string, expectName: string) {
  const page = await phonePage(browser, base);
  await page.goto(path);
  await visible(page, 'invite-screen').waitFor({ timeout: 30_000 });
  expect(await visible(page, 'invite-name').inputValue()).toBe(expectName);
  await visible(page, 'invite-password').fill(STRONG);
  await visible(page, 'invite-accept').click();
  return page;
}

describe('people join and leave through the screens', () => {
  it('a supplier ships a build to a new builder and a new inspector; both join from their mails and show as members', async () => {
    const kitSerial = `PPL-${stamp().toUpperCase()}`;
    const builder = { email: `wren.${stamp()}@hangar-nine.example`, name: 'Wren Okafor' };
    const inspector = { email: `ivo.${stamp()}@airworthy.example`, name: 'Ivo Lindqvist' };

    const office = await widePage();
    await signIn(office, DEMO_USERS.supplier.email);
    await visible(office, 'tab-builds').click();
    await visible(office, 'ship-build').click();
    await visible(office, 'build-kit-NK-2').click();
    await visible(office, 'build-serial').fill(kitSerial);
    await visible(office, 'build-builder-email').fill(builder.email);
    await visible(office, 'build-builder-name').fill(builder.name);
    await visible(office, 'build-inspector-email').fill(inspector.email);
    await visible(office, 'build-inspector-name').fill(inspector.name);
    await visible(office, 'submit-build').click();

    // The build shows both as invited, not joined.
    await visible(office, `pending-${builder.email}`).waitFor({ timeout: 30_000 });
    await visible(office, `pending-${inspector.email}`).waitFor();
    expect(await visible(office, `pending-state-${builder.email}`).textContent()).toContain('not joined yet');
    const buildId = /\/builds\/([0-9a-f-]{36})/.exec(office.url())![1];

    // The builder joins from the mail's link and lands on the bench with the build's parts.
    const bench = await join(await linkIn(builder.email, 'invite'), builder.name);
    await visible(bench, 'bench-screen').waitFor({ timeout: 30_000 });
    const supplierToken = await t.signIn(DEMO_USERS.supplier.email);
    const build = (await request(t.app).get(`/api/builds/${buildId}`).set(auth(supplierToken))).body as {
      travelers: { shortCode: string }[];
    };
    expect(build.travelers.length).toBeGreaterThan(0);
    await visible(bench, `traveler-${build.travelers[0].shortCode}`).waitFor({ timeout: 30_000 });

    // The inspector joins and lands on their review queue.
    const review = await join(await linkIn(inspector.email, 'invite'), inspector.name);
    await visible(review, 'review-screen').waitFor({ timeout: 30_000 });

    // The build screen now lists both as members in their places; nobody is left "not joined".
    await office.reload();
    await visible(office, `member-${builder.email}`).waitFor({ timeout: 30_000 });
    await visible(office, `member-${inspector.email}`).waitFor();
    expect(await visible(office, `member-placed-${builder.email}`).textContent()).toBe('Owner and builder');
    expect(await visible(office, `member-placed-${inspector.email}`).textContent()).toBe('Final inspector');
    expect(await office.locator('[data-testid^="pending-"]:visible').count()).toBe(0);

    // Through the API too: both accounts are the build's people.
    const after = (await request(t.app).get(`/api/builds/${buildId}`).set(auth(supplierToken))).body as {
      people: { members: { email: string }[]; pending: unknown[] };
    };
    expect(after.people.members.map((m) => m.email)).toEqual(expect.arrayContaining([builder.email, inspector.email]));
    expect(after.people.pending).toEqual([]);
    await Promise.all([office, bench, review].map((p) => p.context().close()));
  });

  it('the admin invites someone who joins; deactivated, their sign-in ends at once', async () => {
    const person = { email: `juno.${stamp()}@benchwork.example`, name: 'Juno Marsh' };
    const adminToken = await t.signIn(DEMO_USERS.admin.email);
    const orgs = (await request(t.app).get('/api/people/organizations').set(auth(adminToken))).body.items as {
      id: string;
      kind: string;
    }[];
    const shop = orgs.find((o) => o.kind === 'shop')!;

    const office = await widePage();
    await signIn(office, DEMO_USERS.admin.email);
    await visible(office, 'people-screen').waitFor({ timeout: 30_000 });
    await visible(office, 'tab-people').waitFor();
    await visible(office, 'invite-person-email').fill(person.email);
    await visible(office, 'invite-person-name').fill(person.name);
    await visible(office, 'invite-role-builder').click();
    await visible(office, `invite-org-${shop.id}`).click();
    await visible(office, 'invite-send').click();
    await visible(office, 'invite-sent').waitFor({ timeout: 30_000 });
    await visible(office, `invitation-${person.email}`).waitFor({ timeout: 30_000 });

    // They join from the mail and are signed in on their phone.
    const phone = await join(await linkIn(person.email, 'invite'), person.name);
    await visible(phone, 'bench-screen').waitFor({ timeout: 30_000 });
    const stored = JSON.parse(
      (await phone.evaluate(() => window.localStorage.getItem('pitchcard.session'))) ?? '{}',
    ) as { token?: string };
    expect(stored.token).toBeTruthy();
    expect((await request(t.app).get('/api/auth/me').set(auth(stored.token!))).status).toBe(200);

    // The admin finds them, and deactivates them after saying yes.
    await office.reload();
    await visible(office, 'people-find').fill(person.email);
    await visible(office, `person-${person.email}`).click();
    await visible(office, 'person-action-deactivate').click();
    await visible(office, 'person-ask').waitFor();
    await visible(office, 'person-confirm').click();
    await visible(office, 'person-done').waitFor({ timeout: 30_000 });
    await visible(office, `person-inactive-${person.email}`).waitFor();

    // Their existing token is refused on the next request, and their phone drops to the sign-in page.
    expect((await request(t.app).get('/api/auth/me').set(auth(stored.token!))).status).toBe(401);
    await phone.reload();
    await visible(phone, 'sign-in').waitFor({ timeout: 30_000 });
    await Promise.all([office, phone].map((p) => p.context().close()));
  });

  it('a forgotten password: the sign-in page’s link, the reset mail, a new password, signed in', async () => {
    const who = DEMO_USERS.inspector;
    const page = await phonePage(browser, base);
    await page.goto('/');
    await visible(page, 'forgot-password').click();
    await visible(page, 'forgot-email').fill(who.email);
    await visible(page, 'forgot-send').click();
    await visible(page, 'forgot-sent').waitFor({ timeout: 30_000 });

    await page.goto(await linkIn(who.email, 'reset'));
    await visible(page, 'reset-screen').waitFor({ timeout: 30_000 });
    await visible(page, 'reset-password').fill(STRONG);
    await visible(page, 'reset-submit').click();
    await visible(page, 'review-screen').waitFor({ timeout: 30_000 });

    // The old password is gone and the new one works.
    expect(
      (await request(t.app).post('/api/auth/sign-in').send({ email: who.email, password: DEMO_PASSWORD })).status,
    ).toBe(401);
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: who.email, password: STRONG })).status).toBe(
      200,
    );
    await page.context().close();
  });
});
