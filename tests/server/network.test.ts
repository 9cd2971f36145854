import { X509Certificate } from 'node:crypto';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { request as httpsRequest } from 'node:https';
import { createServer as createHttpsServer, type Server } from 'node:https';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { loadConfig } from '@/server/config';
import { certificateNames, isLoopbackUrl, pickLanAddress } from '@/server/network/lan';
import { loadOrMakeCertificate } from '@/server/network/tls';
import { auth, demoApp, startTestApp, type TestApp, type Tokens } from '../helpers/test-app';

jest.setTimeout(60000);

const iface = (address: string, internal = false) => ({
  address,
  family: 'IPv4' as const,
  internal,
  netmask: '255.255.255.0',
  mac: '00:00:00:00:00:00',
  cidr: null,
});
const base = { DATABASE_URL: 'postgres://x@127.0.0.1/x', JWT_SECRET: 'a-test-secret-long-enough' };
const env = (e: Record<string, string>) => e as unknown as NodeJS.ProcessEnv;

/** The labels of the supplier's first build, as the supplier asks for them. */
async function firstBuildLabels(t: TestApp, supplier: string) {
  const buildId = (await request(t.app).get('/api/builds').set(auth(supplier))).body.items[0].id;
  return request(t.app).get(`/api/travelers/labels?buildId=${buildId}`).set(auth(supplier));
}

describe('the address phones reach', () => {
  it.each([
    ['http://localhost:8080', true],
    ['http://127.0.0.1:8080', true],
    ['http://127.9.9.9', true],
    ['http://[::1]:8080', true],
    ['http://app.localhost', true],
    ['http://0.0.0.0:8080', true],
    ['not a url', true],
    ['https://192.168.1.20:8080', false],
    ['https://shop-pc.lan', false],
    ['http://pitchcard.test:1234', false],
  ])('%s is loopback: %s', (url, loop) => expect(isLoopbackUrl(url)).toBe(loop));

  it('picks the first private-range IPv4 that is not internal, else any other, else none', () => {
    expect(
      pickLanAddress({ lo: [iface('127.0.0.1', true)], eth0: [iface('203.0.113.9')], wlan0: [iface('192.168.4.31')] }),
    ).toBe('192.168.4.31');
    expect(pickLanAddress({ lo: [iface('127.0.0.1', true)], eth0: [iface('203.0.113.9')] })).toBe('203.0.113.9');
    expect(pickLanAddress({ lo: [iface('127.0.0.1', true)] })).toBeNull();
  });

  it('in network mode listens on every interface, speaks HTTPS and puts the LAN address in links; plain mode stays on loopback', () => {
    const machine = {
      interfaces: { lo: [iface('127.0.0.1', true)], wlan0: [iface('192.168.4.31')] },
      hostname: 'Shop-PC',
    };
    const lan = loadConfig(env({ ...base, LAN: '1', PORT: '8443' }), machine);
    expect(lan).toMatchObject({
      host: '0.0.0.0',
      publicUrl: 'https://192.168.4.31:8443',
      network: { lan: true, lanAddress: '192.168.4.31' },
    });
    expect(lan.network.tls?.names).toEqual({ dns: ['localhost', 'shop-pc'], ips: ['127.0.0.1', '192.168.4.31'] });
    const plain = loadConfig(env({ ...base }), machine);
    expect(plain).toMatchObject({
      host: '127.0.0.1',
      publicUrl: 'http://localhost:8080',
      network: { lan: false, tls: null },
    });
    expect(() =>
      loadConfig(env({ ...base, LAN: '1' }), { interfaces: { lo: [iface('127.0.0.1', true)] }, hostname: 'x' }),
    ).toThrow(/no network address/);
    expect(() => loadConfig(env({ ...base, TLS_CERT: '/x.pem' }), machine)).toThrow(/TLS_KEY/);
  });

  it('names the public host in the certificate when the shop gives one', () => {
    expect(certificateNames(null, 'pc', 'https://bench.shop.example:8443')).toEqual({
      dns: ['localhost', 'pc', 'bench.shop.example'],
      ips: ['127.0.0.1'],
    });
  });
});

describe('the certificate made on first start', () => {
  it('covers the machine’s names, keeps its key private, is kept across starts and made again for a new address', async () => {
    const dir = await mkdtemp(path.join(os.tmpdir(), 'pc-tls-test-'));
    try {
      const names = { dns: ['localhost', 'shop-pc'], ips: ['127.0.0.1', '192.168.4.31'] };
      const first = await loadOrMakeCertificate({ dir, names });
      expect(first.made).toBe(true);
      const alt = new X509Certificate(first.cert).subjectAltName!;
      for (const n of ['DNS:localhost', 'DNS:shop-pc', 'IP Address:127.0.0.1', 'IP Address:192.168.4.31'])
        expect(alt).toContain(n);
      expect((await stat(path.join(dir, 'key.pem'))).mode & 0o777).toBe(0o600);
      // Phones refuse server certificates valid much over a year (common practice: 398 days at most).
      const days = (Date.parse(new X509Certificate(first.cert).validTo) - Date.now()) / 86400_000;
      expect(days).toBeLessThanOrEqual(398);
      const again = await loadOrMakeCertificate({ dir, names });
      expect([again.made, again.fingerprint]).toEqual([false, first.fingerprint]);
      const moved = await loadOrMakeCertificate({ dir, names: { ...names, ips: ['127.0.0.1', '10.0.0.7'] } });
      expect(moved.made).toBe(true);
      expect(moved.fingerprint).not.toBe(first.fingerprint);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

describe('network mode served', () => {
  let t: TestApp;
  let server: Server;
  let port: number;
  let dir: string;
  let cert: string;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(os.tmpdir(), 'pc-lan-'));
    // The LAN address is given, not read from this machine: nothing is ever sent to it.
    const tls = await loadOrMakeCertificate({ dir, names: { dns: ['localhost'], ips: ['127.0.0.1', '192.0.2.44'] } });
    cert = tls.cert;
    server = createHttpsServer({ key: tls.key, cert: tls.cert });
    // Every interface, as network mode listens; the test itself talks to 127.0.0.1 only.
    await new Promise<void>((resolve) => server.listen(0, '0.0.0.0', resolve));
    port = (server.address() as AddressInfo).port;
    t = await startTestApp({ port, env: { PUBLIC_URL: `https://192.0.2.44:${port}` } });
    server.on('request', t.app);
    (t.ctx as { tls: unknown }).tls = tls;
  });
  afterAll(async () => {
    await new Promise((r) => server?.close(r));
    await t?.close();
    await rm(dir, { recursive: true, force: true });
  });

  it('answers HTTPS with the generated certificate, verified against it, at 127.0.0.1', async () => {
    const body = await new Promise<string>((resolve, reject) => {
      const req = httpsRequest({ host: '127.0.0.1', port, path: '/api/health', ca: cert }, (res) => {
        let s = '';
        res.on('data', (c) => {
          s += c;
        });
        res.on('end', () => resolve(s));
      });
      req.on('error', reject);
      req.end();
    });
    expect(JSON.parse(body)).toEqual({ ok: true });
  });

  it('puts the public address it was given in labels and on the phone setup page, with the certificate to trust', async () => {
    const tok = await t.tokens();
    const labels = await firstBuildLabels(t, tok.supplier);
    expect(labels.body[0].url).toMatch(new RegExp(`^https://192\\.0\\.2\\.44:${port}/t/`));
    const setup = await request(t.app).get('/api/network').set(auth(tok.admin));
    expect(setup.body).toMatchObject({
      publicUrl: `https://192.0.2.44:${port}`,
      loopback: false,
      https: true,
      certificate: { downloadUrl: '/api/network/certificate' },
    });
    expect(setup.body.qrDataUrl).toMatch(/^data:image\/png;base64,/);
    const pem = await request(t.app).get('/api/network/certificate');
    expect(pem.text).toBe(cert);
    expect((await request(t.app).get('/api/network').set(auth(tok.builder))).status).toBe(403);
  });
});

describe('a loopback public address', () => {
  let t: TestApp;
  let tok: Tokens;
  demoApp((s) => ({ t, tok } = s), { env: { PUBLIC_URL: 'http://localhost:8080' } });

  it('refuses to print labels, saying how to set the address', async () => {
    const res = await firstBuildLabels(t, tok.supplier);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/npm start -- --lan|PUBLIC_URL/);
    expect((await request(t.app).get('/api/network').set(auth(tok.supplier))).body).toMatchObject({
      loopback: true,
      https: false,
      certificate: null,
    });
  });
});

describe('the server started in network mode', () => {
  it('listens on every interface with HTTPS from a certificate it makes, and computes its public address', async () => {
    const { spawn } = await import('node:child_process');
    const { readFile } = await import('node:fs/promises');
    const { createTestDatabase } = await import('../helpers/test-database');
    const db = await createTestDatabase();
    const dir = await mkdtemp(path.join(os.tmpdir(), 'pc-lan-start-'));
    const probe = createHttpsServer();
    await new Promise<void>((r) => probe.listen(0, '127.0.0.1', r));
    const port = (probe.address() as AddressInfo).port;
    await new Promise((r) => probe.close(r));
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: path.join(__dirname, '..', '..'),
      env: {
        ...process.env,
        NODE_ENV: 'test',
        LAN: '1',
        LAN_ADDRESS: '192.0.2.44',
        PORT: String(port),
        DATABASE_URL: db.url,
        JWT_SECRET: 'a-test-secret-long-enough-for-this',
        TLS_DIR: dir,
        SMTP_FAKE: '0',
        SEED_DEMO: '0',
        UPLOADS_DIR: dir,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (c) => {
      out += c;
    });
    child.stderr.on('data', (c) => {
      out += c;
    });
    try {
      const end = Date.now() + 30000;
      while (!/Pitchcard is up/.test(out)) {
        if (Date.now() > end || child.exitCode !== null) throw new Error(`the server did not start: ${out}`);
        await new Promise((r) => setTimeout(r, 100));
      }
      expect(out).toContain(`Pitchcard is up at https://192.0.2.44:${port}`);
      const cert = await readFile(path.join(dir, 'cert.pem'), 'utf8');
      expect(new X509Certificate(cert).subjectAltName).toContain('IP Address:192.0.2.44');
      const health = await new Promise<number>((resolve, reject) => {
        const req = httpsRequest({ host: '127.0.0.1', port, path: '/api/health', ca: cert }, (res) => {
          res.resume();
          resolve(res.statusCode ?? 0);
        });
        req.on('error', reject);
        req.end();
      });
      expect(health).toBe(200);
    } finally {
      child.kill('SIGTERM');
      await new Promise((r) => (child.exitCode !== null ? r(null) : child.once('exit', r)));
      await db.drop();
      await rm(dir, { recursive: true, force: true });
    }
  });
});
