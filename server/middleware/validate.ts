import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { emptyQuerySchema } from '@shared/schemas/common';
import { badRequest, fieldIssues } from '../errors';

declare module 'express-serve-static-core' {
  interface Request {
    /** Inputs after validation: the parsed values replace the raw ones. */
    valid: { body?: unknown; query?: unknown; params?: unknown };
  }
}

/** The zod schemas a route validates its inputs with. */
export interface InputSchemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

/** A request whose `valid` holds the parsed inputs with the types the schemas infer. */
export type ValidRequest<S extends InputSchemas> = Request & { valid: { [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never } };

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Parses the request's params, query and body with the given zod schemas into `req.valid`; a
 * failure is a 400 naming every bad field. A write whose route declares no query takes none:
 * `POST /api/results?dryRun=1` is refused whole (400, nothing stored) rather than stored with
 * the parameter ignored.
 */
function parseInputs(req: Request, schemas: InputSchemas): void {
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
}

/**
 * A route's handler with its inputs validated: `handler` runs only when they parse, and reads
 * them from `req.valid` typed as the schemas infer (no casts). Express 5 passes a rejected
 * promise to the error handler, so an async handler just throws.
 *
 *   router.get('/results/:id', route({ params: idParams }, async (req, res) => { … req.valid.params.id … }));
 */
export function route<const S extends InputSchemas>(schemas: S, handler: (req: ValidRequest<S>, res: Response, next: NextFunction) => unknown): RequestHandler {
  return (req, res, next) => {
    parseInputs(req, schemas);
    return handler(req as ValidRequest<S>, res, next) as void;
  };
}

/**
 * Validation alone, as middleware, for a route that must refuse bad input before a later step
 * (reading an upload); the handler after that step still reads its inputs through `route`.
 */
export function validate(schemas: InputSchemas): RequestHandler {
  return (req, _res, next) => {
    parseInputs(req, schemas);
    next();
  };
}
