import type { ErrorRequestHandler, Request } from 'express';
import multer from 'multer';
import { UniqueConstraintError, ValidationError } from 'sequelize';
import { ComputationError } from '@shared/computation-error';
import { HttpError } from '../errors';
import { logEvent } from '../logging';

/** Where a browser lands when the sign-in round trip fails (the client's sign-in page). */
export const SIGN_IN_FAILED_PATH = '/sign-in?failed=1';

/** passport-oauth2's errors: the provider refused the code or the request (e.g. a reused code). */
const OAUTH_ERRORS = new Set(['TokenError', 'AuthorizationError', 'InternalOAuthError']);

/** multer's limit errors, all of which mean the upload was larger than allowed. */
const UPLOAD_TOO_LARGE = new Set(['LIMIT_PART_COUNT', 'LIMIT_FILE_SIZE', 'LIMIT_FILE_COUNT', 'LIMIT_FIELD_KEY', 'LIMIT_FIELD_VALUE', 'LIMIT_FIELD_COUNT', 'LIMIT_FIELD_NESTING', 'LIMIT_FIELD_ARRAY_INDEX']);

/**
 * The one place that turns errors into responses `{ error, issues? }`. Typed errors keep their
 * status; Sequelize's validation and unique errors become 400 and 409; body-parser's and multer's
 * errors keep theirs (413 for anything too large); a failed OAuth exchange sends the browser to
 * the sign-in page; anything unexpected is a 500 whose details (stack, SQL) stay in the log.
 * Refusals are logged with the OWASP vocabulary's names (authz_fail, input_validation_fail,
 * upload_validation, authn_login_fail).
 */
export function errorHandler(log: (err: unknown, req: Request) => void): ErrorRequestHandler {
  return (err, req, res, next) => {
    // Part of the answer is already on the wire: only closing the connection is left.
    if (res.headersSent) return next(err);
    if (err instanceof HttpError) {
      const upload = !!req.is('multipart/form-data');
      if (err.status === 403) logEvent('authz_fail', req, { reason: err.message });
      else if (upload && (err.status === 400 || err.status === 413 || err.status === 415)) {
        logEvent('upload_validation', req, { result: 'refused', status: err.status, fields: err.issues?.map((i) => i.path) ?? [] });
      } else if (err.status === 400 && err.issues) logEvent('input_validation_fail', req, { fields: err.issues.map((i) => i.path) });
      res.status(err.status).json({ error: err.message, ...(err.issues ? { issues: err.issues } : {}) });
      return;
    }
    if (err instanceof ComputationError) {
      logEvent('input_validation_fail', req, { fields: [err.field ?? '(input)'] });
      res.status(400).json({ error: err.message, issues: [{ path: err.field ?? '(input)', message: err.message }] });
      return;
    }
    if (err instanceof UniqueConstraintError) {
      res.status(409).json({ error: 'That already exists.', issues: err.errors.map((e) => ({ path: e.path ?? '', message: 'must be unique' })) });
      return;
    }
    if (err instanceof ValidationError) {
      logEvent('input_validation_fail', req, { fields: err.errors.map((e) => e.path ?? '') });
      res.status(400).json({ error: 'Invalid input.', issues: err.errors.map((e) => ({ path: e.path ?? '', message: e.message })) });
      return;
    }
    if (err instanceof multer.MulterError) {
      const tooLarge = UPLOAD_TOO_LARGE.has(err.code);
      logEvent('upload_validation', req, { result: 'refused', reason: err.code, field: err.field });
      res.status(tooLarge ? 413 : 400).json({
        error: tooLarge ? `The upload is too large: ${err.message.toLowerCase()}.` : `The upload was refused: ${err.message.toLowerCase()}.`,
        ...(err.field ? { issues: [{ path: err.field, message: err.message }] } : {}),
      });
      return;
    }
    if (err instanceof Error && OAUTH_ERRORS.has(err.name)) {
      logEvent('authn_login_fail', req, { reason: (err as { code?: string }).code ?? err.name });
      res.redirect(SIGN_IN_FAILED_PATH);
      return;
    }
    const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
    if (status === 500) {
      log(err, req);
      res.status(500).json({ error: 'Something went wrong on our side; nothing was changed.' });
      return;
    }
    const message =
      err.type === 'entity.too.large'
        ? 'The request body is too large.'
        : err.type === 'entity.parse.failed'
          ? 'The request body is not valid JSON.'
          : err.type === 'charset.unsupported' || err.type === 'encoding.unsupported'
            ? 'The request body’s encoding is not supported; send UTF-8 JSON.'
            : 'Bad request.';
    res.status(status).json({ error: message });
  };
}
