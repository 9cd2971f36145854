import type { TravelerDetail } from '@/db/contracts';
import { TravelerScreen } from '@/components/travelers/traveler-screen';
import { holeU, standardTraveler } from '../fixtures/traveler';
import { recordFetch, wrap } from './finding-fixtures';

/** What the screen sends: its reads (the notices reaching the part) are not the point here. */
const isSend = (c: { method: string }) => c.method !== 'GET';

jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));

const signed: TravelerDetail = {
  ...standardTraveler,
  holesDone: 1,
  signedOff: true,
  holes: [holeU(1, 0.25, 'installed')],
  signedOffAt: '2025-03-01T10:00:00.000Z',
  signedOffByName: 'Ines Inspector',
  place: 'inspector',
  allowedActions: ['withdraw-sign-off'],
  readiness: { ready: false, reasons: ['this part is already signed off'] },
};

const reopened: TravelerDetail = {
  ...signed,
  signedOff: false,
  signedOffAt: null,
  signedOffByName: null,
  allowedActions: ['raise', 'sign-off'],
  readiness: { ready: true, reasons: [] },
};

describe('withdrawing a sign-off on the traveler screen', () => {
  it('is offered only when the server lists it', async () => {
    const builder = wrap(<TravelerScreen travelerId="trav-1" />, {
      traveler: { ...signed, place: 'builder', allowedActions: [] },
    });
    await builder.settle();
    expect(builder.byTestId('signed-off').textContent).toContain('Signed off by Ines Inspector');
    expect(builder.queryByTestId('withdraw-sign-off')).toBeNull();
  });

  it('asks for a reason and a second, named press; refuses a reason too short before sending anything', async () => {
    const calls = recordFetch({ '/api/travelers/trav-1/sign-off/withdraw': { body: reopened } });
    const r = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: signed });
    await r.settle();
    await r.press('withdraw-sign-off');
    expect(r.byTestId('withdraw-sign-off-form').textContent).toContain('The sign-off stays in the build log');
    expect(calls.filter(isSend)).toHaveLength(0);
    await r.press('withdraw-confirm');
    // NOTE_MIN_LENGTH is 3: the contract's own words come back at the field.
    expect(r.byTestId('withdraw-reason-field-error').textContent).toMatch(/why the sign-off is withdrawn/);
    await r.type('withdraw-reason', 'no');
    await r.press('withdraw-confirm');
    expect(calls.filter(isSend)).toHaveLength(0);
    await r.type('withdraw-reason', '  shop head on U-01 cracked  ');
    await r.press('withdraw-confirm');
    expect(calls.filter(isSend)).toEqual([
      {
        url: expect.stringContaining('/api/travelers/trav-1/sign-off/withdraw'),
        method: 'POST',
        body: { reason: 'shop head on U-01 cracked' },
      },
    ]);
    // The answer is the part as it now stands: open, and ready to sign off again.
    expect(r.queryByTestId('signed-off')).toBeNull();
    expect(r.byTestId('sign-off')).toBeTruthy();
  });

  it('can be called off without sending anything', async () => {
    const calls = recordFetch({});
    const r = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: signed });
    await r.settle();
    await r.press('withdraw-sign-off');
    await r.press('withdraw-cancel');
    expect(r.queryByTestId('withdraw-sign-off-form')).toBeNull();
    expect(r.byTestId('withdraw-sign-off')).toBeTruthy();
    expect(calls.filter(isSend)).toHaveLength(0);
  });

  it('shows the server’s refusal in its words and keeps the form', async () => {
    recordFetch({
      '/api/travelers/trav-1/sign-off/withdraw': {
        status: 409,
        body: { error: { code: 'conflict', message: 'this part is not signed off: there is no sign-off to withdraw' } },
      },
    });
    const r = wrap(<TravelerScreen travelerId="trav-1" />, { traveler: signed });
    await r.settle();
    await r.press('withdraw-sign-off');
    await r.type('withdraw-reason', 'rivet U-01 cracked');
    await r.press('withdraw-confirm');
    expect(r.byTestId('withdraw-error').textContent).toContain('no sign-off to withdraw');
    expect(r.byTestId('withdraw-sign-off-form')).toBeTruthy();
  });
});
