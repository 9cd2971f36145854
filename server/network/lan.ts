import type { NetworkInterfaceInfo } from 'node:os';

/** Whether a URL points at the machine it is opened on: a phone opening it reaches itself, not us. */
export function isLoopbackUrl(url: string): boolean {
  let host: string;
  try {
    host = new URL(url).hostname.replace(/^\[|\]$/g, '').toLowerCase();
  } catch {
    return true;
  }
  return (
    host === 'localhost' ||
    host.endsWith('.localhost') ||
    /^127\.\d+\.\d+\.\d+$/.test(host) ||
    host === '::1' ||
    host === '0.0.0.0'
  );
}

const privateV4 = (a: string) => /^10\./.test(a) || /^192\.168\./.test(a) || /^172\.(1[6-9]|2\d|3[01])\./.test(a);

/**
 * The address phones on the shop's network reach this machine by: its first non-internal IPv4,
 * a private-range one (the usual shop router) before any other. Null when the machine has none.
 */
export function pickLanAddress(interfaces: NodeJS.Dict<NetworkInterfaceInfo[]>): string | null {
  const v4 = Object.values(interfaces)
    .flatMap((list) => list ?? [])
    .filter((i) => i.family === 'IPv4' && !i.internal)
    .map((i) => i.address);
  return v4.find(privateV4) ?? v4[0] ?? null;
}

/** Every name the certificate must carry: the LAN address, the machine's name, and loopback for the machine itself. */
export function certificateNames(
  lanAddress: string | null,
  hostname: string,
  publicUrl?: string,
): { dns: string[]; ips: string[] } {
  const publicHost = publicUrl ? new URL(publicUrl).hostname.replace(/^\[|\]$/g, '').toLowerCase() : null;
  const isIp = (h: string) => /^\d+\.\d+\.\d+\.\d+$/.test(h) || h.includes(':');
  const dns = [
    ...new Set(
      ['localhost', hostname.toLowerCase(), ...(publicHost && !isIp(publicHost) ? [publicHost] : [])].filter((h) =>
        /^[a-z0-9.-]+$/.test(h),
      ),
    ),
  ];
  const ips = [
    ...new Set([
      '127.0.0.1',
      ...(lanAddress ? [lanAddress] : []),
      ...(publicHost && isIp(publicHost) ? [publicHost] : []),
    ]),
  ];
  return { dns, ips };
}
