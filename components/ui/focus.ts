import { useEffect, useState, type RefObject } from 'react';
import { Platform } from 'react-native';

/**
 * Moves keyboard and screen-reader focus to `node` (a View, a Text, a TextInput), where the work
 * continues after an action; without it focus falls back to the page and a keyboard user starts over
 * from the top. A node that is not a control takes focus by script only (tabindex -1).
 */
export function moveFocusTo(node: unknown, opts: { scroll?: boolean } = {}): void {
  if (Platform.OS !== 'web' || !node) return;
  const el = node as HTMLElement;
  if (typeof el.focus !== 'function') return;
  if (!el.hasAttribute?.('tabindex') && !/^(A|BUTTON|INPUT|SELECT|TEXTAREA)$/.test(el.tagName))
    el.setAttribute('tabindex', '-1');
  el.focus({ preventScroll: !opts.scroll });
  if (opts.scroll) el.scrollIntoView?.({ block: 'nearest' });
}

/** How long after it opens a screen's heading still takes focus that has fallen to nowhere. */
const ARRIVAL_MS = 10_000;

/** Focus is nowhere: on the page itself, as after the control that held it was removed. */
const focusNowhere = () =>
  typeof document !== 'undefined' && (document.activeElement == null || document.activeElement === document.body);

/**
 * Focus `ref` once it is on screen, when `when` holds (e.g. a screen's heading on arrival).
 *
 * A browser ignores focus() on a node that is not shown yet, and drops focus to the page when the node
 * holding it is hidden: a screen that opens while the one before it is still leaving (sign-in → the
 * home screen, on a slow device) can miss its moment either way. So for a short while after it opens,
 * whenever the node is laid out again (a ResizeObserver sees it get a size) or a moment passes, and
 * focus is nowhere, the node takes it. Focus anywhere else (a control the person reached) is left alone.
 */
export function useFocusOnMount(ref: RefObject<unknown>, when = true, opts: { onlyIfLost?: boolean } = {}): void {
  const onlyIfLost = !!opts.onlyIfLost;
  useEffect(() => {
    if (!when) return;
    const node = ref.current as HTMLElement | null;
    if (Platform.OS !== 'web' || !node) return;
    const until = Date.now() + ARRIVAL_MS;
    const take = () => {
      if (Date.now() <= until && focusNowhere()) moveFocusTo(node);
    };
    // The first try after the frame in which it appears (a screen pushed onto a stack is laid out first),
    // taking focus from the control that opened it unless `onlyIfLost`; then a few more, for a browser
    // without ResizeObserver or a node that cannot take focus yet.
    const first = onlyIfLost ? take : () => moveFocusTo(node);
    const timers = [0, 250, 1000, 3000].map((ms) => setTimeout(ms === 0 ? first : take, ms));
    const seen = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(take);
    seen?.observe(node);
    const stop = setTimeout(() => seen?.disconnect(), ARRIVAL_MS);
    return () => {
      timers.forEach(clearTimeout);
      clearTimeout(stop);
      seen?.disconnect();
    };
    // Once per mount: focus is given on arrival, never taken back on a later render.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
}

let headingWantedUntil = 0;

/**
 * Asks the screens that open in the next moments to focus their heading if focus has fallen to the page
 * (sign-in → the home screen's title). Not used up by the first heading that shows: on a slow device
 * the router can show a screen for a moment (a route still loading) and remove it, taking focus with
 * it; the heading of the screen that stays then takes it. A heading never takes focus from a control.
 */
export function focusNextHeading(): void {
  headingWantedUntil = Date.now() + ARRIVAL_MS;
}

/** Withdraws focusNextHeading() (the sign-in failed: focus stays on the form). */
export function cancelHeadingFocus(): void {
  headingWantedUntil = 0;
}

/**
 * For a screen's heading `ref`: focus it on arrival when the screen is opened for one task (`always`,
 * taking focus from the control that opened it), or when focusNextHeading() asked and focus is nowhere.
 * Decided once, when the screen opens.
 */
export function useHeadingFocus(ref: RefObject<unknown>, always = false): void {
  const [mode] = useState<'always' | 'if-lost' | 'no'>(() =>
    always ? 'always' : Date.now() <= headingWantedUntil ? 'if-lost' : 'no',
  );
  useFocusOnMount(ref, mode !== 'no', { onlyIfLost: mode === 'if-lost' });
}

const FOCUSABLE = 'a[href], button, input, select, textarea, [tabindex]:not([tabindex="-1"])';

/**
 * A scrolling page with nothing in it that takes focus (a page of text and a picture) cannot be
 * scrolled from the keyboard in every browser: such a page's scroll view takes focus itself, named by
 * the page's title. Called whenever its content changes size; a page with controls is left as it is.
 */
export function keepScrollReachable(scrollView: unknown, label: string): void {
  if (Platform.OS !== 'web') return;
  const node = (scrollView as { getScrollableNode?: () => unknown } | null)?.getScrollableNode?.() as
    HTMLElement | undefined;
  if (!node?.querySelector) return;
  const own = node.dataset.scrollReachable === 'yes';
  if (node.querySelector(FOCUSABLE)) {
    if (own) {
      node.removeAttribute('tabindex');
      node.removeAttribute('role');
      node.removeAttribute('aria-label');
      delete node.dataset.scrollReachable;
    }
    return;
  }
  if (own) return;
  node.tabIndex = 0;
  node.setAttribute('role', 'region');
  node.setAttribute('aria-label', label);
  node.dataset.scrollReachable = 'yes';
}
