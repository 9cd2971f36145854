import path from 'node:path';
import { auditSession, keepScreenshot, routes, shotName, routeWalker, type Width } from './helpers/audit-routes';

/**
 * The layout audit, in Debian's Chromium against the real server: every route of every role, at a
 * phone's and an office screen's width, measured for content wider than the screen, text cut off by
 * its box, tap targets under 48 px and text not in the app's own fonts. A failure names the route,
 * the width, the element and what was measured; each route's whole screen is kept as a picture under
 * tests/e2e/artifacts/layout (git-ignored).
 */
jest.setTimeout(900_000);

const artefacts = path.join(__dirname, 'artifacts', 'layout');

const widths: Width[] = [
  { name: 'phone', viewport: { width: 390, height: 844 }, isMobile: true },
  { name: 'office', viewport: { width: 1280, height: 800 }, isMobile: false },
];

/**
 * The families app/_layout.tsx loads with useFonts (constants/theme.ts names them in `fonts`): Atkinson
 * Hyperlegible for running text, IBM Plex Mono for numbers and codes.
 */
const APP_FONTS = [
  'AtkinsonHyperlegible_400Regular',
  'AtkinsonHyperlegible_700Bold',
  'IBMPlexMono_400Regular',
  'IBMPlexMono_600SemiBold',
];

/**
 * Gloved hands: 48 × 48 CSS px, the app's own minimum (constants/theme.ts `touch`; Material Design's
 * 48 dp touch target, from memory). WCAG 2.2 SC 2.5.5 Target Size (Enhanced) asks 44 × 44 and exempts
 * a target inside a sentence (its "inline" exception), which the audit follows.
 */
const MIN_TARGET = 48;

type LayoutFailure = {
  check: 'wider than the screen' | 'cut off' | 'tap target' | 'font';
  element: string;
  measure: string;
};

/**
 * Runs in the page: every visible element measured. One self-contained function (it is sent to the
 * browser as its source).
 */
function measureLayout(opts: { appFonts: string[]; minTarget: number }): LayoutFailure[] {
  const failures: LayoutFailure[] = [];
  const W = document.documentElement.clientWidth;
  const px = (n: number) => `${Math.round(n * 10) / 10} px`;
  const css = (el: Element) => getComputedStyle(el);
  // 1 px of slack where boxes are compared: layout rounds sub-pixel widths either way.
  const SLACK = 1;
  // 2 px where text or a box's edge meets another edge: a glyph's box takes in its side bearing (blank)
  // and a box may poke out by a rounding; 2 px is half the app's smallest gap (constants/theme.ts
  // space.xs), so nothing beside it is touched.
  const EDGE = 2;
  // The longest text still read as one value (TOKEN_MAX in components/ui/text.tsx): longer ones (a link,
  // a token in a mail) wrap anywhere as running text, by design.
  const TOKEN_MAX = 24;
  type Box = { left: number; right: number; top: number; bottom: number };

  /** Shown at all: laid out, not display:none, visibility:hidden or transparent, and of some size. */
  const shown = (el: Element) => {
    if (!el.checkVisibility({ checkOpacity: true, checkVisibilityCSS: true })) return false;
    const r = el.getBoundingClientRect();
    return r.width > 0 && r.height > 0;
  };
  const clips = (v: string) => v === 'hidden' || v === 'clip';
  const scrolls = (v: string) => v === 'auto' || v === 'scroll';
  /** Where a box clips its content: inside its borders. */
  const paddingBox = (el: Element): Box => {
    const r = el.getBoundingClientRect();
    const s = css(el);
    return {
      left: r.left + parseFloat(s.borderLeftWidth),
      right: r.right - parseFloat(s.borderRightWidth),
      top: r.top + parseFloat(s.borderTopWidth),
      bottom: r.bottom - parseFloat(s.borderBottomWidth),
    };
  };
  const contentBox = (el: Element): Box => {
    const b = paddingBox(el);
    const s = css(el);
    return {
      left: b.left + parseFloat(s.paddingLeft),
      right: b.right - parseFloat(s.paddingRight),
      top: b.top + parseFloat(s.paddingTop),
      bottom: b.bottom - parseFloat(s.paddingBottom),
    };
  };
  /**
   * What the ancestors let show of an element: the intersection of the boxes of those that clip, on each
   * axis up to the first ancestor that scrolls on it (past a scroller, content is reached by scrolling),
   * with the ancestor that clips nearest on each side.
   */
  const clipOf = (el: Element) => {
    const box: Box = { left: -Infinity, right: Infinity, top: -Infinity, bottom: Infinity };
    const by: Partial<Record<keyof Box, Element>> = {};
    /** Narrows the box between sides `lo` and `hi` to ancestor `a`'s padding box `b`, noting `a` where it clips. */
    const narrow = (a: Element, b: Box, lo: 'left' | 'top', hi: 'right' | 'bottom') => {
      if (b[lo] > box[lo]) {
        box[lo] = b[lo];
        by[lo] = a;
      }
      if (b[hi] < box[hi]) {
        box[hi] = b[hi];
        by[hi] = a;
      }
    };
    let x = true;
    let y = true;
    // The page's own <html> and <body> are the screen itself, not a box on it.
    for (let a = el.parentElement; a && a !== document.body && (x || y); a = a.parentElement) {
      const s = css(a);
      if (x && scrolls(s.overflowX)) x = false;
      if (y && scrolls(s.overflowY)) y = false;
      const b = paddingBox(a);
      if (x && clips(s.overflowX)) narrow(a, b, 'left', 'right');
      if (y && clips(s.overflowY)) narrow(a, b, 'top', 'bottom');
    }
    return { box, by, scrollsSideways: !x };
  };

  /** A short CSS path up to the nearest element with a testid (5 steps at most, then that element and an ellipsis). */
  const cssPath = (el: Element) => {
    const steps: string[] = [];
    let e: Element | null = el;
    for (let i = 0; e && e !== document.body && i < 5; i++, e = e.parentElement) {
      const id = e.getAttribute('data-testid');
      if (id) {
        steps.unshift(`[data-testid="${id}"]`);
        return steps.join(' > ');
      }
      const p: Element | null = e.parentElement;
      const nth = p ? Array.from(p.children).indexOf(e) + 1 : 1;
      steps.unshift(`${e.tagName.toLowerCase()}:nth-child(${nth})`);
    }
    const marked = el.closest('[data-testid]');
    return `${marked ? `[data-testid="${marked.getAttribute('data-testid')}"] ` : ''}… > ${steps.join(' > ')}`;
  };
  const describe = (el: Element) => {
    const id = el.getAttribute('data-testid');
    const raw =
      (el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement
        ? el.value || el.placeholder
        : ((el as HTMLElement).innerText ?? el.textContent ?? '')) ||
      el.getAttribute('aria-label') ||
      '';
    const text = raw.replace(/\s+/g, ' ').trim();
    const snippet = text ? ` "${text.length > 40 ? `${text.slice(0, 39)}…` : text}"` : '';
    return `<${el.tagName.toLowerCase()}${id ? ` data-testid="${id}"` : ''}>${snippet} at ${cssPath(el)}`;
  };

  const all = Array.from(document.body.querySelectorAll('*')).filter(
    (el) => !el.closest('script, style, noscript, template') && shown(el),
  );

  // — Wider than the screen. The page itself must not scroll sideways.
  const pageWidth = Math.max(document.documentElement.scrollWidth, document.body.scrollWidth);
  if (pageWidth > W + SLACK)
    failures.push({
      check: 'wider than the screen',
      element: 'the page (<html>)',
      measure: `the page scrolls sideways: ${px(pageWidth)} wide on a ${W} px screen`,
    });
  // An element past the screen's edge: off it (the screen's edge or a screen-wide box cuts it) or
  // making the page scroll sideways. Not: an element in something that scrolls sideways (that scroller
  // is itself held to the screen); one that a box of its own, inside the screen, already clips (a
  // pattern drawn in a bar; text so cut is the "cut off" check's); a box of 1 px or less (the
  // visually-hidden pattern for screen readers).
  const outside = new Set<Element>();
  for (const el of all) {
    const r = el.getBoundingClientRect();
    if (r.width <= 1 && r.height <= 1) continue;
    if (!(r.right > W + EDGE || r.left < -EDGE)) continue;
    const { box, scrollsSideways } = clipOf(el);
    if (scrollsSideways) continue;
    if ((r.right > W + EDGE && box.right < W - SLACK) || (r.left < -EDGE && box.left > SLACK)) continue;
    outside.add(el);
  }
  // Only the outermost element is named (its children go with it); siblings past the edge together
  // are named once, by their parent.
  const outermost = [...outside].filter((el) => !(el.parentElement && outside.has(el.parentElement)));
  const byParent = new Map<Element | null, Element[]>();
  for (const el of outermost) byParent.set(el.parentElement, [...(byParent.get(el.parentElement) ?? []), el]);
  for (const [parent, els] of byParent) {
    const right = Math.max(...els.map((e) => e.getBoundingClientRect().right));
    const left = Math.min(...els.map((e) => e.getBoundingClientRect().left));
    const edge = right > W + EDGE ? `right edge ${px(right)} > ${W}` : `left edge ${px(left)} < 0`;
    if (els.length > 2 && parent)
      failures.push({
        check: 'wider than the screen',
        element: `${els.length} children of ${describe(parent)}`,
        measure: `the last one's ${edge}`,
      });
    else
      for (const el of els) {
        const r = el.getBoundingClientRect();
        failures.push({
          check: 'wider than the screen',
          element: describe(el),
          measure: r.right > W + EDGE ? `right edge ${px(r.right)} > ${W}` : `left edge ${px(r.left)} < 0`,
        });
      }
  }
  const offScreen = (el: Element) => {
    for (let e: Element | null = el; e; e = e.parentElement) if (outside.has(e)) return true;
    return false;
  };

  // — Text cut off: measured word by word (a word's boxes, one a line it is on), so the space that hangs
  // past a wrapped line's end does not count. Words end at spaces, hyphens, dashes and slashes: where
  // the Unicode line-breaking rules (UAX #14) let a line break anyway.
  const words = (node: Text) => {
    // `run`: the length of the whole run between spaces the word is part of (a link is one run).
    const out: { word: string; run: number; rects: DOMRect[] }[] = [];
    const range = document.createRange();
    const runs = /[^\s\u200b]+/g;
    for (let r = runs.exec(node.data); r; r = runs.exec(node.data)) {
      const re = /[^\-\u2010\u2013\u2014/]+/g;
      for (let m = re.exec(r[0]); m; m = re.exec(r[0])) {
        range.setStart(node, r.index + m.index);
        range.setEnd(node, r.index + m.index + m[0].length);
        const rects = Array.from(range.getClientRects()).filter((x) => x.width > 0);
        if (rects.length) out.push({ word: m[0], run: r[0].length, rects });
      }
    }
    return out;
  };
  for (const el of all) {
    const own = Array.from(el.childNodes).filter(
      (n): n is Text => n.nodeType === Node.TEXT_NODE && !!n.textContent!.trim(),
    );
    if (!own.length || el.closest('svg') || offScreen(el)) continue;
    const s = css(el);
    const he = el as HTMLElement;
    const cut = (measure: string) => failures.push({ check: 'cut off', element: describe(el), measure });
    // Cut by its own box: one line with an ellipsis, or a clamp to so many lines.
    if ((clips(s.overflowX) || s.textOverflow === 'ellipsis') && he.scrollWidth > he.clientWidth + SLACK) {
      cut(`text ${px(he.scrollWidth)} in a ${px(he.clientWidth)} box`);
      continue;
    }
    if (clips(s.overflowY) && he.scrollHeight > he.clientHeight + SLACK) {
      const lh = parseFloat(s.lineHeight);
      const lines = (n: number) => (Number.isFinite(lh) && lh > 0 ? `${Math.round(n / lh)} lines, ` : '');
      cut(
        `text ${lines(he.scrollHeight)}${px(he.scrollHeight)} tall in a ${lines(he.clientHeight)}${px(he.clientHeight)} box`,
      );
      continue;
    }
    const ws = own.flatMap(words);
    if (!ws.length) continue;
    const rects = ws.flatMap((w) => w.rects);
    const text: Box = {
      left: Math.min(...rects.map((r) => r.left)),
      right: Math.max(...rects.map((r) => r.right)),
      top: Math.min(...rects.map((r) => r.top)),
      bottom: Math.max(...rects.map((r) => r.bottom)),
    };
    const width = text.right - text.left;
    // Cut by a box around it that clips. Up and down, a quarter of a line's height past the box before
    // it counts: a glyph's box is taller than the line height the layout gives it.
    const { box, by } = clipOf(el);
    const lineH = Math.max(...rects.map((r) => r.height));
    if (text.right > box.right + EDGE || text.left < box.left - EDGE) {
      const side = text.right > box.right + EDGE ? 'right' : 'left';
      cut(
        `text ${px(width)} wide from ${px(text.left)} to ${px(text.right)}, clipped at ${px(box[side])} by ${describe(by[side]!)}`,
      );
      continue;
    }
    if (text.bottom > box.bottom + lineH / 4 || text.top < box.top - lineH / 4) {
      const side = text.bottom > box.bottom + lineH / 4 ? 'bottom' : 'top';
      cut(
        `text from ${px(text.top)} to ${px(text.bottom)} down the page, clipped at ${px(box[side])} by ${describe(by[side]!)}`,
      );
      continue;
    }
    // Running out of its own box over whatever is beside it (a cell narrower than its value). An inline
    // element's box is its text; a block's is what the layout gave it.
    if (!s.display.startsWith('inline')) {
      const c = contentBox(el);
      if (text.right > c.right + EDGE || text.left < c.left - EDGE) {
        cut(
          `text ${px(width)} wide in a ${px(c.right - c.left)} box: it runs ${px(Math.max(text.right - c.right, c.left - text.left))} out over what is beside it`,
        );
        continue;
      }
    }
    // A word broken where no line may break ("Approval/s": overflow-wrap's last resort, when the box is
    // narrower than the word); unless the app asked for it (overflow-wrap: anywhere, for addresses and
    // codes) or the word is longer than a value is read whole (a link or a token in a mail).
    if (s.overflowWrap !== 'anywhere' && s.wordBreak !== 'break-all' && s.wordBreak !== 'break-word') {
      const lines = (w: { rects: DOMRect[] }) => new Set(w.rects.map((r) => Math.round(r.top))).size;
      const broken = ws.find((w) => w.run <= TOKEN_MAX && lines(w) > 1);
      if (broken) {
        const c = contentBox(el);
        cut(`the word "${broken.word}" broken over ${lines(broken)} lines in a ${px(c.right - c.left)} box`);
      }
    }
  }

  // — Tap targets.
  const targets = all.filter((el) =>
    el.matches(
      [
        'a[href]',
        'button',
        'input:not([type="hidden"])',
        'select',
        'textarea',
        '[role="button"]',
        '[role="link"]',
        '[role="checkbox"]',
        '[role="radio"]',
        '[role="tab"]',
        '[role="switch"]',
      ].join(','),
    ),
  );
  for (const el of targets) {
    const r = el.getBoundingClientRect();
    if (r.width + 0.01 >= opts.minTarget && r.height + 0.01 >= opts.minTarget) continue;
    // WCAG 2.5.5's inline exception: a link laid out inline within a sentence, whose line height the
    // words around it set.
    if (css(el).display === 'inline') {
      let block: Element | null = el.parentElement;
      while (block && css(block).display.startsWith('inline')) block = block.parentElement;
      const label = (el.textContent ?? '').trim();
      const around = (block?.textContent ?? '').replace(label, '').trim();
      if (around.length > 0) continue;
    }
    failures.push({
      check: 'tap target',
      element: describe(el),
      measure: `tap target ${Math.round(r.width)}×${Math.round(r.height)} px (under ${opts.minTarget}×${opts.minTarget})`,
    });
  }

  // — Fonts: the first family of each visible text's element must be one of the app's, and loaded.
  const loaded = new Set<string>();
  document.fonts.forEach((f) => {
    if (f.status === 'loaded') loaded.add(f.family.replace(/^["']|["']$/g, ''));
  });
  const fontChecked = new Set<Element>();
  const checkFont = (el: Element) => {
    if (fontChecked.has(el)) return;
    fontChecked.add(el);
    const stack = css(el).fontFamily;
    const first = stack
      .split(',')[0]
      .trim()
      .replace(/^["']|["']$/g, '');
    if (!opts.appFonts.includes(first)) {
      failures.push({
        check: 'font',
        element: describe(el),
        measure: `font "${first}" (${stack}), not one of the app's`,
      });
    } else if (!loaded.has(first)) {
      failures.push({
        check: 'font',
        element: describe(el),
        measure: `font "${first}" is named but not loaded: the text shows in the fallback (${stack})`,
      });
    }
  };
  const visibleSet = new Set(all);
  const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
  for (let n = walker.nextNode(); n; n = walker.nextNode()) {
    const parent = n.parentElement;
    if (parent && n.textContent!.trim() && visibleSet.has(parent)) checkFont(parent);
  }
  // What is typed or hinted in a field is text too.
  for (const el of all) {
    const field =
      (el instanceof HTMLInputElement && !['checkbox', 'radio', 'file', 'range', 'color'].includes(el.type)) ||
      el instanceof HTMLTextAreaElement;
    if (field && ((el as HTMLInputElement).value || (el as HTMLInputElement).placeholder)) checkFont(el);
  }
  return failures;
}

/**
 * A route's failures as lines, grouped by check. The same fault in each row of a list (same place
 * but for the row's id, same measurement) is named once with the count of the rows like it; at most
 * 30 a check.
 */
function report(route: string, width: string, fs: LayoutFailure[]): string {
  // A row's testid is its kind and then its own id or values: "coupon-row-<uuid>", "wing-trade-row-0.02-PULLED-4".
  const rowId = /(data-testid="[a-z]+(?:-[a-z]+)*?)-(?=[^"]*\d)[^"]*"/g;
  const groups = new Map<string, { f: LayoutFailure; n: number }>();
  for (const f of fs) {
    const key = `${f.check}|${f.element.replace(/^.*? at /, '').replace(rowId, '$1-…"')}|${f.measure}`;
    const g = groups.get(key);
    if (g) g.n++;
    else groups.set(key, { f, n: 1 });
  }
  const kinds = [...new Set(fs.map((f) => f.check))];
  return `${route} at ${width}: ${fs.length} layout failures\n${kinds
    .map((k) => {
      const of = [...groups.values()].filter((g) => g.f.check === k);
      return [
        `  ${k} (${fs.filter((f) => f.check === k).length}):`,
        ...of
          .slice(0, 30)
          .map(({ f, n }) => `    ${f.element}${n > 1 ? ` (and ${n - 1} more like it)` : ''}\n      ${f.measure}`),
        of.length > 30 ? `    … and ${of.length - 30} more` : '',
      ]
        .filter(Boolean)
        .join('\n');
    })
    .join('\n')}`;
}

const s = auditSession(artefacts);

describe.each(widths)('every route of every role lays out at $name width', (w) => {
  const walker = routeWalker(w, () => s);
  afterAll(() => walker.closeAll());

  it.each(routes)('$role: $name', async (r) => {
    const page = await walker.open(r);
    const failures = await page.evaluate(measureLayout, { appFonts: APP_FONTS, minTarget: MIN_TARGET });
    await keepScreenshot(page, artefacts, shotName(w.name, r.role, r.name), w.viewport);
    // Every failure of the route in one message.
    if (failures.length) throw new Error(report(`${r.role} ${r.name} (${r.path(s.ids)})`, w.name, failures));
  });
});
