/**
 * What the API answers, as zod schemas: the OpenAPI document (server/openapi/) describes the
 * responses with them, and API tests hold real answers to them. The first ones below are loose
 * objects (more fields may come: a client must ignore what it does not know), every field named
 * checked; those after the divider are closed (decision 038). A client must still ignore fields
 * it does not know: a later version may add some.
 */
import { z } from 'zod';
import { ROLES } from '../permissions';
import { RESULT_REVISION_STATUSES, RESULT_STATUSES, resultInputSchema } from './result';
import { APPLICATION_STATUSES, EMAIL_TOPICS, FLAG_REASONS, FLAG_STATUSES, FLAG_SUBJECTS, FOLLOWABLE_PAGES, siteSettingsSchema, type EmailTopic, type FlagReason } from './publishing';
import { GRIT_STANDARDS } from '../grit';
import { HARDNESS_SCALES } from '../hardness';
import { LIVE_FILTER_KEYS } from './compare';

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
    progression: z.array(z.looseObject({ abrasive: z.string(), abrasiveName: z.string(), material: z.string(), gritUm: z.number(), perSideDeg: z.number().nullable() })),
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

const handleOrNull = z.object({ handle: z.string() }).nullable();
const revisionNumber = z.number().int().positive();
const richTextSchema = z.looseObject({ type: z.string() }).nullable();

/**
 * One revision in a page's history (server/presenters/pages.ts presentRevisionSummary). `id`
 * is what routes and writes take; `number` (1, 2, 3… per page) is how people name it. The
 * revisions it names are given both ways.
 */
export const pageRevisionSummarySchema = z
  .looseObject({
    id: z.number().int().positive(),
    number: revisionNumber,
    author: handleOrNull,
    createdAt: z.string(),
    summary: z.string(),
    status: z.enum(['live', 'proposed', 'declined']),
    kind: z.enum(['edit', 'revert', 'merge']),
    current: z.boolean(),
    baseRevisionId: z.number().int().positive().nullable(),
    baseRevisionNumber: revisionNumber.nullable(),
    revertedFromId: z.number().int().positive().nullable(),
    revertedFromNumber: revisionNumber.nullable(),
    appliedFromId: z.number().int().positive().nullable(),
    appliedFromNumber: revisionNumber.nullable(),
    /** Who reviewed and when (public); the note only for the author and moderators. */
    review: z.object({ by: handleOrNull, at: z.string(), note: z.string().nullable() }).nullable(),
  })
  .meta({ id: 'PageRevisionSummary' });

/** A page revision whole: its fields and body as saved, with its page and what the viewer may do. */
export const pageRevisionSchema = pageRevisionSummarySchema
  .extend({
    pageType: z.enum(['steel', 'abrasive', 'method']),
    page: z.object({ slug: z.string(), name: z.string(), section: z.enum(['steels', 'abrasives', 'methods']) }),
    fields: z.looseObject({ name: z.string() }),
    body: richTextSchema,
    bodyHtml: z.string(),
    can: z.object({ review: z.boolean(), revert: z.boolean() }),
  })
  .meta({ id: 'PageRevision' });

/** GET /{section}/:slug/revisions: the revisions the viewer may read, newest first, and the page's moderation events. */
export const pageHistorySchema = z
  .looseObject({
    page: z.object({
      slug: z.string(),
      name: z.string(),
      currentRevisionId: z.number().int().positive().nullable(),
      currentRevisionNumber: revisionNumber.nullable(),
      isProtected: z.boolean(),
      mergedInto: z.string().nullable(),
    }),
    items: z.array(pageRevisionSummarySchema),
    events: z.array(
      z.object({
        id: z.number().int().positive(),
        action: z.enum(['protect', 'unprotect', 'merged-into', 'absorbed']),
        by: handleOrNull,
        at: z.string(),
        note: z.string().nullable(),
        detail: z.looseObject({}).nullable(),
      }),
    ),
  })
  .meta({ id: 'PageHistory' });

/**
 * A steel, abrasive or method page whole (GET /{section}/:slug): its type's fields (a steel's
 * composition, an abrasive's grit, a method's readings per edge…) and the wiki parts every page
 * has, named here: its text, references, current revision (id and number), protection, open
 * proposals and what the viewer may do.
 */
export const wikiPageSchema = z
  .looseObject({
    slug: z.string(),
    name: z.string(),
    body: richTextSchema,
    bodyHtml: z.string(),
    citations: z.array(z.looseObject({ title: z.string(), organisation: z.string(), year: z.number().int().nullable(), supports: z.string() })),
    sources: z.record(z.string(), z.number().int().nonnegative()),
    revision: z.number().int().positive().nullable(),
    revisionNumber: revisionNumber.nullable(),
    isProtected: z.boolean(),
    proposals: z.number().int().nonnegative(),
    can: z.object({ edit: z.boolean(), publish: z.boolean(), revert: z.boolean(), protect: z.boolean(), merge: z.boolean() }),
  })
  .meta({ id: 'WikiPage' });

/** PUT /{section}/:slug: live at once (200, with the page) or proposed for review (202). POST /{section}/:slug/revert: live. */
export const pageSaveSchema = z
  .looseObject({ status: z.enum(['live', 'proposed']), revision: pageRevisionSchema, page: wikiPageSchema.optional() })
  .meta({ id: 'PageSave' });

/** POST /{steels,abrasives,methods}: the new page and its first revision (number 1, live). */
export const pageCreatedSchema = z
  .object({ status: z.literal('live'), revision: pageRevisionSchema, page: wikiPageSchema })
  .meta({ id: 'PageCreated' });

/** POST /page-revisions/:id/review: the proposal as decided, and the revision that went live (itself, or a merge over later edits). */
export const pageReviewOutcomeSchema = z
  .looseObject({ status: z.enum(['live', 'declined']), revision: pageRevisionSchema, applied: pageRevisionSchema })
  .meta({ id: 'PageReviewOutcome' });

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
    kit: z.looseObject({
      totals: z.array(z.looseObject({ currency: z.string() })),
      perSharpening: z.looseObject({
        byCurrency: z.array(z.looseObject({ currency: z.string(), costPerSharpening: z.number(), wheelIds: z.array(z.number().int()), rough: z.boolean() })),
        missing: z.array(z.looseObject({ wheelId: z.number().int(), why: z.enum(['no-price', 'no-estimate']) })),
      }),
      coolant: z.looseObject({ order: z.array(z.number().int()) }),
    }),
  })
  .meta({ id: 'Workshop' });

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

// ---------------------------------------------------------------------------------------------
// Answers named field by field and closed (`z.object`: the document says `additionalProperties:
// false`, so the API tests fail on a field the server sends but this file does not name). The
// presenters are typed by them through `Presented<…>`.

/**
 * What a presenter may hand to `res.json` for an answer of schema S: the schema's output, where a
 * Date may stand for a free-text string (`res.json` writes a Date as its ISO 8601 text). A loose
 * object's index signature is dropped: TypeScript's objects may carry more fields anyway.
 */
export type Presented<S extends z.ZodType> = Wire<z.output<S>>;
type Wire<T> = T extends string ? (string extends T ? T | Date : T) : T extends readonly (infer U)[] ? Wire<U>[] : T extends object ? { [K in keyof T as string extends K ? never : K]: Wire<T[K]> } : T;

/** A moment, as ISO 8601 text in UTC. */
const timestamp = z.string().meta({ format: 'date-time', examples: ['2026-03-01T09:30:00.000Z'] });
/** A day, as ISO 8601 text. */
const day = z.string().meta({ format: 'date', examples: ['2026-03-01'] });

/** An object with one field of `value` for each key. */
function everyKey<const K extends string, V extends z.ZodType>(keys: readonly K[], value: V) {
  return z.object(Object.fromEntries(keys.map((k) => [k, value])) as Record<K, V>);
}

/** GET /tools/grit: the grade as read, its size, its band, and the nearest grade of each standard. */
export const gritToolAnswerSchema = z
  .object({
    standard: z.enum(GRIT_STANDARDS),
    grade: z.string(),
    /** True when no standard was given and one was assumed. */
    inferred: z.boolean(),
    micrometres: z.number(),
    band: z.object({ loUm: z.number(), hiUm: z.number() }),
    nearest: everyKey(GRIT_STANDARDS, z.string().nullable()),
  })
  .meta({ id: 'GritTool' });

/** GET /tools/hardness: the value on every scale (null outside a scale's table). */
export const hardnessToolAnswerSchema = everyKey(HARDNESS_SCALES, z.number().nullable()).meta({ id: 'HardnessTool' });

/** An edge angle, or (when asked with an angle) the gap that gives it. */
export const edgeAngleAnswerSchema = z
  .union([z.object({ perSideDeg: z.number(), inclusiveDeg: z.number() }), z.object({ gapMm: z.number() })])
  .meta({ id: 'EdgeAngleOrGap' });

/** GET /tools/wear-drift. */
export const wearDriftAnswerSchema = z
  .object({ originalPerSideDeg: z.number(), currentPerSideDeg: z.number(), currentGapMm: z.number(), restoringGapMm: z.number() })
  .meta({ id: 'WearDrift' });

/** POST /tools/retention: ICP and TCC (ISO 8442-5) with their minimums; a pass is null while undecided. */
export const retentionToolAnswerSchema = z
  .object({
    icpMm: z.number(),
    tccMm: z.number(),
    cycles: z.number().int().positive(),
    limits: z.object({ icpMinMm: z.number(), tccMinMm: z.number() }),
    icpPass: z.boolean().nullable(),
    tccPass: z.boolean().nullable(),
  })
  .meta({ id: 'RetentionTool' });

/** GET /price-reports: medians with n per currency and condition, and the days they span; no reporter named. */
export const priceSummarySchema = z
  .object({
    abrasive: z.string(),
    groups: z.array(z.object({ currency: z.string(), condition: z.string(), medianPrice: z.number(), n: z.number().int().positive(), from: day, to: day })),
  })
  .meta({ id: 'PriceSummary' });

/** An answer that only says it was done. */
export const doneSchema = z.object({ ok: z.literal(true) }).meta({ id: 'Done' });

const closedAccount = z.object({ handle: z.string(), displayName: z.string(), role: z.enum(ROLES) });
const handleOnly = z.object({ handle: z.string() });

/** A publisher's badge, from their approved application; null for other roles. */
const badgeSchema = z.object({ label: z.string(), workshop: z.string().nullable(), link: z.string().nullable() }).nullable();

/** GET /publishers: each publisher with the badge their approved application gives. */
export const publisherListSchema = z
  .object({ items: z.array(closedAccount.extend({ badge: badgeSchema })) })
  .meta({ id: 'PublisherList' });

/** A publisher application as its applicant and the admins see it. */
export const applicationSchema = z
  .object({
    id: z.number().int().positive(),
    status: z.enum(APPLICATION_STATUSES),
    workshop: z.string(),
    instruments: z.string(),
    link: z.string(),
    createdAt: timestamp,
    applicant: closedAccount.nullable(),
    decision: z.object({ at: timestamp, note: z.string().nullable(), by: handleOnly.nullable() }).nullable(),
  })
  .meta({ id: 'PublisherApplication' });

/** GET /publishers/applications. */
export const applicationListSchema = z.object({ items: z.array(applicationSchema) }).meta({ id: 'PublisherApplicationList' });

/** GET and PUT /publishers/settings. */
export const siteSettingsAnswerSchema = siteSettingsSchema.meta({ id: 'SiteSettings' });

/** A flag as the moderators see it; `subject` names what it is about (null just after flagging). */
export const flagSchema = z
  .object({
    id: z.number().int().positive(),
    subjectType: z.enum(FLAG_SUBJECTS),
    subjectId: z.number().int(),
    subject: z.object({ title: z.string(), path: z.string() }).nullable(),
    reason: z.enum(Object.keys(FLAG_REASONS) as [FlagReason, ...FlagReason[]]),
    reasonLabel: z.string(),
    text: z.string().nullable(),
    status: z.enum(FLAG_STATUSES),
    createdAt: timestamp,
    reporter: handleOnly.nullable(),
    resolution: z.object({ at: timestamp, note: z.string().nullable() }).nullable(),
  })
  .meta({ id: 'Flag' });

/** An open flag as an item of the desk. */
const deskFlagSchema = flagSchema.extend({ kind: z.literal('flag') });

/** GET /flags. */
export const flagListSchema = z.object({ items: z.array(deskFlagSchema) }).meta({ id: 'FlagList' });

/** One audit log line: who, what, on what, when, why, and whether it was done or refused. */
export const auditEntrySchema = z
  .object({
    id: z.number().int().positive(),
    at: timestamp,
    actor: z.object({ handle: z.string(), role: z.enum(ROLES) }).nullable(),
    /** What was attempted, e.g. "result.approve". */
    action: z.string(),
    outcome: z.enum(['done', 'refused']),
    subjectType: z.string(),
    subjectId: z.number().int().nullable(),
    reason: z.string().nullable(),
    /** What the action recorded beside it; its fields depend on the action. */
    details: z.record(z.string(), z.unknown()).nullable(),
  })
  .meta({ id: 'AuditEntry' });

/** GET /audit. */
export const auditPageSchema = pageOf(auditEntrySchema, 'AuditPage');

/** PATCH /admin/users/:handle: the account after the change. */
export const managedAccountChangeSchema = closedAccount.extend({ banned: z.boolean() }).meta({ id: 'ManagedAccountChange' });

/** An API token as listed to its owner: never the token, only the prefix to tell it apart. */
export const tokenSchema = z
  .object({
    id: z.number().int().positive(),
    name: z.string(),
    prefix: z.string(),
    createdAt: timestamp,
    lastUsedAt: timestamp.nullable(),
    revokedAt: timestamp.nullable(),
    active: z.boolean(),
  })
  .meta({ id: 'Token' });

/** GET /tokens. */
export const tokenListSchema = z.object({ items: z.array(tokenSchema) }).meta({ id: 'TokenList' });

/** POST /tokens: the new token with its secret, shown this once. */
export const createdTokenSchema = tokenSchema.extend({ token: z.string() }).meta({ id: 'CreatedToken' });

/** GET /dev/mail: the messages the local mail catcher holds, newest first. */
export const caughtMailSchema = z
  .array(z.object({ to: z.string(), subject: z.string(), text: z.string(), html: z.string(), date: z.string(), unsubscribe: z.string().optional() }))
  .meta({ id: 'CaughtMail' });

/** POST /review-desk/bulk-approve: the ids approved, and those refused with why. */
export const bulkApprovalSchema = z
  .object({ approved: z.array(z.number().int().positive()), refused: z.array(z.object({ id: z.number().int().positive(), reason: z.string() })) })
  .meta({ id: 'BulkApproval' });

/** GET /review-desk: pending results, proposed page edits, open flags, imports with results pending, corrections of published results. */
export const reviewDeskSchema = z
  .object({
    items: z.array(resultSchema.extend({ kind: z.literal('result'), importId: z.number().int().nullable() })),
    /** Proposed page edits (described with the reference pages). */
    revisions: z.array(z.looseObject({ kind: z.literal('page-revision'), id: z.number().int() })),
    flags: z.array(deskFlagSchema),
    imports: z.array(z.object({ id: z.number().int().positive(), publisher: closedAccount.nullable(), rows: z.number().int(), pending: z.number().int(), createdAt: timestamp })),
    resultRevisions: z.array(
      resultRevisionSchema.extend({ kind: z.literal('result-revision'), result: resultSchema, can: z.object({ review: z.boolean() }) }),
    ),
  })
  .meta({ id: 'ReviewDesk' });

/** GET /review-desk/results/:id/context: what the desk shows beside one pending result (shared/desk-context.ts computes it). */
export const deskContextSchema = z
  .object({
    resultId: z.number().int().positive(),
    /** The cell it would join: the approved results of its sharpness method, steel, abrasive material and whole-φ grit band. */
    cell: z.object({
      method: z.string().nullable(),
      steelId: z.number().int().positive(),
      material: z.string(),
      materialLabel: z.string(),
      gritPhi: z.number().int(),
      /** The cell's median readings: n, median and quartiles, g; null while it is empty. */
      figures: z.object({ n: z.number().int().positive(), median: z.number(), q1: z.number(), q3: z.number() }).nullable(),
      position: z.object({ percentileRank: z.number(), band: z.enum(['below-q1', 'q1-median', 'median', 'median-q3', 'above-q3']), words: z.string() }).nullable(),
      outlier: z.object({ rule: z.string(), source: z.string(), fences: z.tuple([z.number(), z.number()]).nullable(), outside: z.enum(['low', 'high']).nullable(), words: z.string() }),
    }),
    sharpnessMedianG: z.number(),
    readings: z.object({ required: z.number().int().nonnegative(), given: z.number().int().nonnegative(), short: z.number().int().nonnegative(), words: z.string() }),
    nearDuplicateRule: z.string(),
    nearDuplicates: z.array(
      z.object({
        id: z.number().int().positive(),
        status: z.enum(RESULT_STATUSES),
        author: closedAccount.nullable(),
        sameAuthor: z.boolean(),
        perSideDeg: z.number(),
        sharpnessMedianG: z.number(),
        createdAt: timestamp,
      }),
    ),
    authorRecord: z.object({
      published: z.number().int().nonnegative(),
      pending: z.number().int().nonnegative(),
      returnedNow: z.number().int().nonnegative(),
      everReturned: z.number().int().nonnegative(),
      rejected: z.number().int().nonnegative(),
    }),
  })
  .meta({ id: 'DeskContext' });

/** PUT /me/notifications: which e-mails the member now receives. */
export const notificationSettingsAnswerSchema = everyKey(Object.keys(EMAIL_TOPICS) as EmailTopic[], z.boolean()).meta({ id: 'NotificationSettings' });

/** POST /me/follows. */
export const followSchema = z.object({ pageType: z.enum(FOLLOWABLE_PAGES), slug: z.string(), following: z.literal(true) }).meta({ id: 'Follow' });

/** POST /me/duplicate-check: the member's results a new one would repeat. */
export const duplicatesSchema = z
  .object({ duplicates: z.array(z.object({ id: z.number().int().positive(), status: z.enum(RESULT_STATUSES), createdAt: timestamp })) })
  .meta({ id: 'Duplicates' });

/** POST /me/unsubscribe. */
export const unsubscribedSchema = z.object({ topic: z.enum(Object.keys(EMAIL_TOPICS) as [EmailTopic, ...EmailTopic[]]), topicLabel: z.string(), unsubscribed: z.literal(true) }).meta({ id: 'Unsubscribed' });

/** A photo of a result: its addresses, alt text and stored size. */
export const photoSchema = z
  .object({
    id: z.number().int().positive(),
    resultId: z.number().int().positive(),
    url: z.string(),
    thumbUrl: z.string(),
    alt: z.string(),
    width: z.number().int().positive(),
    height: z.number().int().positive(),
    bytes: z.number().int().positive(),
    createdAt: timestamp,
  })
  .meta({ id: 'Photo' });

/** GET /results/:id/photos: the photos, how many a result may carry, and whether the viewer may add one. */
export const photoListSchema = z.object({ items: z.array(photoSchema), max: z.number().int().positive(), canAdd: z.boolean() }).meta({ id: 'PhotoList' });

// The comparison and search (issue 19): what publishers script most.

/** Which method version a comparison answer is about. */
const comparedMethod = z.object({ slug: z.string(), name: z.string(), version: z.number().int().positive() });
/** A pair of figures, smallest first. */
const range = z.tuple([z.number(), z.number()]);

/** One comparison cell (method × steel × abrasive material × grit band) as the API gives it (server/queries/compare-view.ts presentCell). */
export const compareRowSchema = z
  .object({
    /** steel:material:φ, for the cell, paired and difference queries. */
    cell: z.string(),
    method: z.string(),
    methodName: z.string(),
    methodVersion: z.number().int().positive(),
    steel: z.string(),
    steelName: z.string(),
    steelCategory: z.string(),
    material: z.string(),
    materialLabel: z.string(),
    band: z.object({ phi: z.number(), step: z.union([z.literal(1), z.literal(0.5)]), loUm: z.number(), hiUm: z.number(), words: z.string() }),
    gritBand: z.object({ loUm: z.number(), hiUm: z.number() }),
    n: z.number().int().positive(),
    testers: z.number().int().positive(),
    fewResults: z.boolean(),
    singleTester: z.boolean(),
    /** Median readings of the cell's results, grams-force. */
    sharpnessG: z.object({ median: z.number(), q1: z.number(), q3: z.number(), mean: z.number(), sd: z.number().nullable(), ci95: range.nullable() }),
    /** The median pulled toward the method's overall median, for the "ranked" order. */
    rankedMedianG: z.number(),
    retentionCuts: z.object({ median: z.number(), n: z.number().int().positive() }).nullable(),
    hrcRange: range,
    angleRange: range,
    gritUmRange: range,
  })
  .meta({ id: 'CompareCellRow' });

/** GET /compare: one page of the view's cells with the totals of the whole view. */
export const compareTableSchema = z
  .object({
    method: comparedMethod.extend({ replaces: z.string().nullable(), replacedBy: z.string().nullable() }),
    step: z.union([z.literal(1), z.literal(0.5)]),
    /** `cells` from the precomputed cells; `results` when a filter needs each result. */
    source: z.enum(['cells', 'results']),
    liveFilters: z.array(z.enum(LIVE_FILTER_KEYS)),
    sort: z.string().nullable(),
    total: z.number().int().nonnegative(),
    totalResults: z.number().int().nonnegative(),
    methodResults: z.number().int().nonnegative(),
    shrinkage: z.object({ pseudoResults: z.number(), overallMedianG: z.number().nullable() }),
    page: z.number().int().positive(),
    pageSize: z.number().int().positive(),
    rows: z.array(compareRowSchema),
  })
  .meta({ id: 'CompareTable' });

/** GET /compare/cell: one cell's figures (null when the filters leave it empty) and a page of its results, newest first. */
export const compareCellSchema = z
  .object({
    method: comparedMethod,
    cell: compareRowSchema.nullable(),
    items: z.array(resultSchema),
    page: z.number().int().positive(),
    pageSize: z.number().int().positive(),
    total: z.number().int().nonnegative(),
  })
  .meta({ id: 'CompareCell' });

/** An interval between two order statistics, with its exact coverage and the 1-based ranks used. */
const orderInterval = z.object({ lo: z.number(), hi: z.number(), coverage: z.number(), ranks: z.tuple([z.number().int(), z.number().int()]) });

/** GET /compare/paired: per tester in both cells, their median in A minus their median in B; the median difference with its sign-test interval. */
export const comparePairedSchema = z
  .object({
    method: comparedMethod,
    a: compareRowSchema.nullable(),
    b: compareRowSchema.nullable(),
    /** The two cells' medians' difference A − B, g, ignoring who measured what. */
    unpairedMedianDiffG: z.number().nullable(),
    paired: z.object({
      pairs: z.array(z.object({ tester: z.string(), nA: z.number().int().positive(), nB: z.number().int().positive(), medianAG: z.number(), medianBG: z.number(), diffG: z.number() })),
      n: z.number().int().nonnegative(),
      medianDiffG: z.number().nullable(),
      ci95: orderInterval.nullable(),
      widest: orderInterval.nullable(),
      signs: z.object({ aLower: z.number().int().nonnegative(), bLower: z.number().int().nonnegative(), ties: z.number().int().nonnegative() }),
      unpairedTesters: z.object({ a: z.number().int().nonnegative(), b: z.number().int().nonnegative() }),
    }),
  })
  .meta({ id: 'ComparePaired' });

/** A shift B − A between two samples (Hodges–Lehmann, exact Mann–Whitney 95 % interval where one exists). */
const shiftSchema = z.object({
  nA: z.number().int().nonnegative(),
  nB: z.number().int().nonnegative(),
  estimate: z.number(),
  interval: orderInterval.nullable(),
  widestCoverage: z.number(),
  distribution: z.enum(['exact', 'normal']),
  unit: z.enum(['g', 'cuts']),
  words: z.string(),
});

/** GET /compare/difference: two cells as independent samples. */
export const compareDifferenceSchema = z
  .object({
    method: comparedMethod,
    a: compareRowSchema.nullable(),
    b: compareRowSchema.nullable(),
    sharpness: shiftSchema.nullable(),
    retention: shiftSchema.nullable(),
    withinEdge: z.object({ medianSdG: z.number().nullable(), edges: z.number().int().nonnegative(), readingsPerEdge: z.number().nullable() }),
    words: z.array(z.string()),
  })
  .meta({ id: 'CompareDifference' });

/** GET /compare/points: one chart point per result (an evenly spaced sample beyond `limit`), with the names of the steels and abrasives they name. */
export const comparePointsSchema = z
  .object({
    method: comparedMethod,
    total: z.number().int().nonnegative(),
    /** 1 when every result is a point; k when every k-th is. */
    sampledEvery: z.number().int().positive(),
    points: z.array(
      z.object({
        id: z.number().int().positive(),
        steel: z.string(),
        abrasive: z.string(),
        material: z.string(),
        gritUm: z.number(),
        medianG: z.number(),
        hrc: z.number(),
        perSideDeg: z.number(),
        retentionCuts: z.number().nullable(),
        author: z.string().nullable(),
      }),
    ),
    steels: z.record(z.string(), z.string()),
    abrasives: z.record(z.string(), z.object({ name: z.string(), material: z.string(), bond: z.string() })),
  })
  .meta({ id: 'ComparePoints' });

/** What search finds: reference pages, results and comparison cells. */
export const SEARCH_HIT_TYPES = ['steel', 'abrasive', 'method', 'result', 'cell'] as const;
/** Where the matched words are: [start, end) character offsets, in order. */
const spans = z.array(z.tuple([z.number().int().nonnegative(), z.number().int().nonnegative()]));

/** GET /search: hits best first (the best overall, then each kind's best few), and how many of each kind matched before the type filter. */
export const searchAnswerSchema = z
  .object({
    hits: z.array(
      z.object({
        type: z.enum(SEARCH_HIT_TYPES),
        /** A result's or a cell's id. */
        id: z.number().int().optional(),
        /** A reference page's slug. */
        slug: z.string().optional(),
        title: z.string(),
        snippet: z.string(),
        highlights: spans,
        titleHighlights: spans,
        /** The sub-facet: a steel's category, an abrasive's material. */
        group: z.string().optional(),
        score: z.number(),
        /** A comparison cell's place and figures (grams-force). */
        cell: z
          .object({ method: z.string(), ref: z.string(), n: z.number().int().positive(), testers: z.number().int().positive(), medianG: z.number(), q1G: z.number(), q3G: z.number() })
          .optional(),
      }),
    ),
    facets: everyKey(SEARCH_HIT_TYPES, z.number().int().nonnegative()),
    /** Per kind, matches per sub-facet. */
    groups: z.partialRecord(z.enum(SEARCH_HIT_TYPES), z.record(z.string(), z.number().int().nonnegative())),
  })
  .meta({ id: 'SearchAnswer' });

// Profiles, the import's report and the refusals that carry more than an error (issue 19).

/** A name with how many published results use it (a member's methods and steels). */
const countedPage = z.object({ slug: z.string(), name: z.string(), results: z.number().int().positive() });

/** GET /profiles/:handle: a member's public profile (never an e-mail address), with their ten latest published results. */
export const profileSchema = closedAccount
  .extend({
    bio: z.string().nullable(),
    joinedAt: timestamp,
    badge: badgeSchema,
    counts: z.object({ published: z.number().int().nonnegative(), withdrawn: z.number().int().nonnegative(), methods: z.number().int().nonnegative(), steels: z.number().int().nonnegative() }),
    /** Most used first. */
    methods: z.array(countedPage),
    /** Most used first, at most twelve. */
    steels: z.array(countedPage),
    recent: z.array(resultSchema),
  })
  .meta({ id: 'Profile' });

/** What checking an import file found: rows, rows that passed, each problem by row and column, a normalised preview. */
const importReportFields = {
  rows: z.number().int().nonnegative(),
  valid: z.number().int().nonnegative(),
  errors: z.array(z.object({ row: z.number().int().nonnegative(), column: z.string(), message: z.string() })),
  /** Header columns that match nothing and were ignored. */
  ignoredColumns: z.array(z.string()),
  preview: z.array(
    z.object({
      row: z.number().int().positive(),
      steel: z.string(),
      abrasive: z.string(),
      hrc: z.number(),
      gritGrade: z.string(),
      gritUm: z.number(),
      perSideDeg: z.number(),
      sharpnessMedianG: z.number(),
    }),
  ),
  /** Whether the rows would be published at once (the site trusts publishers' imports). */
  publishesAtOnce: z.boolean(),
};

/** An invented report of a two-row file, one row refused. */
const importReportExample = {
  rows: 2,
  valid: 1,
  errors: [{ row: 3, column: 'readings_g', message: 'not a number: "x"' }],
  ignoredColumns: ['colour'],
  preview: [{ row: 2, steel: 'aisi-d2', abrasive: 'cbn-electroplated-wheel-250-b126', hrc: 61, gritGrade: 'B126', gritUm: 126, perSideDeg: 15, sharpnessMedianG: 176 }],
  publishesAtOnce: false,
};

/** POST /import/results?dryRun=1: the report, nothing stored. */
export const importReportSchema = z.object(importReportFields).meta({ id: 'ImportReport', examples: [importReportExample] });

/** POST /import/results: how many results went in, in which import, and whether they wait for review. */
export const importedSchema = z
  .object({ imported: z.number().int().positive(), importId: z.number().int().positive(), status: z.enum(['pending', 'approved']) })
  .meta({ id: 'Imported', examples: [{ imported: 120, importId: 7, status: 'pending' }] });

/** POST /import/results refused (400): nothing was imported; the dry run's report says why. */
export const importRefusedSchema = z
  .object({ error: z.string(), ...importReportFields })
  .meta({ id: 'ImportRefused', examples: [{ error: 'Nothing was imported: 1 problem in the file.', ...importReportExample }] });

/**
 * A page edit refused because the page changed meanwhile (409 on a save; on approving a proposal
 * whose fields someone else changed too): the current revision, the fields both changed, and a
 * suggested merge (fields and body) to review and save.
 */
export const pageConflictSchema = z
  .object({
    error: z.string(),
    current: pageRevisionSchema,
    conflicts: z.array(z.string()),
    merged: z.object({ fields: z.record(z.string(), z.unknown()), body: richTextSchema }),
  })
  .meta({ id: 'PageConflict' });
