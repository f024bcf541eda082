import type { z } from 'zod';

/**
 * Plain words for zod's built-in checks, used by the client's forms. Messages written in the
 * shared schemas (e.g. "must be above 0°") take precedence over these.
 */
export const friendlyZodMessages: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.expected === 'number') return issue.input === undefined ? 'required' : 'enter a number';
      if (issue.expected === 'int') return 'enter a whole number';
      if (issue.input === undefined || issue.input === '') return 'required';
      return undefined;
    case 'too_small':
      if (issue.origin === 'number') return issue.inclusive ? `must be at least ${issue.minimum}` : `must be above ${issue.minimum}`;
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'required' : `at least ${issue.minimum} characters`;
      if (issue.origin === 'array') return `at least ${issue.minimum}`;
      return undefined;
    case 'too_big':
      if (issue.origin === 'number') return issue.inclusive ? `must be at most ${issue.maximum}` : `must be below ${issue.maximum}`;
      if (issue.origin === 'string') return `at most ${issue.maximum} characters`;
      if (issue.origin === 'array') return `at most ${issue.maximum}`;
      return undefined;
    case 'invalid_value':
      return 'choose one of the listed options';
    case 'unrecognized_keys':
      return `not a field of this form: ${issue.keys.join(', ')}`;
    default:
      return undefined;
  }
};
