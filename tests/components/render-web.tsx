/**
 * A small renderer for the app's web build under jest-expo/web. React Native Testing Library looks for
 * native host components, but on the web react-native-web renders DOM elements (testID becomes
 * data-testid), so these tests render with react-dom and query the DOM the browser would see.
 */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, type ReactElement } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import type { UnitSystem } from '@/constants/units';
import { SessionProvider } from '@/hooks/use-session';
import { UnitsProvider } from '@/hooks/use-units';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

export type Rendered = {
  container: HTMLElement;
  byTestId: (id: string) => HTMLElement;
  queryByTestId: (id: string) => HTMLElement | null;
  allByTestIdPrefix: (prefix: string) => HTMLElement[];
  byLabel: (label: string) => HTMLElement;
  text: () => string;
  press: (id: string) => Promise<void>;
  type: (id: string, value: string) => Promise<void>;
  settle: () => Promise<void>;
  rerender: (ui: ReactElement) => void;
  unmount: () => void;
};

/** Quotes a value for an attribute selector (jsdom has no CSS.escape). */
const q = (v: string) => v.replace(/["\\]/g, '\\$&');

const mounted: { root: Root; container: HTMLElement }[] = [];

export function renderWeb(ui: ReactElement): Rendered {
  const container = document.createElement('div');
  document.body.appendChild(container);
  const root = createRoot(container);
  act(() => root.render(ui));
  mounted.push({ root, container });

  const queryByTestId = (id: string) => container.querySelector<HTMLElement>(`[data-testid="${q(id)}"]`);
  const byTestId = (id: string) => {
    const el = queryByTestId(id);
    if (!el) throw new Error(`No element with testID "${id}". Text on screen: ${container.textContent?.slice(0, 400)}`);
    return el;
  };
  const settle = async () => {
    for (let i = 0; i < 5; i++) {
      // Let resolvers, effects and microtasks run.
      await act(async () => {
        await new Promise((r) => setTimeout(r, 0));
      });
    }
  };

  return {
    container,
    byTestId,
    queryByTestId,
    allByTestIdPrefix: (prefix) => Array.from(container.querySelectorAll<HTMLElement>(`[data-testid^="${q(prefix)}"]`)),
    byLabel: (label) => {
      const el = container.querySelector<HTMLElement>(`[aria-label="${q(label)}"]`);
      if (!el) throw new Error(`No element labelled "${label}"`);
      return el;
    },
    text: () => container.textContent ?? '',
    press: async (id) => {
      const el = byTestId(id);
      await act(async () => {
        el.click();
      });
      await settle();
    },
    type: async (id, value) => {
      const el = byTestId(id) as HTMLInputElement | HTMLTextAreaElement;
      const proto = el instanceof HTMLTextAreaElement ? HTMLTextAreaElement.prototype : HTMLInputElement.prototype;
      const setter = Object.getOwnPropertyDescriptor(proto, 'value')?.set;
      await act(async () => {
        setter?.call(el, value);
        el.dispatchEvent(new Event('input', { bubbles: true }));
      });
      await settle();
    },
    settle,
    rerender: (next) => act(() => root.render(next)),
    unmount: () => act(() => root.unmount()),
  };
}

afterEach(() => {
  while (mounted.length) {
    const m = mounted.pop()!;
    act(() => m.root.unmount());
    m.container.remove();
  }
});

/** A query client for one screen test: nothing retried, nothing refetched on its own. */
export const testQueryClient = () =>
  new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });

/**
 * A screen as the app draws it (a phone's window, the query client, units, the session), with `qc`'s
 * cache as the test seeded it.
 */
export function renderInApp(ui: ReactElement, qc: QueryClient, system: UnitSystem = 'imperial'): Rendered {
  return renderWeb(
    <SafeAreaProvider
      initialMetrics={{
        frame: { x: 0, y: 0, width: 390, height: 844 },
        insets: { top: 0, left: 0, right: 0, bottom: 0 },
      }}
    >
      <QueryClientProvider client={qc}>
        <UnitsProvider initial={system}>
          <SessionProvider>{ui}</SessionProvider>
        </UnitsProvider>
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
}
