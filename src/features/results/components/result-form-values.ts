/**
 * The new-result form's own values and their translation to the API's ResultInput. The form
 * keeps every box as typed (numbers as NaN while empty, readings as one text box); the shared
 * schema sees only what the person actually filled in, with empty optional groups left out,
 * because the schema is strict.
 */
import type { DefaultValues, FieldError, FieldErrors, FieldPath } from 'react-hook-form';
import type { GritStandard } from '@shared/grit';
import type { HardnessScale } from '@shared/hardness';
import type { RichTextNode } from '@shared/rich-text';
import type { ResultInput } from '@shared/schemas/result';

export type AngleMode = 'perSide' | 'setup';

/** One progression step as the form holds it. */
export interface ProgressionFormStep {
  abrasive: string;
  gritGrade: string;
  perSideDeg: number;
}

/** What the form holds while a person fills it in. Lengths in mm, angles in degrees, readings in grams. */
export interface ResultFormValues {
  steel: string;
  hardness: { value: number; scale: HardnessScale; measured: boolean };
  heatTreatment: string;
  /** Steps before the final abrasive (progression-fields.tsx); an empty grit uses the abrasive's own. */
  progression: ProgressionFormStep[];
  abrasive: string;
  grit: { standard: GritStandard | ''; grade: string };
  angleMode: AngleMode;
  edgeAngle: {
    perSideDeg: number;
    setup: { wheelDiameterMm: number; barDiameterMm: number; gapMm: number; projectionMm: number };
  };
  sharpness: { method: string; readingsText: string };
  retention: { method: string; cuts: number };
  notes: RichTextNode | null;
}

/** An empty form: HRC preselected, per-side angle as the default way to give the angle. */
export const emptyResultForm: ResultFormValues = {
  steel: '',
  hardness: { value: Number.NaN, scale: 'HRC', measured: false },
  heatTreatment: '',
  progression: [],
  abrasive: '',
  grit: { standard: '', grade: '' },
  angleMode: 'perSide',
  edgeAngle: {
    perSideDeg: Number.NaN,
    setup: { wheelDiameterMm: Number.NaN, barDiameterMm: Number.NaN, gapMm: Number.NaN, projectionMm: Number.NaN },
  },
  sharpness: { method: '', readingsText: '' },
  retention: { method: '', cuts: Number.NaN },
  notes: null,
};

/**
 * Splits the readings box into numbers: commas, semicolons or spaces separate readings, a point
 * marks decimals. A word that is not a number stays NaN so the schema names it.
 */
export function parseReadings(text: string): number[] {
  return text
    .split(/[\s,;]+/)
    .map((t) => t.trim())
    .filter(Boolean)
    .map((t) => (/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(t) ? Number(t) : Number.NaN));
}

const isBlankNumber = (n: number) => n === undefined || n === null || Number.isNaN(n);

/** The API input for these form values; what the schema will validate (it may still be invalid). */
export function toResultInput(v: ResultFormValues): Record<string, unknown> {
  const input: Record<string, unknown> = {
    steel: v.steel,
    hardness: { value: v.hardness.value, scale: v.hardness.scale, measured: v.hardness.measured },
    abrasive: v.abrasive,
    edgeAngle:
      v.angleMode === 'setup' ? { setup: { ...v.edgeAngle.setup } } : { perSideDeg: v.edgeAngle.perSideDeg },
    sharpness: { method: v.sharpness.method, readingsG: parseReadings(v.sharpness.readingsText) },
  };
  const heat = v.heatTreatment.trim();
  if (heat) input.heatTreatment = heat;
  const grade = v.grit.grade.trim();
  if (grade || v.grit.standard) input.grit = { ...(v.grit.standard ? { standard: v.grit.standard } : {}), grade };
  if (v.retention.method || !isBlankNumber(v.retention.cuts)) {
    input.retention = { method: v.retention.method, cuts: v.retention.cuts };
  }
  if (v.notes) input.notes = v.notes;
  if (v.progression?.length) {
    input.progression = v.progression.map((s) => ({
      abrasive: s.abrasive,
      ...(s.gritGrade.trim() ? { grit: { grade: s.gritGrade.trim() } } : {}),
      ...(isBlankNumber(s.perSideDeg) ? {} : { perSideDeg: s.perSideDeg }),
    }));
  }
  return input;
}

/** The form's values for a result's stored input (to edit it). */
export function fromResultInput(input: ResultInput): ResultFormValues {
  const setup = 'setup' in input.edgeAngle ? input.edgeAngle.setup : null;
  return {
    steel: input.steel,
    hardness: { value: input.hardness.value, scale: input.hardness.scale, measured: input.hardness.measured ?? false },
    heatTreatment: input.heatTreatment ?? '',
    abrasive: input.abrasive,
    grit: { standard: input.grit?.standard ?? '', grade: input.grit?.grade ?? '' },
    angleMode: setup ? 'setup' : 'perSide',
    edgeAngle: {
      perSideDeg: 'perSideDeg' in input.edgeAngle ? input.edgeAngle.perSideDeg : Number.NaN,
      setup: setup ?? { ...emptyResultForm.edgeAngle.setup },
    },
    sharpness: { method: input.sharpness.method, readingsText: input.sharpness.readingsG.join(', ') },
    retention: { method: input.retention?.method ?? '', cuts: input.retention?.cuts ?? Number.NaN },
    notes: (input.notes as RichTextNode | undefined) ?? null,
    progression: (input.progression ?? []).map((s) => ({ abrasive: s.abrasive, gritGrade: s.grit?.grade ?? '', perSideDeg: s.perSideDeg ?? Number.NaN })),
  };
}

const knownFields = new Set<string>([
  'steel',
  'hardness.value',
  'hardness.scale',
  'hardness.measured',
  'heatTreatment',
  'abrasive',
  'grit.standard',
  'grit.grade',
  'edgeAngle.perSideDeg',
  'edgeAngle.setup',
  'edgeAngle.setup.wheelDiameterMm',
  'edgeAngle.setup.barDiameterMm',
  'edgeAngle.setup.gapMm',
  'edgeAngle.setup.projectionMm',
  'sharpness.method',
  'sharpness.readingsText',
  'retention.method',
  'retention.cuts',
  'notes',
]);

/**
 * The form field that shows a problem the schema or the server reported at `path` (dotted,
 * like "hardness.value" or "sharpness.readingsG.2"); null when no field fits.
 */
export function formFieldFor(path: string, mode: AngleMode): FieldPath<ResultFormValues> | null {
  if (path === 'sharpness.readingsG' || path.startsWith('sharpness.readingsG.')) return 'sharpness.readingsText';
  if (path === 'notes' || path.startsWith('notes.')) return 'notes';
  if (path === 'edgeAngle') return mode === 'setup' ? 'edgeAngle.setup' : 'edgeAngle.perSideDeg';
  if (path === 'hardness') return 'hardness.value';
  if (path === 'grit') return 'grit.grade';
  if (path === 'retention') return 'retention.cuts';
  if (path === 'sharpness') return 'sharpness.readingsText';
  if (knownFields.has(path)) return path as FieldPath<ResultFormValues>;
  const step = /^progression\.(\d+)\.(abrasive|grit|perSideDeg)/.exec(path);
  if (step) return `progression.${Number(step[1])}.${step[2] === 'grit' ? 'gritGrade' : step[2]}` as FieldPath<ResultFormValues>;
  return null;
}

/** A reading's position in words, for messages about one of several readings. */
export function readingMessage(path: string, message: string): string {
  const m = /^sharpness\.readingsG\.(\d+)$/.exec(path);
  return m ? `reading ${Number(m[1]) + 1}: ${message}` : message;
}

type ErrorTree = { [key: string]: ErrorTree | FieldError | undefined } & Partial<FieldError>;

/** Flattens nested resolver errors into dotted paths with their messages. */
export function flattenErrors(errors: FieldErrors | ErrorTree, prefix = ''): { path: string; error: FieldError }[] {
  const out: { path: string; error: FieldError }[] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || typeof value !== 'object' || key === 'ref') continue;
    const path = prefix ? `${prefix}.${key}` : key;
    const node = value as ErrorTree;
    if (typeof node.message === 'string' && typeof node.type === 'string') out.push({ path, error: node as FieldError });
    out.push(...flattenErrors(node, path));
  }
  return out;
}

/**
 * The values as the form's boxes start: an empty number box is left empty rather than given NaN,
 * which a number input cannot show (Chromium warns "The specified value "NaN" cannot be parsed").
 * The form reads an untouched box as undefined, which counts as blank like NaN.
 */
export function initialBoxes<T>(values: T): DefaultValues<T> {
  const clean = (v: unknown): unknown =>
    typeof v === 'number' && Number.isNaN(v) ? undefined : Array.isArray(v) ? v.map(clean) : v && typeof v === 'object' ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, clean(x)])) : v;
  return clean(values) as DefaultValues<T>;
}
