import { hiddenPageHref, safeInAppPath, signInMessage } from '@/components/navigation/pending-link';

describe('which opened links are kept for after sign-in', () => {
  it.each([
    ['/findings/abc', '/findings/abc'],
    ['/findings/3f1c9a2e-7b4d-4e8a-9c1f-2d5e6a7b8c9d', '/findings/3f1c9a2e-7b4d-4e8a-9c1f-2d5e6a7b8c9d'],
    ['/t/Qm9vLWJhcl9iYXo', '/t/Qm9vLWJhcl9iYXo'],
    ['/travelers/abc', '/travelers/abc'],
    ['/travelers/abc/flag', '/travelers/abc/flag'],
    ['/findings?status=open&q=U-07', '/findings?status=open&q=U-07'],
    ['/findings/abc#photo', '/findings/abc'],
    ['/catalogue/designs/a%20b', '/catalogue/designs/a%20b'],
  ])('keeps %s', (raw, kept) => {
    expect(safeInAppPath(raw)).toBe(kept);
  });

  it.each([
    ['a protocol-relative link to another site', '//evil.example'],
    ['a protocol-relative link with a path', '//evil.example/findings/abc'],
    ['an absolute link to another site', 'https://evil.example'],
    ['an absolute link to our own pages', 'http://localhost/findings/abc'],
    ['a script link', 'javascript:alert(1)'],
    ['a script link made to look like a path', ' /findings/abc'],
    ['a backslash read by browsers as a second slash', '/\\evil.example'],
    ['an escaped backslash', '/%5Cevil.example'],
    ['an escaped slash that would make a second slash', '/%2Fevil.example'],
    ['a tab inside the path', '/findings/\tabc'],
    ['a line break inside the path', '/findings/abc\n'],
    ['a carriage return in the query', '/findings?x=1\r\nSet-Cookie:a'],
    ['a null character', '/findings/\u0000abc'],
    ['an escaped control character', '/findings/%0Aabc'],
    ['a C1 control character', '/findings/\u0085abc'],
    ['a line separator', '/findings/\u2028abc'],
    ['a malformed escape', '/findings/%E0%A4%A'],
    ['a dot segment', '/findings/../admin'],
    ['an escaped dot segment', '/findings/%2E%2E/admin'],
    ['the sign-in page', '/sign-in'],
    ['the sign-in page with a query', '/sign-in?next=/findings/abc'],
    ['the sign-in page with a trailing slash', '/sign-in/'],
    ['the sign-in page named through its group', '/(auth)/sign-in'],
    ['the home page', '/'],
    ['the home page named through its group', '/(app)'],
    ['an empty string', ''],
    ['a relative path without a leading slash', 'findings/abc'],
    ['a path longer than any of ours', `/findings/${'a'.repeat(2000)}`],
  ])('refuses %s', (_why, raw) => {
    expect(safeInAppPath(raw)).toBeNull();
  });

  it.each([[null], [undefined], [42], [{ pathname: '/findings/abc' }], [['/findings/abc']]])(
    'refuses a value that is not text (%p)',
    (raw) => {
      expect(safeInAppPath(raw)).toBeNull();
    },
  );
});

describe('which page the sign-in guard hid when the app was opened', () => {
  it('keeps a finding in the signed-in group, without repeating its id in the query', () => {
    expect(
      hiddenPageHref({
        pathname: '/findings/abc',
        segments: ['(app)', 'findings', '[findingId]'],
        params: { findingId: 'abc' },
      }),
    ).toBe('/findings/abc');
  });

  it('keeps the query of a hidden page', () => {
    expect(
      hiddenPageHref({
        pathname: '/findings',
        segments: ['(app)', 'findings'],
        params: { status: 'open', tag: ['a', 'b'] },
      }),
    ).toBe('/findings?status=open&tag=a&tag=b');
  });

  it('escapes an id that would otherwise change the path', () => {
    expect(
      hiddenPageHref({
        pathname: '/travelers/a?b',
        segments: ['(app)', 'travelers', '[travelerId]'],
        params: { travelerId: 'a?b' },
      }),
    ).toBe('/travelers/a%3Fb');
  });

  it('ignores the router’s own bookkeeping', () => {
    expect(
      hiddenPageHref({
        pathname: '/builds/b1',
        segments: ['(app)', 'builds', '[buildId]'],
        params: { buildId: 'b1', __EXPO_ROUTER_key: 'x', '#': 'top' },
      }),
    ).toBe('/builds/b1');
  });

  it.each([
    ['the sign-in page', { pathname: '/sign-in', segments: ['(auth)', 'sign-in'], params: {} }],
    [
      'a scanned label, which is open to everyone and asks for sign-in itself',
      { pathname: '/t/abcd', segments: ['t', '[token]'], params: { token: 'abcd' } },
    ],
    ['the home page', { pathname: '/', segments: ['(app)'], params: {} }],
    ['a page that does not exist', { pathname: '/nowhere', segments: ['+not-found'], params: {} }],
  ])('keeps nothing for %s', (_why, route) => {
    expect(hiddenPageHref(route)).toBeNull();
  });
});

describe('what the sign-in screen says will open', () => {
  it.each([
    ['/t/Qm9vLWJhcl9iYXo', 'Sign in to open the part you scanned.'],
    ['/findings/abc', 'Sign in to open the finding you were sent.'],
    ['/travelers/abc', 'Sign in to open the part you were sent.'],
    ['/travelers/abc/flag', 'Sign in to open the part you were sent.'],
    ['/builds/b1/labels', 'Sign in to open the build you were sent.'],
    ['/studies/s1', 'Sign in to open the load study you were sent.'],
    ['/catalogue/designs/d1', 'Sign in to open the design you were sent.'],
    ['/studies/new', 'Sign in to go on to the page you opened.'],
    ['/findings', 'Sign in to go on to the page you opened.'],
    ['/coupons?kit=K1', 'Sign in to go on to the page you opened.'],
  ])('for %s: “%s”', (pending, message) => {
    expect(signInMessage(pending)).toBe(message);
  });

  it.each([[null], [undefined], ['//evil.example'], ['/sign-in'], ['/']])(
    'says nothing when no safe page waits (%p)',
    (pending) => {
      expect(signInMessage(pending)).toBeNull();
    },
  );
});
