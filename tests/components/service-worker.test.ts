import { clearOfflineCaches, registerServiceWorker } from '@/lib/service-worker';
import offline from '@/lib/offline-caches.json';

type CacheStore = { keys: () => Promise<string[]>; delete: (name: string) => Promise<boolean> };
const g = globalThis as unknown as { caches?: CacheStore };

afterEach(() => {
  delete g.caches;
});

describe('the offline copy', () => {
  it('on sign-out empties the caches of API answers and photos, and keeps the app shell', async () => {
    const names = ['pitchcard-precache-v2-http://localhost/', offline.api, offline.photos, 'someone-else'];
    const deleted: string[] = [];
    g.caches = {
      keys: async () => names,
      delete: async (n) => {
        deleted.push(n);
        return true;
      },
    };
    await clearOfflineCaches();
    expect(deleted.sort()).toEqual([offline.api, offline.photos].sort());
  });

  it('clearing is quiet where the browser has no cache storage or refuses it', async () => {
    await expect(clearOfflineCaches()).resolves.toBeUndefined();
    g.caches = {
      keys: async () => {
        throw new Error('SecurityError');
      },
      delete: async () => false,
    };
    await expect(clearOfflineCaches()).resolves.toBeUndefined();
  });

  it('is not installed outside a production build (here, under jest)', () => {
    const register = jest.fn(() => Promise.resolve());
    Object.defineProperty(navigator, 'serviceWorker', { value: { register }, configurable: true });
    registerServiceWorker();
    window.dispatchEvent(new Event('load'));
    expect(register).not.toHaveBeenCalled();
  });

  describe('in a production build', () => {
    const env = process.env.NODE_ENV;
    const setSecure = (secure: boolean) =>
      Object.defineProperty(window, 'isSecureContext', { value: secure, configurable: true });
    beforeEach(() => {
      process.env.NODE_ENV = 'production';
    });
    afterEach(() => {
      process.env.NODE_ENV = env;
    });

    it('registers /sw.js for the whole app, with its updates never taken from the HTTP cache', () => {
      setSecure(true);
      const register = jest.fn(() => Promise.resolve());
      Object.defineProperty(navigator, 'serviceWorker', { value: { register }, configurable: true });
      registerServiceWorker();
      window.dispatchEvent(new Event('load'));
      expect(register).toHaveBeenCalledTimes(1);
      expect(register).toHaveBeenCalledWith('/sw.js', { scope: '/', updateViaCache: 'none' });
    });

    it('does not try on a plain-http shop address, where browsers refuse service workers', () => {
      setSecure(false);
      const register = jest.fn(() => Promise.resolve());
      Object.defineProperty(navigator, 'serviceWorker', { value: { register }, configurable: true });
      registerServiceWorker();
      window.dispatchEvent(new Event('load'));
      expect(register).not.toHaveBeenCalled();
    });
  });
});
