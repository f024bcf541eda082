import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { emptyQuerySchema } from '@shared/schemas/common';
import { badRequest, fieldIssues } from '../errors';

declare module 'express-serve-static-core' {
  interface Request {
    /** Inputs after validation: the parsed values replace the raw ones. */
    valid: { body?: unknown; query?: unknown; params?: unknown };
  }
}

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Validates the request's body, query and params with the given zod schemas; a failure is a
 * 400 naming every bad field. Handlers read the parsed values from `req.valid`. A write whose
 * route declares no query takes none: `POST /api/results?dryRun=1` is refused whole (400,
 * nothing stored) rather than stored with the parameter ignored.
 */
export function validate(schemas: { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType }): RequestHandler {
  return (req, _res, next) => {
    req.valid ??= {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = part === 'query' && !schemas.query && !READS.has(req.method) && !req.valid.query ? emptyQuerySchema : schemas[part];
      if (!schema) continue;
      const parsed = schema.safeParse(req[part] ?? (part === 'body' ? undefined : {}));
      if (!parsed.success) {
        throw badRequest(`Invalid ${part === 'body' ? 'input' : part}.`, fieldIssues(parsed.error, part));
      }
      req.valid[part] = parsed.data;
    }
    next();
  };
}
