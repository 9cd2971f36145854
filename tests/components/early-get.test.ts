import { apiRequest, configureApiClient, startEarlyGet } from '@/lib/api-client';

/**
 * A GET started before the app first draws (a traveler opened from its link) is taken by the screen's
 * own first request of that path: asked once, not twice. Only with the same token, only once.
 */
describe('an early GET', () => {
  const original = globalThis.fetch;
  let token: string | null = 'token-a';
  const fetchMock = jest.fn(async (_url: string, _init?: RequestInit) => {
    const n = fetchMock.mock.calls.length;
    return { ok: true, status: 200, text: async () => JSON.stringify({ n }) };
  });

  beforeAll(() => {
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    configureApiClient({ getToken: () => token });
  });
  afterAll(() => {
    globalThis.fetch = original;
  });
  beforeEach(() => {
    fetchMock.mockClear();
    token = 'token-a';
  });

  it('is taken by the first request of the same path, and a later one asks again', async () => {
    startEarlyGet('/api/travelers/p1', 'token-a');
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(await apiRequest('/api/travelers/p1')).toEqual({ n: 1 });
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(await apiRequest('/api/travelers/p1')).toEqual({ n: 2 });
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });

  it('is not taken by a request signed with another token', async () => {
    startEarlyGet('/api/travelers/p2', 'token-a');
    token = 'token-b';
    await apiRequest('/api/travelers/p2');
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect((fetchMock.mock.calls[1][1]?.headers as Record<string, string>).Authorization).toBe('Bearer token-b');
  });

  it('is not taken by a write to the same path', async () => {
    startEarlyGet('/api/travelers/p3', 'token-a');
    await apiRequest('/api/travelers/p3', { method: 'POST', body: { a: 1 } });
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(fetchMock.mock.calls[1][1]?.method).toBe('POST');
  });
});
