import type { Browser } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * Links that arrive from outside (a mail's link to a finding, a QR label) opened by someone signed out,
 * in Debian's headless Chromium against the real server: sign in, then land on the page the link named,
 * not on the role's home tab.
 */
jest.setTimeout(180_000);

let t: TestApp;
let base: string;
let browser: Browser;

servedWithBrowser((s) => ({ t, base, browser } = s));

const pendingKey = 'pitchcard.pending-link';

async function api<T>(email: string, path: string): Promise<T> {
  const token = await t.signIn(email);
  const res = await request(t.app).get(path).set(auth(token));
  if (res.status !== 200) throw new Error(`GET ${path} as ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as T;
}

describe('a link opened while signed out opens after sign-in', () => {
  it('a mail’s link to a finding: sign-in says what will open, survives a reload, then shows that finding', async () => {
    const findings = (await api<{ items: { id: string }[] }>(DEMO_USERS.inspector.email, '/api/findings')).items;
    expect(findings.length).toBeGreaterThan(0);
    const findingId = findings[0].id;

    const page = await phonePage(browser, base);
    await page.goto(`/findings/${findingId}`);
    const notice = page.getByTestId('pending-link');
    await notice.waitFor({ timeout: 30000 });
    expect(await notice.textContent()).toContain('Sign in to open the finding you were sent');
    expect(new URL(page.url()).pathname).toBe('/sign-in');

    // A reload of the sign-in page still knows where the person was going.
    await page.reload();
    await notice.waitFor({ timeout: 30000 });
    expect(await notice.textContent()).toContain('Sign in to open the finding you were sent');

    await fillSignIn(page, DEMO_USERS.inspector.email);
    await page.waitForURL((url) => url.pathname === `/findings/${findingId}`, { timeout: 30000 });
    await page.getByTestId('finding-screen').waitFor({ timeout: 30000 });
    // Used once: nothing is left to send the person there again.
    expect(await page.evaluate((key) => window.sessionStorage.getItem(key), pendingKey)).toBeNull();

    await page.goto('/');
    await page.getByTestId('review-screen').waitFor({ timeout: 30000 });
    await page.context().close();
  });

  it('a scanned label: straight to sign-in with no button to press, then the part', async () => {
    const builds = (await api<{ items: { id: string }[] }>(DEMO_USERS.supplier.email, '/api/builds')).items;
    expect(builds.length).toBeGreaterThan(0);
    const labels = await api<{ travelerId: string; url: string }[]>(
      DEMO_USERS.supplier.email,
      `/api/travelers/labels?buildId=${builds[0].id}`,
    );
    expect(labels.length).toBeGreaterThan(0);
    const label = labels[0];
    const labelPath = new URL(label.url).pathname;
    expect(labelPath).toMatch(/^\/t\/[A-Za-z0-9_-]{20,}$/);

    const page = await phonePage(browser, base);
    await page.goto(labelPath);
    const notice = page.getByTestId('pending-link');
    await notice.waitFor({ timeout: 30000 });
    expect(await notice.textContent()).toContain('Sign in to open the part you scanned');
    expect(new URL(page.url()).pathname).toBe('/sign-in');

    await fillSignIn(page, DEMO_USERS.builder.email);
    // The label's page looks the part up and moves on to it; the address says so before the screen draws.
    await page.waitForURL((url) => url.pathname === `/travelers/${label.travelerId}`, { timeout: 30000 });
    await page.getByTestId('traveler-screen').waitFor({ timeout: 30000 });
    await page.context().close();
  });

  it('the sign-in page opened on its own says nothing will open, and signing in goes to the role’s home', async () => {
    const page = await phonePage(browser, base);
    await page.goto('/sign-in');
    await page.getByTestId('email').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('pending-link').count()).toBe(0);
    await fillSignIn(page, DEMO_USERS.inspector.email);
    await page.getByTestId('review-screen').waitFor({ timeout: 30000 });
    await page.context().close();
  });

  it('a kept link to another site is ignored, not followed', async () => {
    const page = await phonePage(browser, base);
    await page.goto('/sign-in');
    await page.getByTestId('email').waitFor({ timeout: 30000 });
    // As if someone had slipped it into the tab's storage: what is read back is checked again.
    await page.evaluate((key) => window.sessionStorage.setItem(key, '//evil.example/findings'), pendingKey);
    await page.reload();
    await page.getByTestId('email').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('pending-link').count()).toBe(0);
    await fillSignIn(page, DEMO_USERS.inspector.email);
    await page.getByTestId('review-screen').waitFor({ timeout: 30000 });
    expect(new URL(page.url()).origin).toBe(new URL(base).origin);
    await page.context().close();
  });
});
