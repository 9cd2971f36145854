import { existsSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { startTestApp, type TestApp } from '../../helpers/test-app';

const webDist = path.join(__dirname, '..', '..', '..', 'dist');

/**
 * The test app serving the exported web app on a free loopback port, as a browser sees the product.
 * The port is taken first, so the links the app puts in labels and mails name it.
 */
export async function serveTestApp(): Promise<{ t: TestApp; base: string; close: () => Promise<void> }> {
  if (!existsSync(path.join(webDist, 'index.html'))) throw new Error('dist/ has no web export: run the tests with `npm test`, which exports the app first');
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const t = await startTestApp({ port, webDist });
  server.on('request', t.app);
  return {
    t,
    base: `http://localhost:${port}`,
    async close() {
      await new Promise((r) => server.close(r));
      await t.close();
    },
  };
}
