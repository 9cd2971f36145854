import AsyncStorage from '@react-native-async-storage/async-storage';
import { Platform } from 'react-native';

/** Every key the app keeps on the device, in one place so none collide. */
export const storageKeys = {
  session: 'pitchcard.session',
  units: 'pitchcard.units',
  /** A finding not sent yet, the person's own: the next person on this phone neither sees it nor sends it as theirs. */
  findingDraft: (personId: string | null, travelerId: string) =>
    personId ? `pitchcard.finding-draft.${personId}.${travelerId}` : `pitchcard.finding-draft.${travelerId}`,
  /** TanStack Query's persisted client: bench actions not yet through to the server (lib/query-client.ts). */
  queryCache: 'pitchcard.query-cache',
  /** Bench actions set aside for a person who signed out before they were sent (hooks/queries/bench-actions.ts). */
  keptFor: (personId: string) => `pitchcard.kept-actions.${personId}`,
  /** Where earlier versions kept unsent ticks themselves; read once at start-up and handed over (adoptEarlierTicks). */
  oldOfflineTicks: 'pitchcard.tick-outbox',
  /** A link opened before signing in (see tabScoped below). */
  pendingLink: 'pitchcard.pending-link',
} as const;

export async function readJson<T>(key: string): Promise<T | null> {
  try {
    const raw = await AsyncStorage.getItem(key);
    return raw ? (JSON.parse(raw) as T) : null;
  } catch {
    return null;
  }
}

/**
 * The same value read at once, on the web only, where AsyncStorage keeps it in the page's localStorage
 * under the same key: for what must be known before the first render (components/navigation/early-arrival.web.ts). Null
 * elsewhere, and when absent or unreadable.
 */
export function readJsonNow<T>(key: string): T | null {
  if (Platform.OS !== 'web' || typeof window === 'undefined') return null;
  try {
    const raw = window.localStorage?.getItem(key);
    return raw ? (JSON.parse(raw) as T) : null;
  } catch {
    return null;
  }
}

export async function writeJson(key: string, value: unknown): Promise<void> {
  await AsyncStorage.setItem(key, JSON.stringify(value));
}

export async function removeKey(key: string): Promise<void> {
  await AsyncStorage.removeItem(key);
}

/**
 * Web keeps these in the tab's session storage: a link opened in one tab must not steer a sign-in in
 * another, and a closed tab should forget it. It still survives a reload of the tab. Elsewhere the
 * device storage above serves.
 */
function webSession(): Storage | null {
  if (Platform.OS !== 'web' || typeof window === 'undefined') return null;
  try {
    return window.sessionStorage ?? null;
  } catch {
    // Some browsers refuse storage outright (privacy settings); the value then lives in memory only.
    return null;
  }
}

export const tabScoped = {
  async read(key: string): Promise<string | null> {
    if (Platform.OS === 'web') {
      try {
        return webSession()?.getItem(key) ?? null;
      } catch {
        return null;
      }
    }
    try {
      return await AsyncStorage.getItem(key);
    } catch {
      return null;
    }
  },
  async write(key: string, value: string): Promise<void> {
    if (Platform.OS === 'web') {
      try {
        webSession()?.setItem(key, value);
      } catch {
        // A full or refused store loses only the convenience of surviving a reload.
      }
      return;
    }
    await AsyncStorage.setItem(key, value);
  },
  async remove(key: string): Promise<void> {
    if (Platform.OS === 'web') {
      try {
        webSession()?.removeItem(key);
      } catch {
        // Nothing stored, nothing to forget.
      }
      return;
    }
    await AsyncStorage.removeItem(key);
  },
};
