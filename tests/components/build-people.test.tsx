import type { BuildPeople } from '@/db/contracts';
import { BuildScreen } from '@/components/builds/build-screen';
import { buildKeys, type BuildPage } from '@/hooks/queries/builds';
import { buildPeople, owner, recordFetch, wrapSignedIn } from './people-fixtures';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

const BUILD = 'b-1';
const page = (people: BuildPeople): BuildPage => ({
  id: BUILD,
  kitSerial: 'NK2-0147',
  kitName: 'NK-2 Quillon',
  supplierName: 'Northfold Kitworks',
  createdAt: '2026-01-03T00:00:00.000Z',
  builders: [],
  inspectors: [],
  travelerCount: 0,
  holesTotal: 0,
  holesDone: 0,
  openFindings: 0,
  travelers: [],
  people,
});

async function shown(people: BuildPeople, routes: Parameters<typeof recordFetch>[0] = {}) {
  const calls = recordFetch(routes);
  const r = wrapSignedIn(<BuildScreen buildId={BUILD} />, owner, [[buildKeys.detail(BUILD), page(people)]]);
  await r.settle();
  return { r, calls };
}

describe('people on a build', () => {
  it('lists members in their places, and the invited as not joined yet', async () => {
    const { r } = await shown(buildPeople([]));
    expect(r.byTestId('member-placed-tobias@benchwork.example').textContent).toBe('Owner and builder');
    expect(r.byTestId('member-placed-priya@checkpoint.example').textContent).toBe('Final inspector');
    expect(r.byTestId('pending-state-new.adviser@airworthy.example').textContent).toContain('not joined yet');
    // Builders first, the owner at the head.
    expect(r.allByTestIdPrefix('member-placed-').map((el) => el.textContent)).toEqual([
      'Owner and builder',
      'Helper',
      'Final inspector',
    ]);
  });

  it('offers no change at all when the reader may make none', async () => {
    const { r } = await shown(buildPeople([]));
    expect(r.allByTestIdPrefix('member-remove-')).toEqual([]);
    expect(r.allByTestIdPrefix('member-hand-over-')).toEqual([]);
    expect(r.queryByTestId('member-add-form')).toBeNull();
  });

  it.each([
    ['add only', ['add'], { add: true, remove: 0, handOver: 0 }],
    ['remove only', ['remove'], { add: false, remove: 2, handOver: 0 }],
    ['hand over only', ['hand-over'], { add: false, remove: 0, handOver: 1 }],
  ] as const)('%s: only what `allowed` lists', async (_n, allowed, expected) => {
    const { r } = await shown(buildPeople([...allowed]));
    expect(!!r.queryByTestId('member-add-form')).toBe(expected.add);
    expect(r.allByTestIdPrefix('member-remove-')).toHaveLength(expected.remove);
    expect(r.allByTestIdPrefix('member-hand-over-')).toHaveLength(expected.handOver);
  });

  it('never offers to remove the owner, and hands over only to another builder on the build', async () => {
    const { r } = await shown(buildPeople(['add', 'remove', 'hand-over']));
    expect(r.queryByTestId('member-remove-tobias@benchwork.example')).toBeNull();
    expect(r.allByTestIdPrefix('member-hand-over-').map((el) => el.getAttribute('data-testid'))).toEqual([
      'member-hand-over-ada@benchwork.example',
    ]);
  });

  it('asks before taking someone off, then sends one DELETE and shows the build as answered', async () => {
    const after = buildPeople(['add', 'remove', 'hand-over']);
    after.members = after.members.filter((m) => m.userId !== 'u-ada');
    const { r, calls } = await shown(buildPeople(['add', 'remove', 'hand-over']), {
      [`/api/builds/${BUILD}/members/u-ada`]: { body: page(after) },
    });
    await r.press('member-remove-ada@benchwork.example');
    expect(r.byTestId('member-ask').textContent).toContain('lose access');
    expect(calls.filter((c) => c.method === 'DELETE')).toEqual([]);
    await r.press('member-confirm');
    expect(calls.filter((c) => c.method === 'DELETE').map((c) => c.url)).toEqual([
      `/api/builds/${BUILD}/members/u-ada`,
    ]);
    expect(r.queryByTestId('member-ada@benchwork.example')).toBeNull();
    expect(r.byTestId('member-done').textContent).toContain('Ada Rowe is off build NK2-0147');
  });

  it('hands the build over after saying what happens to the present owner', async () => {
    const { r, calls } = await shown(buildPeople(['hand-over']), {
      [`/api/builds/${BUILD}/owner`]: { body: page(buildPeople(['hand-over'])) },
    });
    await r.press('member-hand-over-ada@benchwork.example');
    expect(r.byTestId('member-ask').textContent).toContain('stays on as a helper');
    await r.press('member-confirm');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([
      { url: `/api/builds/${BUILD}/owner`, method: 'POST', body: { userId: 'u-ada' } },
    ]);
  });

  it('adds a person by address and place; an empty name is left out, not refused', async () => {
    const { r, calls } = await shown(buildPeople(['add']), {
      [`/api/builds/${BUILD}/members`]: { body: page(buildPeople(['add'])) },
    });
    // The owner's place changes by handing over, never by adding.
    expect(r.queryByTestId('member-place-owner')).toBeNull();
    await r.type('member-email', 'Helper.Two@Benchwork.example');
    await r.press('member-place-helper');
    await r.press('member-add');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([
      {
        url: `/api/builds/${BUILD}/members`,
        method: 'POST',
        body: { email: 'helper.two@benchwork.example', place: 'helper' },
      },
    ]);
    expect(r.byTestId('member-added').textContent).toContain('invitation is on its way');
  });

  it('puts the server’s refusal at the field', async () => {
    const { r } = await shown(buildPeople(['add']), {
      [`/api/builds/${BUILD}/members`]: {
        status: 400,
        body: {
          error: {
            code: 'bad_request',
            message: 'x has an account as builder, not as inspector',
            fields: { email: "not a inspector's account" },
          },
        },
      },
    });
    await r.type('member-email', 'tobias@benchwork.example');
    await r.press('member-place-adviser');
    await r.press('member-add');
    expect(r.byTestId('member-email-field-error').textContent).toBe("not a inspector's account");
  });
});
