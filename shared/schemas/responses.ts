/**
 * What the API answers, as zod schemas: the OpenAPI document (server/openapi/) describes the
 * responses with them, and API tests hold real answers to them. Objects are loose (more fields
 * may come: a client must ignore what it does not know), but every field named is checked.
 */
import { z } from 'zod';
import { ROLES } from '../permissions';
import { RESULT_STATUSES, resultInputSchema } from './result';

/** Every refusal: a message, and for a 400 the fields at fault (`path` dotted, e.g. "hardness.value"). */
export const errorSchema = z
  .object({
    error: z.string(),
    issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
  })
  .meta({ id: 'Error', examples: [{ error: 'Invalid input.', issues: [{ path: 'hardness.value', message: 'Too small: expected number to be >=20' }] }] });

/** GET /health. */
export const healthSchema = z
  .object({
    ok: z.literal(true),
    searchDocuments: z.number().int().nonnegative(),
    pendingWrites: z.number().int().nonnegative(),
    /** Event-loop stalls longer than `overMs` since start, and the latest (end time, ms since the epoch; length, ms). */
    eventLoop: z.object({ overMs: z.number(), count: z.number().int().nonnegative(), recent: z.array(z.object({ at: z.number(), ms: z.number() })) }),
  })
  .meta({ id: 'Health', examples: [{ ok: true, searchDocuments: 1200, pendingWrites: 0 }] });

/** The public face of an account: never its e-mail address. */
export const accountSchema = z.looseObject({ handle: z.string(), displayName: z.string(), role: z.enum(ROLES) }).meta({ id: 'Account' });

/** GET /session: who is signed in, and the token to send as X-CSRF-Token on writes. */
export const sessionSchema = z
  .object({ user: accountSchema.nullable(), csrfToken: z.string() })
  .meta({ id: 'Session', examples: [{ user: { handle: 'demo-member', displayName: 'Demo member (invented)', role: 'member' }, csrfToken: 'a1b2c3…' }] });

/** A result as the API gives it (server/presenters/result.ts). */
export const resultSchema = z
  .looseObject({
    id: z.number().int().positive(),
    status: z.enum(RESULT_STATUSES),
    createdAt: z.string(),
    updatedAt: z.string(),
    author: accountSchema.nullable(),
    steel: z.string(),
    steelName: z.string(),
    abrasive: z.string(),
    abrasiveName: z.string(),
    sharpness: z.looseObject({ method: z.string(), readingsG: z.array(z.number()) }),
    derived: z.looseObject({ hrc: z.number(), perSideDeg: z.number(), inclusiveDeg: z.number(), sharpnessMedianG: z.number() }),
    trail: z.array(z.looseObject({ to: z.enum(RESULT_STATUSES), at: z.string() })),
    can: z.object({ review: z.boolean(), retract: z.boolean() }),
  })
  .meta({ id: 'Result' });

/** One page of a list; the answer's `Link` header names the first, previous, next and last pages (RFC 8288). */
export function pageOf<T extends z.ZodType>(item: T, id: string) {
  return z
    .looseObject({ items: z.array(item), page: z.number().int().positive(), pageSize: z.number().int().positive(), total: z.number().int().nonnegative() })
    .meta({ id });
}

/** GET /results. */
export const resultPageSchema = pageOf(resultSchema, 'ResultPage');

/** A reference page in a list (steels, abrasives, methods). */
export const pageSummarySchema = z.looseObject({ slug: z.string(), name: z.string() }).meta({ id: 'PageSummary' });

/** GET /steels, /abrasives, /methods. */
export const pageListSchema = z.looseObject({ items: z.array(pageSummarySchema) }).meta({ id: 'PageList' });

/** A JSON object whose fields this document does not list one by one yet. */
export const jsonObjectSchema = z.looseObject({}).meta({ id: 'JsonObject' });

/** An example body for POST /results (and for the duplicate check): invented values. */
export const resultInputExample: z.input<typeof resultInputSchema> = {
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190] },
};
