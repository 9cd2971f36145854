import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/dev/seed';
import { contrast } from '../components/colour-math';
import { auth } from '../helpers/test-app';
import {
  auditSession,
  keepScreenshot,
  routes,
  shotName,
  routeWalker,
  signedInContext,
  visible,
} from './helpers/audit-routes';

/**
 * Readable and operable for everyone at the bench, checked in Debian's Chromium against the real
 * server: axe-core (WCAG 2.1 A and AA) over every route of every role at a phone's and an office
 * screen's width, failing on any serious or critical violation; and the checkboxes and radios of the
 * traveler, flag and finding screens driven by the keyboard alone, Space and Enter both, with what
 * was recorded read back through the API.
 */
jest.setTimeout(900_000);

// axe's own source, put into the page as a script (no CDN). The app's content security policy allows
// no inline script, so the audit's pages bypass it: the product's policy is tested in security-headers.e2e.ts.
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');
const artefacts = path.join(__dirname, 'artifacts', 'a11y');

const s = auditSession(artefacts);

const widths = [
  { name: 'phone', viewport: { width: 390, height: 844 }, isMobile: true },
  { name: 'office', viewport: { width: 1280, height: 800 }, isMobile: false },
  // The same phone with its text at 200 % (page zoom): 195 × 422 CSS pixels.
  { name: 'phone at 200 %', viewport: { width: 195, height: 422 }, isMobile: true },
] as const;

type Violation = {
  id: string;
  impact: string;
  help: string;
  nodes: { target: string[]; html: string; failureSummary: string }[];
};

/** axe over the page as shown; the serious and critical violations, each named with its elements and measurements. */
async function audit(page: Page): Promise<Violation[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ content: axeSource });
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as { axe: { run: (ctx: unknown, opts: unknown) => Promise<{ violations: Violation[] }> } }
    ).axe;
    const r = await axe.run(document, {
      runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] },
      resultTypes: ['violations'],
    });
    return r.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      nodes: v.nodes.map((n) => ({ target: n.target, html: n.html.slice(0, 160), failureSummary: n.failureSummary })),
    }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

function describeViolations(route: string, width: string, vs: Violation[]): string {
  return vs
    .map((v) =>
      [
        `${route} at ${width}: ${v.id} (${v.impact}) — ${v.help}`,
        ...v.nodes
          .slice(0, 8)
          .map((n) => `    ${n.target.join(' ')}  ${n.html}\n      ${n.failureSummary.replace(/\n/g, '\n      ')}`),
        v.nodes.length > 8 ? `    … and ${v.nodes.length - 8} more` : '',
      ]
        .filter(Boolean)
        .join('\n'),
    )
    .join('\n');
}

describe.each(widths)('every route of every role passes axe (WCAG 2.1 A/AA) at $name width', (w) => {
  const walker = routeWalker(w, () => s);
  afterAll(() => walker.closeAll());

  it.each(routes)('$role: $name', async (r) => {
    const page = await walker.open(r);
    const found = await audit(page);
    await keepScreenshot(page, artefacts, shotName(w.name, r.role, r.name), w.viewport);
    if (found.length)
      throw new Error(
        `${found.reduce((n, v) => n + v.nodes.length, 0)} failing elements\n${describeViolations(`${r.role} ${r.name} (${r.path(s.ids)})`, w.name, found)}`,
      );
  });
});

/**
 * The data-testid of whatever has keyboard focus (or of its nearest marked ancestor); where nothing
 * marked holds it, the element itself (`<body>`, `<a "Bench">`), so a failure says where focus went.
 */
const focusedTestId = (page: Page) =>
  page.evaluate(() => {
    const el = document.activeElement;
    if (!el) return null;
    const id = el.closest('[data-testid]')?.getAttribute('data-testid');
    return id ?? `<${el.tagName.toLowerCase()} "${(el.textContent ?? '').trim().slice(0, 30)}">`;
  });
const checked = (page: Page, id: string) => visible(page, id).getAttribute('aria-checked');

/** Puts keyboard focus on a control (as Tab would) without pressing it; the keys then do the work. */
async function keyOn(page: Page, id: string, key: 'Space' | 'Enter') {
  await visible(page, id).focus();
  await page.keyboard.press(key);
}

/** Polls the API until `test` holds for what `read` returns. */
async function until<T>(read: () => Promise<T>, test: (v: T) => boolean, what: string): Promise<T> {
  const end = Date.now() + 20000;
  for (;;) {
    const v = await read();
    if (test(v)) return v;
    if (Date.now() > end) throw new Error(`${what}: still ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

describe('the keyboard alone, Space and Enter both', () => {
  let builderToken: string;
  let inspectorToken: string;
  const holeStatus = async (holeId: string) => {
    const d = (await request(s.t.app).get(`/api/travelers/${s.ids.walkTravelerId}`).set(auth(builderToken))).body;
    return (d.holes as { holeId: string; status: string }[]).find((h) => h.holeId === holeId)!.status;
  };
  beforeAll(async () => {
    builderToken = await s.t.signIn(DEMO_USERS.builder.email);
    inspectorToken = await s.t.signIn(DEMO_USERS.inspector.email);
  });

  it('rings the focused control in our own colour, 3:1 or more against the paper and against a chosen (ink) chip', async () => {
    const { context, page } = await signedInContext(s.browser, s.base, 'builder', widths[0]);
    try {
      await page.goto(`/travelers/${s.ids.walkTravelerId}`);
      await visible(page, 'traveler-screen').waitFor({ timeout: 30000 });
      // From "Closer" back to the chosen "Whole part" by Shift+Tab: focus by keyboard, as :focus-visible wants it.
      await visible(page, 'zoom-closer').focus();
      await page.keyboard.press('Shift+Tab');
      expect(await focusedTestId(page)).toBe('zoom-fit');
      const ring = await page.evaluate(() => {
        const el = document.activeElement as HTMLElement;
        const css = getComputedStyle(el);
        const parentBg = getComputedStyle(
          el.parentElement!.closest('[data-testid="traveler-screen"]')!,
        ).backgroundColor;
        return {
          color: css.outlineColor,
          width: css.outlineWidth,
          style: css.outlineStyle,
          offset: css.outlineOffset,
          chip: css.backgroundColor,
          paper: parentBg,
        };
      });
      const hex = (rgb: string) =>
        `#${(rgb.match(/\d+/g) ?? [])
          .slice(0, 3)
          .map((n) => Number(n).toString(16).padStart(2, '0'))
          .join('')}`;
      expect(ring.style).toBe('solid');
      expect(parseFloat(ring.width)).toBeGreaterThanOrEqual(3);
      expect(parseFloat(ring.offset)).toBeGreaterThanOrEqual(2);
      expect(contrast(hex(ring.color), hex(ring.chip))).toBeGreaterThanOrEqual(3);
      expect(contrast(hex(ring.color), hex(ring.paper))).toBeGreaterThanOrEqual(3);
      const box = (await visible(page, 'zoom-fit').boundingBox())!;
      await page.screenshot({
        path: path.join(artefacts, 'focus-ring-on-a-chosen-chip.png'),
        clip: { x: box.x - 12, y: box.y - 12, width: box.width * 3, height: box.height + 24 },
      });
    } finally {
      await context.close();
    }
  });

  it('focuses the home screen’s heading after signing in, and the error after a failed sign-in', async () => {
    const context = await s.browser.newContext({
      baseURL: s.base,
      viewport: { width: 390, height: 844 },
      isMobile: true,
      hasTouch: true,
      serviceWorkers: 'block',
    });
    const page = await context.newPage();
    try {
      await page.goto('/');
      await visible(page, 'email').focus();
      await page.keyboard.type(DEMO_USERS.builder.email);
      await page.keyboard.press('Tab');
      await page.keyboard.type('not the password');
      await page.keyboard.press('Enter');
      await visible(page, 'sign-in-error').waitFor({ timeout: 30000 });
      await until(
        () => focusedTestId(page),
        (v) => v === 'sign-in-error',
        'focus after a failed sign-in',
      );

      await visible(page, 'password').fill('');
      await visible(page, 'password').focus();
      await page.keyboard.type(DEMO_PASSWORD);
      await page.keyboard.press('Enter');
      await visible(page, 'bench-screen').waitFor({ timeout: 30000 });
      await until(
        () => focusedTestId(page),
        (v) => v === 'screen-title',
        'focus after signing in',
      );
      expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Bench');
    } finally {
      await context.close();
    }
  });

  it('ticks holes and steps, zooms and ticks a run on the traveler (and switches units on the bench)', async () => {
    const { context, page } = await signedInContext(s.browser, s.base, 'builder', widths[0]);
    try {
      await page.goto('/bench');
      await visible(page, 'bench-screen').waitFor({ timeout: 30000 });
      await keyOn(page, 'units-metric', 'Space');
      expect(await checked(page, 'units-metric')).toBe('true');
      await keyOn(page, 'units-imperial', 'Enter');
      expect(await checked(page, 'units-imperial')).toBe('true');

      await page.goto(`/travelers/${s.ids.walkTravelerId}`);
      await visible(page, 'traveler-screen').waitFor({ timeout: 30000 });

      // Holes: Space ticks one in, Enter another; Space again takes the first tick off.
      await keyOn(page, 'hole-U-01', 'Space');
      await until(
        () => holeStatus('U-01'),
        (s) => s === 'installed',
        'U-01 after Space',
      );
      await keyOn(page, 'hole-U-02', 'Enter');
      await until(
        () => holeStatus('U-02'),
        (s) => s === 'installed',
        'U-02 after Enter',
      );
      expect(await checked(page, 'hole-U-01')).toBe('true');
      await keyOn(page, 'hole-U-01', 'Space');
      await until(
        () => holeStatus('U-01'),
        (s) => s === 'pending',
        'U-01 after Space again',
      );
      // Space on a control is the control's: the page did not scroll away under it.
      expect(await focusedTestId(page)).toBe('hole-U-01');

      // Shop steps.
      const stepDone = async (seq: number) => {
        const d = (await request(s.t.app).get(`/api/travelers/${s.ids.walkTravelerId}`).set(auth(builderToken))).body;
        return !!(d.steps as { seq: number; doneAt: string | null }[]).find((s) => s.seq === seq)!.doneAt;
      };
      await keyOn(page, 'step-1', 'Space');
      await until(
        () => stepDone(1),
        (v) => v,
        'step 1 after Space',
      );
      await keyOn(page, 'step-2', 'Enter');
      await until(
        () => stepDone(2),
        (v) => v,
        'step 2 after Enter',
      );

      // The drawing's zoom: radios.
      await keyOn(page, 'zoom-closer', 'Space');
      expect(await checked(page, 'zoom-closer')).toBe('true');
      expect(await checked(page, 'zoom-fit')).toBe('false');
      await keyOn(page, 'zoom-closest', 'Enter');
      expect(await checked(page, 'zoom-closest')).toBe('true');

      // A run: focus goes to the run bar, the ends are picked by Space and Enter, and back to "Tick a run" after.
      await keyOn(page, 'run-mode', 'Enter');
      await until(
        () => focusedTestId(page),
        (v) => v === 'run-bar',
        'focus after "Tick a run"',
      );
      await keyOn(page, 'hole-U-03', 'Space');
      expect(await visible(page, 'hole-U-03').getAttribute('aria-pressed')).toBe('true');
      await keyOn(page, 'hole-U-05', 'Enter');
      await keyOn(page, 'tick-run', 'Space');
      for (const h of ['U-03', 'U-04', 'U-05'])
        await until(
          () => holeStatus(h),
          (s) => s === 'installed',
          `${h} after the run`,
        );
      await until(
        () => focusedTestId(page),
        (v) => v === 'run-mode',
        'focus after the run is ticked',
      );
    } finally {
      await context.close();
    }
  });

  it('chooses holes and the kind on the flag screen, whose heading has focus when it opens', async () => {
    const { context, page } = await signedInContext(s.browser, s.base, 'builder', widths[0]);
    try {
      await page.goto(`/travelers/${s.ids.walkTravelerId}/flag?holes=U-04`);
      await visible(page, 'flag-screen').waitFor({ timeout: 30000 });
      await until(
        () => focusedTestId(page),
        (v) => v === 'screen-title',
        'focus on opening the flag screen',
      );

      await keyOn(page, 'change-holes', 'Enter');
      await keyOn(page, 'pick-hole-U-05', 'Space');
      expect(await checked(page, 'pick-hole-U-05')).toBe('true');
      await keyOn(page, 'pick-hole-U-04', 'Enter');
      expect(await checked(page, 'pick-hole-U-04')).toBe('false');

      await keyOn(page, 'finding-kind-hole_cracked', 'Enter');
      expect(await checked(page, 'finding-kind-hole_cracked')).toBe('true');
      await keyOn(page, 'finding-kind-hole_burrs', 'Space');
      expect(await checked(page, 'finding-kind-hole_burrs')).toBe('true');
      expect(await checked(page, 'finding-kind-hole_cracked')).toBe('false');
    } finally {
      await context.close();
    }
  });

  it('records the disposition chosen by Space, after another was chosen by Enter, and focuses the result', async () => {
    const { context, page } = await signedInContext(s.browser, s.base, 'inspector', widths[0]);
    try {
      await page.goto(`/findings/${s.ids.walkFindingId}`);
      await visible(page, 'finding-decision').waitFor({ timeout: 30000 });

      await keyOn(page, 'disposition-repair', 'Enter');
      expect(await checked(page, 'disposition-repair')).toBe('true');
      await keyOn(page, 'repair-scheme-doubler', 'Space');
      expect(await checked(page, 'repair-scheme-doubler')).toBe('true');
      await keyOn(page, 'repair-scheme-other', 'Enter');
      expect(await checked(page, 'repair-scheme-other')).toBe('true');
      // What the issue saw go wrong: Space on Rework, then the form sent a Repair.
      await keyOn(page, 'disposition-rework', 'Space');
      expect(await checked(page, 'disposition-rework')).toBe('true');
      expect(await checked(page, 'disposition-repair')).toBe('false');

      await visible(page, 'action-note').focus();
      await page.keyboard.type('Drill out L-02 and set the same rivet again');
      await keyOn(page, 'finding-action-disposition', 'Enter');
      const f = await until(
        async () =>
          (await request(s.t.app).get(`/api/findings/${s.ids.walkFindingId}`).set(auth(inspectorToken))).body as {
            status: string;
            disposition: string | null;
          },
        (b) => b.status !== 'raised',
        'the finding after recording',
      );
      expect(f.disposition).toBe('rework');
      await until(
        () => focusedTestId(page),
        (v) => v === 'action-result',
        'focus after recording the disposition',
      );
    } finally {
      await context.close();
    }
  });
});
