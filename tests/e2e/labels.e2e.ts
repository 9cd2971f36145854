import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { readQr } from '../fixtures/read-qr';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * QR labels in a real browser: a builder reprints one part's label from its traveler; the supplier prints
 * a whole build's; each label stock gives the printed page its own size.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;

servedWithBrowser((s) => ({ t, base, browser } = s));

async function signIn(page: Page, email: string) {
  await page.goto('/');
  await fillSignIn(page, email);
}

/**
 * Each page's box in a PDF, in points (1 in = 72 pt, PDF's default user space unit). Chromium's PDF writer
 * puts a MediaBox on every page object, uncompressed.
 */
function pageBoxes(pdf: Buffer): number[][] {
  const s = pdf.toString('latin1');
  const pages = (s.match(/\/Type\s*\/Page\b(?!s)/g) ?? []).length;
  const boxes = [...s.matchAll(/\/MediaBox\s*\[\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s*\]/g)].map((m) => [
    Number(m[3]) - Number(m[1]),
    Number(m[4]) - Number(m[2]),
  ]);
  // A page without a box of its own takes the first (the page tree's).
  return Array.from({ length: pages }, (_, i) => boxes[i] ?? boxes[0]);
}

describe('QR labels in a real browser', () => {
  it('a builder reprints one part’s label from the traveler: kit model, supplier, part, revision, serial, short code and a QR that opens it', async () => {
    const token = await t.signIn(DEMO_USERS.builder.email);
    const parts = (await request(t.app).get('/api/travelers').set(auth(token))).body.items as {
      id: string;
      shortCode: string;
      serial: string;
      partNumber: string;
      letter: string;
    }[];
    const part = parts[0];
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.builder.email);
    await page
      .getByTestId('bench-screen')
      .or(page.getByTestId('travelers-screen'))
      .first()
      .waitFor({ timeout: 20000 })
      .catch(() => undefined);
    await page.goto(`/travelers/${part.id}`);
    await page.getByTestId('traveler-label').click();
    const card = page.getByTestId(`part-label-${part.shortCode}`);
    await card.waitFor({ timeout: 15000 });
    expect(page.url()).toBe(`${base}/travelers/${part.id}/label`);
    expect(await page.locator('[data-testid^="part-label-"]').count()).toBe(1);

    const text = await card.innerText();
    const kit = (await request(t.app).get(`/api/travelers/labels?travelerId=${part.id}`).set(auth(token))).body[0];
    for (const s of [
      part.shortCode,
      part.serial,
      part.partNumber,
      kit.kitModelCode,
      kit.kitModelName,
      kit.supplierName,
    ])
      expect(text).toContain(s);
    expect(await card.getByTestId('label-revision').innerText()).toBe(part.letter);

    // The QR read back off the page, as a phone would: the public address of this part.
    const png = await card.locator('img').first().screenshot();
    expect(await readQr(png)).toMatch(new RegExp(`^${t.config.publicUrl}/t/[A-Za-z0-9_-]{20,}$`));
    await page.context().close();
  });

  it('each stock prints on its own page size: sheet, 2 × 1 in, 62 mm roll', async () => {
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.supplier.email);
    await page.getByTestId('email').waitFor({ state: 'detached', timeout: 20000 });
    const supplierToken = await t.signIn(DEMO_USERS.supplier.email);
    const builds = (await request(t.app).get('/api/builds').set(auth(supplierToken))).body.items as {
      id: string;
      travelerCount: number;
    }[];
    const build = builds.find((b) => b.travelerCount > 1)!;
    await page.goto(`/travelers/labels?build=${build.id}`);
    await page.locator('[data-testid^="part-label-"]').first().waitFor({ timeout: 15000 });
    expect(await page.locator('[data-testid^="part-label-"]').count()).toBe(build.travelerCount);

    // 2 × 1 in = 144 × 72 pt; 62 × 32 mm = 175.7 × 90.7 pt (72 pt to the inch, 25.4 mm to the inch).
    for (const [size, w, h] of [
      ['2x1in', 144, 72],
      ['62mm', 175.7, 90.7],
    ] as const) {
      await page.getByTestId(`label-size-${size}`).click();
      await page.emulateMedia({ media: 'print' });
      expect(await page.getByTestId('print-bar').isVisible()).toBe(false);
      const box = (await page.locator('[data-testid^="part-label-"]').first().boundingBox())!;
      // Drawn at the stock's size: 96 CSS px to the inch.
      expect([Math.round(box.width), Math.round(box.height)]).toEqual([
        Math.round((w / 72) * 96),
        Math.round((h / 72) * 96),
      ]);
      // Still as print: a PDF made under screen emulation would ignore the print rules.
      const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
      await page.emulateMedia({ media: null });
      const boxes = pageBoxes(pdf);
      // One label a page on a die-cut or roll stock.
      expect(boxes).toHaveLength(build.travelerCount);
      for (const [bw, bh] of boxes) expect([bw, bh]).toEqual([expect.closeTo(w, 0), expect.closeTo(h, 0)]);
    }
    await page.getByTestId('label-size-sheet').click();
    await page.emulateMedia({ media: 'print' });
    const sheet = pageBoxes(await page.pdf({ preferCSSPageSize: true, format: 'Letter' }));
    // The sheet keeps the printer's paper (US Letter, 612 × 792 pt) with the labels flowing over it.
    expect(sheet.length).toBeLessThan(build.travelerCount);
    expect(sheet[0]).toEqual([612, 792]);
    await page.context().close();
  });
});
