import { EngineeringInputError } from '@/server/engineering';

/** The error the engine refuses an input with; fails the test if it accepts it or throws anything else. */
export function refusal(run: () => unknown): EngineeringInputError {
  try {
    run();
  } catch (e) {
    if (e instanceof EngineeringInputError) return e;
    throw e;
  }
  throw new Error('expected the engine to refuse the input');
}
