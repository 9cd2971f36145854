/**
 * Native builds have no service worker: the app is on the phone already, and the query client keeps
 * bench actions made without signal (paused, persisted) until the server has them. These are the same calls as
 * lib/service-worker.web.ts, doing nothing.
 */
export function registerServiceWorker(): void {}

export async function clearOfflineCaches(): Promise<void> {}
