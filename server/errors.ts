import type { z } from 'zod';

/** A validation problem with one field; `path` is dotted, e.g. "hardness.value". */
export interface FieldIssue {
  path: string;
  message: string;
}

/** An error the client may see: its status, a stable id, a message and optional field issues. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly id: string,
    message: string,
    readonly issues?: FieldIssue[],
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, issues?: FieldIssue[]) => new HttpError(400, 'bad_request', message, issues);
export const unauthorized = (message = 'Sign in first.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'You may not do that.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);

/**
 * Turns zod issues into dotted field paths with messages; an unknown field is named by its own
 * path ("status", "notes.colour"), one issue each. `part` names an issue about the whole input.
 */
export function fieldIssues(error: z.ZodError, part: 'body' | 'query' | 'params' = 'body'): FieldIssue[] {
  return error.issues.flatMap((i) =>
    i.code === 'unrecognized_keys'
      ? i.keys.map((key) => ({ path: [...i.path, key].join('.'), message: 'unknown field: not accepted here' }))
      : [{ path: i.path.join('.') || `(${part})`, message: i.message }],
  );
}
