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
