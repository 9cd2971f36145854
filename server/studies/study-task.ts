import type { MessagePort } from 'node:worker_threads';
import {
  EngineeringInputError,
  ribCandidate,
  ribStudy,
  wingStudy,
  type RibStudyInput,
  type RibStudyResult,
  type StudyCandidate,
  type WingStudyInput,
  type WingStudyResult,
} from '../engineering';

/**
 * What a study worker thread runs: the engine, and nothing else. A job is a rib study, a whole wing, or
 * one candidate of a rib study recomputed with its holes (the stored result keeps the recommended
 * candidate's holes only). The task posts on `started` the moment it begins, so the pool can time the
 * study itself and not its wait in the queue. A refusal comes back as data: a class does not survive
 * the trip between threads, and the field it names must.
 */
export type StudyJob =
  | { kind: 'rib'; input: RibStudyInput }
  | { kind: 'wing'; input: WingStudyInput }
  | { kind: 'rib-candidate'; input: RibStudyInput; pick: { gaugeIn: number; rivet: string } };
export type StudyJobResult<J extends StudyJob> = J extends { kind: 'rib' }
  ? RibStudyResult
  : J extends { kind: 'wing' }
    ? WingStudyResult
    : StudyCandidate;
export type StudyTask = StudyJob & { started: MessagePort };
export type StudyOutcome =
  | { ok: true; result: RibStudyResult | WingStudyResult | StudyCandidate }
  | { ok: false; field: string; reason: string };

function run(job: StudyJob): RibStudyResult | WingStudyResult | StudyCandidate {
  switch (job.kind) {
    case 'rib':
      return ribStudy(job.input);
    case 'wing':
      return wingStudy(job.input);
    case 'rib-candidate':
      return ribCandidate(job.input, job.pick);
    default:
      throw new EngineeringInputError('kind', 'a study is of a rib or of a wing');
  }
}

export function runStudyTask(task: StudyTask): StudyOutcome {
  task.started.postMessage('started');
  task.started.close();
  try {
    return { ok: true, result: run(task) };
  } catch (err) {
    if (err instanceof EngineeringInputError) return { ok: false, field: err.field, reason: err.reason };
    throw err;
  }
}
