// Shared with the service worker's build (scripts/build-offline.mjs), which names its caches from it.
import offline from './offline-caches.json';

/**
 * The service worker (made at build time by scripts/build-offline.mjs) keeps the app shell and the
 * bench's API answers on the phone, so Pitchcard opens without signal.
 *
 * Registered only in an exported production build: under `expo start` Metro serves bundles that
 * change on every edit and a cached shell would hide the edits, and under jest there is no browser.
 * Browsers allow service workers only in a secure context (https, or localhost on the same machine):
 * on a plain-http shop address the app still works, just not offline.
 */
export function registerServiceWorker(): void {
  if (process.env.NODE_ENV !== 'production') return;
  if (typeof window === 'undefined' || typeof navigator === 'undefined') return;
  if (!window.isSecureContext || !('serviceWorker' in navigator)) return;
  const register = () => {
    // updateViaCache 'none': the browser asks the server for sw.js itself on every update check rather
    // than trusting its HTTP cache, so a new build reaches the phone on its next load.
    navigator.serviceWorker
      .register(offline.serviceWorker, { scope: '/', updateViaCache: 'none' })
      .catch((e: unknown) => {
        // The app works without it (only not offline): say why in the console and carry on.
        console.warn('Pitchcard could not install its offline copy:', e);
      });
  };
  // After the page has loaded, so that installing (downloading the whole shell) does not compete with
  // the first screen for a weak signal.
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
}

/**
 * Empties the caches that hold a person's data (API answers and photos), keeping the app shell. Call it
 * when a person signs out. It works without signal (the caches are on the device) and never throws: a
 * browser without Cache Storage has nothing to clear.
 */
export async function clearOfflineCaches(): Promise<void> {
  if (typeof caches === 'undefined') return;
  const ours = [offline.api, offline.photos];
  try {
    const names = await caches.keys();
    await Promise.all(names.filter((n) => ours.includes(n)).map((n) => caches.delete(n)));
  } catch {
    // Storage refused (private mode, quota): nothing was kept there to leak either.
  }
}
