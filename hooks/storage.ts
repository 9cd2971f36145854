import AsyncStorage from '@react-native-async-storage/async-storage';

/** Every key the app keeps on the device, in one place so none collide. */
export const storageKeys = {
  session: 'pitchcard.session',
  units: 'pitchcard.units',
  findingDraft: (travelerId: string) => `pitchcard.finding-draft.${travelerId}`,
  tickOutbox: 'pitchcard.tick-outbox',
} as const;

export async function readJson<T>(key: string): Promise<T | null> {
  try {
    const raw = await AsyncStorage.getItem(key);
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
