import { z } from 'zod';
import { COOLANTS } from '../vocabulary';

/** Where a grinder's support bar mounts: facing into the wheel's rotation, with it, or beside the face. */
export const BAR_MOUNTS = {
  'into-rotation': 'Facing into the rotation (edge leading)',
  'with-rotation': 'With the rotation (edge trailing)',
  side: 'Beside the wheel’s face (flat bevels)',
} as const;
export type BarMount = keyof typeof BAR_MOUNTS;

const name = z.string().trim().min(1, 'required').max(120);
const money = z.number().finite().min(0).max(1_000_000);
/** ISO 4217 code, e.g. EUR, USD. */
const currency = z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, 'a three-letter currency code, e.g. EUR');
const isoDate = z.iso.date('a date as yyyy-mm-dd');

/** POST /api/workshop/grinders */
export const grinderInputSchema = z
  .object({
    name,
    spindleRpm: z.number().finite().positive().max(60_000),
    barDiameterMm: z.number().finite().positive().max(200),
    barMount: z.enum(Object.keys(BAR_MOUNTS) as [BarMount, ...BarMount[]]),
    pricePaid: money.optional(),
    currency: currency.optional(),
  })
  .strict()
  .refine((g) => (g.pricePaid === undefined) === (g.currency === undefined), { message: 'give a price with its currency', path: ['currency'] });
export type GrinderInput = z.infer<typeof grinderInputSchema>;

/** POST /api/workshop/jigs */
export const jigInputSchema = z.object({ name, offsetMm: z.number().finite().min(-200).max(200) }).strict();
export type JigInput = z.infer<typeof jigInputSchema>;

/** POST /api/workshop/setups */
export const setupInputSchema = z
  .object({
    name,
    jigId: z.number().int().positive().nullable().optional(),
    projectionMm: z.number().finite().positive().max(2000),
    perSideDeg: z.number().finite().gt(0).lt(90),
  })
  .strict();
export type SetupInput = z.infer<typeof setupInputSchema>;

/** POST /api/workshop/wheels: a wheel from an abrasive page, on one of the member's grinders. */
export const workshopWheelInputSchema = z
  .object({
    name,
    abrasive: z.string().trim().min(1, 'choose the abrasive page').max(80),
    grinderId: z.number().int().positive(),
    originalDiameterMm: z.number().finite().positive().max(2000),
    minDiameterMm: z.number().finite().positive().max(2000).optional(),
    ratedSpeedMps: z.number().finite().positive().max(200),
    coolant: z.enum(Object.keys(COOLANTS) as [keyof typeof COOLANTS, ...(keyof typeof COOLANTS)[]]).optional(),
    acquiredOn: isoDate.optional(),
    pricePaid: money.optional(),
    currency: currency.optional(),
  })
  .strict()
  .refine((w) => w.minDiameterMm === undefined || w.minDiameterMm < w.originalDiameterMm, {
    message: 'smaller than the diameter when new',
    path: ['minDiameterMm'],
  })
  .refine((w) => (w.pricePaid === undefined) === (w.currency === undefined), { message: 'give a price with its currency', path: ['currency'] });
export type WorkshopWheelInput = z.infer<typeof workshopWheelInputSchema>;

/** POST /api/workshop/wheels/:id/retire */
export const retireWheelSchema = z.object({ retiredOn: isoDate, retiredAfterSharpenings: z.number().int().min(0).max(1_000_000) }).strict();
export type RetireWheelInput = z.infer<typeof retireWheelSchema>;

/** POST /api/price-reports: a price paid for an abrasive, no shop named. */
export const priceReportInputSchema = z
  .object({
    abrasive: z.string().trim().min(1, 'choose the abrasive page').max(80),
    price: money.positive(),
    currency,
    paidOn: isoDate,
    condition: z.enum(['new', 'used']),
  })
  .strict();
export type PriceReportInput = z.infer<typeof priceReportInputSchema>;

/** GET /api/price-reports?abrasive= */
export const priceReportQuerySchema = z.object({ abrasive: z.string().trim().min(1).max(80) }).strict();
