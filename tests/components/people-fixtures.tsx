/** Shared data and wrapping for the people, account and build-people tests: a signed-in reader and the API recorded. */
import type { ReactElement } from 'react';
import type { BuildPeople, OrganizationSummary, PersonSummary, SessionUser } from '@/db/contracts';
import { storageKeys } from '@/lib/storage';
import { renderInApp, testQueryClient } from './render-web';

export { recordFetch, type Call } from './finding-fixtures';

// Real ids: the contract's inputs check them.
export const NORTH = '6f1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a01';
export const SHOP = '6f1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a02';
export const INSPECTION = '6f1c2a4e-0d5b-4c43-9a61-3b7d2f0e9a03';

export const admin: SessionUser = {
  id: 'u-admin',
  email: 'admin@pitchcard.example',
  name: 'Site Admin',
  role: 'admin',
  lead: false,
  organizationId: null,
  organizationName: null,
};
export const lead: SessionUser = {
  id: 'u-maren',
  email: 'maren@northfold.example',
  name: 'Maren Holt',
  role: 'supplier',
  lead: true,
  organizationId: NORTH,
  organizationName: 'Northfold Kitworks',
};
export const owner: SessionUser = {
  id: 'u-tobias',
  email: 'tobias@benchwork.example',
  name: 'Tobias Fenn',
  role: 'builder',
  lead: false,
  organizationId: SHOP,
  organizationName: 'Benchwork Hangar 3',
};

export const organizations: OrganizationSummary[] = [
  { id: NORTH, name: 'Northfold Kitworks', kind: 'supplier', people: 2, createdAt: '2026-01-01T00:00:00.000Z' },
  { id: SHOP, name: 'Benchwork Hangar 3', kind: 'shop', people: 2, createdAt: '2026-01-01T00:00:00.000Z' },
  {
    id: INSPECTION,
    name: 'Airworthy Inspections',
    kind: 'inspection',
    people: 0,
    createdAt: '2026-01-01T00:00:00.000Z',
  },
];

export const person = (over: Partial<PersonSummary> & Pick<PersonSummary, 'id' | 'email' | 'name'>): PersonSummary => ({
  role: 'builder',
  organizationId: SHOP,
  organizationName: 'Benchwork Hangar 3',
  active: true,
  lead: false,
  createdAt: '2026-01-02T00:00:00.000Z',
  allowed: [],
  ...over,
});

export const people: PersonSummary[] = [
  person({
    id: 'u-tobias',
    email: 'tobias@benchwork.example',
    name: 'Tobias Fenn',
    allowed: ['change-role', 'deactivate'],
  }),
  person({
    id: 'u-priya',
    email: 'priya@checkpoint.example',
    name: 'Priya Ashdown',
    role: 'inspector',
    allowed: ['change-role', 'deactivate'],
  }),
  person({
    id: 'u-old',
    email: 'old@benchwork.example',
    name: 'Oskar Left',
    active: false,
    allowed: ['change-role', 'reactivate'],
  }),
  // The signed-in lead as the list shows them.
  person({ ...lead, allowed: ['change-role', 'deactivate'] }),
  person({
    id: 'u-admin',
    email: 'admin@pitchcard.example',
    name: 'Site Admin',
    role: 'admin',
    organizationId: null,
    organizationName: null,
    allowed: [],
  }),
];

export const buildPeople = (allowed: BuildPeople['allowed']): BuildPeople => ({
  members: [
    {
      userId: 'u-priya',
      name: 'Priya Ashdown',
      email: 'priya@checkpoint.example',
      place: 'final_inspector',
      addedAt: '2026-01-03T00:00:00.000Z',
    },
    {
      userId: 'u-tobias',
      name: 'Tobias Fenn',
      email: 'tobias@benchwork.example',
      place: 'owner',
      addedAt: '2026-01-03T00:00:00.000Z',
    },
    {
      userId: 'u-ada',
      name: 'Ada Rowe',
      email: 'ada@benchwork.example',
      place: 'helper',
      addedAt: '2026-01-04T00:00:00.000Z',
    },
  ],
  pending: [
    {
      email: 'new.adviser@airworthy.example',
      name: 'Nell Adviser',
      place: 'adviser',
      expiresAt: '2026-01-11T00:00:00.000Z',
    },
  ],
  allowed,
});

/** Renders signed in as `user` (the session read from storage, as on a reload), with `seed` in the query cache. */
export function wrapSignedIn(ui: ReactElement, user: SessionUser | null, seed: [readonly unknown[], unknown][] = []) {
  window.localStorage.clear();
  if (user) {
    window.localStorage.setItem(
      storageKeys.session,
      JSON.stringify({ token: 'token-1', expiresAt: new Date(Date.now() + 3600_000).toISOString(), user }),
    );
  }
  const qc = testQueryClient();
  for (const [key, data] of seed) qc.setQueryData(key, data);
  const r = renderInApp(ui, qc);
  return { ...r, qc };
}

/** The session stored on the device now, as the app would read it on a reload. */
export function storedSession(): { token: string; user: SessionUser } | null {
  const raw = window.localStorage.getItem(storageKeys.session);
  return raw ? JSON.parse(raw) : null;
}
