import { BoundedMap } from '@/server/bounded-map';
import { createUrlSigner } from '@/server/photos/url-signer';

describe('a bounded map', () => {
  it('never holds more than its bound, dropping the oldest entry first', () => {
    const m = new BoundedMap<number, string>(3);
    for (let i = 0; i < 10; i++) m.set(i, String(i));
    expect(m.size).toBe(3);
    expect([...m.keys()]).toEqual([7, 8, 9]);
  });

  it('makes a key set again the newest, so the next to go is another', () => {
    const m = new BoundedMap<string, number>(2);
    m.set('a', 1).set('b', 2).set('a', 3).set('c', 4);
    expect([...m.entries()]).toEqual([
      ['a', 3],
      ['c', 4],
    ]);
  });

  it('refuses a bound that holds nothing', () => {
    expect(() => new BoundedMap(0)).toThrow(/at least one entry/);
    expect(() => new BoundedMap(1.5)).toThrow(/at least one entry/);
  });
});

describe('signed photo links', () => {
  const signer = createUrlSigner('a test secret of enough length for the signer');
  const parts = (url: string) => {
    const u = new URL(url, 'http://127.0.0.1');
    const [, , , photoId, variant] = u.pathname.split('/');
    return [
      photoId,
      variant,
      u.searchParams.get('u')!,
      u.searchParams.get('exp')!,
      u.searchParams.get('sig')!,
    ] as const;
  };

  it('signs the same link twice within the hour, and the link verifies', () => {
    const a = signer.sign('p1', 'thumb', 'viewer-1');
    expect(signer.sign('p1', 'thumb', 'viewer-1')).toBe(a);
    expect(signer.verify(...parts(a))).toBe(true);
  });

  it('refuses a link changed in any part, or verified by another secret', () => {
    const [photoId, variant, viewer, exp, sig] = parts(signer.sign('p2', 'full', 'viewer-1'));
    expect(signer.verify('p3', variant, viewer, exp, sig)).toBe(false);
    expect(signer.verify(photoId, 'thumb', viewer, exp, sig)).toBe(false);
    expect(signer.verify(photoId, variant, 'viewer-2', exp, sig)).toBe(false);
    expect(signer.verify(photoId, variant, viewer, String(Number(exp) + 3600), sig)).toBe(false);
    expect(
      createUrlSigner('another secret of enough length for a signer').verify(photoId, variant, viewer, exp, sig),
    ).toBe(false);
  });

  it('refuses a link whose hour has passed, though its signature is right', () => {
    const [photoId, variant, viewer, exp, sig] = parts(signer.sign('p4', 'thumb', 'viewer-1', -7200));
    expect(Number(exp)).toBeLessThan(Date.now() / 1000);
    expect(signer.verify(photoId, variant, viewer, exp, sig)).toBe(false);
  });
});
