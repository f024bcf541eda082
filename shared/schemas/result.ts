import { z } from 'zod';
import { limits } from '../validations';
import { richTextSchema } from '../rich-text';
import { ComputationError } from '../computation-error';
import { parseGrit } from '../grit';
import { HARDNESS_SCALES, toHrc } from '../hardness';
import { angleFromSetup } from '../geometry';
import { gritInputSchema, slugSchema } from './common';
import { checkProgressionGrits, progressionSchema } from '../progression';

/** A page's slug (in ./common.ts, so that shared/progression.ts can use it without a cycle). */
export { slugSchema };

export const wheelSetupSchema = z
  .object({
    wheelDiameterMm: z.number().positive().max(2000),
    barDiameterMm: z.number().positive().max(200),
    gapMm: z.number().min(0).max(1000),
    projectionMm: z.number().positive().max(2000),
  })
  .strict();

export const edgeAngleSchema = z.union([
  z.object({ perSideDeg: z.number().gt(0, 'must be above 0°').max(60, 'must be at most 60° per side') }).strict(),
  z.object({ setup: wheelSetupSchema }).strict(),
]);

export const RESULT_STATUSES = ['draft', 'pending', 'approved', 'returned', 'rejected', 'retracted'] as const;
export type ResultStatus = (typeof RESULT_STATUSES)[number];

/**
 * A result revision's state: `applied` at once (an edit before publication), or, for a
 * correction of a published result, `pending` until a moderator approves, returns or rejects
 * it; a newer correction `supersedes` one still waiting.
 */
export const RESULT_REVISION_STATUSES = ['applied', 'pending', 'approved', 'returned', 'rejected', 'superseded'] as const;
export type ResultRevisionStatus = (typeof RESULT_REVISION_STATUSES)[number];

/** What a member posts as one measured edge (POST /api/results and the new-result form). */
export const resultInputSchema = z
  .object({
    steel: slugSchema,
    hardness: z
      .object({
        value: z.number().positive().max(2000),
        scale: z.enum(HARDNESS_SCALES),
        measured: z.boolean().optional(),
      })
      .strict(),
    heatTreatment: z.string().trim().max(500).optional(),
    /** The steps before the final abrasive (shared/progression.ts). */
    progression: progressionSchema.optional(),
    abrasive: slugSchema,
    grit: gritInputSchema.optional(),
    edgeAngle: edgeAngleSchema,
    sharpness: z
      .object({
        method: slugSchema,
        readingsG: z
          .array(z.number().positive('a reading must be above 0 g').max(limits.readingGMax))
          .min(1, 'at least one reading')
          .max(limits.readingsMax),
      })
      .strict(),
    retention: z
      .object({
        method: slugSchema,
        cuts: z.number().int().min(0).max(limits.cutsMax),
      })
      .strict()
      .optional(),
    notes: richTextSchema.optional(),
  })
  .strict()
  .superRefine((input, ctx) => {
    const check = (path: (string | number)[], run: () => unknown) => {
      try {
        run();
      } catch (err) {
        if (!(err instanceof ComputationError)) throw err;
        ctx.addIssue({ code: 'custom', path, message: err.message });
      }
    };
    check(['hardness', 'value'], () => toHrc(input.hardness.value, input.hardness.scale));
    if (input.grit) check(['grit', 'grade'], () => parseGrit(input.grit!.grade, input.grit!.standard));
    if ('setup' in input.edgeAngle) {
      const setup = input.edgeAngle.setup;
      check(['edgeAngle', 'setup'], () => angleFromSetup(setup));
    }
    checkProgressionGrits(input.progression, (path, message) => ctx.addIssue({ code: 'custom', path, message }));
  });

export type ResultInput = z.infer<typeof resultInputSchema>;

export const reviewInputSchema = z
  .object({
    decision: z.enum(['approve', 'return', 'reject']),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.decision !== 'approve' && !v.note) {
      ctx.addIssue({ code: 'custom', path: ['note'], message: 'say what to change, or why it is rejected' });
    }
  });
export type ReviewInput = z.infer<typeof reviewInputSchema>;

export const resultListQuerySchema = z
  .object({
    status: z.enum(RESULT_STATUSES).optional(),
    steel: slugSchema.optional(),
    abrasive: slugSchema.optional(),
    method: slugSchema.optional(),
    author: z.string().max(limits.handleMax).optional(),
    page: z.coerce.number().int().min(1).max(100_000).default(1),
  })
  .strict();

/** The comparison's query lives in ./compare.ts with its other schemas; kept here for old importers. */
export { compareQuerySchema } from './compare';

export const searchQuerySchema = z
  .object({
    q: z.string().trim().min(1, 'type something to search for').max(limits.searchQueryMax),
    type: z.enum(['steel', 'abrasive', 'method', 'result', 'cell']).optional(),
  })
  .strict();

/** The path of a route that names one revision of a result (`/results/:id/revisions/:rev`). */
export const resultRevisionParams = z.object({ id: z.coerce.number().int().positive(), rev: z.coerce.number().int().positive() }).strict();
