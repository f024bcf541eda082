import { z } from 'zod';

/** POST /api/wheels: a wheel added to the member's log. */
export const wheelInputSchema = z
  .object({
    name: z.string().trim().min(1, 'required').max(120),
    abrasive: z.string().trim().max(80).optional(),
    wears: z.boolean(),
    originalDiameterMm: z.number().positive().max(2000),
    barDiameterMm: z.number().positive().max(200),
    projectionMm: z.number().positive().max(2000),
    usualAnglesDeg: z.array(z.number().gt(0).lt(60)).min(1, 'give at least one angle').max(8),
  })
  .strict();
export type WheelInput = z.infer<typeof wheelInputSchema>;

/**
 * POST /api/wheels/:id/measurements (and PATCH …/measurements/:mid): a measured diameter on a date,
 * whether the wheel was just dressed, and the sharpenings done since the entry before.
 */
export const wheelMeasurementSchema = z
  .object({
    measuredOn: z.iso.date('a date as yyyy-mm-dd'),
    diameterMm: z.number().positive().max(2000),
    dressed: z.boolean().optional(),
    sharpenings: z.number().int().min(0).max(100_000).optional(),
  })
  .strict();
export type WheelMeasurementInput = z.infer<typeof wheelMeasurementSchema>;

/** The path of a route that names one measurement of one wheel (`/wheels/:id/measurements/:measurementId`). */
export const measurementParams = z.object({ id: z.coerce.number().int().positive(), measurementId: z.coerce.number().int().positive() }).strict();
