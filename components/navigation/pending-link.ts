/**
 * The link a signed-out person followed (a QR label, a mail), kept until they have signed in.
 * Pure: no router, no storage, so the rules can be tested as a table.
 *
 * The path is later handed to the router, so anything that could leave our origin or confuse it is
 * refused here, not patched: an absolute URL, a protocol-relative `//host`, a backslash (browsers read
 * `/\host` as `//host`), dot segments, control characters, malformed escapes.
 */

// Long enough for any of our paths with a query; short enough that storage and logs stay sane.
const maxLength = 2000;

// C0 and C1 controls, DEL, and the Unicode line and paragraph separators.
const controlChars = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;
// As written in the link: no controls, no blanks (a real one arrives escaped) and no backslash.
const forbiddenRaw = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\s\\]/;

/** `(app)` and the like: route groups organise files and name no page of their own. */
const isGroup = (segment: string) => /^\(.*\)$/.test(segment);

function decodeSegment(segment: string): string | null {
  try {
    return decodeURIComponent(segment);
  } catch {
    return null;
  }
}

/** The page-naming segments of a path (without query, groups or empty parts), or null if any is unsafe. */
function pageSegments(pathPart: string): string[] | null {
  const out: string[] = [];
  for (const raw of pathPart.split('/').slice(1)) {
    const segment = decodeSegment(raw);
    // An escaped slash or backslash would make one segment read as two once decoded; an escaped
    // control character is still one.
    if (segment === null || controlChars.test(segment) || segment.includes('/') || segment.includes('\\')) return null;
    if (segment === '.' || segment === '..') return null;
    if (segment === '' || isGroup(segment)) continue;
    out.push(segment);
  }
  return out;
}

/**
 * The path and query to open after sign-in, or null when it is not one of our own pages worth
 * coming back to. The fragment is dropped: no screen of ours reads it.
 */
export function safeInAppPath(raw: unknown): string | null {
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > maxLength) return null;
  if (raw[0] !== '/' || raw[1] === '/') return null;
  if (forbiddenRaw.test(raw)) return null;
  const withoutFragment = raw.split('#')[0];
  const queryAt = withoutFragment.indexOf('?');
  const pathPart = queryAt === -1 ? withoutFragment : withoutFragment.slice(0, queryAt);
  const segments = pageSegments(pathPart);
  if (!segments) return null;
  // The home page picks the role's own first tab anyway, and the sign-in page is where the person already is.
  if (segments.length === 0) return null;
  if (segments.length === 1 && segments[0].toLowerCase() === 'sign-in') return null;
  return withoutFragment;
}

/** `[findingId]` or `[...rest]`: the names of the route's path parameters. */
function dynamicNames(segments: readonly string[]): Set<string> {
  const names = new Set<string>();
  for (const s of segments) {
    const m = /^\[(?:\.\.\.)?(.+)\]$/.exec(s);
    if (m) names.add(m[1]);
  }
  return names;
}

export type RouteSnapshot = {
  /** As `usePathname()` gives it: `/findings/abc`. */
  pathname: string;
  /** As `useSegments()` gives it: `['(app)', 'findings', '[findingId]']`. */
  segments: readonly string[];
  /** As `useGlobalSearchParams()` gives it: path parameters and query together. */
  params: Readonly<Record<string, string | string[] | undefined>>;
};

/**
 * The path and query of the page a signed-out person tried to open, when the sign-in guard hid it
 * (it lies in the `(app)` group); null otherwise. Pages open to everyone show themselves and need
 * no remembering.
 */
export function hiddenPageHref(route: RouteSnapshot): string | null {
  if (route.segments[0] !== '(app)') return null;
  // Re-escape each segment so a decoded space or `?` in an id cannot change the path's meaning.
  const pathSegments = route.pathname.split('/').map((s) => encodeURIComponent(decodeSegment(s) ?? s));
  const path = pathSegments.join('/');
  const fromPath = dynamicNames(route.segments);
  const query: string[] = [];
  for (const [key, value] of Object.entries(route.params)) {
    // Path parameters are already in the path; `#` and `__…` are the router's own bookkeeping.
    if (fromPath.has(key) || key === '#' || key.startsWith('__') || value === undefined) continue;
    for (const v of Array.isArray(value) ? value : [value])
      query.push(`${encodeURIComponent(key)}=${encodeURIComponent(v)}`);
  }
  return safeInAppPath(query.length ? `${path}?${query.join('&')}` : path);
}

/** What the sign-in screen says will open once the person is in; null when nothing is waiting. */
export function signInMessage(pending: string | null | undefined): string | null {
  const safe = safeInAppPath(pending);
  if (!safe) return null;
  const [first, second, third] = pageSegments(safe.split('?')[0]) ?? [];
  const named = (s: string | undefined) => !!s && s !== 'new';
  if (first === 't' && second) return 'Sign in to open the part you scanned.';
  if (first === 'findings' && named(second)) return 'Sign in to open the finding you were sent.';
  if (first === 'travelers' && named(second)) return 'Sign in to open the part you were sent.';
  if (first === 'builds' && named(second)) return 'Sign in to open the build you were sent.';
  if (first === 'studies' && named(second)) return 'Sign in to open the load study you were sent.';
  if (first === 'catalogue' && second === 'designs' && named(third)) return 'Sign in to open the design you were sent.';
  return 'Sign in to go on to the page you opened.';
}
