import { act, useRef } from 'react';
import { cancelHeadingFocus, focusNextHeading, useFocusOnMount, useHeadingFocus } from '@/components/ui/focus';
import { renderWeb } from './render-web';

/**
 * A heading focused on arrival: a screen that opens while the one before it is still leaving cannot
 * take focus at once (the browser ignores focus() on a node not yet shown), so it tries again while
 * focus is nowhere, and leaves focus alone once a person has put it somewhere.
 */
function Heading({ refuse }: { refuse: number }) {
  const ref = useRef<HTMLDivElement | null>(null);
  useFocusOnMount(ref);
  return (
    <div
      data-testid="heading"
      ref={(el) => {
        ref.current = el;
        if (!el || el.dataset.wrapped) return;
        // As a browser does with a node that is not laid out yet: the first `refuse` calls do nothing.
        el.dataset.wrapped = 'yes';
        const focus = el.focus.bind(el);
        let calls = 0;
        el.focus = (opts?: FocusOptions) => {
          calls += 1;
          if (calls > refuse) focus(opts);
        };
      }}
    />
  );
}

beforeEach(() => jest.useFakeTimers());
afterEach(() => jest.useRealTimers());

const wait = (ms: number) => act(() => void jest.advanceTimersByTime(ms));

describe('focus on arrival', () => {
  it('tries again until the heading can take focus', () => {
    (document.activeElement as HTMLElement | null)?.blur?.();
    const r = renderWeb(<Heading refuse={3} />);
    wait(0);
    expect(document.activeElement).not.toBe(r.byTestId('heading'));
    wait(3100);
    expect(document.activeElement).toBe(r.byTestId('heading'));
    r.unmount();
  });

  it('takes focus again when its screen is shown again and focus has fallen to the page', () => {
    // jsdom lays nothing out: a stand-in observer, called as a browser calls it when the node gets a size.
    const observers: (() => void)[] = [];
    const real = globalThis.ResizeObserver;
    globalThis.ResizeObserver = class {
      constructor(private readonly call: () => void) {}
      observe() {
        observers.push(this.call);
      }
      unobserve() {}
      disconnect() {
        observers.splice(observers.indexOf(this.call), 1);
      }
    } as unknown as typeof ResizeObserver;
    try {
      const r = renderWeb(<Heading refuse={0} />);
      wait(0);
      expect(document.activeElement).toBe(r.byTestId('heading'));
      // Hidden while the screen before it leaves: the browser drops focus to the page.
      r.byTestId('heading').blur();
      expect(document.activeElement).toBe(document.body);
      act(() => observers.forEach((call) => call()));
      expect(document.activeElement).toBe(r.byTestId('heading'));
      r.unmount();
      expect(observers).toHaveLength(0);
    } finally {
      globalThis.ResizeObserver = real;
    }
  });

  it('does not take focus back from a control the person reached first', () => {
    const input = document.createElement('input');
    document.body.appendChild(input);
    const r = renderWeb(<Heading refuse={1} />);
    wait(0);
    input.focus();
    wait(2500);
    expect(document.activeElement).toBe(input);
    r.unmount();
    input.remove();
  });
});

/** A screen's heading as ScreenHeader has it: focused on arrival when sign-in asked for it. */
function ScreenTitle({ id }: { id: string }) {
  const ref = useRef<HTMLDivElement | null>(null);
  useHeadingFocus(ref);
  return <div data-testid={id} ref={ref} />;
}

describe('the heading after signing in', () => {
  afterEach(() => cancelHeadingFocus());

  it('is taken by the screen that stays, after one shown for a moment took focus and was removed', () => {
    (document.activeElement as HTMLElement | null)?.blur?.();
    focusNextHeading();
    const passing = renderWeb(<ScreenTitle id="passing" />);
    wait(0);
    expect(document.activeElement).toBe(passing.byTestId('passing'));
    passing.unmount();
    expect(document.activeElement).toBe(document.body);
    const home = renderWeb(<ScreenTitle id="home" />);
    wait(300);
    expect(document.activeElement).toBe(home.byTestId('home'));
    home.unmount();
  });

  it('does not take focus from the control that holds it', () => {
    const input = document.createElement('input');
    document.body.appendChild(input);
    input.focus();
    focusNextHeading();
    const home = renderWeb(<ScreenTitle id="home" />);
    wait(3100);
    expect(document.activeElement).toBe(input);
    home.unmount();
    input.remove();
  });

  it('is not taken when nobody asked, or the sign-in failed', () => {
    (document.activeElement as HTMLElement | null)?.blur?.();
    const unasked = renderWeb(<ScreenTitle id="unasked" />);
    wait(3100);
    expect(document.activeElement).toBe(document.body);
    unasked.unmount();
    focusNextHeading();
    cancelHeadingFocus();
    const failed = renderWeb(<ScreenTitle id="failed" />);
    wait(3100);
    expect(document.activeElement).toBe(document.body);
    failed.unmount();
  });
});
