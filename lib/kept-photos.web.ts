import { createStore, del, get, keys, set, type UseStore } from 'idb-keyval';
import type { DraftPhoto } from './photo-form-data';

/**
 * A finding's photos kept on the device until it is sent, on the web. The picker hands a blob: URI that
 * dies with the page, and a phone's photo is some megabytes: too large for localStorage, where the draft's
 * fields are kept. So each photo's bytes go into IndexedDB under an id the draft carries (`keptId`), and a
 * reload makes a fresh URI from them. Where IndexedDB cannot be opened (some private windows), a photo up to
 * `inlineBytes` is kept inline in the draft as a data: URI instead, as before there was a store.
 * lib/kept-photos.ts is the native side, where a picked photo is a file that outlives the app's restart.
 */

type Kept = { blob: Blob };

const inlineBytes = 1_500_000;
/** A photo kept longer than this belongs to a draft left for good (or to none): swept at the next start. */
const keepDays = 90;

let store: UseStore | null | undefined;
function theStore(): UseStore | null {
  if (store === undefined) {
    try {
      store = typeof indexedDB === 'undefined' ? null : createStore('pitchcard-photos', 'kept');
    } catch {
      store = null;
    }
  }
  return store;
}

/**
 * Each call to the store gives up after this long: a browser whose IndexedDB hangs (it happens) must not
 * hold the form's Send, nor the bench's queue behind a finding.
 */
const storeWaitMs = 3000;
class StoreTimeout extends Error {}
function within<T>(work: Promise<T>): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new StoreTimeout('the photo store did not answer')), storeWaitMs);
  });
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

/** The id each page-lived URI was kept under, so a draft saved again does not store its photos again. */
const keptIdOf = new Map<string, string>();
/** The live URI made for each kept photo in this page, so a draft read twice shows the same one. */
const uriOf = new Map<string, string>();

/** An id that starts with the moment it was kept (base 36), so the sweep reads ids, not megabytes of photos. */
function newId(now = Date.now()): string {
  const random = globalThis.crypto?.randomUUID?.() ?? Math.random().toString(36).slice(2);
  return `${now.toString(36)}.${random}`;
}

function readAsDataUrl(file: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(String(r.result));
    r.onerror = () => reject(r.error);
    r.readAsDataURL(file);
  });
}

async function blobOf(uri: string): Promise<Blob | null> {
  try {
    return await (await fetch(uri)).blob();
  } catch {
    return null;
  }
}

/**
 * The photos with their bytes kept: each page-lived (blob:) photo gets a `keptId`. A photo already kept,
 * inline, or no longer readable is returned as it is. Never throws: a photo that cannot be kept stays as
 * it was (it is readable until the page goes).
 */
export async function keepPhotos(photos: DraftPhoto[]): Promise<DraftPhoto[]> {
  const s = theStore();
  return Promise.all(
    photos.map(async (p) => {
      if (p.keptId || !p.uri.startsWith('blob:')) return p;
      const known = keptIdOf.get(p.uri);
      if (known) return { ...p, keptId: known };
      const blob = await blobOf(p.uri);
      if (!blob) return p;
      if (s) {
        const id = newId();
        try {
          await within(set(id, { blob } satisfies Kept, s));
          keptIdOf.set(p.uri, id);
          uriOf.set(id, p.uri);
          return { ...p, keptId: id };
        } catch {
          /* the store is full or closed: inline below if small enough */
        }
      }
      if (blob.size > inlineBytes) return p;
      try {
        return { ...p, uri: await readAsDataUrl(blob) };
      } catch {
        return p;
      }
    }),
  );
}

/**
 * The photos of a draft read back after a reload: each kept one gets a live URI made from its bytes. One
 * whose bytes are gone keeps its dead URI, and sending it says which photo to add again.
 */
export async function revivePhotos(photos: DraftPhoto[]): Promise<DraftPhoto[]> {
  const s = theStore();
  if (!s) return photos;
  return Promise.all(
    photos.map(async (p) => {
      if (!p.keptId) return p;
      const live = uriOf.get(p.keptId);
      if (live) return { ...p, uri: live };
      try {
        const kept = await within(get<Kept>(p.keptId, s));
        if (!kept?.blob) return p;
        const uri = URL.createObjectURL(kept.blob);
        uriOf.set(p.keptId, uri);
        keptIdOf.set(uri, p.keptId);
        return { ...p, uri };
      } catch {
        return p;
      }
    }),
  );
}

/** The bytes of a kept photo, when its URI can no longer be read: null when they are gone too. */
export async function keptBlob(keptId: string): Promise<Blob | null> {
  const s = theStore();
  if (!s) return null;
  try {
    return (await within(get<Kept>(keptId, s)))?.blob ?? null;
  } catch {
    return null;
  }
}

/**
 * Whether a photo outlives this page: kept in the store, or not page-lived at all. A finding is handed to
 * the bench's queue only when all its photos do; one kept inline would swell the queue the device keeps
 * in localStorage, ticks and all.
 */
export const outlivesPage = (p: DraftPhoto): boolean => !!p.keptId || !/^(blob|data):/.test(p.uri);

/** Lets go of kept photos: the draft was sent, started over, or the photo taken out of it. */
export async function forgetPhotos(keptIds: string[]): Promise<void> {
  const s = theStore();
  if (!s) return;
  for (const id of keptIds) {
    const uri = uriOf.get(id);
    uriOf.delete(id);
    if (uri) keptIdOf.delete(uri);
    try {
      await within(del(id, s));
    } catch {
      /* gone already, or the store is closed: the sweep takes it */
    }
  }
}

/** Removes photos kept longer than `keepDays` (a draft left for good, or a tab closed mid-save). */
export async function sweepKeptPhotos(now = Date.now()): Promise<number> {
  const s = theStore();
  if (!s) return 0;
  try {
    const old = (await within(keys<string>(s))).filter((id) => {
      const keptAt = parseInt(String(id).split('.')[0], 36);
      return !(keptAt > now - keepDays * 86_400_000);
    });
    await forgetPhotos(old);
    return old.length;
  } catch {
    return 0;
  }
}
