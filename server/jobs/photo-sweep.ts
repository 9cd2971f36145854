import type { Logger } from 'pino';
import type { Db } from '../../db';
import { photoKeysInUse } from '../findings/findings-repository';
import { workPhotoKeysInUse } from '../travelers/work-repository';
import { noticeKeysInUse } from '../notices/notices-repository';
import type { PhotoStorage } from '../storage/photo-storage';

/**
 * Removes photo files that no finding_photos row points to. A finding writes its files before the
 * transaction that records them; a crash or a rollback in between (or a deleted row) leaves files
 * behind forever. The grace period keeps files whose transaction may still be running.
 * finding_photos, work_photos, notice_files and notice_photos keep storage keys: a new table that does must be asked here too.
 */
export async function sweepOrphanPhotos(deps: {
  db: Db;
  storage: PhotoStorage;
  graceSeconds: number;
  now?: Date;
}): Promise<{ examined: number; removed: string[] }> {
  const cutoff = (deps.now ?? new Date()).getTime() - deps.graceSeconds * 1000;
  const removed: string[] = [];
  let examined = 0;
  // Pages of 500 keys: one query per page, never the whole folder in memory or in one statement.
  for await (const page of deps.storage.list(500)) {
    examined += page.length;
    const old = page.filter((f) => f.modifiedAt.getTime() < cutoff).map((f) => f.key);
    if (old.length === 0) continue;
    const kept = await Promise.all([
      photoKeysInUse(deps.db, old),
      workPhotoKeysInUse(deps.db, old),
      noticeKeysInUse(deps.db, old),
    ]);
    const used = new Set(kept.flatMap((keys) => [...keys]));
    for (const key of old) {
      if (used.has(key)) continue;
      await deps.storage.remove(key);
      removed.push(key);
    }
  }
  return { examined, removed };
}

/** Runs the sweep now and then every `intervalSeconds`; `stop()` ends the schedule and waits for a running sweep. */
export function schedulePhotoSweep(deps: {
  db: Db;
  storage: PhotoStorage;
  graceSeconds: number;
  intervalSeconds: number;
  logger: Logger;
}) {
  let running: Promise<void> = Promise.resolve();
  const run = () => {
    // One at a time: a slow sweep is not overtaken by the next one.
    running = running.then(async () => {
      try {
        const { examined, removed } = await sweepOrphanPhotos(deps);
        if (removed.length)
          deps.logger.info({ examined, removed: removed.length }, 'photo sweep removed files no row points to');
      } catch (err) {
        deps.logger.error({ err }, 'photo sweep failed; it runs again at the next interval');
      }
    });
  };
  run();
  const timer = setInterval(run, deps.intervalSeconds * 1000);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
