import { z } from 'zod';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '../vocabulary';
import { limits } from '../validations';
import { PROGRESSION_MAX } from '../progression';

/** Step counts a progression filter accepts, as query text. */
const PROGRESSION_STEP_COUNTS = Array.from({ length: PROGRESSION_MAX + 1 }, (_, i) => String(i)) as [string, ...string[]];

/**
 * The comparison's query: which cells (method × steel × abrasive material × grit band) to show,
 * filtered and sorted. One schema serves GET /api/compare, its export, the paired comparison,
 * the drill-down and the chart points, and the client's URL: the whole view is in the URL.
 */

/** Columns the comparison can be sorted by; a leading "-" sorts descending. */
export const COMPARE_SORT_KEYS = [
  'steel',
  'material',
  'band',
  'n',
  'testers',
  'median',
  'q1',
  'q3',
  'mean',
  'ci',
  'retention',
  'hrc',
  'angle',
  'ranked',
] as const;
export type CompareSortKey = (typeof COMPARE_SORT_KEYS)[number];

// The same rule as result.ts's slugSchema, written here so that result.ts can re-export this
// file's schema without an import cycle.
const slugSchema = z
  .string()
  .trim()
  .min(1, 'required')
  .max(limits.slugMax)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'must be a slug: lower-case letters, digits and hyphens');

/** A sort key, optionally descending ("-median"). */
const sortSchema = z
  .string()
  .regex(new RegExp(`^-?(${COMPARE_SORT_KEYS.join('|')})$`), `must be one of ${COMPARE_SORT_KEYS.join(', ')}, optionally with a leading "-"`)
  .optional();

/** The widest page of cells one request may ask for (the pivot view asks for a method's all). */
export const COMPARE_PAGE_MAX = 5000;
/** Rows per page when the query does not say. */
export const COMPARE_PAGE_DEFAULT = 100;

/** A list given as repeated parameters (`steel=a&steel=b`) or comma-separated (`steel=a,b`). */
const listOf = <T extends z.ZodType<string>>(item: T, max: number) =>
  z.preprocess(
    (v) => {
      if (v === undefined || v === '') return undefined;
      const parts = (Array.isArray(v) ? v : [v]).flatMap((x) => (typeof x === 'string' ? x.split(',') : [x]));
      const cleaned = parts.map((x) => (typeof x === 'string' ? x.trim() : x)).filter((x) => x !== '');
      return cleaned.length ? [...new Set(cleaned)] : undefined;
    },
    z.array(item).max(max, `at most ${max} values`).optional(),
  );

const keys = <T extends Record<string, string>>(table: T) => Object.keys(table) as [keyof T & string, ...(keyof T & string)[]];

/** Query values arrive as text: "1", "true", "yes" and "on" are true; "0", "false", "no", "off" false. */
const flag = z.preprocess((v) => {
  if (v === undefined || v === '') return undefined;
  if (typeof v === 'boolean') return v;
  const s = String(v).toLowerCase();
  if (['1', 'true', 'yes', 'on'].includes(s)) return true;
  if (['0', 'false', 'no', 'off'].includes(s)) return false;
  return v;
}, z.boolean({ message: 'must be true or false (1 or 0)' }).optional());

const number = (min: number, max: number, what: string) =>
  z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number({ message: `must be a number (${what})` }).min(min).max(max).optional());

/** A calendar day as YYYY-MM-DD (UTC). */
const day = z.preprocess(
  (v) => (v === '' ? undefined : v),
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date written YYYY-MM-DD')
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), 'is not a real date')
    .optional(),
);

/** The band width: whole φ units (the default) or half φ units. */
export const bandStepSchema = z.preprocess(
  (v) => (v === undefined || v === '' ? 1 : Number(v)),
  z.union([z.literal(1), z.literal(0.5)], { message: 'must be 1 (whole φ) or 0.5 (half φ)' }),
);
export type BandStep = 1 | 0.5;

/** Filters shared by every comparison endpoint (everything but sorting and paging). */
export const compareFilterShape = {
  /** Method version slug; without it, the method version with the most published results. */
  method: slugSchema.optional(),
  steel: listOf(slugSchema, 100),
  category: listOf(z.enum(keys(STEEL_CATEGORIES)), 10),
  material: listOf(z.enum(keys(ABRASIVE_MATERIALS)), 20),
  bond: listOf(z.enum(keys(BONDS)), 10),
  step: bandStepSchema,
  /** Particle-size range, µm: cells whose band overlaps it. */
  umMin: number(0.01, 10_000, 'µm'),
  umMax: number(0.01, 10_000, 'µm'),
  /** Hardness range in HRC (the client converts other scales to HRC with shared/hardness.ts). */
  hrcMin: number(0, 100, 'HRC'),
  hrcMax: number(0, 100, 'HRC'),
  /** Edge angle per side, degrees. */
  angleMin: number(0, 90, 'degrees per side'),
  angleMax: number(0, 90, 'degrees per side'),
  /** Only results posted by verified publishers. */
  publisher: flag,
  /** Posted on or after / on or before this day (UTC). */
  postedFrom: day,
  postedTo: day,
  /** Only results whose progression passed through one of these abrasive materials. */
  via: listOf(z.enum(keys(ABRASIVE_MATERIALS)), 20),
  /** Only results with one of these numbers of steps before the final abrasive (0: none recorded). */
  steps: listOf(z.enum(PROGRESSION_STEP_COUNTS, { message: `must be a whole number of steps, 0 to ${PROGRESSION_MAX}` }), PROGRESSION_MAX + 1),
};

const orderedPairs = <T extends Record<string, unknown>>(schema: z.ZodType<T>) =>
  schema.superRefine((v, ctx) => {
    const pairs: [string, string][] = [
      ['umMin', 'umMax'],
      ['hrcMin', 'hrcMax'],
      ['angleMin', 'angleMax'],
      ['postedFrom', 'postedTo'],
    ];
    for (const [lo, hi] of pairs) {
      const a = v[lo] as number | string | undefined;
      const b = v[hi] as number | string | undefined;
      if (a !== undefined && b !== undefined && a > b) ctx.addIssue({ code: 'custom', path: [hi], message: `must not be below ${lo} (${a})` });
    }
  });

/** GET /api/compare (and the client's URL): filters, sorting, paging, and the ranked order. */
export const compareQuerySchema = orderedPairs(
  z
    .object({
      ...compareFilterShape,
      sort: sortSchema,
      page: z.coerce.number().int().min(1).max(100_000).default(1),
      pageSize: z.coerce.number().int().min(1).max(COMPARE_PAGE_MAX).default(COMPARE_PAGE_DEFAULT),
    })
    .strict(),
);
export type CompareQuery = z.infer<typeof compareQuerySchema>;

/** The filters alone (what a cell's drill-down, the chart points and the export share). */
export const compareFiltersSchema = orderedPairs(z.object(compareFilterShape).strict());
export type CompareFilters = z.infer<typeof compareFiltersSchema>;

/**
 * A cell named in a URL: `steel:material:phi`, where phi is the φ of the band's coarse edge
 * (a whole number, or ending in .5 for half bands), e.g. "aisi-d2:cbn:6".
 */
export const cellRefSchema = z
  .string()
  .trim()
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*:[a-z-]+:-?\d+(?:\.5)?$/, 'must name a cell as steel:material:phi, e.g. aisi-d2:cbn:6')
  .transform((s) => {
    const [steel, material, phi] = s.split(':');
    return { steel, material, phi: Number(phi) };
  });
export type CellRef = z.infer<typeof cellRefSchema>;

/** GET /api/compare/cell: one cell's figures and its results, under the view's filters. */
export const compareCellQuerySchema = orderedPairs(
  z
    .object({
      ...compareFilterShape,
      cell: cellRefSchema,
      page: z.coerce.number().int().min(1).max(100_000).default(1),
    })
    .strict(),
);

/** GET /api/compare/paired: tester-paired differences between two cells of one method. */
export const comparePairedQuerySchema = orderedPairs(
  z
    .object({
      ...compareFilterShape,
      a: cellRefSchema,
      b: cellRefSchema,
    })
    .strict(),
);

/** GET /api/compare/export: the view as CSV or JSON, with licence and citation. */
export const compareExportQuerySchema = orderedPairs(
  z
    .object({
      ...compareFilterShape,
      sort: sortSchema,
      format: z.enum(['csv', 'json']).default('csv'),
    })
    .strict(),
);

/** GET /api/compare/points: the results behind the charts (one point per result). */
export const comparePointsQuerySchema = orderedPairs(
  z
    .object({
      ...compareFilterShape,
      limit: z.coerce.number().int().min(1).max(20_000).default(4000),
    })
    .strict(),
);

/** Which query keys are filters (everything the precomputed cells can answer is the rest). */
export const LIVE_FILTER_KEYS = ['bond', 'hrcMin', 'hrcMax', 'angleMin', 'angleMax', 'publisher', 'postedFrom', 'postedTo', 'via', 'steps'] as const;
