import { X509Certificate } from 'node:crypto';
import { chmod, mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { generate } from 'selfsigned';

export type TlsMaterial = {
  key: string;
  cert: string;
  fingerprint: string;
  names: { dns: string[]; ips: string[] };
  made: boolean;
};

/** The names a certificate covers, read back from it. */
function namesIn(certPem: string): { dns: string[]; ips: string[] } {
  const alt = new X509Certificate(certPem).subjectAltName ?? '';
  const parts = alt.split(',').map((s) => s.trim());
  return {
    dns: parts.filter((p) => p.startsWith('DNS:')).map((p) => p.slice(4)),
    ips: parts.filter((p) => p.startsWith('IP Address:')).map((p) => p.slice(11)),
  };
}

const fingerprintOf = (certPem: string) => new X509Certificate(certPem).fingerprint256;

/**
 * The shop's own certificate when it supplies one; otherwise one made on first start and kept in `dir`,
 * made again only when it no longer covers the machine's names (the shop's network handed out a new
 * address) or is about to run out. The key file is readable by us only.
 */
export async function loadOrMakeCertificate(opts: {
  dir: string;
  names: { dns: string[]; ips: string[] };
  certFile?: string;
  keyFile?: string;
  now?: Date;
}): Promise<TlsMaterial> {
  if (opts.certFile && opts.keyFile) {
    const [cert, key] = await Promise.all([readFile(opts.certFile, 'utf8'), readFile(opts.keyFile, 'utf8')]);
    return { cert, key, fingerprint: fingerprintOf(cert), names: namesIn(cert), made: false };
  }
  const certPath = path.join(opts.dir, 'cert.pem');
  const keyPath = path.join(opts.dir, 'key.pem');
  const now = opts.now ?? new Date();
  try {
    const [cert, key] = await Promise.all([readFile(certPath, 'utf8'), readFile(keyPath, 'utf8')]);
    const have = namesIn(cert);
    const covers =
      opts.names.dns.every((d) => have.dns.includes(d)) && opts.names.ips.every((i) => have.ips.includes(i));
    const lasts = new Date(new X509Certificate(cert).validTo).getTime() - now.getTime() > 30 * 86400_000;
    if (covers && lasts) return { cert, key, fingerprint: fingerprintOf(cert), names: have, made: false };
  } catch {
    // none yet, or unreadable: make one below
  }
  const made = await generate(
    [
      { name: 'commonName', value: opts.names.ips.at(-1) ?? 'localhost' },
      { name: 'organizationName', value: 'Pitchcard on this machine' },
    ],
    {
      keyType: 'ec',
      curve: 'P-256',
      algorithm: 'sha256',
      notBeforeDate: new Date(now.getTime() - 86400_000),
      // Phones refuse server certificates valid for much over a year (common practice: 398 days at most).
      notAfterDate: new Date(now.getTime() + 397 * 86400_000),
      extensions: [
        { name: 'basicConstraints', cA: false },
        { name: 'keyUsage', digitalSignature: true, keyEncipherment: true, critical: true },
        { name: 'extKeyUsage', serverAuth: true },
        {
          name: 'subjectAltName',
          altNames: [
            ...opts.names.dns.map((value) => ({ type: 2 as const, value })),
            ...opts.names.ips.map((ip) => ({ type: 7 as const, ip })),
          ],
        },
      ],
    },
  );
  await mkdir(opts.dir, { recursive: true, mode: 0o700 });
  await writeFile(keyPath, made.private, { mode: 0o600 });
  await chmod(keyPath, 0o600);
  await writeFile(certPath, made.cert, { mode: 0o644 });
  return {
    cert: made.cert,
    key: made.private,
    fingerprint: fingerprintOf(made.cert),
    names: namesIn(made.cert),
    made: true,
  };
}
