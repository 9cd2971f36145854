import { existsSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { createServer as createHttpsServer } from 'node:https';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { loadOrMakeCertificate, type TlsMaterial } from '@/server/network/tls';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../../helpers/test-app';
import { launchBrowser } from './browser';

/** The web export the tests serve: dist/ (as `npm test` makes it), or another export named by E2E_WEB_DIST. */
export const webDist = process.env.E2E_WEB_DIST
  ? path.resolve(process.env.E2E_WEB_DIST)
  : path.join(__dirname, '..', '..', '..', 'dist');

/**
 * The test app serving the exported web app on a free loopback port, as a browser sees the product.
 * The port is taken first, so the links the app puts in labels and mails name it. With `https`, it
 * serves as network mode does — a certificate made for the public name (mapped to 127.0.0.1 in the
 * browser) — while listening on loopback only, so no traffic leaves this machine.
 */
export async function serveTestApp(
  opts: { https?: boolean } = {},
): Promise<{ t: TestApp; base: string; tls: TlsMaterial | null; close: () => Promise<void> }> {
  if (!existsSync(path.join(webDist, 'index.html')))
    throw new Error('dist/ has no web export: run the tests with `npm test`, which exports the app first');
  const tls = opts.https
    ? await loadOrMakeCertificate({
        dir: path.join(os.tmpdir(), `pc-tls-${process.pid}`),
        names: { dns: ['localhost', 'pitchcard.test'], ips: ['127.0.0.1'] },
      })
    : null;
  const server: Server = tls ? createHttpsServer({ key: tls.key, cert: tls.cert }) : createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const t = await startTestApp({
    port,
    webDist,
    ...(tls ? { env: { PUBLIC_URL: `https://pitchcard.test:${port}` } } : {}),
  });
  server.on('request', t.app);
  return {
    t,
    tls,
    base: tls ? `https://pitchcard.test:${port}` : `http://localhost:${port}`,
    async close() {
      await new Promise((r) => server.close(r));
      await t.close();
    },
  };
}

/**
 * For a browser test file: the served app (demo seeded) and one browser, opened before its tests and
 * closed after them; `take` receives them once both are up (set the file's own variables there).
 */
export function servedWithBrowser(take: (s: { t: TestApp; base: string; browser: Browser }) => void) {
  let browser: Browser | undefined;
  let close: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    const served = await serveTestApp();
    close = served.close;
    browser = await launchBrowser();
    take({ t: served.t, base: served.base, browser });
  });
  afterAll(async () => {
    await browser?.close().catch(() => undefined);
    await close?.();
  });
}
