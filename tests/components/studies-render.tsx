/**
 * What the study screens' tests share: the demo kit model, jsdom given a layout so the pictures and
 * tables draw, and rendering inside the providers the screens need (units; queries for results).
 */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactElement } from 'react';
import type { KitModel } from '@/db/contracts';
import { UnitsProvider } from '@/hooks/use-units';
import { standardKit } from '../fixtures/rib-study';
import { renderWeb } from './render-web';

export const KIT_ID = '3f1c9a52-8a1e-4c47-9b7e-2f3a4d5e6f70';

/** The standard kit (1320 lb, 120 sq ft, 54 in mean chord) as a stored kit model, NACA 2412. */
export const demoKit: KitModel = {
  id: KIT_ID,
  organizationId: 'org',
  createdAt: '2026-10-01T00:00:00Z',
  code: 'NK-2',
  name: 'NK-2 Quillon',
  ...standardKit,
  airfoil: 'NACA 2412',
};

/**
 * jsdom lays nothing out: every element reports `width()` wide and 300 px high, and a ResizeObserver
 * reports each element once, so the pictures and tables draw (call at the top of a test file).
 */
export function fakeLayout(width: () => number) {
  beforeAll(() => {
    Object.defineProperty(HTMLElement.prototype, 'offsetWidth', { configurable: true, get: width });
    Object.defineProperty(HTMLElement.prototype, 'offsetHeight', { configurable: true, get: () => 300 });
    (window as unknown as { ResizeObserver: unknown }).ResizeObserver = class {
      constructor(private cb: (entries: { target: Element }[]) => void) {}
      observe(target: Element) {
        setTimeout(() => this.cb([{ target }]), 0);
      }
      unobserve() {}
      disconnect() {}
    };
  });
}

type System = 'imperial' | 'metric';
const inUnits = (system: System, ui: ReactElement) => <UnitsProvider initial={system}>{ui}</UnitsProvider>;

/** A form or a view in the chosen units. */
export function renderInUnits(system: System, ui: ReactElement) {
  return renderWeb(inUnits(system, ui));
}

/**
 * A results view with its queries answered beforehand by `seed` (nothing goes to a server: no retry,
 * nothing stale), once its effects have run.
 */
export async function renderWithQueries(system: System, seed: (qc: QueryClient) => void, ui: ReactElement) {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  seed(qc);
  const r = renderWeb(<QueryClientProvider client={qc}>{inUnits(system, ui)}</QueryClientProvider>);
  await r.settle();
  return r;
}
