import { z } from 'zod';
import { richTextSchema, type RichTextNode } from '../rich-text';
import { ComputationError } from '../computation-error';
import { GRIT_STANDARDS, parseGrit } from '../grit';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS, DESIGNATION_SYSTEMS, STEEL_CATEGORIES } from '../vocabulary';
import { limits } from '../validations';
import { slugSchema } from './result';

/**
 * The editable fields of each reference page type, as the wiki's forms show them and as a page
 * revision stores them (`fields`). One schema per page type serves the server's validation of
 * PUT /api/{steels,abrasives,methods}/:slug and the client's form (react-hook-form's zod resolver).
 * The slug is not editable (links point at it); a method's version is not either (a changed
 * protocol is a new version with its own page).
 */

export const PAGE_TYPES = ['steel', 'abrasive', 'method'] as const;
export type PageType = (typeof PAGE_TYPES)[number];

/** The API's plural section for each page type ("/api/steels/…"). */
export const PAGE_SECTIONS: Record<PageType, 'steels' | 'abrasives' | 'methods'> = { steel: 'steels', abrasive: 'abrasives', method: 'methods' };

/** The path of a page route (`/steels/:slug`). */
export const slugParams = z.object({ slug: slugSchema }).strict();

/** The path of one revision of a page (`/steels/:slug/revisions/:id`). */
export const revisionParams = z.object({ slug: slugSchema, id: z.coerce.number().int().positive() }).strict();

const keysOf = <T extends Record<string, string>>(table: T) => Object.keys(table) as [keyof T & string, ...(keyof T & string)[]];
const text = (max: number) => z.string().trim().min(1, 'required').max(max, `at most ${max} characters`);
const optionalText = (max: number) => z.string().trim().max(max, `at most ${max} characters`).nullable();

/** One source behind a page: a standard, a handbook, an article or a web page. */
export const citationSchema = z
  .object({
    title: text(300),
    /** Author or organisation. */
    organisation: z.string().trim().max(200).default(''),
    /** Year of the edition cited, or null when unknown. */
    year: z.number().int('a whole year').min(1500, 'a year after 1500').max(2100, 'a year before 2100').nullable().default(null),
    /** Standard number, e.g. "ASTM A681". */
    standard: z.string().trim().max(100).optional(),
    url: z
      .string()
      .trim()
      .max(2000)
      .regex(/^https?:\/\/[^\s<>"]+$/i, 'an address starting with http:// or https://')
      .optional(),
    /** Which statements on the page this source supports. */
    supports: text(300),
  })
  .strict()
  .transform((c) => ({
    ...c,
    standard: c.standard ? c.standard : undefined,
    url: c.url ? c.url : undefined,
  }));
export type CitationInput = z.infer<typeof citationSchema>;

/** Infobox fields that may point at a citation, per page type. */
export const SOURCE_FIELDS = {
  steel: ['category', 'designations', 'composition', 'hardnessHrc'],
  abrasive: ['material', 'bond', 'form', 'grit', 'gritRange', 'wheelDiameterMm', 'widthMm', 'wears', 'coolant', 'sideUsable', 'priceNote'],
  method: ['instrument', 'medium', 'readingsPerEdge', 'retentionMedium', 'thresholdG'],
} as const satisfies Record<PageType, readonly string[]>;

const citationsSchema = z.array(citationSchema).max(40, 'at most 40 citations');
const sourcesSchema = <T extends PageType>(type: T) =>
  z.partialRecord(z.enum(SOURCE_FIELDS[type] as unknown as [string, ...string[]]), z.number().int().min(0)).default({});

/** Each `sources` entry must name an existing citation. */
function checkSources(v: { citations: unknown[]; sources: Record<string, number | undefined> }, ctx: z.RefinementCtx) {
  for (const [field, index] of Object.entries(v.sources)) {
    if (index !== undefined && index >= v.citations.length) {
      ctx.addIssue({ code: 'custom', path: ['sources', field], message: `points at citation ${index + 1}, but the page has ${v.citations.length}` });
    }
  }
}

const compositionLimitSchema = z
  .object({
    element: z.string().trim().regex(/^[A-Z][a-z]?$/, 'a chemical symbol such as C, Cr or Mo'),
    /** wt %; null when the standard gives a maximum only. */
    min: z.number().min(0, 'at least 0 %').max(100, 'at most 100 %').nullable(),
    max: z.number().gt(0, 'above 0 %').max(100, 'at most 100 %'),
  })
  .strict()
  .refine((l) => l.min === null || l.min <= l.max, { path: ['min'], message: 'the minimum must not exceed the maximum' });

const steelShape = {
  name: text(200),
  category: z.enum(keysOf(STEEL_CATEGORIES)),
  designations: z
    .array(z.object({ system: z.enum(DESIGNATION_SYSTEMS), code: text(40) }).strict())
    .min(1, 'at least one designation')
    .max(20),
  /** Composition limits in wt %, from the standard cited for them. */
  composition: z.array(compositionLimitSchema).max(30),
  /** Typical working hardness for blades, HRC. */
  hardnessHrc: z
    .object({ min: z.number().min(20, 'at least 20 HRC').max(72, 'at most 72 HRC'), max: z.number().min(20).max(72, 'at most 72 HRC') })
    .strict()
    .refine((h) => h.min <= h.max, { path: ['min'], message: 'the lower hardness must not exceed the upper' })
    .nullable(),
  citations: citationsSchema.default([]),
  sources: sourcesSchema('steel'),
};

function checkSteel(v: { designations: { system: string; code: string }[]; composition: { element: string }[] }, ctx: z.RefinementCtx) {
  const seen = new Set<string>();
  v.designations.forEach((d, i) => {
    const key = `${d.system} ${d.code.toLowerCase()}`;
    if (seen.has(key)) ctx.addIssue({ code: 'custom', path: ['designations', i, 'code'], message: `${d.system} ${d.code} is listed twice` });
    seen.add(key);
  });
  const elements = new Set<string>();
  v.composition.forEach((l, i) => {
    if (elements.has(l.element)) ctx.addIssue({ code: 'custom', path: ['composition', i, 'element'], message: `${l.element} is listed twice` });
    elements.add(l.element);
  });
}

const positiveMm = (max: number) => z.number().gt(0, 'above 0 mm').max(max, `at most ${max} mm`).nullable();

const abrasiveShape = {
  name: text(200),
  material: z.enum(keysOf(ABRASIVE_MATERIALS)),
  bond: z.enum(keysOf(BONDS)),
  form: z.enum(keysOf(ABRASIVE_FORMS)),
  grit: z.object({ standard: z.enum(GRIT_STANDARDS), grade: text(40) }).strict(),
  /** For dressable stones: the span of grades (same standard) the surface can be dressed to, coarse to fine. */
  gritRange: z.object({ from: text(40), to: text(40) }).strict().nullable().default(null),
  wheelDiameterMm: positiveMm(2000),
  widthMm: positiveMm(500),
  wears: z.boolean(),
  coolant: z.enum(keysOf(COOLANTS)),
  sideUsable: z.boolean(),
  priceNote: optionalText(120).default(null),
  citations: citationsSchema.default([]),
  sources: sourcesSchema('abrasive'),
};

function checkAbrasive(v: { grit: { standard: (typeof GRIT_STANDARDS)[number]; grade: string }; gritRange: { from: string; to: string } | null }, ctx: z.RefinementCtx) {
  const read = (path: (string | number)[], grade: string) => {
    try {
      parseGrit(grade, v.grit.standard);
    } catch (err) {
      if (!(err instanceof ComputationError)) throw err;
      ctx.addIssue({ code: 'custom', path, message: err.message });
    }
  };
  read(['grit', 'grade'], v.grit.grade);
  if (v.gritRange) {
    read(['gritRange', 'from'], v.gritRange.from);
    read(['gritRange', 'to'], v.gritRange.to);
  }
}

const methodShape = {
  name: text(200),
  instrument: text(300),
  medium: text(300),
  readingsPerEdge: z.number().int('a whole number').min(1, 'at least 1').max(limits.readingsMax, `at most ${limits.readingsMax}`),
  retentionMedium: optionalText(300),
  /** Retention ends when the sharpness reading passes this force, grams. */
  thresholdG: z.number().gt(0, 'above 0 g').max(limits.readingGMax).nullable(),
  citations: citationsSchema.default([]),
  sources: sourcesSchema('method'),
};

/** The editable field names per page type, in the order forms and diffs show them. */
export const EDITABLE_FIELDS = {
  steel: Object.keys(steelShape) as (keyof typeof steelShape)[],
  abrasive: Object.keys(abrasiveShape) as (keyof typeof abrasiveShape)[],
  method: Object.keys(methodShape) as (keyof typeof methodShape)[],
} as const;

/** The words for each editable field, as forms and diffs label them. */
export const FIELD_LABELS: Record<string, string> = {
  name: 'Name',
  category: 'Category',
  designations: 'Designations',
  composition: 'Composition (wt %)',
  hardnessHrc: 'Typical hardness (HRC)',
  material: 'Material',
  bond: 'Bond',
  form: 'Form',
  grit: 'Grit',
  gritRange: 'Dressable range',
  wheelDiameterMm: 'Diameter (mm)',
  widthMm: 'Width (mm)',
  wears: 'Wears in use',
  coolant: 'Coolant',
  sideUsable: 'Side usable for flat bevels',
  priceNote: 'Price',
  instrument: 'Instrument',
  medium: 'Test medium',
  readingsPerEdge: 'Readings per edge',
  retentionMedium: 'Retention medium',
  thresholdG: 'Retention threshold (g)',
  citations: 'References',
  sources: 'Sources of infobox values',
  body: 'Text',
};

export const steelFieldsSchema = z.object(steelShape).strict().superRefine(checkSteel).superRefine(checkSources);
export const abrasiveFieldsSchema = z.object(abrasiveShape).strict().superRefine(checkAbrasive).superRefine(checkSources);
export const methodFieldsSchema = z.object(methodShape).strict().superRefine(checkSources);

export type SteelFields = z.infer<typeof steelFieldsSchema>;
export type AbrasiveFields = z.infer<typeof abrasiveFieldsSchema>;
export type MethodFields = z.infer<typeof methodFieldsSchema>;
export type PageFields = SteelFields | AbrasiveFields | MethodFields;

/** What every edit carries besides the fields: the revision it started from, why, and the body. */
const editShape = {
  /** Id of the revision the editor started from; a different current revision means someone saved first. */
  baseRevision: z.number().int().positive('a revision id'),
  summary: text(300),
  body: richTextSchema.nullable(),
};

/** PUT /api/steels/:slug: the steel fields, the body, a summary and the base revision. */
export const steelEditSchema = z.object({ ...steelShape, ...editShape }).strict().superRefine(checkSteel).superRefine(checkSources);
/** PUT /api/abrasives/:slug. */
export const abrasiveEditSchema = z.object({ ...abrasiveShape, ...editShape }).strict().superRefine(checkAbrasive).superRefine(checkSources);
/** PUT /api/methods/:slug. */
export const methodEditSchema = z.object({ ...methodShape, ...editShape }).strict().superRefine(checkSources);

export const pageEditSchemas = { steel: steelEditSchema, abrasive: abrasiveEditSchema, method: methodEditSchema } as const;
export const pageFieldsSchemas = { steel: steelFieldsSchema, abrasive: abrasiveFieldsSchema, method: methodFieldsSchema } as const;

/**
 * What a new page carries besides its fields: its slug (made from the name when left out, by
 * `slugFromName`, and held to the same rule as every page's slug), why, and the body.
 */
const createShape = {
  slug: slugSchema.optional(),
  summary: text(300).default('First version.'),
  body: richTextSchema.nullable(),
};

/** POST /api/{steels,abrasives,methods}: a new page, with the same fields as an edit. */
export const pageCreateSchemas = {
  steel: z.object({ ...steelShape, ...createShape }).strict().superRefine(checkSteel).superRefine(checkSources),
  abrasive: z.object({ ...abrasiveShape, ...createShape }).strict().superRefine(checkAbrasive).superRefine(checkSources),
  method: z.object({ ...methodShape, ...createShape }).strict().superRefine(checkSources),
} as const;
export type PageCreate = z.infer<(typeof pageCreateSchemas)[PageType]>;

/**
 * The slug a page name gives: accents dropped, lower case, every run of other characters one
 * hyphen, cut to the slug's length limit ("EN 1.2379 (D2)" → "en-1-2379-d2"). Empty when the name
 * has no letter or digit of the Latin alphabet; the caller then asks for a slug.
 */
export function slugFromName(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .slice(0, limits.slugMax)
    .replace(/^-+|-+$/g, '');
}

/** A new page's slug and content, as its first revision stores them. */
export function splitCreate(type: PageType, input: PageCreate): { slug: string; summary: string; content: PageContent } {
  const { slug, summary, body, ...fields } = input;
  return { slug: slug ?? slugFromName(input.name), summary, content: { fields: normalizeFields(type, fields), body } };
}

export type SteelEdit = z.infer<typeof steelEditSchema>;
export type AbrasiveEdit = z.infer<typeof abrasiveEditSchema>;
export type MethodEdit = z.infer<typeof methodEditSchema>;
export type PageEdit = SteelEdit | AbrasiveEdit | MethodEdit;

/** A page's content as a revision holds it. */
export interface PageContent {
  fields: Record<string, unknown>;
  body: RichTextNode | null;
}

const FIELD_DEFAULTS: Record<string, unknown> = { citations: [], sources: {}, gritRange: null, priceNote: null, hardnessHrc: null, retentionMedium: null, thresholdG: null, wheelDiameterMm: null, widthMm: null };

/**
 * A revision's stored fields reduced to the editable ones of its page type, with defaults for
 * those an older revision lacks (the first revisions hold the slug, and abrasives and methods no
 * citations), so any two revisions compare field by field.
 */
export function normalizeFields(type: PageType, fields: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of EDITABLE_FIELDS[type]) {
    const value = fields[key];
    out[key] = value === undefined ? (FIELD_DEFAULTS[key] ?? null) : value;
  }
  return out;
}

/** An edit split into what a revision stores (fields and body) and what it is about (base, summary). */
export function splitEdit(type: PageType, edit: PageEdit): { base: number; summary: string; content: PageContent } {
  const { baseRevision, summary, body, ...fields } = edit;
  return { base: baseRevision, summary, content: { fields: normalizeFields(type, fields), body } };
}

/** POST /api/page-revisions/:id/review: approve a proposed revision, or decline it with a reason. */
export const pageReviewSchema = z
  .object({
    decision: z.enum(['approve', 'decline']),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.decision === 'decline' && !v.note) ctx.addIssue({ code: 'custom', path: ['note'], message: 'say why the edit is declined' });
  });
export type PageReview = z.infer<typeof pageReviewSchema>;

/** POST /api/steels/:slug/revert: restore an earlier accepted revision as a new one. */
export const pageRevertSchema = z
  .object({
    toRevision: z.number().int().positive('a revision id'),
    summary: z.string().trim().max(300).optional(),
    /** Optional: refuse with 409 when the page has moved on since this revision. */
    baseRevision: z.number().int().positive().optional(),
  })
  .strict();
export type PageRevert = z.infer<typeof pageRevertSchema>;

/** POST /api/steels/:slug/protect: protect (only moderators edit) or release a page. */
export const pageProtectSchema = z
  .object({
    protected: z.boolean(),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict();
export type PageProtect = z.infer<typeof pageProtectSchema>;

/** POST /api/steels/:slug/merge: merge this (duplicate) page into `into`, which survives. */
export const pageMergeSchema = z
  .object({
    into: z
      .string()
      .trim()
      .min(1, 'required')
      .max(limits.slugMax)
      .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'must be a slug: lower-case letters, digits and hyphens'),
    note: z.string().trim().max(limits.noteMax).optional(),
  })
  .strict();
export type PageMerge = z.infer<typeof pageMergeSchema>;

/** GET /api/steels query: filters of the steel list. */
export const steelListQuerySchema = z
  .object({
    category: z.enum(keysOf(STEEL_CATEGORIES)).optional(),
    /** Element filters such as "C ≥ 1 %, V ≥ 2 %" (see shared/composition-filter.ts). */
    composition: z.string().trim().max(200).optional(),
    hrcMin: z.coerce.number().min(0).max(100).optional(),
    hrcMax: z.coerce.number().min(0).max(100).optional(),
  })
  .strict();

/** GET /api/abrasives query: filters of the abrasive list. */
export const abrasiveListQuerySchema = z
  .object({
    material: z.enum(keysOf(ABRASIVE_MATERIALS)).optional(),
    bond: z.enum(keysOf(BONDS)).optional(),
    form: z.enum(keysOf(ABRASIVE_FORMS)).optional(),
    /** Grit band as the coarse edge's whole φ (see shared/grit.ts gritBandPhi). */
    gritPhi: z.coerce.number().int().min(-2).max(20).optional(),
  })
  .strict();
