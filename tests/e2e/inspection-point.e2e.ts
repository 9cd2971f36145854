import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { auth } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * An inspection point in a real browser: the builder does the fit check (step 2 of the demo's inboard
 * rib) and finds step 3 held; the inspector stamps the point on their phone; the builder then does step 3
 * as a named helper's work and keeps an hour on the part.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;

servedWithBrowser((s) => ({ t, base, browser } = s));

async function part(page: Page, email: string, id: string) {
  await page.goto('/');
  await fillSignIn(page, email);
  await page
    .getByTestId('bench-screen')
    .or(page.getByTestId('travelers-screen'))
    .or(page.getByTestId('review-screen'))
    .first()
    .waitFor({ timeout: 20000 })
    .catch(() => undefined);
  await page.goto(`/travelers/${id}`);
  await page.getByTestId('traveler-screen').waitFor({ timeout: 20000 });
}

async function until<T>(read: () => Promise<T>, ok: (v: T) => boolean, what: string): Promise<T> {
  const end = Date.now() + 20000;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`${what}: still ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('an inspection point in a real browser', () => {
  it('holds the next step until the inspector stamps it, then credits the step to the named helper', async () => {
    const { builder: builderToken } = await t.tokens();
    const parts = (await request(t.app).get('/api/travelers').set(auth(builderToken))).body.items as {
      id: string;
      partNumber: string;
    }[];
    const innerId = parts.find((p) => p.partNumber === 'W-104')!.id;
    const steps = async () =>
      (await request(t.app).get(`/api/travelers/${innerId}`).set(auth(builderToken))).body.steps as {
        seq: number;
        doneAt: string | null;
        stampedAt: string | null;
        by: string | null;
        byName: string | null;
      }[];

    const bench = await phonePage(browser, base);
    await part(bench, DEMO_USERS.builder.email, innerId);
    await bench.getByTestId('step-2').click();
    await until(steps, (s) => !!s[1].doneAt, 'step 2 done');
    await bench.getByTestId('step-3').click();
    await bench
      .getByText('step 2 is an inspection point: an inspector stamps it before later steps are done')
      .waitFor();
    expect((await steps())[2].doneAt).toBeNull();

    const review = await phonePage(browser, base);
    await part(review, DEMO_USERS.inspector.email, innerId);
    await review.getByTestId('step-stamp-2').click();
    await until(steps, (s) => !!s[1].stampedAt, 'step 2 stamped');
    await review.getByTestId('step-point-2').getByText('Inspection point · stamped').waitFor();

    await bench.reload();
    await bench.getByTestId('traveler-screen').waitFor();
    await bench.getByTestId('step-by-helper').click();
    await bench.getByTestId('step-by-name').fill('Sam Ortiz');
    await bench.getByTestId('step-3').click();
    const done = await until(steps, (s) => !!s[2].doneAt, 'step 3 done');
    expect(done[2]).toMatchObject({ by: 'helper', byName: 'Sam Ortiz' });

    // An hour and a half entered afterwards (yesterday: whatever the hour now), as the helper's work.
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    await bench.getByTestId('work-day').fill(yesterday);
    await bench.getByTestId('work-hours').fill('1.5');
    await bench.getByTestId('work-hours-add').click();
    await bench
      .getByTestId('work-total')
      .getByText(/1 h 30 min on this part/)
      .waitFor();
    const hours = await until(
      async () =>
        (await request(t.app).get(`/api/travelers/${innerId}`).set(auth(builderToken))).body.work.byWho as {
          who: string;
          hours: number;
        }[],
      (w) => w.length > 0,
      'hours kept',
    );
    expect(hours).toEqual([{ who: 'Sam Ortiz', by: 'helper', hours: 1.5 }]);
  });
});
