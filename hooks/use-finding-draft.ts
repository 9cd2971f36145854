import { useCallback, useEffect, useRef, useState } from 'react';
import type { FindingKind, Measurements } from '@/db/contracts';
import { forgetPhotos, keepPhotos, revivePhotos, sweepKeptPhotos } from '@/lib/kept-photos';
import { keptIdsOf, type DraftPhoto } from '@/lib/photo-form-data';
import { readJson, removeKey, storageKeys, writeJson } from '@/lib/storage';
import { useSession } from './use-session';

export type FindingDraft = {
  /** Measurements in inches, as the form holds them. */
  values: { holeIds: string[]; kind?: FindingKind; note: string; measurements?: Measurements };
  photos: DraftPhoto[];
  savedAt: string;
};

function isEmpty(d: Omit<FindingDraft, 'savedAt'>): boolean {
  return (
    !d.values.holeIds.length &&
    !d.values.kind &&
    !d.values.note.trim() &&
    !d.photos.length &&
    !Object.values(d.values.measurements ?? {}).some((v) => typeof v === 'number')
  );
}

/** A draft kept before drafts were kept per person: handed to the first person who opens its part's form. */
async function adoptUnowned(travelerId: string, key: string): Promise<FindingDraft | null> {
  const old = storageKeys.findingDraft(null, travelerId);
  const d = await readJson<FindingDraft>(old);
  if (d) {
    await writeJson(key, d);
    await removeKey(old);
  }
  return d;
}

/** Photos of drafts left for months are swept once per start, on the first form opened. */
let swept = false;

/**
 * Keeps a finding that is not sent yet on the device (fields, and photos with their bytes on the web:
 * lib/kept-photos), so a dropped connection, a reload or a closed app does not lose it. Cleared once the
 * server has it. Kept under the person signed in: it waits for them, never shown to whoever signs in next
 * on the same phone.
 */
export function useFindingDraft(travelerId: string) {
  const personId = useSession().user?.id ?? null;
  const key = storageKeys.findingDraft(personId, travelerId);
  const [loaded, setLoaded] = useState(false);
  const [restored, setRestored] = useState<FindingDraft | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const pending = useRef<Omit<FindingDraft, 'savedAt'> | null>(null);
  /** The kept photos of the draft as last written: one taken out of the form is let go at the next write. */
  const written = useRef<string[]>([]);
  /** Writes one after another: keeping a photo takes a moment, and two writes must not keep it twice. */
  const writing = useRef<Promise<void>>(Promise.resolve());

  useEffect(() => {
    let alive = true;
    if (!swept) {
      swept = true;
      void sweepKeptPhotos();
    }
    readJson<FindingDraft>(key)
      .then((d) => d ?? (personId ? adoptUnowned(travelerId, key) : null))
      .then(async (d) => (d ? { ...d, photos: await revivePhotos(d.photos ?? []) } : null))
      .then((d) => {
        if (!alive) return;
        written.current = d ? keptIdsOf(d.photos) : [];
        setRestored(d && !isEmpty(d) ? d : null);
        setLoaded(true);
      });
    return () => {
      alive = false;
    };
  }, [key, personId, travelerId]);

  const flush = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const d = pending.current;
    pending.current = null;
    if (!d) return writing.current;
    const run = writing.current.then(async () => {
      const photos = await keepPhotos(d.photos);
      const now = keptIdsOf(photos);
      const dropped = written.current.filter((id) => !now.includes(id));
      if (isEmpty(d)) await removeKey(key);
      else await writeJson(key, { ...d, photos, savedAt: new Date().toISOString() });
      written.current = now;
      await forgetPhotos(dropped);
    });
    // A failed write is told to whoever waits on this one; the next write still runs.
    writing.current = run.catch(() => {});
    return run;
  }, [key]);

  /** Saves shortly after the last change; nothing is written before the old draft has been read. */
  const save = useCallback(
    (d: Omit<FindingDraft, 'savedAt'>) => {
      if (!loaded) return;
      pending.current = d;
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void flush(), 250);
    },
    [loaded, flush],
  );

  /** The draft is gone: sent, or started over. `handedOver`: its photos now belong to a queued finding. */
  const clear = useCallback(
    async (opts?: { handedOver?: boolean }) => {
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
      pending.current = null;
      setRestored(null);
      await writing.current;
      await removeKey(key);
      const kept = written.current;
      written.current = [];
      if (!opts?.handedOver) await forgetPhotos(kept);
    },
    [key],
  );

  // Write what is pending when the screen goes away.
  useEffect(
    () => () => {
      void flush();
    },
    [flush],
  );

  return { loaded, restored, save, clear, flush };
}
