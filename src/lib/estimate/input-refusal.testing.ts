/** For the core's tests: the input error a call was refused with (the test fails if it was not). */
import { EstimateInputError } from './errors.ts';

export function inputRefusal(fn: () => unknown): EstimateInputError {
  try {
    fn();
  } catch (e) {
    if (e instanceof EstimateInputError) return e;
    throw e;
  }
  throw new Error('expected an EstimateInputError');
}

/** The fields of that refusal, by path. */
export const fieldsOf = (fn: () => unknown): Record<string, string> => inputRefusal(fn).fields;
