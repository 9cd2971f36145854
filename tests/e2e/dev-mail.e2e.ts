import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import sharp from 'sharp';
import { DEMO_USERS } from '@/server/dev/seed';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * In Debian's headless Chromium against the real server: the development mail page shows what the SMTP
 * fake took in on its first request and draws a mail's HTML, its photo included, in a sandboxed frame;
 * and the small faults of the phone's frame stay fixed (the admin's landing, the header, the tab labels).
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;
let subject: string;

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  // A finding raised with a photo, so that the inspector's mail carries it.
  const tok = await t.tokens();
  const list = await request(t.app).get('/api/travelers').set(auth(tok.builder));
  const traveler = await request(t.app).get(`/api/travelers/${list.body.items[0].id}`).set(auth(tok.builder));
  const hole = traveler.body.holes.find((h: { status: string }) => h.status === 'pending');
  const photo = await sharp({ create: { width: 80, height: 60, channels: 3, background: '#5a5a5a' } })
    .jpeg()
    .toBuffer();
  const res = await request(t.app)
    .post('/api/findings')
    .set(auth(tok.builder))
    .field('travelerId', traveler.body.id)
    .field('holeIds', JSON.stringify([hole.holeId]))
    .field('kind', 'hole_cracked')
    .field('note', 'crack')
    .attach('photos', photo, { filename: 'crack.jpg', contentType: 'image/jpeg' });
  expect(res.status).toBe(201);
  subject = (
    await t.waitForMail((m) => m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes(`hole ${hole.holeId}`))
  ).subject;
});

async function signIn(page: Page, email: string) {
  await page.goto('/');
  await fillSignIn(page, email);
  await page.getByTestId('screen-title').first().waitFor();
}

describe('the development mail page', () => {
  it('shows the mail from its first request, none of them cut short', async () => {
    const page = await phonePage(browser, base);
    const asked: string[] = [];
    const failed: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/dev/mail')) asked.push(r.url());
    });
    page.on('requestfailed', (r) => {
      if (r.url().includes('/api/dev/mail')) failed.push(`${r.url()}: ${r.failure()?.errorText}`);
    });
    await signIn(page, DEMO_USERS.supplier.email);
    await page.goto('/dev/mail');
    await page.locator('[data-testid="mail-subject"]:visible').first().waitFor();
    // The page polls every 3 s: the list came with the first answer, not a later poll.
    expect(asked).toHaveLength(1);
    expect(failed).toEqual([]);
  });

  it('draws the newest mail as it looks, its photo from the inline part, in a frame with every sandbox restriction', async () => {
    const context = await browser.newContext({ baseURL: base, viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto('/dev/mail');
    const first = page.locator('[data-testid="mail-subject"]').first();
    await first.waitFor();
    expect(await first.textContent()).toBe(subject);
    const frame = page.locator('iframe[data-testid="mail-html"]').first();
    await frame.waitFor();
    expect(await frame.getAttribute('sandbox')).toBe('');
    const inside = page.frameLocator('iframe[data-testid="mail-html"]').first();
    await inside.locator('h2').waitFor();
    const img = inside.locator('img[alt="photo of the hole"]');
    await img.waitFor();
    // Decoded: the image drawn in from its part (the finding's thumbnail), not a broken link.
    const natural = await img.evaluate(async (el: HTMLImageElement) => {
      await el.decode().catch(() => undefined);
      return el.naturalWidth;
    });
    expect(natural).toBeGreaterThan(0);
    expect(await page.getByTestId('mail-parts').first().textContent()).toMatch(
      /1 shown inline \(cid:hole-[0-9a-f-]+@pitchcard\)/,
    );
    await context.close();
  });
});

describe("the frame around each role's pages", () => {
  it("lands the admin on their own page when a link leads to the supplier's catalogue or to builds", async () => {
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.admin.email);
    for (const path of ['/catalogue', '/builds']) {
      await page.goto(path);
      await page.waitForURL(/\/people$/);
      expect(await page.locator('[data-testid="screen-title"]:visible').first().textContent()).toBe('People');
      expect(await page.locator('body').innerText()).not.toMatch(/only a supplier may do this|Builds you inspect/);
    }
  });

  it("on a phone, keeps Sign out and the tab labels whole on the supplier's catalogue and builds", async () => {
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.supplier.email);
    for (const path of ['/catalogue', '/builds']) {
      await page.goto(path);
      const signOut = page.locator('[data-testid="sign-out"]:visible').first();
      await signOut.waitFor();
      const box = (await signOut.boundingBox())!;
      expect([path, box.x >= 0 && box.x + box.width <= 390, box.height >= 48]).toEqual([path, true, true]);
      // No label of a tab or of the header's controls is cut: its text fits the box it is drawn in.
      const cut = await page.evaluate(() =>
        Array.from(document.querySelectorAll('[role="tab"] *, [role="button"] *'))
          .filter((el) => Array.from(el.childNodes).some((n) => n.nodeType === 3 && n.textContent!.trim()))
          .filter(
            (el) =>
              el.getBoundingClientRect().width > 0 &&
              (el.scrollWidth > el.clientWidth + 1 || el.scrollHeight > el.clientHeight + 1),
          )
          .map(
            (el) => `"${el.textContent}" ${el.scrollWidth}×${el.scrollHeight} in ${el.clientWidth}×${el.clientHeight}`,
          ),
      );
      expect([path, cut]).toEqual([path, []]);
    }
  });
});
