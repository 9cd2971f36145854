import { randomUUID } from 'node:crypto';
import { cachedSessionUser, forgetSessionUser, SESSION_CACHE_MS, type SessionRow } from '@/server/auth/session-cache';

/**
 * The signed-in person kept for a second between requests: read once for a run of requests with one
 * token, read again when a newer token comes, when the copy is a second old, or when a write forgot it.
 * (The API-level checks, that a role change or "sign out everywhere" ends a token at once, are in
 * people.test.ts and hardening.test.ts.)
 */
describe('the session cache', () => {
  const row = (id: string, sessionVersion: number): SessionRow => ({
    id,
    email: 'a@example.test',
    name: 'A',
    role: 'builder',
    lead: false,
    organizationId: null,
    organizationName: null,
    active: true,
    sessionVersion,
  });

  afterEach(() => jest.useRealTimers());

  it('reads the person once for many requests with the same token', async () => {
    const id = randomUUID();
    const load = jest.fn(async () => row(id, 1));
    for (let i = 0; i < 5; i++) expect((await cachedSessionUser(id, 1, load))?.id).toBe(id);
    expect(load).toHaveBeenCalledTimes(1);
  });

  it('reads again for a token newer than the copy (a new password, a new sign-in)', async () => {
    const id = randomUUID();
    let version = 1;
    const load = jest.fn(async () => row(id, version));
    await cachedSessionUser(id, 1, load);
    version = 2;
    expect((await cachedSessionUser(id, 2, load))?.sessionVersion).toBe(2);
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('reads again once forgotten, so an ended sign-in is refused at the next request', async () => {
    const id = randomUUID();
    let version = 1;
    const load = jest.fn(async () => row(id, version));
    await cachedSessionUser(id, 1, load);
    version = 2;
    forgetSessionUser(id);
    // The old token (version 1) now meets the row as it is: the caller refuses it.
    expect((await cachedSessionUser(id, 1, load))?.sessionVersion).toBe(2);
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('keeps a copy no longer than a second (what another process may lag by)', async () => {
    jest.useFakeTimers({ now: new Date('2026-12-03T12:00:00Z'), doNotFake: ['nextTick', 'setImmediate'] });
    const id = randomUUID();
    const load = jest.fn(async () => row(id, 1));
    await cachedSessionUser(id, 1, load);
    jest.setSystemTime(Date.now() + SESSION_CACHE_MS - 1);
    await cachedSessionUser(id, 1, load);
    expect(load).toHaveBeenCalledTimes(1);
    jest.setSystemTime(Date.now() + 2);
    await cachedSessionUser(id, 1, load);
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('keeps no one unknown: a missing person is read again after the second too', async () => {
    const id = randomUUID();
    const load = jest.fn(async () => undefined);
    expect(await cachedSessionUser(id, 1, load)).toBeUndefined();
    expect(await cachedSessionUser(id, 1, load)).toBeUndefined();
    expect(load).toHaveBeenCalledTimes(2);
  });
});
