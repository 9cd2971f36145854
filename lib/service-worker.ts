/**
 * Native builds have no service worker: the app is on the phone already, and the tick outbox keeps
 * work made without signal. These are the same calls as lib/service-worker.web.ts, doing nothing.
 */
export function registerServiceWorker(): void {}

export async function clearOfflineCaches(): Promise<void> {}
