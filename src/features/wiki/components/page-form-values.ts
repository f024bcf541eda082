import { EDITABLE_FIELDS, normalizeFields, type PageContent, type PageCreate, type PageEdit, type PageType } from '@shared/schemas/pages';
import type { RichTextNode } from '@shared/rich-text';

/**
 * The wiki form's values: the page's editable fields as the inputs hold them (empty strings for
 * blank optional text, null for blank numbers, a string index per source), with body, summary
 * and base revision. `toPageEdit` turns them into what PUT /api/{section}/:slug takes.
 */
export type PageFormValues = {
  summary: string;
  body: RichTextNode | null;
  baseRevision: number;
  sources: Record<string, string>;
  citations: { title: string; organisation: string; year: number | null; standard: string; url: string; supports: string }[];
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the form's other fields differ per page type
} & Record<string, any>;

const blankToNull = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : v);
const numberOrNull = (v: unknown) => (v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v)) ? null : v);

/** Form values from a page's content (a revision's fields or a page as GET gives it). */
export function toFormValues(type: PageType, content: PageContent, baseRevision: number, summary = ''): PageFormValues {
  const f = normalizeFields(type, content.fields);
  const sources = Object.fromEntries(Object.entries((f.sources as Record<string, number>) ?? {}).map(([k, v]) => [k, String(v)]));
  const citations = ((f.citations as PageFormValues['citations']) ?? []).map((c) => ({
    title: c.title ?? '',
    organisation: c.organisation ?? '',
    year: c.year ?? null,
    standard: c.standard ?? '',
    url: c.url ?? '',
    supports: c.supports ?? '',
  }));
  const values: PageFormValues = { ...f, summary, body: content.body, baseRevision, sources, citations };
  if (type === 'steel') values.hardnessHrc = f.hardnessHrc ?? { min: null, max: null };
  if (type === 'abrasive') {
    values.gritRange = f.gritRange ?? { from: '', to: '' };
    values.priceNote = f.priceNote ?? '';
  }
  if (type === 'method') values.retentionMedium = f.retentionMedium ?? '';
  return values;
}

/** What a new page's form starts from: nothing entered, lists empty but for one designation row. */
const EMPTY_FIELDS: Record<PageType, Record<string, unknown>> = {
  steel: { name: '', category: '', designations: [{ system: 'AISI', code: '' }], composition: [] },
  abrasive: { name: '', material: '', bond: '', form: '', grit: { standard: 'fepa-f', grade: '' }, wears: false, sideUsable: false, coolant: '' },
  method: { name: '', instrument: '', medium: '', readingsPerEdge: null },
};

/** The form's values for a new page of the type. */
export const emptyFormValues = (type: PageType): PageFormValues => toFormValues(type, { fields: EMPTY_FIELDS[type], body: null }, 0);

/** What POST /api/{section} takes from the form's values: an edit without its base revision. */
export function toPageCreate(type: PageType, values: PageFormValues): PageCreate {
  const { baseRevision: _b, summary, ...input } = toPageEdit(type, values);
  // A blank summary takes the server's default ("First version.").
  return { ...input, ...(summary.trim() ? { summary } : {}) } as PageCreate;
}

/** The page content of the form's values, before validation. */
export function toPageEdit(type: PageType, values: PageFormValues): PageEdit {
  const out: Record<string, unknown> = {};
  for (const key of EDITABLE_FIELDS[type]) out[key] = values[key];
  out.sources = Object.fromEntries(Object.entries(values.sources ?? {}).filter(([, v]) => v !== '' && v !== undefined).map(([k, v]) => [k, Number(v)]));
  out.citations = (values.citations ?? []).map((c) => ({
    title: c.title,
    organisation: c.organisation,
    year: numberOrNull(c.year),
    ...(c.standard?.trim() ? { standard: c.standard } : {}),
    ...(c.url?.trim() ? { url: c.url } : {}),
    supports: c.supports,
  }));
  if (type === 'steel') {
    const h = values.hardnessHrc as { min: number | null; max: number | null };
    out.hardnessHrc = numberOrNull(h?.min) === null && numberOrNull(h?.max) === null ? null : { min: numberOrNull(h.min), max: numberOrNull(h.max) };
    out.composition = ((values.composition as { element: string; min: number | null; max: number }[]) ?? []).map((l) => ({ ...l, min: numberOrNull(l.min) }));
  }
  if (type === 'abrasive') {
    const r = values.gritRange as { from: string; to: string } | null;
    out.gritRange = !r || (!r.from?.trim() && !r.to?.trim()) ? null : r;
    out.priceNote = blankToNull(values.priceNote);
    out.wheelDiameterMm = numberOrNull(values.wheelDiameterMm);
    out.widthMm = numberOrNull(values.widthMm);
  }
  if (type === 'method') {
    out.retentionMedium = blankToNull(values.retentionMedium);
    out.thresholdG = numberOrNull(values.thresholdG);
  }
  return { ...out, body: values.body, summary: values.summary, baseRevision: values.baseRevision } as PageEdit;
}

/** The content (fields and body) an edit would save, for diffs and merges. */
export function contentOfEdit(type: PageType, edit: PageEdit): PageContent {
  const { baseRevision: _b, summary: _s, body, ...fields } = edit as PageEdit & Record<string, unknown>;
  return { fields: normalizeFields(type, fields), body: body ?? null };
}
