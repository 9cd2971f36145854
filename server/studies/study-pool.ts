import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { EngineeringInputError } from '../engineering';
import { busy, HttpError } from '../http-error';
import type { StudyJob, StudyJobResult, StudyOutcome, StudyTask } from './study-task';

/**
 * Load studies run here, off the request thread: a small pool of worker threads (Piscina) with a
 * bounded queue and a time limit per study, so one heavy study never holds up other requests and a
 * flood of them is told "busy" instead of piling up. The engine refuses a study over its work budget
 * before it starts; the limits here are the backstop for whatever the budget did not foresee.
 */

export type StudyPoolLimits = {
  /** worker threads: one or two (a study is one core's work; the rest is for requests and the database) */
  threads: number;
  /** studies that may wait for a thread; the next one is answered 503 */
  queue: number;
  /** longest a study may run once a thread has it, ms → 422 */
  runMs: number;
  /** longest a study may wait for a thread, ms → 503 */
  waitMs: number;
  /** heap of a study thread, MB: a study that needs more ends its own thread, not the server */
  heapMb: number;
};

export const DEFAULT_STUDY_LIMITS: StudyPoolLimits = {
  threads: Math.max(1, Math.min(2, os.availableParallelism() - 1)),
  queue: 8,
  runMs: 20_000,
  waitMs: 30_000,
  heapMb: 768,
};

const WORKER = path.join(__dirname, 'study-worker.js');

let limits: StudyPoolLimits = { ...DEFAULT_STUDY_LIMITS };
let pool: Piscina<StudyTask, StudyOutcome> | null = null;
let running = 0;

function thePool(): Piscina<StudyTask, StudyOutcome> {
  pool ??= new Piscina<StudyTask, StudyOutcome>({
    filename: WORKER,
    minThreads: 1,
    maxThreads: limits.threads,
    maxQueue: limits.queue,
    // A thread beyond the first ends after a minute idle; the first stays warm (it is unref'd while idle,
    // so it never keeps a script from exiting).
    idleTimeout: 60_000,
    resourceLimits: { maxOldGenerationSizeMb: limits.heapMb },
  });
  return pool;
}

/**
 * Changes the limits (server start-up from its config, or a test); the pool is rebuilt with them on
 * the next study. Call before studies are running.
 */
export async function configureStudyPool(change: Partial<StudyPoolLimits>): Promise<void> {
  limits = { ...limits, ...change };
  const old = pool;
  pool = null;
  await old?.destroy();
}

/** How many studies are running and waiting now (for a health view, and for tests). */
export function studyPoolLoad(): { running: number; queued: number; threads: number } {
  return { running, queued: pool?.queueSize ?? 0, threads: pool?.threads.length ?? 0 };
}

/** Ends the pool: running studies finish (each within its time limit), waiting ones are refused. Idempotent. */
export async function closeStudyPool(): Promise<void> {
  const old = pool;
  pool = null;
  await old?.close({ force: true });
}

const studiesBusy = () => busy('the server is working through other load studies: try again in a minute', 60);
const tooLong = (ms: number) =>
  new HttpError(
    422,
    'study_too_long',
    `the study ran longer than ${Math.round(ms / 1000)} s and was stopped: study fewer gauges or rivets at once, use a coarser pitch increment or fewer panels`,
  );
const tooBig = () =>
  new HttpError(
    422,
    'study_too_large',
    'the study needed more memory than a study may use and was stopped: study fewer gauges or rivets at once, or fewer or shorter lines',
  );

/**
 * Runs a study job (a rib, a whole wing, or one rib candidate with its holes) on a worker thread.
 * Resolves with the result; rejects with the engine's refusal (its field as the engine names it), or an
 * HttpError when the pool is full (503), the study waited or ran too long (503 / 422) or outgrew its
 * memory (422).
 */
export async function runStudy<J extends StudyJob>(job: J): Promise<StudyJobResult<J>> {
  const { runMs, waitMs } = limits;
  const p = thePool();
  const { port1, port2 } = new MessageChannel();
  const stop = new AbortController();
  // An object, not a let: TypeScript would narrow a let to 'waiting' and miss the listener's change.
  const state: { phase: 'waiting' | 'running' } = { phase: 'waiting' };
  let timer = setTimeout(() => stop.abort(new Error('waited too long')), waitMs);
  port1.once('message', () => {
    state.phase = 'running';
    running += 1;
    clearTimeout(timer);
    // Aborting a running task ends its thread; Piscina starts a fresh one for the next study.
    timer = setTimeout(() => stop.abort(new Error('ran too long')), runMs);
  });
  try {
    const outcome = await p.run({ ...job, started: port2 }, { transferList: [port2], signal: stop.signal });
    if (!outcome.ok) throw new EngineeringInputError(outcome.field, outcome.reason);
    return outcome.result as StudyJobResult<J>;
  } catch (err) {
    if (err instanceof EngineeringInputError) throw err;
    if (stop.signal.aborted) throw state.phase === 'running' ? tooLong(runMs) : studiesBusy();
    const e = err as { message?: string; code?: string };
    if (e?.message === 'Task queue is at limit' || e?.message === 'No task queue available and all Workers are busy')
      throw studiesBusy();
    if (e?.code === 'ERR_WORKER_OUT_OF_MEMORY') throw tooBig();
    throw err;
  } finally {
    clearTimeout(timer);
    if (state.phase === 'running') running -= 1;
    port1.close();
  }
}
