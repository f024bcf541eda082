import { expect } from 'vitest';
import { ComputationError } from '@shared/computation-error';

/** Runs `fn`, which must throw a ComputationError, and returns it so a test can check its field and message. */
export function computationError(fn: () => unknown): ComputationError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(ComputationError);
    return err as ComputationError;
  }
  throw new Error('expected a ComputationError, none was thrown');
}
