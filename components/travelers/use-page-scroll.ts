import { useEffect, useLayoutEffect, useRef } from 'react';
import { Platform } from 'react-native';

/**
 * Calls `onMove` (at most once a frame) whenever anything on the page scrolls or the window changes
 * size. A listener on the window in the capture phase hears every scroll container's scroll, so the
 * holes list follows the page's own scrolling (one scroll for the whole page, on a phone and in two
 * panes) without owning a scroll view of its own, nor knowing which of its parents scrolls.
 */
export function usePageScroll(onMove: () => void, enabled: boolean): void {
  // The newest callback, kept once each render is committed (not while drawing): the listener calls it.
  const latest = useRef(onMove);
  useLayoutEffect(() => {
    latest.current = onMove;
  });
  useEffect(() => {
    if (!enabled || Platform.OS !== 'web' || typeof window === 'undefined') return;
    let frame: number | null = null;
    const run = () => {
      frame = null;
      latest.current();
    };
    const schedule = () => {
      if (frame === null) frame = window.requestAnimationFrame(run);
    };
    const opts = { capture: true, passive: true } as const;
    window.addEventListener('scroll', schedule, opts);
    window.addEventListener('resize', schedule, opts);
    return () => {
      window.removeEventListener('scroll', schedule, opts);
      window.removeEventListener('resize', schedule, opts);
      if (frame !== null) window.cancelAnimationFrame(frame);
    };
  }, [enabled]);
}

/**
 * The part of the element `node` that is on screen, in px from its own top (`top` < 0 while it starts
 * below the top of the window); null where nothing is laid out (a test's DOM, a hidden pane).
 */
export function visibleSpan(node: unknown): { top: number; bottom: number; width: number } | null {
  if (Platform.OS !== 'web' || typeof window === 'undefined' || !node) return null;
  const el = node as HTMLElement;
  if (typeof el.getBoundingClientRect !== 'function') return null;
  const r = el.getBoundingClientRect();
  if (r.width <= 0) return null;
  return { top: -r.top, bottom: window.innerHeight - r.top, width: r.width };
}
