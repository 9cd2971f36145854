import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { smallKits } from '../../fixtures/rib-revision';
import { publishSmallKit, shipBuild } from '../../helpers/small-kit';
import type { TestApp } from '../../helpers/test-app';
import { fillSignIn } from './browser';
import { servedWithBrowser } from './served-app';

/**
 * What the whole-app browser audits share (a11y.e2e.ts, layout-audit.e2e.ts): the routes of every role
 * with the testid that says each has drawn, the demo ids they open, and a signed-in page per role.
 */

/** 'none': signed out. */
export type Role = 'builder' | 'inspector' | 'supplier' | 'admin' | 'none';
export type Ids = {
  buildId: string;
  travelerId: string;
  findingId: string;
  kitId: string;
  designId: string;
  studyId: string;
  wingStudyId: string;
  walkTravelerId: string;
  walkFindingId: string;
  inviteToken: string;
  resetToken: string;
  noticeId: string;
};
export type Route = { role: Role; name: string; path: (ids: Ids) => string; ready: string };
export type Width = { name: string; viewport: { width: number; height: number }; isMobile: boolean };

/**
 * Every screen of app/ for every role that works on it (components/navigation/role-tabs.ts says which
 * pages are closed to a role: those only send the person on to their own first page). Not listed: /
 * (sends each role on to its first tab) and /t/<token> (a scanned label: sends on to the part, or to
 * sign-in when signed out). The not-found page is listed once, signed out.
 */
export const routes: Route[] = [
  { role: 'builder', name: 'bench', path: () => '/bench', ready: 'bench-screen' },
  { role: 'builder', name: 'parts', path: () => '/travelers', ready: 'travelers-screen' },
  { role: 'builder', name: 'a traveler', path: (i) => `/travelers/${i.travelerId}`, ready: 'traveler-screen' },
  {
    role: 'builder',
    name: 'the flag screen',
    path: (i) => `/travelers/${i.travelerId}/flag?holes=U-10`,
    ready: 'flag-screen',
  },
  { role: 'builder', name: 'a part’s label', path: (i) => `/travelers/${i.travelerId}/label`, ready: 'labels-screen' },
  { role: 'builder', name: 'findings', path: () => '/findings', ready: 'my-findings-screen' },
  { role: 'builder', name: 'a finding', path: (i) => `/findings/${i.findingId}`, ready: 'finding-screen' },
  { role: 'builder', name: 'builds', path: () => '/builds', ready: 'builds-screen' },
  { role: 'builder', name: 'a build', path: (i) => `/builds/${i.buildId}`, ready: 'build-screen' },
  { role: 'builder', name: 'build log', path: (i) => `/builds/${i.buildId}/log`, ready: 'build-log-screen' },
  { role: 'builder', name: 'account', path: () => '/account', ready: 'account-screen' },
  { role: 'inspector', name: 'review queue', path: () => '/findings', ready: 'review-screen' },
  {
    role: 'inspector',
    name: 'a finding with its decision form',
    path: (i) => `/findings/${i.findingId}`,
    ready: 'finding-decision',
  },
  { role: 'inspector', name: 'builds', path: () => '/builds', ready: 'builds-screen' },
  { role: 'inspector', name: 'a build', path: (i) => `/builds/${i.buildId}`, ready: 'build-screen' },
  { role: 'inspector', name: 'build log', path: (i) => `/builds/${i.buildId}/log`, ready: 'build-log-screen' },
  { role: 'inspector', name: 'parts', path: () => '/travelers', ready: 'travelers-screen' },
  { role: 'inspector', name: 'a traveler', path: (i) => `/travelers/${i.travelerId}`, ready: 'traveler-screen' },
  { role: 'inspector', name: 'account', path: () => '/account', ready: 'account-screen' },
  { role: 'supplier', name: 'catalogue', path: () => '/catalogue', ready: 'catalogue-screen' },
  { role: 'supplier', name: 'a kit', path: (i) => `/catalogue/kits/${i.kitId}`, ready: 'kit-screen' },
  {
    role: 'supplier',
    name: 'issue a notice',
    path: (i) => `/catalogue/kits/${i.kitId}/new-notice`,
    ready: 'notice-form-screen',
  },
  { role: 'supplier', name: 'a notice', path: (i) => `/catalogue/notices/${i.noticeId}`, ready: 'notice-screen' },
  { role: 'builder', name: 'a notice', path: (i) => `/builds/notices/${i.noticeId}`, ready: 'compliance-form' },
  { role: 'inspector', name: 'a notice', path: (i) => `/builds/notices/${i.noticeId}`, ready: 'notice-screen' },
  { role: 'supplier', name: 'a design', path: (i) => `/catalogue/designs/${i.designId}`, ready: 'design-screen' },
  { role: 'supplier', name: 'a new kit', path: () => '/catalogue/new-kit', ready: 'kit-form-screen' },
  {
    role: 'supplier',
    name: 'a new design',
    path: (i) => `/catalogue/designs/new?kitModelId=${i.kitId}`,
    ready: 'design-create-screen',
  },
  { role: 'supplier', name: 'load studies', path: () => '/studies', ready: 'studies-screen' },
  { role: 'supplier', name: 'a study', path: (i) => `/studies/${i.studyId}`, ready: 'study-screen' },
  { role: 'supplier', name: 'a wing study', path: (i) => `/studies/${i.wingStudyId}`, ready: 'wing-study-screen' },
  {
    role: 'supplier',
    name: 'a new study',
    path: (i) => `/studies/new?kitModelId=${i.kitId}`,
    ready: 'new-study-screen',
  },
  {
    role: 'supplier',
    name: 'a new wing study',
    path: (i) => `/studies/new-wing?kitModelId=${i.kitId}`,
    ready: 'new-wing-study-screen',
  },
  { role: 'supplier', name: 'coupons', path: () => '/coupons', ready: 'coupons-screen' },
  { role: 'supplier', name: 'builds', path: () => '/builds', ready: 'builds-screen' },
  { role: 'supplier', name: 'a build', path: (i) => `/builds/${i.buildId}`, ready: 'build-screen' },
  { role: 'supplier', name: 'shipping a build', path: () => '/builds/new', ready: 'ship-build-screen' },
  { role: 'supplier', name: 'labels', path: (i) => `/builds/${i.buildId}/labels`, ready: 'labels-screen' },
  {
    role: 'supplier',
    name: 'a build’s labels from the parts',
    path: (i) => `/travelers/labels?build=${i.buildId}`,
    ready: 'labels-screen',
  },
  { role: 'supplier', name: 'build log', path: (i) => `/builds/${i.buildId}/log`, ready: 'build-log-screen' },
  { role: 'supplier', name: 'a traveler', path: (i) => `/travelers/${i.travelerId}`, ready: 'traveler-screen' },
  { role: 'supplier', name: 'approvals', path: () => '/findings', ready: 'supplier-findings-screen' },
  // The demo supplier is their organisation's lead engineer: the people tab is theirs too.
  { role: 'supplier', name: 'people', path: () => '/people', ready: 'people-screen' },
  { role: 'supplier', name: 'phone setup', path: () => '/phone', ready: 'phone-setup-screen' },
  { role: 'supplier', name: 'account', path: () => '/account', ready: 'account-screen' },
  { role: 'admin', name: 'people', path: () => '/people', ready: 'people-screen' },
  { role: 'admin', name: 'phones', path: () => '/phone', ready: 'phone-setup-screen' },
  { role: 'admin', name: 'account', path: () => '/account', ready: 'account-screen' },
  { role: 'none', name: 'sign-in', path: () => '/sign-in', ready: 'sign-in' },
  { role: 'none', name: 'forgot password', path: () => '/forgot', ready: 'forgot-screen' },
  { role: 'none', name: 'an invitation', path: (i) => `/invite/${i.inviteToken}`, ready: 'invite-name' },
  { role: 'none', name: 'a password reset', path: (i) => `/reset/${i.resetToken}`, ready: 'reset-screen' },
  { role: 'none', name: 'a page that is not there', path: () => '/no-such-page', ready: 'go-home' },
  // Development only, and open to anyone (no session needed): the mail the local catcher took in.
  { role: 'none', name: 'development mail', path: () => '/dev/mail', ready: 'dev-mail-screen' },
];

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
export const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

/**
 * The demo scenario's ids (build NK2-0147, its inboard rib part-riveted with a raised finding, a rib
 * and a wing study), plus a small kit of our own with a flagged hole, a pending invitation and a
 * password-reset link, each read back from its mail as the person would.
 */
export async function gatherIds(t: TestApp): Promise<Ids> {
  const tokens = await t.tokens();
  const parts = (await request(t.app).get('/api/travelers').set(auth(tokens.builder))).body.items as {
    id: string;
    partNumber: string;
    buildId: string;
  }[];
  const inner = parts.find((p) => p.partNumber === 'W-104')!;
  const detail = (await request(t.app).get(`/api/travelers/${inner.id}`).set(auth(tokens.builder))).body;
  const kits = (await request(t.app).get('/api/kits').set(auth(tokens.supplier))).body.items as {
    id: string;
    code: string;
  }[];
  const kit = kits.find((k) => k.code === 'NK-2')!;
  const designs = (await request(t.app).get(`/api/designs?kitModelId=${kit.id}`).set(auth(tokens.supplier))).body
    .items as { id: string; partNumber: string }[];
  const studies = (await request(t.app).get('/api/studies').set(auth(tokens.supplier))).body.items as {
    id: string;
    kind: string;
  }[];
  const walk = await walkKit(t, tokens.supplier, tokens.builder);
  return {
    buildId: inner.buildId,
    travelerId: inner.id,
    findingId: detail.findings[0].id,
    kitId: kit.id,
    designId: designs.find((d) => d.partNumber === 'W-104')!.id,
    // A rib study and a wing study draw on screens of their own.
    studyId: studies.find((s) => s.kind !== 'wing')!.id,
    wingStudyId: studies.find((s) => s.kind === 'wing')!.id,
    ...walk,
    inviteToken: await inviteLink(t, tokens.admin),
    resetToken: await resetLink(t),
    noticeId: await issueNotice(t, tokens.supplier, kit.id),
  };
}

/** A mandatory notice to every NK-2 kit (the demo build among them), for the notice screens. */
async function issueNotice(t: TestApp, supplier: string, kitModelId: string): Promise<string> {
  const res = await request(t.app).post('/api/notices').set(auth(supplier)).send({
    kitModelId,
    level: 'mandatory',
    title: 'Check the flange bend radius',
    body: 'Check the flange bend radius at the nose of each rib before riveting, and record what you found.',
  });
  if (res.status !== 201) throw new Error(`the audit's notice was refused: ${JSON.stringify(res.body)}`);
  return res.body.id as string;
}

/** A small kit of our own (one rib, two short lines), shipped, with one hole flagged: for the keyboard walk. */
async function walkKit(t: TestApp, supplier: string, builder: string) {
  const kitId = await publishSmallKit(t, supplier, smallKits.keyboardWalk);
  const { travelerId: walkTravelerId } = await shipBuild(t, supplier, kitId, 'AX-0001');
  const raised = await request(t.app)
    .post('/api/findings')
    .set(auth(builder))
    .field('travelerId', walkTravelerId)
    .field('holeIds', '["L-02"]')
    .field('kind', 'hole_elongated')
    .field('note', 'oval after deburring')
    .attach(
      'photos',
      await sharp({ create: { width: 320, height: 240, channels: 3, background: '#8a9096' } })
        .jpeg()
        .toBuffer(),
      'l02.jpg',
    );
  if (raised.status !== 201)
    throw new Error(`raising the walk finding failed: ${raised.status} ${JSON.stringify(raised.body)}`);
  return { walkTravelerId, walkFindingId: raised.body.id as string };
}

/** The token of the one-time link in the newest mail to `to` that links to `kind`. */
async function linkToken(t: TestApp, to: string, kind: 'invite' | 'reset'): Promise<string> {
  const mail = await t.waitForMail((m) => m.to.includes(to) && new RegExp(`/${kind}/`).test(m.text));
  const m = new RegExp(`https?://\\S+/${kind}/([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!m) throw new Error(`no ${kind} link in the mail to ${to}: ${mail.text}`);
  return m[1];
}

/** The admin invites a builder, who has not yet joined: the invitation page as they open it. */
async function inviteLink(t: TestApp, admin: string): Promise<string> {
  const email = 'audit.invitee@shop.example';
  const res = await request(t.app)
    .post('/api/people/invitations')
    .set(auth(admin))
    .send({ email, name: 'Audit Invitee', role: 'builder' });
  if (res.status !== 201) throw new Error(`inviting ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return linkToken(t, email, 'invite');
}

/** A reset link asked for the demo inspector (their password stays until the link is used; it is not). */
async function resetLink(t: TestApp): Promise<string> {
  const res = await request(t.app).post('/api/auth/forgot').send({ email: DEMO_USERS.inspector.email });
  if (res.status >= 300) throw new Error(`asking for a reset link failed: ${res.status} ${JSON.stringify(res.body)}`);
  return linkToken(t, DEMO_USERS.inspector.email, 'reset');
}

/** A page at `w`'s size, signed in as `role` through the sign-in form (signed out for 'none'). */
export async function signedInContext(
  browser: Browser,
  base: string,
  role: Role,
  w: Width,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({
    baseURL: base,
    viewport: w.viewport,
    isMobile: w.isMobile,
    hasTouch: w.isMobile,
    deviceScaleFactor: 1,
    bypassCSP: true,
    // No service worker: every route is loaded fresh from the server under test.
    serviceWorkers: 'block',
  });
  const page = await context.newPage();
  await page.goto('/');
  if (role === 'none') {
    await visible(page, 'email').waitFor({ timeout: 30000 });
    return { context, page };
  }
  await fillSignIn(page, DEMO_USERS[role].email);
  await visible(page, 'screen-title').waitFor({ timeout: 30000 });
  return { context, page };
}

/**
 * The whole screen as a picture (git-ignored, under tests/e2e/artifacts): the app scrolls inside its
 * own scroll view, so the page is made as tall as the longest scrolling content for the shot.
 */
export async function keepScreenshot(
  page: Page,
  dir: string,
  name: string,
  viewport: { width: number; height: number },
) {
  const tall = await page.evaluate(() =>
    Math.max(
      ...Array.from(document.querySelectorAll('*'))
        .filter((e) => e.scrollHeight > e.clientHeight + 1 && /(auto|scroll)/.test(getComputedStyle(e).overflowY))
        .map((e) => e.scrollHeight - e.clientHeight),
      0,
    ),
  );
  await page.setViewportSize({ width: viewport.width, height: Math.min(12000, viewport.height + tall) });
  await page.waitForTimeout(200);
  await page.screenshot({ path: path.join(dir, `${name}.png`) });
  await page.setViewportSize(viewport);
}

/** A file name from a route and width. */
export const shotName = (...parts: string[]) => parts.join('-').replace(/[^a-z0-9]+/gi, '-');

/**
 * One signed-in page per role at one width, for a walk over the routes: each route opened, its ready
 * mark shown, loading gone, fonts in and layout settled. Close them with `closeAll` after the walk.
 */
export function routeWalker(w: Width, env: () => { browser: Browser; base: string; ids: Ids }) {
  const pages = new Map<Role, { context: BrowserContext; page: Page }>();
  return {
    async open(r: Route): Promise<Page> {
      const { browser, base, ids } = env();
      if (!pages.has(r.role)) pages.set(r.role, await signedInContext(browser, base, r.role, w));
      const { page } = pages.get(r.role)!;
      await page.goto(r.path(ids));
      await visible(page, r.ready).waitFor({ timeout: 30000 });
      await page
        .waitForFunction(() => !document.querySelector('[data-testid="loading"]'), undefined, { timeout: 30000 })
        .catch(() => undefined);
      await page.evaluate(() => document.fonts.ready);
      await page.waitForTimeout(300);
      return page;
    },
    async closeAll() {
      for (const p of pages.values()) await p.context.close().catch(() => undefined);
    },
  };
}

/**
 * What both walks open before their tests and close after: the served app with the demo, one browser,
 * the demo's ids and the folder the screenshots go to. Read its fields inside tests (they are set in beforeAll).
 */
export function auditSession(artefacts: string) {
  const s = {} as { t: TestApp; base: string; browser: Browser; ids: Ids };
  servedWithBrowser((served) => Object.assign(s, served));
  beforeAll(async () => {
    await mkdir(artefacts, { recursive: true });
    s.ids = await gatherIds(s.t);
  });
  return s;
}
