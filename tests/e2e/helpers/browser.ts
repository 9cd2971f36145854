import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '@/server/dev/seed';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/**
 * Debian's Chromium, headless, with no network chatter (Playwright gives it a fresh profile);
 * optionally a fake camera playing `video`.
 */
export async function launchBrowser(opts: { video?: string; trustSpki?: string } = {}): Promise<Browser> {
  const args = [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--disable-dev-shm-usage',
    // The test app's public address is a reserved .test name: it resolves to this machine only.
    '--host-resolver-rules=MAP pitchcard.test 127.0.0.1',
  ];
  // Trust one certificate (by its public key's hash) the way a phone that installed it would; nothing else.
  if (opts.trustSpki) args.push(`--ignore-certificate-errors-spki-list=${opts.trustSpki}`);
  if (opts.video)
    args.push(
      '--use-fake-ui-for-media-stream',
      '--use-fake-device-for-media-stream',
      `--use-file-for-fake-video-capture=${opts.video}`,
    );
  return chromium.launch({ executablePath: CHROMIUM, args, headless: true });
}

/** A phone-sized page, as the bench sees it. */
export async function phonePage(browser: Browser, baseURL: string) {
  const context = await browser.newContext({
    baseURL,
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    permissions: ['camera'],
  });
  return context.newPage();
}

/** The sign-in form, filled with `email` and `password` (the demo's by default) and sent, on whatever page shows it. */
export async function fillSignIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in').click();
}

/**
 * The ids of the photos a page keeps on the device for its finding drafts and queued findings
 * (lib/kept-photos.web.ts), read from IndexedDB as the page sees it. `put` first stores one photo under
 * the id given, as an earlier visit would have.
 */
export function keptPhotoIds(page: Page, put?: string): Promise<string[]> {
  return page.evaluate(
    (id) =>
      new Promise<string[]>((resolve, reject) => {
        const open = indexedDB.open('pitchcard-photos');
        open.onerror = () => reject(open.error);
        open.onupgradeneeded = () => open.result.createObjectStore('kept');
        open.onsuccess = () => {
          const tx = open.result.transaction('kept', 'readwrite');
          const kept = tx.objectStore('kept');
          if (id) kept.put({ blob: new Blob(['old']) }, id);
          const all = kept.getAllKeys();
          all.onsuccess = () => resolve(all.result.map(String));
          all.onerror = () => reject(all.error);
        };
      }),
    put,
  );
}
