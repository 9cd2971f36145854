import { createContext, createElement, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { Role, SessionUser, SignInResult } from '@/db/contracts';
import { configureApiClient } from './api-client';
import { readJson, removeKey, storageKeys, writeJson } from './storage';

type Stored = { token: string; expiresAt: string; user: SessionUser };

export type Session = {
  status: 'loading' | 'signed-out' | 'signed-in';
  user: SessionUser | null;
  token: string | null;
  expiresAt: string | null;
  /** Why the last session ended, when it was not the person's own choice. */
  endedBecause: string | null;
  signIn: (result: SignInResult) => Promise<void>;
  signOut: (reason?: string) => Promise<void>;
  /** Where to go once signed in (a scanned label opened before signing in). */
  pendingHref: string | null;
  setPendingHref: (href: string | null) => void;
};

const SessionContext = createContext<Session | null>(null);

function isLive(s: Stored | null): s is Stored {
  return !!s && !!s.token && !!s.user && new Date(s.expiresAt).getTime() > Date.now();
}

export function SessionProvider({ children }: { children: ReactNode }) {
  const [status, setStatus] = useState<Session['status']>('loading');
  const [stored, setStored] = useState<Stored | null>(null);
  const [endedBecause, setEndedBecause] = useState<string | null>(null);
  const [pendingHref, setPendingHref] = useState<string | null>(null);
  const tokenRef = useRef<string | null>(null);

  const signOut = useCallback(async (reason?: string) => {
    tokenRef.current = null;
    setStored(null);
    setStatus('signed-out');
    setEndedBecause(reason ?? null);
    await removeKey(storageKeys.session);
  }, []);

  const signIn = useCallback(async (result: SignInResult) => {
    const next: Stored = { token: result.token, expiresAt: result.expiresAt, user: result.user };
    tokenRef.current = next.token;
    setStored(next);
    setEndedBecause(null);
    setStatus('signed-in');
    await writeJson(storageKeys.session, next);
  }, []);

  // Wired during the first render, before any child can send a request.
  const wired = useRef(false);
  if (!wired.current) {
    wired.current = true;
    configureApiClient({
      getToken: () => tokenRef.current,
      onUnauthorized: () => {
        if (tokenRef.current) void signOut('Your session ran out. Please sign in again.');
      },
    });
  }

  useEffect(() => {
    let alive = true;
    readJson<Stored>(storageKeys.session).then((s) => {
      if (!alive) return;
      if (isLive(s)) {
        tokenRef.current = s.token;
        setStored(s);
        setStatus('signed-in');
      } else {
        setStatus('signed-out');
        if (s) void removeKey(storageKeys.session);
      }
    });
    return () => { alive = false; };
  }, []);

  // End the session when the token expires rather than on the next refused request.
  useEffect(() => {
    if (!stored) return;
    const ms = new Date(stored.expiresAt).getTime() - Date.now();
    if (!Number.isFinite(ms)) return;
    const t = setTimeout(() => void signOut('Your session ran out. Please sign in again.'), Math.max(0, Math.min(ms, 2 ** 31 - 1)));
    return () => clearTimeout(t);
  }, [stored, signOut]);

  const value = useMemo<Session>(() => ({
    status,
    user: stored?.user ?? null,
    token: stored?.token ?? null,
    expiresAt: stored?.expiresAt ?? null,
    endedBecause,
    signIn,
    signOut,
    pendingHref,
    setPendingHref,
  }), [status, stored, endedBecause, signIn, signOut, pendingHref]);

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
