import type { InvitationView, SignInResult } from '@/db/contracts';
import { AccountScreen } from '@/components/account/account-screen';
import { ForgotScreen } from '@/components/auth/forgot-screen';
import { InviteScreen } from '@/components/auth/invite-screen';
import { ResetScreen } from '@/components/auth/reset-screen';
import { owner, recordFetch, storedSession, wrapSignedIn } from './people-fixtures';

const mockReplace = jest.fn();
jest.mock('expo-router', () => ({
  useRouter: () => ({ push: jest.fn(), replace: mockReplace, back: jest.fn(), canGoBack: () => false }),
}));
beforeEach(() => mockReplace.mockReset());

const TOKEN = 'Q2hvb3NlLWEtcGFzc3dvcmQtb25jZQ';
const invitation: InvitationView = {
  email: 'wren@hangar-nine.example',
  name: 'Wren Okafor',
  role: 'builder',
  organizationName: null,
  invitedByName: 'Maren Holt',
  expiresAt: '2026-01-10T00:00:00.000Z',
};
const joined: SignInResult = {
  token: 'fresh-token',
  expiresAt: new Date(Date.now() + 3600_000).toISOString(),
  user: {
    id: 'u-wren',
    email: invitation.email,
    name: 'Wren Okafor',
    role: 'builder',
    lead: false,
    organizationId: null,
    organizationName: null,
  },
};
const weak = {
  status: 400,
  body: {
    error: {
      code: 'bad_request',
      message: 'this password is too easy to guess: Add more words.',
      fields: { password: 'this password is too easy to guess: Add more words.' },
    },
  },
};

describe('joining from an invitation', () => {
  it('says who invites whom, and fills in the name from the invitation', async () => {
    recordFetch({ [`/api/invitations/${TOKEN}`]: { body: invitation } });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, null);
    await r.settle();
    expect(r.byTestId('invite-what').textContent).toBe('Maren Holt invites you as builder.');
    expect(r.byTestId('invite-email').textContent).toContain('wren@hangar-nine.example');
    expect((r.byTestId('invite-name') as HTMLInputElement).value).toBe('Wren Okafor');
  });

  it('shows the server’s advice on a weak password once, under the password', async () => {
    recordFetch({ [`/api/invitations/${TOKEN}`]: { body: invitation }, '/api/invitations/accept': weak });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, null);
    await r.settle();
    await r.type('invite-password', 'password123');
    await r.press('invite-accept');
    expect(r.byTestId('invite-password-field-error').textContent).toBe(
      'this password is too easy to guess: Add more words.',
    );
    expect(r.queryByTestId('invite-error')).toBeNull();
    expect(storedSession()).toBeNull();
  });

  it('asks for at least ten characters before asking the server', async () => {
    const calls = recordFetch({ [`/api/invitations/${TOKEN}`]: { body: invitation } });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, null);
    await r.settle();
    await r.type('invite-password', 'short');
    await r.press('invite-accept');
    expect(r.byTestId('invite-password-field-error').textContent).toBe('use at least 10 characters');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
  });

  it('joins with the name and password given, keeps the new sign-in and opens the app', async () => {
    const calls = recordFetch({
      [`/api/invitations/${TOKEN}`]: { body: invitation },
      '/api/invitations/accept': { body: joined },
    });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, null);
    await r.settle();
    await r.type('invite-name', 'Wren O.');
    await r.type('invite-password', 'copper-ribs-tilt-44-quietly');
    await r.press('invite-accept');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([
      {
        url: '/api/invitations/accept',
        method: 'POST',
        body: { token: TOKEN, name: 'Wren O.', password: 'copper-ribs-tilt-44-quietly' },
      },
    ]);
    expect(storedSession()?.token).toBe('fresh-token');
    expect(mockReplace).toHaveBeenCalledWith('/');
  });

  it('says plainly when the invitation has run out or was used', async () => {
    recordFetch({
      [`/api/invitations/${TOKEN}`]: {
        status: 404,
        body: {
          error: { code: 'not_found', message: 'this invitation has expired or was already used: ask for a new one' },
        },
      },
    });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, null);
    await r.settle();
    expect(r.byTestId('invite-gone').textContent).toBe(
      'This invitation has expired or was already used: ask for a new one.',
    );
    expect(r.queryByTestId('invite-accept')).toBeNull();
  });

  it('asks nothing of the server for a link cut short', async () => {
    const calls = recordFetch({});
    const r = wrapSignedIn(<InviteScreen token="abc" />, null);
    await r.settle();
    expect(r.byTestId('invite-gone').textContent).toContain('incomplete or damaged');
    expect(calls).toEqual([]);
  });

  it('on a device where someone is signed in, asks them to sign out first', async () => {
    recordFetch({ [`/api/invitations/${TOKEN}`]: { body: invitation } });
    const r = wrapSignedIn(<InviteScreen token={TOKEN} />, owner);
    await r.settle();
    expect(r.byTestId('signed-in-other').textContent).toContain('Tobias Fenn');
    expect(r.queryByTestId('invite-password')).toBeNull();
    await r.press('signed-in-other-sign-out');
    expect(storedSession()).toBeNull();
    expect(r.queryByTestId('invite-password')).not.toBeNull();
  });
});

describe('a forgotten password', () => {
  it('asks for the link and shows the server’s answer, the same for any address', async () => {
    const calls = recordFetch({
      '/api/auth/forgot': { status: 202, body: { message: 'If this address has an account, a link is on its way.' } },
    });
    const r = wrapSignedIn(<ForgotScreen />, null);
    await r.settle();
    await r.type('forgot-email', 'Priya@Checkpoint.example');
    await r.press('forgot-send');
    expect(calls.map((c) => c.body)).toEqual([{ email: 'priya@checkpoint.example' }]);
    expect(r.byTestId('forgot-sent').textContent).toBe('If this address has an account, a link is on its way.');
  });

  it('a new password from the mail’s link signs the person in', async () => {
    recordFetch({ '/api/auth/reset': { body: joined } });
    const r = wrapSignedIn(<ResetScreen token={TOKEN} />, null);
    await r.settle();
    await r.type('reset-password', 'copper-ribs-tilt-44-quietly');
    await r.press('reset-submit');
    expect(storedSession()?.token).toBe('fresh-token');
    expect(mockReplace).toHaveBeenCalledWith('/');
  });

  it('a spent link says so and offers a new one', async () => {
    recordFetch({
      '/api/auth/reset': {
        status: 400,
        body: {
          error: {
            code: 'bad_request',
            message: 'this link has expired or was already used: ask for a new one',
            fields: { token: 'expired or already used' },
          },
        },
      },
    });
    const r = wrapSignedIn(<ResetScreen token={TOKEN} />, null);
    await r.settle();
    await r.type('reset-password', 'copper-ribs-tilt-44-quietly');
    await r.press('reset-submit');
    expect(r.byTestId('reset-gone').textContent).toContain('expired or was already used');
    await r.press('reset-ask-again');
    expect(mockReplace).toHaveBeenCalledWith('/forgot');
  });
});

describe('the account page', () => {
  it('shows who is signed in', async () => {
    recordFetch({});
    const r = wrapSignedIn(<AccountScreen />, owner);
    await r.settle();
    // Each line reads label then value.
    expect(r.byTestId('account-email').textContent).toBe('E-mailtobias@benchwork.example');
    expect(r.byTestId('account-role').textContent).toBe('RoleBuilder');
    expect(r.byTestId('account-organization').textContent).toBe('OrganisationBenchwork Hangar 3');
  });

  it('a changed password keeps this device signed in with the new token the answer carries', async () => {
    const calls = recordFetch({
      '/api/auth/change-password': { body: { ...joined, token: 'after-change', user: owner } },
    });
    const r = wrapSignedIn(<AccountScreen />, owner);
    await r.settle();
    expect(storedSession()?.token).toBe('token-1');
    await r.type('current-password', 'pitchcard-demo');
    await r.type('new-password', 'copper-ribs-tilt-44-quietly');
    await r.press('change-password');
    expect(calls.map((c) => c.body)).toEqual([
      { currentPassword: 'pitchcard-demo', newPassword: 'copper-ribs-tilt-44-quietly' },
    ]);
    expect(storedSession()?.token).toBe('after-change');
    expect(r.byTestId('password-changed').textContent).toContain('Other devices were signed out');
  });

  it('a wrong current password is said at that field', async () => {
    recordFetch({
      '/api/auth/change-password': {
        status: 400,
        body: {
          error: {
            code: 'bad_request',
            message: 'the current password is not right',
            fields: { currentPassword: 'not right' },
          },
        },
      },
    });
    const r = wrapSignedIn(<AccountScreen />, owner);
    await r.settle();
    await r.type('current-password', 'guess');
    await r.type('new-password', 'copper-ribs-tilt-44-quietly');
    await r.press('change-password');
    expect(r.byTestId('current-password-field-error').textContent).toBe('not right');
    expect(storedSession()?.token).toBe('token-1');
  });

  it('signs out everywhere only after a yes, and then here too', async () => {
    const calls = recordFetch({ '/api/auth/sign-out-everywhere': { status: 204, body: '' } });
    const r = wrapSignedIn(<AccountScreen />, owner);
    await r.settle();
    await r.press('sign-out-everywhere');
    expect(calls).toEqual([]);
    await r.press('sign-out-everywhere-cancel');
    expect(r.queryByTestId('sign-out-everywhere-confirm')).toBeNull();
    await r.press('sign-out-everywhere');
    await r.press('sign-out-everywhere-confirm');
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['POST /api/auth/sign-out-everywhere']);
    expect(storedSession()).toBeNull();
  });
});
