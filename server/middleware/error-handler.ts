import type { ErrorRequestHandler } from 'express';
import { UniqueConstraintError, ValidationError } from 'sequelize';
import { ComputationError } from '@shared/computation-error';
import { HttpError } from '../errors';

/**
 * The one place that turns errors into responses `{ error, issues? }`. Typed errors keep their
 * status; Sequelize's validation and unique errors become 400 and 409; body-parser's errors keep
 * theirs; anything unexpected is a 500 whose details stay in the log.
 */
export function errorHandler(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    if (err instanceof HttpError) {
      res.status(err.status).json({ error: err.message, ...(err.issues ? { issues: err.issues } : {}) });
      return;
    }
    if (err instanceof ComputationError) {
      res.status(400).json({ error: err.message, issues: [{ path: err.field ?? '(input)', message: err.message }] });
      return;
    }
    if (err instanceof UniqueConstraintError) {
      res.status(409).json({ error: 'That already exists.', issues: err.errors.map((e) => ({ path: e.path ?? '', message: 'must be unique' })) });
      return;
    }
    if (err instanceof ValidationError) {
      res.status(400).json({ error: 'Invalid input.', issues: err.errors.map((e) => ({ path: e.path ?? '', message: e.message })) });
      return;
    }
    const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
    if (status === 500) {
      log(err);
      res.status(500).json({ error: 'Something went wrong on our side; nothing was changed.' });
      return;
    }
    const message = err.type === 'entity.too.large' ? 'The request body is too large.' : err.type === 'entity.parse.failed' ? 'The request body is not valid JSON.' : 'Bad request.';
    res.status(status).json({ error: message });
  };
}
