import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { DefaultTheme, Stack, ThemeProvider } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { colors } from '@/constants/theme';
import { useArrivalHref } from '@/components/navigation/use-arrival-href';
import { usePreloadArrival } from '@/components/navigation/preload-arrival';
import { LoadingState } from '@/components/ui/states';
import { afterRestore, clearForNextPerson, makeQueryClient, persistOptions } from '@/lib/query-client';
import { resumeKeptFor } from '@/hooks/queries/bench-actions';
import { SessionProvider, useSession } from '@/hooks/use-session';
import { UnitsProvider } from '@/hooks/use-units';
import { useAppFonts } from '@/lib/app-fonts';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

const navTheme = {
  ...DefaultTheme,
  colors: {
    ...DefaultTheme.colors,
    background: colors.paper,
    card: colors.paper,
    text: colors.ink,
    border: colors.rule,
    primary: colors.accent,
  },
};

export default function RootLayout() {
  // The app's faces (lib/app-fonts.ts; on the web the page declares them): text shows at once in the
  // fallback face and switches when they load.
  useAppFonts();
  const [queryClient] = useState(makeQueryClient);
  // Set-aside actions go back into the queue once the kept queue is restored (one kept in both goes once).
  const [restored] = useState(() => {
    let done = () => {};
    const promise = new Promise<void>((resolve) => (done = resolve));
    return { promise, done };
  });
  const resumeKept = useCallback(
    (personId: string) => void restored.promise.then(() => resumeKeptFor(queryClient, personId)),
    [queryClient, restored],
  );
  // Bench actions made without signal (ticks, steps, work) are kept on the device by TanStack Query's persister and sent after a reload.
  return (
    <PersistQueryClientProvider
      client={queryClient}
      persistOptions={persistOptions()}
      onSuccess={() => afterRestore(queryClient).finally(restored.done)}
      onError={restored.done}
    >
      <SessionWithArrival>
        <UnitsProvider>
          <ThemeProvider value={navTheme}>
            <StatusBar style="dark" />
            <Guarded onSignedOut={() => clearForNextPerson(queryClient)} onSignedIn={resumeKept} />
          </ThemeProvider>
        </UnitsProvider>
      </SessionWithArrival>
    </PersistQueryClientProvider>
  );
}

/**
 * The session, told which hidden page the app was opened at. A component of its own because the route
 * hooks re-render it on every navigation; its children are the same elements each time, so nothing below
 * re-renders with it.
 */
function SessionWithArrival({ children }: { children: ReactNode }) {
  const arrivalHref = useArrivalHref();
  return <SessionProvider arrivalHref={arrivalHref}>{children}</SessionProvider>;
}

function Guarded({ onSignedOut, onSignedIn }: { onSignedOut: () => void; onSignedIn: (personId: string) => void }) {
  const { status, user } = useSession();
  usePreloadArrival(status);
  // Nothing cached for one person may show to the next: cleared when a session ends. Not when the app
  // starts signed out: nothing is cached yet, and clearing then would cancel the first request of a page
  // open to everyone (an invitation, a password reset) while it is on its way, leaving it waiting forever.
  const hadSession = useRef(false);
  useEffect(() => {
    if (status === 'signed-in') hadSession.current = true;
    if (status === 'signed-out' && hadSession.current) {
      hadSession.current = false;
      onSignedOut();
    }
  }, [status, user?.id, onSignedOut]);
  // What this person left unsent at an earlier sign-out on this device goes back into the queue.
  const personId = status === 'signed-in' ? (user?.id ?? null) : null;
  useEffect(() => {
    if (personId) onSignedIn(personId);
  }, [personId, onSignedIn]);

  if (status === 'loading') {
    return (
      <View style={{ flex: 1, backgroundColor: colors.paper, justifyContent: 'center' }}>
        <LoadingState what="Opening Pitchcard" />
      </View>
    );
  }
  const signedIn = status === 'signed-in';
  return (
    <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.paper } }}>
      <Stack.Protected guard={signedIn}>
        <Stack.Screen name="(app)" />
      </Stack.Protected>
      <Stack.Protected guard={!signedIn}>
        <Stack.Screen name="(auth)" />
      </Stack.Protected>
      {/* Open signed in or out: a scanned label, and the one-time links of an invitation and a password reset. */}
      <Stack.Screen name="t/[token]" />
      <Stack.Screen name="invite/[token]" />
      <Stack.Screen name="reset/[token]" />
      <Stack.Screen name="dev/mail" />
      <Stack.Screen name="+not-found" />
    </Stack>
  );
}
