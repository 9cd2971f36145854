import {
  createContext,
  createElement,
  useCallback,
  useContext,
  useEffect,
  useLayoutEffect,
  useMemo,
  useRef,
  useState,
  type ReactNode,
} from 'react';
import type { Role, SessionUser, SignInResult } from '@/db/contracts';
import { safeInAppPath } from '@/components/navigation/pending-link';
import { configureApiClient } from '@/lib/api-client';
import { readJson, readJsonNow, removeKey, storageKeys, tabScoped, writeJson } from '@/lib/storage';
import { clearOfflineCaches } from '@/lib/service-worker';

/** The session as kept on the device (storageKeys.session). */
export type StoredSession = { token: string; expiresAt: string; user: SessionUser };

export type Session = {
  status: 'loading' | 'signed-out' | 'signed-in';
  user: SessionUser | null;
  token: string | null;
  expiresAt: string | null;
  /** Why the last session ended, when it was not the person's own choice. */
  endedBecause: string | null;
  signIn: (result: SignInResult) => Promise<void>;
  signOut: (reason?: string) => Promise<void>;
  /**
   * Where to go once signed in: the page a signed-out person opened (a mail's link, a scanned label).
   * Only a safe in-app path is ever kept; anything else is dropped.
   */
  pendingHref: string | null;
  setPendingHref: (href: string | null) => void;
  /** The pending path, forgotten as it is handed over, so that it opens once. */
  takePendingHref: () => string | null;
};

const SessionContext = createContext<Session | null>(null);

export function isLive(s: StoredSession | null): s is StoredSession {
  return !!s && !!s.token && !!s.user && new Date(s.expiresAt).getTime() > Date.now();
}

/**
 * `arrivalHref`: the page the app was opened at, if the sign-in guard hides it (read once, at start).
 * It becomes the pending path when no live session turns up.
 */
export function SessionProvider({
  children,
  arrivalHref = null,
}: {
  children: ReactNode;
  arrivalHref?: string | null;
}) {
  // On the web the stored session is read at once (localStorage): a person already signed in gets their
  // page on the first draw rather than after an "opening" one. Elsewhere (and signed out) the read below decides.
  const [initial] = useState(() => {
    const s = readJsonNow<StoredSession>(storageKeys.session);
    return isLive(s) ? s : null;
  });
  const [status, setStatus] = useState<Session['status']>(initial ? 'signed-in' : 'loading');
  const [stored, setStored] = useState<StoredSession | null>(initial);
  const [endedBecause, setEndedBecause] = useState<string | null>(null);
  const [pendingHref, setPendingState] = useState<string | null>(null);
  // The live session for the API client: its token, and whose it is (bench actions go only as their maker's).
  const liveRef = useRef<StoredSession | null>(initial);
  // False while the stored session is still being read (native): whose it is is not known yet.
  const knownRef = useRef(!!initial);
  // A ref as well as state: taking the path must see the latest value at once, not after a render.
  const pendingRef = useRef<string | null>(null);
  const arrivalRef = useRef(arrivalHref);

  const setPendingHref = useCallback((href: string | null) => {
    const safe = safeInAppPath(href);
    pendingRef.current = safe;
    setPendingState(safe);
    // Kept outside memory so a reload of the sign-in page still knows where the person was going.
    void (safe ? tabScoped.write(storageKeys.pendingLink, safe) : tabScoped.remove(storageKeys.pendingLink));
  }, []);

  const takePendingHref = useCallback(() => {
    const href = pendingRef.current;
    if (href) setPendingHref(null);
    return href;
  }, [setPendingHref]);

  const signOut = useCallback(
    async (reason?: string) => {
      liveRef.current = null;
      knownRef.current = true;
      setStored(null);
      setStatus('signed-out');
      setEndedBecause(reason ?? null);
      // A link followed by the last person is not the next person's business.
      setPendingHref(null);
      await removeKey(storageKeys.session);
      // Nothing one person's device cached (API answers kept for work without signal) may show to the next.
      await clearOfflineCaches();
    },
    [setPendingHref],
  );

  const signIn = useCallback(async (result: SignInResult) => {
    const next: StoredSession = { token: result.token, expiresAt: result.expiresAt, user: result.user };
    liveRef.current = next;
    knownRef.current = true;
    setStored(next);
    setEndedBecause(null);
    setStatus('signed-in');
    await writeJson(storageKeys.session, next);
  }, []);

  // Wired once the first render is committed, before any child can send a request: layout effects all
  // run before the first passive effect (where queries start) anywhere in the tree.
  useLayoutEffect(() => {
    configureApiClient({
      getToken: () => liveRef.current?.token ?? null,
      getPersonId: () => (knownRef.current ? (liveRef.current?.user.id ?? null) : undefined),
      onUnauthorized: () => {
        if (liveRef.current)
          void signOut(
            'You were signed out (the session ended, or was ended from another device). Please sign in again.',
          );
      },
    });
  }, [signOut]);

  useEffect(() => {
    let alive = true;
    Promise.all([readJson<StoredSession>(storageKeys.session), tabScoped.read(storageKeys.pendingLink)]).then(
      ([s, kept]) => {
        if (!alive) return;
        knownRef.current = true;
        if (isLive(s)) {
          liveRef.current = s;
          setStored(s);
          // Already signed in: the page opened shows as it is, and nothing waits for a sign-in.
          if (kept) setPendingHref(null);
          setStatus('signed-in');
        } else {
          // A page opened just now wins over one kept from before; a reload of the sign-in page keeps the old one.
          setPendingHref(arrivalRef.current ?? kept);
          setStatus('signed-out');
          if (s) {
            void removeKey(storageKeys.session);
            void clearOfflineCaches();
          }
        }
      },
    );
    return () => {
      alive = false;
    };
  }, [setPendingHref]);

  // End the session when the token expires rather than on the next refused request.
  useEffect(() => {
    if (!stored) return;
    const ms = new Date(stored.expiresAt).getTime() - Date.now();
    if (!Number.isFinite(ms)) return;
    const t = setTimeout(
      () => void signOut('Your session ran out. Please sign in again.'),
      Math.max(0, Math.min(ms, 2 ** 31 - 1)),
    );
    return () => clearTimeout(t);
  }, [stored, signOut]);

  const value = useMemo<Session>(
    () => ({
      status,
      user: stored?.user ?? null,
      token: stored?.token ?? null,
      expiresAt: stored?.expiresAt ?? null,
      endedBecause,
      signIn,
      signOut,
      pendingHref,
      setPendingHref,
      takePendingHref,
    }),
    [status, stored, endedBecause, signIn, signOut, pendingHref, setPendingHref, takePendingHref],
  );

  // The callbacks in `value` touch refs only when called; the same element written as JSX passes the rule.
  // eslint-disable-next-line react-hooks/refs -- createElement is JSX spelled as a call (this file is .ts)
  return createElement(SessionContext.Provider, { value }, children);
}

export function useSession(): Session {
  const s = useContext(SessionContext);
  if (!s) throw new Error('useSession must be used inside <SessionProvider>');
  return s;
}

export function useRole(): Role | null {
  return useSession().user?.role ?? null;
}
