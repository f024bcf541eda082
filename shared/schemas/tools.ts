import { z } from 'zod';
import { GRIT_STANDARDS } from '../grit';
import { HARDNESS_SCALES } from '../hardness';
import { MAX_CYCLES } from '../retention';

const mm = (max: number) => z.coerce.number().finite().min(0).max(max);
/** A blade-plane offset from the bar's axis, mm: either side (DESIGN.md). */
const offset = z.coerce.number().finite().min(-200).max(200);

/** GET /api/tools/grit */
export const gritToolQuerySchema = z
  .object({
    grade: z.string().trim().min(1, 'type a grade, e.g. F400, #6000, D46 or 15 µm').max(40),
    standard: z.enum(GRIT_STANDARDS).optional(),
    step: z.enum(['1', '0.5']).optional(),
  })
  .strict();

/** GET /api/tools/hardness */
export const hardnessToolQuerySchema = z
  .object({ value: z.coerce.number().finite().positive(), scale: z.enum(HARDNESS_SCALES) })
  .strict();

/** GET /api/tools/angle: with `gapMm` gives the angle; with `perSideDeg` instead gives the gap. */
export const angleToolQuerySchema = z
  .object({
    wheelDiameterMm: mm(2000).positive(),
    barDiameterMm: mm(200).positive(),
    projectionMm: mm(2000).positive(),
    gapMm: mm(1000).optional(),
    perSideDeg: z.coerce.number().finite().gt(0).lt(90).optional(),
    offsetMm: offset.optional(),
  })
  .strict()
  .refine((q) => (q.gapMm === undefined) !== (q.perSideDeg === undefined), {
    message: 'give either gapMm (to get the angle) or perSideDeg (to get the gap), not both',
    path: ['gapMm'],
  });

/** GET /api/tools/side-angle: a flat bevel on a wheel's side; with `gapMm` gives the angle, with `perSideDeg` the gap. */
export const sideAngleToolQuerySchema = z
  .object({
    barDiameterMm: mm(200).positive(),
    projectionMm: mm(2000).positive(),
    gapMm: mm(1000).optional(),
    perSideDeg: z.coerce.number().finite().gt(0).lt(90).optional(),
    offsetMm: offset.optional(),
  })
  .strict()
  .refine((q) => (q.gapMm === undefined) !== (q.perSideDeg === undefined), {
    message: 'give either gapMm (to get the angle) or perSideDeg (to get the gap), not both',
    path: ['gapMm'],
  });

/** GET /api/tools/wear-drift */
export const wearDriftQuerySchema = z
  .object({
    originalDiameterMm: mm(2000).positive(),
    currentDiameterMm: mm(2000).positive(),
    barDiameterMm: mm(200).positive(),
    gapMm: mm(1000),
    projectionMm: mm(2000).positive(),
    offsetMm: offset.optional(),
  })
  .strict();

/** POST /api/tools/retention */
export const retentionToolBodySchema = z
  .object({ cutsMm: z.array(z.number().finite().min(0).max(10_000)).min(1, 'give at least one cycle').max(MAX_CYCLES) })
  .strict();
