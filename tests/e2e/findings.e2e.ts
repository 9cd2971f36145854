import { mkdtemp, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { smallKits } from '../fixtures/rib-revision';
import { publishSmallKit, shipBuild, workPart } from '../helpers/small-kit';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, keptPhotoIds, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * A finding's whole life through the screens at phone size, in Debian's headless Chromium against the
 * real server, PostgreSQL, job queue and SMTP fake: repair with the next-size rivet, approved by the
 * design authority from the mail's link, work done with a photo, sent back once, accepted, signed off;
 * and scrap, after which the replacement part appears on the bench and is worked to sign-off.
 */
jest.setTimeout(420_000);

let t: TestApp;
let base: string;
let browser: Browser;
let photo: string;
let kitId: string;
let serial = 0;

const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'pc-e2e-findings-'));
  photo = path.join(dir, 'work.jpg');
  await writeFile(
    photo,
    await sharp({ create: { width: 640, height: 480, channels: 3, background: '#8a9096' } })
      .jpeg()
      .toBuffer(),
  );
  kitId = await publishSmallKit(t, await t.signIn(DEMO_USERS.supplier.email), smallKits.findingWalk);
});

/** A freshly shipped build of the walk kit: its one part, with every hole but `except` riveted and its step done. */
async function part(except: string[]) {
  const supplier = await t.signIn(DEMO_USERS.supplier.email);
  const builder = await t.signIn(DEMO_USERS.builder.email);
  const kitSerial = `FE-${++serial}-${Date.now().toString(36).slice(-4).toUpperCase()}`;
  const { buildId, travelerId } = await shipBuild(t, supplier, kitId, kitSerial);
  await workPart(t, builder, travelerId, except);
  return { travelerId, kitSerial, buildId };
}

async function signedIn(email: string, at = '/') {
  const page = await phonePage(browser, base);
  await page.goto(at);
  await fillSignIn(page, email);
  return page;
}

/** The finding screen, after the status shows `status`. */
async function findingAt(page: Page, status: string) {
  await visible(page, `finding-status-${status}`).waitFor({ timeout: 30000 });
}

async function act(page: Page, action: string, note?: string) {
  if (note !== undefined) await visible(page, 'action-note').fill(note);
  await visible(page, `finding-action-${action}`).click();
}

async function attachPhoto(page: Page) {
  const chooser = page.waitForEvent('filechooser');
  await visible(page, 'add-photo').click();
  await (await chooser).setFiles(photo);
  await visible(page, 'photo-0').waitFor();
}

describe('a finding through the screens at phone size', () => {
  it('repair with the next-size rivet → approved from the mail’s link → done → sent back → done → accepted → signed off', async () => {
    const p = await part(['U-02']);

    // The builder flags the hole with a photo.
    const bench = await signedIn(DEMO_USERS.builder.email);
    await visible(bench, 'tab-bench').waitFor({ timeout: 30000 });
    await bench.goto(`/travelers/${p.travelerId}/flag?holes=U-02`);
    await visible(bench, 'flag-screen').waitFor({ timeout: 30000 });
    await visible(bench, 'finding-kind-hole_elongated').click();
    await visible(bench, 'finding-note').fill('U-02 came out oval after deburring');
    await attachPhoto(bench);
    await visible(bench, 'submit-finding').click();
    await visible(bench, 'finding-sent').waitFor({ timeout: 30000 });
    const raised = await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes(p.kitSerial),
    );
    const findingPath = new URL(/https?:\/\/\S+\/findings\/[0-9a-f-]{36}/.exec(raised.text)![0]).pathname;

    // The inspector opens the mail's link and chooses a repair with the next-size rivet; the check fails, so they say why.
    const review = await signedIn(DEMO_USERS.inspector.email, findingPath);
    await findingAt(review, 'raised');
    await visible(review, 'disposition-repair').click();
    await visible(review, 'repair-scheme-oversize_rivet').click();
    await visible(review, 'repair-rivet-MS20470AD5').click();
    await visible(review, 'repair-rivet-check').click();
    await visible(review, 'repair-rivet-result').waitFor({ timeout: 30000 });
    await visible(review, 'override-reason').fill('Measured 0.33 in to the edge on the part itself');
    await act(review, 'disposition', 'Drill out to #21 and set MS20470AD5');
    await findingAt(review, 'awaiting_approval');

    // The supplier's engineer opens the mail's link signed out, signs in, and lands on the finding.
    const daMail = await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.supplier.email) && m.subject.includes(p.kitSerial),
    );
    expect(daMail.text).toContain('Chosen anyway because: Measured 0.33 in');
    const link = new URL(/https?:\/\/\S+\/findings\/[0-9a-f-]{36}/.exec(daMail.text)![0]);
    const office = await signedIn(DEMO_USERS.supplier.email, link.pathname);
    await findingAt(office, 'awaiting_approval');
    await visible(office, 'override-reason-shown').waitFor();
    await act(office, 'approve', 'Approved: next size with the measured edge distance');
    await findingAt(office, 'work_ordered');

    // The builder reports the work done with a photo.
    await bench.goto(findingPath);
    await findingAt(bench, 'work_ordered');
    await attachPhoto(bench);
    await act(bench, 'report-done', 'Drilled #21, set MS20470AD5');
    await findingAt(bench, 'work_done');

    // The inspector sends it back once; the builder does it again; the inspector accepts.
    await review.reload();
    await findingAt(review, 'work_done');
    await act(review, 'send-back', 'Shop head too flat: drill out and set again');
    await findingAt(review, 'work_ordered');
    await bench.reload();
    await findingAt(bench, 'work_ordered');
    await attachPhoto(bench);
    await act(bench, 'report-done', 'Set again, shop head 1.5D');
    await findingAt(bench, 'work_done');
    await review.reload();
    await findingAt(review, 'work_done');
    await act(review, 'accept');
    await findingAt(review, 'closed');
    expect(await visible(review, 'closure').textContent()).toMatch(/accepted/i);

    // The part is now ready: the inspector signs it off from the traveler.
    await visible(review, 'open-traveler').click();
    await visible(review, 'traveler-screen').waitFor({ timeout: 30000 });
    await visible(review, 'sign-off').click();
    await visible(review, 'signed-off').waitFor({ timeout: 30000 });
  });

  it('scrap → the replacement appears on the bench → its holes ticked → it signs off', async () => {
    const p = await part(['U-03']);
    const builderToken = await t.signIn(DEMO_USERS.builder.email);
    const raised = await request(t.app)
      .post('/api/findings')
      .set(auth(builderToken))
      .field('travelerId', p.travelerId)
      .field('holeIds', '["U-03"]')
      .field('kind', 'hole_cracked')
      .field('note', 'crack runs to the flange edge')
      .attach('photos', photo);
    expect(raised.status).toBe(201);

    const review = await signedIn(DEMO_USERS.inspector.email, `/findings/${raised.body.id}`);
    await findingAt(review, 'raised');
    await visible(review, 'disposition-scrap').click();
    await act(review, 'disposition', 'Crack through the flange: scrap the rib');
    await findingAt(review, 'closed');
    await visible(review, 'finding-replacement').waitFor();
    const replacement = (await request(t.app).get(`/api/findings/${raised.body.id}`).set(auth(builderToken))).body
      .replacement;

    const bench = await signedIn(DEMO_USERS.builder.email);
    await visible(bench, 'tab-bench').waitFor({ timeout: 30000 });
    const fresh = (await request(t.app).get(`/api/travelers/${replacement.travelerId}`).set(auth(builderToken))).body;
    await visible(bench, `traveler-${fresh.shortCode}`).click();
    await visible(bench, 'traveler-screen').waitFor({ timeout: 30000 });
    await visible(bench, 'replaces').waitFor();
    for (const [first, last] of [
      ['U-01', 'U-05'],
      ['L-01', 'L-05'],
    ]) {
      await visible(bench, 'run-mode').click();
      await visible(bench, `hole-${first}`).click();
      await visible(bench, `hole-${last}`).click();
      await visible(bench, 'tick-run').click();
    }
    await visible(bench, 'step-1').click();
    const until = Date.now() + 30000;
    for (;;) {
      const d = (await request(t.app).get(`/api/travelers/${fresh.id}`).set(auth(builderToken))).body;
      if (d.holesDone === d.holesTotal && d.steps.every((s: { doneAt: string | null }) => s.doneAt)) break;
      if (Date.now() > until) throw new Error(`the replacement is not done: ${d.holesDone}/${d.holesTotal}`);
      await new Promise((r) => setTimeout(r, 200));
    }

    await review.goto(`/travelers/${fresh.id}`);
    await visible(review, 'traveler-screen').waitFor({ timeout: 30000 });
    await visible(review, 'sign-off').click();
    await visible(review, 'signed-off').waitFor({ timeout: 30000 });
    // The scrapped part stays in the record, marked, naming its replacement.
    await review.goto(`/travelers/${p.travelerId}`);
    await visible(review, 'replaced-by').waitFor({ timeout: 30000 });
  });
});

describe('a finding’s photo kept on the phone until it is sent', () => {
  it('a camera-sized photo survives a reload of the form and is sent; its kept bytes go once the server has it', async () => {
    // A phone camera's photo is megabytes, too large for the draft's localStorage: this one is about 2 MB.
    const big = path.join(path.dirname(photo), 'camera.jpg');
    const bytes = await sharp({
      create: {
        width: 1800,
        height: 1350,
        channels: 3,
        background: '#888',
        noise: { type: 'gaussian', mean: 128, sigma: 50 },
      },
    })
      .jpeg({ quality: 92 })
      .toBuffer();
    expect(bytes.length).toBeGreaterThan(1_500_000);
    await writeFile(big, bytes);
    const p = await part(['U-04']);

    const bench = await signedIn(DEMO_USERS.builder.email);
    await visible(bench, 'tab-bench').waitFor({ timeout: 30000 });
    // A photo kept by a draft left for months is swept when the form is next opened.
    await keptPhotoIds(bench, `${(Date.now() - 200 * 86_400_000).toString(36)}.left-for-good`);
    await bench.reload();
    await bench.goto(`/travelers/${p.travelerId}/flag?holes=U-04`);
    await visible(bench, 'flag-screen').waitFor({ timeout: 30000 });
    await visible(bench, 'finding-kind-hole_elongated').click();
    await visible(bench, 'finding-note').fill('U-04 oval, photo from the phone camera');
    const chooser = bench.waitForEvent('filechooser');
    await visible(bench, 'add-photo').click();
    await (await chooser).setFiles(big);
    await visible(bench, 'photo-0').waitFor();
    // Kept once the draft is written (a quarter second after the change); the old one swept.
    const keptCount = async (n: number) => {
      const until = Date.now() + 15000;
      let kept = await keptPhotoIds(bench);
      while (kept.length !== n && Date.now() < until) {
        await new Promise((r) => setTimeout(r, 200));
        kept = await keptPhotoIds(bench);
      }
      expect(kept).toHaveLength(n);
      return kept;
    };
    const [first] = await keptCount(1);
    expect(first).not.toContain('left-for-good');
    // A second photo taken out of the form again is let go at the next write.
    await attachPhoto(bench);
    await visible(bench, 'photo-1').waitFor();
    await keptCount(2);
    await visible(bench, 'remove-photo-1').click();
    expect(await keptCount(1)).toEqual([first]);

    // The page goes (the phone closed the tab): the draft comes back with its photo, shown and sendable.
    await bench.reload();
    await visible(bench, 'draft-restored').waitFor({ timeout: 30000 });
    await visible(bench, 'photo-0').waitFor();
    await bench.waitForFunction(() =>
      Array.from(document.querySelectorAll('[data-testid="photo-0"] img')).some(
        (i) => (i as HTMLImageElement).naturalWidth > 0,
      ),
    );
    await visible(bench, 'submit-finding').click();
    await visible(bench, 'finding-sent').waitFor({ timeout: 30000 });

    const builder = await t.signIn(DEMO_USERS.builder.email);
    const list = await request(t.app).get(`/api/findings?travelerId=${p.travelerId}`).set(auth(builder));
    const found = (list.body.items ?? list.body).find((f: { holeIds: string[] }) => f.holeIds.includes('U-04'));
    const finding = (await request(t.app).get(`/api/findings/${found.id}`).set(auth(builder))).body;
    expect(finding.photos).toHaveLength(1);
    expect(finding.photos[0]).toMatchObject({ width: 1800, height: 1350 });
    expect(await keptPhotoIds(bench)).toEqual([]);
  });
});
