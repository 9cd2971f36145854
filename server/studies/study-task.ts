import type { MessagePort } from 'node:worker_threads';
import { EngineeringInputError, ribStudy, type RibStudyInput, type RibStudyResult } from '../engineering';

/**
 * What a study worker thread runs: the engine, and nothing else. It posts on `started` the moment it
 * begins, so the pool can time the study itself and not its wait in the queue. A refusal comes back as
 * data: a class does not survive the trip between threads, and the field it names must.
 */
export type StudyTask = { input: RibStudyInput; started: MessagePort };
export type StudyOutcome = { ok: true; result: RibStudyResult } | { ok: false; field: string; reason: string };

export function runStudyTask({ input, started }: StudyTask): StudyOutcome {
  started.postMessage('started');
  started.close();
  try {
    return { ok: true, result: ribStudy(input) };
  } catch (err) {
    if (err instanceof EngineeringInputError) return { ok: false, field: err.field, reason: err.reason };
    throw err;
  }
}
