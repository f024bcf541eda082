/**
 * What the API answers, as zod schemas: the OpenAPI document (server/openapi/) describes the
 * responses with them, and API tests hold real answers to them. Objects are loose (more fields
 * may come: a client must ignore what it does not know), but every field named is checked.
 */
import { z } from 'zod';
import { ROLES } from '../permissions';
import { RESULT_REVISION_STATUSES, RESULT_STATUSES, resultInputSchema } from './result';

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
    /** The kept answers of the busiest reads: whether they are kept, and hits and misses since start. */
    answerCache: z.object({ on: z.boolean(), hits: z.number().int().nonnegative(), misses: z.number().int().nonnegative() }),
    /** Event-loop stalls longer than `overMs` since start, and the latest (end time, ms since the epoch; length, ms). */
    eventLoop: z.object({ overMs: z.number(), count: z.number().int().nonnegative(), recent: z.array(z.object({ at: z.number(), ms: z.number() })) }),
  })
  .meta({ id: 'Health', examples: [{ ok: true, searchDocuments: 1200, pendingWrites: 0, answerCache: { on: true, hits: 310, misses: 42 }, eventLoop: { overMs: 20, count: 0, recent: [] } }] });

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
    progression: z.array(z.looseObject({ abrasive: z.string(), material: z.string(), gritUm: z.number(), perSideDeg: z.number().nullable() })),
    trail: z.array(z.looseObject({ to: z.enum(RESULT_STATUSES), at: z.string() })),
    can: z.object({ review: z.boolean(), retract: z.boolean(), edit: z.boolean() }),
  })
  .meta({ id: 'Result' });

/** One version of a result (server/presenters/result.ts presentResultRevision). */
export const resultRevisionSchema = z
  .looseObject({
    number: z.number().int().positive(),
    status: z.enum(RESULT_REVISION_STATUSES),
    statusLabel: z.string(),
    createdAt: z.string(),
    author: z.object({ handle: z.string() }).nullable(),
    reviewedBy: z.object({ handle: z.string() }).nullable(),
    reviewedAt: z.string().nullable(),
    note: z.string().nullable(),
    input: z.looseObject({ steel: z.string(), abrasive: z.string() }),
    /** The number of the version it replaces; null for the first, or against the published result. */
    replaces: z.number().int().positive().nullable(),
    changes: z.array(z.looseObject({ path: z.string(), label: z.string() })),
  })
  .meta({ id: 'ResultRevision' });

/** GET /results/:id/revisions: every version the viewer may see, oldest first. */
export const resultRevisionListSchema = z.looseObject({ items: z.array(resultRevisionSchema) }).meta({ id: 'ResultRevisionList' });

/** PUT /results/:id (and /draft): applied at once (200) or proposed for review (202). */
export const resultEditSchema = z
  .looseObject({ outcome: z.enum(['updated', 'proposed']), result: resultSchema, revision: resultRevisionSchema })
  .meta({ id: 'ResultEdit' });

/** POST /results/:id/revisions/:rev/review. */
export const resultRevisionDecisionSchema = z.looseObject({ result: resultSchema, revision: resultRevisionSchema }).meta({ id: 'ResultRevisionDecision' });

/** One page of a list; the answer's `Link` header names the first, previous, next and last pages (RFC 8288). */
export function pageOf<T extends z.ZodType>(item: T, id: string) {
  return z
    .looseObject({ items: z.array(item), page: z.number().int().positive(), pageSize: z.number().int().positive(), total: z.number().int().nonnegative() })
    .meta({ id });
}

/** A result in a list (GET /results; server/presenters/result.ts presentResultSummary): GET /results/:id gives the rest. */
export const resultSummarySchema = resultSchema
  .pick({ id: true, status: true, createdAt: true, updatedAt: true, author: true, steel: true, steelName: true, abrasive: true, abrasiveName: true, derived: true, can: true })
  .extend({ sharpnessMethodName: z.string() })
  .meta({ id: 'ResultSummary' });

/** GET /results. */
export const resultPageSchema = pageOf(resultSummarySchema, 'ResultPage');

/** A reference page in a list (steels, abrasives, methods). */
export const pageSummarySchema = z.looseObject({ slug: z.string(), name: z.string() }).meta({ id: 'PageSummary' });

/** GET /steels, /abrasives, /methods. */
export const pageListSchema = z.looseObject({ items: z.array(pageSummarySchema) }).meta({ id: 'PageList' });

/** GET /me: the signed-in member's own page. */
export const ownPageSchema = z
  .looseObject({
    account: accountSchema,
    counts: z.partialRecord(z.enum(RESULT_STATUSES), z.number().int().nonnegative()),
    drafts: z.array(resultSchema),
    pending: z.array(resultSchema),
    returned: z.array(resultSchema),
    rejected: z.array(resultSchema),
    following: z.array(z.looseObject({ pageType: z.enum(['steel', 'abrasive']), slug: z.string(), name: z.string() })),
    notifications: z.object({ review: z.boolean(), application: z.boolean(), digest: z.boolean() }),
    tokens: z.array(z.looseObject({ id: z.number().int(), name: z.string(), prefix: z.string(), active: z.boolean() })),
    imports: z.array(z.looseObject({ id: z.number().int(), rows: z.number().int(), pending: z.number().int() })),
    can: z.object({ import: z.boolean(), tokens: z.boolean(), apply: z.boolean() }),
  })
  .meta({ id: 'OwnPage' });

/** A wheel of the wheel log with today's figures (GET /wheels, POST /wheels). */
export const loggedWheelSchema = z
  .looseObject({
    id: z.number().int().positive(),
    name: z.string(),
    wears: z.boolean(),
    originalDiameterMm: z.number(),
    barDiameterMm: z.number().nullable(),
    projectionMm: z.number(),
    usualAnglesDeg: z.array(z.number()),
  })
  .meta({ id: 'LoggedWheel' });

/** GET /wheels. */
export const wheelListSchema = z.looseObject({ items: z.array(loggedWheelSchema) }).meta({ id: 'WheelList' });

/** GET /workshop: the member's grinders, jigs, setups with today's settings, wheels with their forecasts, and the kit. */
export const workshopSchema = z
  .looseObject({
    grinders: z.array(z.looseObject({ id: z.number().int(), name: z.string(), spindleRpm: z.number().nullable(), barDiameterMm: z.number() })),
    jigs: z.array(z.looseObject({ id: z.number().int(), name: z.string(), offsetMm: z.number() })),
    setups: z.array(z.looseObject({ id: z.number().int(), name: z.string(), jigId: z.number().int().nullable(), projectionMm: z.number(), perSideDeg: z.number(), settings: z.array(z.looseObject({})) })),
    wheels: z.array(
      z.looseObject({
        id: z.number().int(),
        name: z.string(),
        abrasive: z.looseObject({ slug: z.string(), name: z.string() }).nullable(),
        grinderId: z.number().int().nullable(),
        originalDiameterMm: z.number(),
        currentDiameterMm: z.number(),
        retiredOn: z.string().nullable(),
        measurements: z.array(z.looseObject({ id: z.number().int(), measuredOn: z.string(), diameterMm: z.number() })),
      }),
    ),
    kit: z.looseObject({ totals: z.array(z.looseObject({ currency: z.string() })), coolant: z.looseObject({ order: z.array(z.number().int()) }) }),
  })
  .meta({ id: 'Workshop' });

/** A shift B − A between two samples (Hodges–Lehmann, exact Mann–Whitney 95 % interval where one exists). */
const shiftSchema = z.looseObject({
  nA: z.number().int().nonnegative(),
  nB: z.number().int().nonnegative(),
  estimate: z.number(),
  interval: z.looseObject({ lo: z.number(), hi: z.number(), coverage: z.number() }).nullable(),
  unit: z.enum(['g', 'cuts']),
  words: z.string(),
});

/** GET /compare/difference: two cells as independent samples. */
export const compareDifferenceSchema = z
  .looseObject({
    method: z.looseObject({ slug: z.string(), name: z.string(), version: z.number().int() }),
    a: z.looseObject({}).nullable(),
    b: z.looseObject({}).nullable(),
    sharpness: shiftSchema.nullable(),
    retention: shiftSchema.nullable(),
    withinEdge: z.object({ medianSdG: z.number().nullable(), edges: z.number().int().nonnegative(), readingsPerEdge: z.number().nullable() }),
    words: z.array(z.string()),
  })
  .meta({ id: 'CompareDifference' });

/** What adding a record answers: its id. */
export const createdIdSchema = z.object({ id: z.number().int().positive() }).meta({ id: 'CreatedId' });

/** GET /admin/users: accounts with their result counts (never their e-mail addresses). */
export const managedAccountPageSchema = pageOf(
  accountSchema.extend({ banned: z.boolean(), createdAt: z.string(), published: z.number().int(), returned: z.number().int(), pending: z.number().int() }),
  'ManagedAccountPage',
);

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
