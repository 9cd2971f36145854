import { roles } from '@/db/contracts';
import {
  filterPeople,
  matchesPerson,
  organizationsFor,
  peopleCount,
  rolesFor,
  roleWords,
} from '@/components/people/people-view';
import { allTabRoutes, tabsFor } from '@/components/navigation/role-tabs';
import { INSPECTION, NORTH, organizations, people, person, SHOP } from './people-fixtures';

describe('the people list', () => {
  it.each([
    ['a part of the name', 'tob', ['Tobias Fenn']],
    ['part of the address, any case', 'CHECKPOINT', ['Priya Ashdown']],
    ['the organisation', 'northfold', ['Maren Holt']],
    ['the role in words', 'inspector', ['Priya Ashdown']],
    ['the words “lead engineer”', 'lead engineer', ['Maren Holt']],
    ['the word “deactivated”', 'deactivated', ['Oskar Left']],
    ['every word, in any order', 'hangar fenn', ['Tobias Fenn']],
    ['every word or not at all', 'fenn northfold', []],
  ])('finds people by %s', (_what, text, names) => {
    expect(filterPeople(people, text, 'all').map((p) => p.name)).toEqual(names);
  });

  it('lists active people first, each group by name', () => {
    expect(filterPeople(people, '', 'all').map((p) => p.name)).toEqual([
      'Maren Holt',
      'Priya Ashdown',
      'Site Admin',
      'Tobias Fenn',
      'Oskar Left',
    ]);
  });

  it('shows only the active or only the deactivated when asked', () => {
    expect(filterPeople(people, '', 'inactive').map((p) => p.name)).toEqual(['Oskar Left']);
    expect(filterPeople(people, '', 'active')).toHaveLength(4);
  });

  it('an empty find box matches everyone', () => {
    expect(people.every((p) => matchesPerson(p, '   '))).toBe(true);
  });

  it('counts people, the deactivated, and how many a narrowed list shows', () => {
    expect(peopleCount(people, people.length)).toBe('5 people · 1 deactivated');
    expect(peopleCount(people, 2)).toBe('2 of 5 people shown');
    expect(peopleCount([people[0]], 1)).toBe('1 person');
  });

  it('names the lead engineer in the role', () => {
    expect(roleWords(person({ id: 'x', email: 'x@x.example', name: 'X', role: 'supplier', lead: true }))).toBe(
      'Supplier’s engineer, lead engineer',
    );
    expect(roleWords(person({ id: 'y', email: 'y@x.example', name: 'Y', role: 'builder', lead: false }))).toBe(
      'Builder',
    );
  });
});

describe('the roles and organisations offered follow the contract’s table', () => {
  it('offers an organisation only for the roles its kind holds', () => {
    expect(organizationsFor('supplier', organizations).map((o) => o.id)).toEqual([NORTH]);
    expect(organizationsFor('builder', organizations).map((o) => o.id)).toEqual([SHOP]);
    expect(organizationsFor('inspector', organizations).map((o) => o.id)).toEqual([INSPECTION, SHOP]);
    expect(organizationsFor('admin', organizations)).toEqual([]);
    expect(organizationsFor(undefined, organizations)).toHaveLength(3);
  });

  it('offers the roles of the person’s organisation, or every role without one', () => {
    expect(rolesFor('shop')).toEqual(['builder', 'inspector']);
    expect(rolesFor('supplier')).toEqual(['supplier']);
    expect(rolesFor(null)).toEqual(roles);
  });
});

describe('tabs by role', () => {
  const ids = (u: Parameters<typeof tabsFor>[0]) => tabsFor(u).map((t) => t.testID);

  it('gives the admin the People tab in place of the old session page', () => {
    expect(ids({ role: 'admin', lead: false })).toEqual(['tab-people', 'tab-phones']);
  });

  it('gives a supplier’s lead engineer the People tab too, and an engineer who is not lead none', () => {
    expect(ids({ role: 'supplier', lead: true })).toEqual([
      'tab-catalogue',
      'tab-studies',
      'tab-coupons',
      'tab-builds',
      'tab-approvals',
      'tab-people',
    ]);
    expect(ids({ role: 'supplier', lead: false })).not.toContain('tab-people');
  });

  it('keeps the builder’s and inspector’s tabs, and gives the builder their builds (an owner manages its people there)', () => {
    expect(ids({ role: 'builder', lead: false })).toEqual(['tab-bench', 'tab-parts', 'tab-findings', 'tab-builds']);
    expect(ids({ role: 'inspector', lead: false })).toEqual(['tab-review', 'tab-builds']);
    expect(ids(null)).toEqual([]);
  });

  it('names only routes the tab navigator knows', () => {
    for (const role of roles) {
      for (const t of tabsFor({ role, lead: true })) expect(allTabRoutes).toContain(t.name);
    }
  });
});
