import { personActions, type PersonAction, type PersonSummary } from '@/db/contracts';
import { PeopleScreen } from '@/components/people/people-screen';
import { peopleKeys } from '@/hooks/queries/people';
import {
  admin,
  lead,
  NORTH,
  organizations,
  owner,
  people,
  person,
  recordFetch,
  SHOP,
  wrapSignedIn,
} from './people-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

/** A list as the infinite query holds it: the pages loaded so far (one here), and where the next one starts. */
const paged = <T,>(items: T[], next: string | null = null) => ({ pages: [{ items, next }], pageParams: [null] });

const seeded = (list: PersonSummary[] = people, next: string | null = null): [readonly unknown[], unknown][] => [
  [peopleKeys.list(), paged(list, next)],
  [peopleKeys.invitations(), paged([])],
  [peopleKeys.organizations(), paged(organizations)],
];

/** POST answers the invitation made; GET (the list asked again after it) an empty page. */
const invitationsRoute = (sent: unknown) =>
  sent ? { status: 201, body: { ok: true } } : { body: { items: [], next: null } };

async function shown(user = admin, list: PersonSummary[] = people) {
  recordFetch({});
  const r = wrapSignedIn(<PeopleScreen />, user, seeded(list));
  await r.settle();
  return r;
}

const actionIds = (r: Awaited<ReturnType<typeof shown>>) =>
  r.allByTestIdPrefix('person-action-').map((el) => el.getAttribute('data-testid'));

describe('the people screen offers exactly what the server allows', () => {
  const table: [string, PersonAction[]][] = [
    ['nothing', []],
    ['deactivate only', ['deactivate']],
    ['reactivate and make lead', ['reactivate', 'make-lead']],
    ['every action of the rules module', [...personActions]],
  ];

  it.each(table)('%s', async (_name, allowed) => {
    const p = person({ id: 'u-x', email: 'x@benchwork.example', name: 'Xavi Test', allowed });
    const r = await shown(admin, [p]);
    await r.press('person-x@benchwork.example');
    expect(actionIds(r)).toEqual(allowed.map((a) => `person-action-${a}`));
    if (!allowed.length) expect(r.byTestId('person-nothing').textContent).toContain('Nothing here');
    // Role chips only come with change-role.
    expect(r.allByTestIdPrefix('person-role-').length > 0).toBe(allowed.includes('change-role'));
  });

  it('offers the reader nothing on their own row and points to their account page', async () => {
    const r = await shown();
    await r.press('person-admin@pitchcard.example');
    expect(r.queryByTestId('person-actions')).toBeNull();
    expect(r.text()).toContain('your account page');
  });
});

describe('deactivating and reactivating', () => {
  it('asks first, then sends one request, and shows the person deactivated', async () => {
    // The server as it would answer: the list asked again after the change shows the change.
    let list = people;
    const calls = recordFetch({
      '/api/people/u-tobias': (sent) => {
        const next: PersonSummary = { ...people[0], ...(sent as object), allowed: ['change-role', 'reactivate'] };
        list = people.map((p) => (p.id === next.id ? next : p));
        return { body: next };
      },
      '/api/people': () => ({ body: { items: list, next: null } }),
    });
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.press('person-tobias@benchwork.example');
    await r.press('person-action-deactivate');
    expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(0);
    expect(r.byTestId('person-ask').textContent).toContain('signed out on every device');

    await r.press('person-confirm');
    const patches = calls.filter((c) => c.method === 'PATCH');
    expect(patches).toEqual([{ url: '/api/people/u-tobias', method: 'PATCH', body: { active: false } }]);
    expect(r.byTestId('person-done').textContent).toContain('Tobias Fenn is deactivated');
    expect(r.queryByTestId('person-inactive-tobias@benchwork.example')).not.toBeNull();
  });

  it('sends nothing when the person thinks better of it', async () => {
    const calls = recordFetch({});
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.press('person-old@benchwork.example');
    await r.press('person-action-reactivate');
    await r.press('person-confirm-cancel');
    expect(calls.filter((c) => c.method === 'PATCH')).toEqual([]);
    expect(r.queryByTestId('person-action-reactivate')).not.toBeNull();
  });

  it('changes a role to one of the organisation’s roles only', async () => {
    const calls = recordFetch({
      '/api/people/u-tobias': { body: { ...people[0], role: 'inspector' } },
      '/api/people': { body: { items: people, next: null } },
    });
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.press('person-tobias@benchwork.example');
    // A build shop holds builders and inspectors.
    expect(r.allByTestIdPrefix('person-role-').map((el) => el.getAttribute('data-testid'))).toEqual([
      'person-role-builder',
      'person-role-inspector',
    ]);
    expect(r.byTestId('person-action-change-role').getAttribute('aria-disabled')).toBe('true');
    await r.press('person-role-inspector');
    await r.press('person-action-change-role');
    expect(calls.filter((c) => c.method === 'PATCH').map((c) => c.body)).toEqual([{ role: 'inspector' }]);
    expect(r.byTestId('person-done').textContent).toContain('now inspector');
  });
});

describe('finding people', () => {
  it('narrows the list as one types, and says so when nobody matches', async () => {
    const r = await shown();
    await r.type('people-find', 'priya');
    expect(
      r.allByTestIdPrefix('person-').filter((el) => /^person-[^-]+@/.test(el.getAttribute('data-testid')!)).length,
    ).toBe(1);
    expect(r.byTestId('people-count').textContent).toBe('1 of 5 people shown');
    await r.type('people-find', 'nobody-like-this');
    expect(r.byTestId('empty').textContent).toContain('Nobody matches');
  });
});

describe('people in pages', () => {
  it('appends the next page under the first when asked, with the cursor the first page gave, and then says all are shown', async () => {
    const more = [person({ id: 'u-zed', email: 'zed@benchwork.example', name: 'Zed Later' })];
    const calls = recordFetch({ '/api/people': { body: { items: more, next: null } } });
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded(people, 'cursor-of-page-1'));
    await r.settle();
    const before = r
      .allByTestIdPrefix('person-')
      .filter((el) => /^person-[^-]+@/.test(el.getAttribute('data-testid')!)).length;
    expect(r.queryByTestId('person-zed@benchwork.example')).toBeNull();
    await r.press('people-more');
    await r.settle();
    expect(calls.filter((c) => c.url.startsWith('/api/people')).map((c) => c.url)).toEqual([
      '/api/people?cursor=cursor-of-page-1',
    ]);
    const rows = r.allByTestIdPrefix('person-').filter((el) => /^person-[^-]+@/.test(el.getAttribute('data-testid')!));
    expect(rows).toHaveLength(before + 1);
    // The first page's people stay; the second page's person joins them (active people first, as the list shows them).
    const ids = rows.map((el) => el.getAttribute('data-testid'));
    expect(ids).toContain('person-zed@benchwork.example');
    for (const p of people) expect(ids).toContain(`person-${p.email}`);
    expect(r.queryByTestId('people-more')).toBeNull();
    expect(r.byTestId('people-more-end').textContent).toBe(`All ${before + 1} people shown`);
  });
});

describe('inviting', () => {
  it('the admin chooses role and organisation; the organisations offered hold the role', async () => {
    const calls = recordFetch({ '/api/people/invitations': invitationsRoute });
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.press('invite-send');
    expect(r.byTestId('invite-role-field-error').textContent).toBe('choose a role');
    await r.type('invite-person-email', 'Juno@Benchwork.example');
    await r.type('invite-person-name', 'Juno Marsh');
    await r.press('invite-role-builder');
    expect(r.queryByTestId(`invite-org-${NORTH}`)).toBeNull();
    await r.press(`invite-org-${SHOP}`);
    expect(r.queryByTestId('invite-lead')).toBeNull();
    await r.press('invite-send');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([
      {
        url: '/api/people/invitations',
        method: 'POST',
        body: {
          email: 'juno@benchwork.example',
          name: 'Juno Marsh',
          role: 'builder',
          organizationId: SHOP,
          lead: false,
        },
      },
    ]);
    expect(r.byTestId('invite-sent').textContent).toContain('juno@benchwork.example');
  });

  it('puts the server’s refusal at the field', async () => {
    recordFetch({
      '/api/people/invitations': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'this address already has an account',
            fields: { email: 'already has an account' },
          },
        },
      },
    });
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.type('invite-person-email', 'tobias@benchwork.example');
    await r.type('invite-person-name', 'Tobias');
    await r.press('invite-role-builder');
    await r.press('invite-send');
    expect(r.byTestId('invite-person-email-field-error').textContent).toBe('already has an account');
  });

  it('a lead engineer invites engineers of their own organisation, with no organisations to manage', async () => {
    const calls = recordFetch({ '/api/people/invitations': invitationsRoute });
    const r = wrapSignedIn(<PeopleScreen />, lead, seeded(people.filter((p) => p.organizationId === NORTH)));
    await r.settle();
    expect(r.queryByTestId('organizations')).toBeNull();
    expect(r.allByTestIdPrefix('invite-role-')).toHaveLength(0);
    await r.type('invite-person-email', 'eng@northfold.example');
    await r.type('invite-person-name', 'New Engineer');
    await r.press('invite-lead');
    await r.press('invite-send');
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([
      { email: 'eng@northfold.example', name: 'New Engineer', role: 'supplier', organizationId: NORTH, lead: true },
    ]);
  });

  it('tells anyone else this is not theirs to manage, and asks the server nothing', async () => {
    const calls = recordFetch({});
    const r = wrapSignedIn(<PeopleScreen />, owner);
    await r.settle();
    expect(r.byTestId('empty').textContent).toContain('Not yours to manage');
    expect(calls.filter((c) => c.url.startsWith('/api/people'))).toEqual([]);
  });
});

describe('a new organisation', () => {
  it('marks an empty name at the field only, with nothing at the top of the form, and sends nothing', async () => {
    const calls = recordFetch({});
    const r = wrapSignedIn(<PeopleScreen />, admin, seeded());
    await r.settle();
    await r.press('org-new');
    await r.press('org-create');
    expect(r.byTestId('org-name-field-error').textContent).not.toBe('');
    expect(r.queryByTestId('org-error')).toBeNull();
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
  });
});
