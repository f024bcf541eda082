/**
 * The result import file (CSV): its columns, the header spellings accepted for each, the
 * mapping of one row to the same input the new-result form posts, and the error report (written
 * by shared/csv-writer.ts). Pure: no I/O; lookups of pages are passed in.
 */
import type { RichTextNode } from './rich-text';
import { parseProgressionCell } from './progression';
import { toCsv } from './csv-writer';

/** Columns of the import file, in the template's order. */
export const IMPORT_COLUMNS = [
  'steel',
  'hardness',
  'hardness_scale',
  'hardness_measured',
  'heat_treatment',
  'progression',
  'abrasive',
  'grit_standard',
  'grit',
  'angle_per_side_deg',
  'wheel_diameter_mm',
  'bar_diameter_mm',
  'gap_mm',
  'projection_mm',
  'sharpness_method',
  'readings_g',
  'retention_method',
  'retention_cuts',
  'notes',
] as const;
export type ImportColumn = (typeof IMPORT_COLUMNS)[number];

/** Columns every file must have. */
export const REQUIRED_COLUMNS: ImportColumn[] = ['steel', 'hardness', 'abrasive', 'sharpness_method', 'readings_g'];

/** What each column holds, for the template's help and the import page. */
export const IMPORT_COLUMN_HELP: Record<ImportColumn, string> = {
  steel: 'steel page: its slug (aisi-d2) or any designation (D2, 1.2379, SKD11)',
  hardness: 'hardness value, optionally with its scale ("61" or "61 HRC")',
  hardness_scale: 'HRC, HV, HBW or HRA (HRC when empty)',
  hardness_measured: 'yes when you measured it, no when the maker stated it (optional)',
  heat_treatment: 'heat treatment note (optional, plain text)',
  progression: 'steps before the final abrasive, coarse to fine, separated by ">": each an abrasive slug or name, optionally with "(grit, angle°)", e.g. alox-vitrified-wheel-250-coarse > cbn-resin-wheel-250-b46 (15°) (optional)',
  abrasive: 'final abrasive page: its slug or its exact name',
  grit_standard: 'fepa-f, fepa-p, jis, ansi, ansi-bonded, mesh, iso6106 or um (optional)',
  grit: 'grit grade as labelled, e.g. F220, #4000, B126, 15 (optional: the abrasive page’s grit)',
  angle_per_side_deg: 'edge angle per side in degrees; or leave empty and give the four wheel-setup columns',
  wheel_diameter_mm: 'wheel diameter, mm (setup)',
  bar_diameter_mm: 'support bar diameter, mm (setup)',
  gap_mm: 'shortest gap from bar to rim, mm (setup)',
  projection_mm: 'edge distance from the bar axis along the blade, mm (setup)',
  sharpness_method: 'method page slug, e.g. push-cut-test-v2',
  readings_g: 'sharpness readings in grams, separated by ";" (e.g. 180;175;190)',
  retention_method: 'retention method page slug (optional; with retention_cuts)',
  retention_cuts: 'retention count (whole number; with retention_method)',
  notes: 'notes, plain text; blank lines start new paragraphs (optional)',
};

/** Header cell → lower-case words joined by "_", without units in brackets. */
export function normaliseHeader(header: string): string {
  return header
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/\((.*?)\)/g, ' $1 ')
    .replace(/[^a-z0-9µ°]+/g, '_')
    .replace(/°/g, 'deg')
    .replace(/µm/g, 'um')
    .replace(/^_+|_+$/g, '');
}

/** Other header spellings people use for each column (already normalised). */
const ALIASES: Record<ImportColumn, string[]> = {
  steel: ['steel_slug', 'steel_grade', 'grade', 'designation'],
  hardness: ['hardness_value', 'hrc'],
  hardness_scale: ['scale', 'hardness_unit'],
  hardness_measured: ['measured', 'hardness_was_measured'],
  heat_treatment: ['heat_treat', 'ht', 'heattreatment'],
  progression: ['steps', 'grit_progression', 'progression_steps'],
  abrasive: ['abrasive_slug', 'final_abrasive', 'stone', 'wheel'],
  grit_standard: ['standard', 'grit_system'],
  grit: ['grit_grade', 'final_grit'],
  angle_per_side_deg: ['angle', 'angle_deg', 'per_side_deg', 'angle_per_side', 'edge_angle_per_side_deg', 'dps'],
  wheel_diameter_mm: ['wheel_diameter', 'wheel_mm'],
  bar_diameter_mm: ['bar_diameter', 'bar_mm'],
  gap_mm: ['gap', 'bar_gap_mm', 'bar_gap'],
  projection_mm: ['projection', 'distance_mm', 'bar_to_edge_mm'],
  sharpness_method: ['method', 'method_slug', 'sharpness_method_slug'],
  readings_g: ['readings', 'sharpness_g', 'sharpness_readings', 'sharpness_readings_g', 'grams'],
  retention_method: ['retention_method_slug'],
  retention_cuts: ['cuts', 'retention', 'retention_count'],
  notes: ['note', 'comments', 'remarks'],
};

const byName = new Map<string, ImportColumn>();
for (const column of IMPORT_COLUMNS) {
  byName.set(column, column);
  for (const alias of ALIASES[column]) byName.set(alias, column);
}

/** How a file's header row maps onto the import columns. */
export interface HeaderMapping {
  /** Column → index of the cell in each row. */
  index: Partial<Record<ImportColumn, number>>;
  /** Header cells that match no column (ignored, reported). */
  unknown: string[];
  /** Columns named twice (the first one is used). */
  duplicate: ImportColumn[];
  /** Required columns missing from the header. */
  missing: ImportColumn[];
}

/** Maps a header row onto the import columns, case- and punctuation-insensitively. */
export function mapHeader(headers: string[]): HeaderMapping {
  const index: Partial<Record<ImportColumn, number>> = {};
  const unknown: string[] = [];
  const duplicate: ImportColumn[] = [];
  headers.forEach((raw, i) => {
    const name = normaliseHeader(raw);
    if (!name) return;
    const column = byName.get(name);
    if (!column) unknown.push(raw.trim());
    else if (index[column] !== undefined) duplicate.push(column);
    else index[column] = i;
  });
  const missing = REQUIRED_COLUMNS.filter((c) => index[c] === undefined);
  return { index, unknown, duplicate, missing };
}

/** One problem with one cell of the file; `row` counts lines as a spreadsheet does (header = 1). */
export interface RowIssue {
  column: ImportColumn | string;
  message: string;
}

/** Resolves what a person wrote in a reference column to a page slug, or null when unknown. */
export interface PageLookup {
  steel(text: string): string | null;
  abrasive(text: string): string | null;
  method(text: string): string | null;
}

const NUMBER = /^[+-]?(?:\d+(?:[.,]\d+)?|[.,]\d+)$/;

function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\s+/g, '');
  if (!NUMBER.test(t)) return null;
  return Number(t.replace(',', '.'));
}

const YES = new Set(['yes', 'y', 'true', '1', 'measured']);
const NO = new Set(['no', 'n', 'false', '0', 'stated']);

/** Plain text → a rich-text document of paragraphs (blank lines or line breaks separate them). */
export function plainToRichText(text: string): RichTextNode {
  const paragraphs = text
    .split(/\r?\n(?:\s*\r?\n)*/)
    .map((p) => p.trim())
    .filter(Boolean);
  return { type: 'doc', content: paragraphs.map((p) => ({ type: 'paragraph', content: [{ type: 'text', text: p }] })) };
}

/**
 * One row of the file (cells by column) → the body the new-result form would post, and the
 * problems found while mapping it. The caller validates the body with resultInputSchema.
 */
export function rowToResultInput(cells: Partial<Record<ImportColumn, string>>, lookup: PageLookup): { input: Record<string, unknown>; issues: RowIssue[] } {
  const issues: RowIssue[] = [];
  const cell = (c: ImportColumn) => (cells[c] ?? '').trim();
  const number = (c: ImportColumn, example: string): number | undefined => {
    const text = cell(c);
    if (!text) return undefined;
    const n = parseNumber(text);
    if (n === null) issues.push({ column: c, message: `must be a number, e.g. ${example} (got "${text.slice(0, 40)}")` });
    return n ?? undefined;
  };
  const input: Record<string, unknown> = {};

  const steelText = cell('steel');
  if (!steelText) issues.push({ column: 'steel', message: 'required: a steel slug or designation' });
  else {
    const slug = lookup.steel(steelText);
    if (!slug) issues.push({ column: 'steel', message: `no steel page matches "${steelText.slice(0, 60)}" by slug or designation` });
    else input.steel = slug;
  }

  const hardnessText = cell('hardness');
  let scale = cell('hardness_scale').toUpperCase() || undefined;
  if (!hardnessText) issues.push({ column: 'hardness', message: 'required: the hardness value, e.g. 61' });
  else {
    const m = /^(.*?)\s*(HRC|HV|HBW|HRA)$/i.exec(hardnessText);
    const valueText = m ? m[1] : hardnessText;
    if (m) {
      const inline = m[2].toUpperCase();
      if (scale && scale !== inline) issues.push({ column: 'hardness_scale', message: `says ${scale} but hardness says ${inline}` });
      scale = inline;
    }
    const value = parseNumber(valueText);
    if (value === null) issues.push({ column: 'hardness', message: `must be a number, optionally with its scale, e.g. 61 or 61 HRC (got "${hardnessText.slice(0, 40)}")` });
    else input.hardness = { value, scale: scale ?? 'HRC' };
  }
  const measured = cell('hardness_measured').toLowerCase();
  if (measured && input.hardness) {
    if (YES.has(measured)) (input.hardness as Record<string, unknown>).measured = true;
    else if (NO.has(measured)) (input.hardness as Record<string, unknown>).measured = false;
    else issues.push({ column: 'hardness_measured', message: 'must be yes or no' });
  }

  if (cell('heat_treatment')) input.heatTreatment = cell('heat_treatment');

  if (cell('progression')) {
    const parsed = parseProgressionCell(cell('progression'), (text) => lookup.abrasive(text));
    for (const message of parsed.issues) issues.push({ column: 'progression', message });
    if (!parsed.issues.length) input.progression = parsed.steps;
  }

  const abrasiveText = cell('abrasive');
  if (!abrasiveText) issues.push({ column: 'abrasive', message: 'required: an abrasive slug or name' });
  else {
    const slug = lookup.abrasive(abrasiveText);
    if (!slug) issues.push({ column: 'abrasive', message: `no abrasive page matches "${abrasiveText.slice(0, 60)}" by slug or name` });
    else input.abrasive = slug;
  }

  const gritStandard = cell('grit_standard').toLowerCase();
  const grit = cell('grit');
  if (grit) input.grit = gritStandard ? { standard: gritStandard, grade: grit } : { grade: grit };
  else if (gritStandard) issues.push({ column: 'grit', message: 'give the grit grade with its standard' });

  const perSide = number('angle_per_side_deg', '15');
  const setupColumns = ['wheel_diameter_mm', 'bar_diameter_mm', 'gap_mm', 'projection_mm'] as const;
  const setupGiven = setupColumns.filter((c) => cell(c));
  if (cell('angle_per_side_deg') && setupGiven.length) {
    issues.push({ column: 'angle_per_side_deg', message: 'give either the angle per side or the wheel setup, not both' });
  } else if (cell('angle_per_side_deg')) {
    if (perSide !== undefined) input.edgeAngle = { perSideDeg: perSide };
  } else if (setupGiven.length) {
    const [wheelDiameterMm, barDiameterMm, gapMm, projectionMm] = [
      number('wheel_diameter_mm', '250'),
      number('bar_diameter_mm', '12'),
      number('gap_mm', '40'),
      number('projection_mm', '140'),
    ];
    for (const c of setupColumns) if (!cell(c)) issues.push({ column: c, message: 'required with the other wheel-setup columns' });
    if ([wheelDiameterMm, barDiameterMm, gapMm, projectionMm].every((v) => v !== undefined)) {
      input.edgeAngle = { setup: { wheelDiameterMm, barDiameterMm, gapMm, projectionMm } };
    }
  } else {
    issues.push({ column: 'angle_per_side_deg', message: 'required: the angle per side, or the four wheel-setup columns' });
  }

  const method = cell('sharpness_method');
  const readingsText = cell('readings_g');
  const readings: number[] = [];
  if (!readingsText) issues.push({ column: 'readings_g', message: 'required: at least one reading in grams' });
  else {
    for (const piece of readingsText.split(/[;|\s]+/).filter(Boolean)) {
      const n = parseNumber(piece);
      if (n === null) {
        issues.push({ column: 'readings_g', message: `"${piece.slice(0, 20)}" is not a number; separate readings with ";"` });
        break;
      }
      readings.push(n);
    }
  }
  if (!method) issues.push({ column: 'sharpness_method', message: 'required: a method page slug' });
  else {
    const slug = lookup.method(method);
    if (!slug) issues.push({ column: 'sharpness_method', message: `no method page "${method.slice(0, 60)}"` });
    else input.sharpness = { method: slug, readingsG: readings };
  }

  const retentionMethod = cell('retention_method');
  const cuts = number('retention_cuts', '240');
  if (retentionMethod || cell('retention_cuts')) {
    if (!retentionMethod) issues.push({ column: 'retention_method', message: 'required with retention_cuts' });
    else if (!cell('retention_cuts')) issues.push({ column: 'retention_cuts', message: 'required with retention_method' });
    else {
      const slug = lookup.method(retentionMethod);
      if (!slug) issues.push({ column: 'retention_method', message: `no method page "${retentionMethod.slice(0, 60)}"` });
      else if (cuts !== undefined) input.retention = { method: slug, cuts };
    }
  }

  if (cell('notes')) input.notes = plainToRichText(cells.notes ?? '');
  return { input, issues };
}

/** The import column a validation issue of the result input refers to (zod path → column). */
export function columnOfPath(path: readonly PropertyKey[]): ImportColumn | string {
  const [first, second, third] = path.map(String);
  switch (first) {
    case 'steel':
      return 'steel';
    case 'hardness':
      return second === 'scale' ? 'hardness_scale' : second === 'measured' ? 'hardness_measured' : 'hardness';
    case 'heatTreatment':
      return 'heat_treatment';
    case 'abrasive':
      return 'abrasive';
    case 'progression':
      return 'progression';
    case 'grit':
      return second === 'standard' ? 'grit_standard' : 'grit';
    case 'edgeAngle': {
      if (second !== 'setup') return 'angle_per_side_deg';
      const setup: Record<string, ImportColumn> = { wheelDiameterMm: 'wheel_diameter_mm', barDiameterMm: 'bar_diameter_mm', gapMm: 'gap_mm', projectionMm: 'projection_mm' };
      return setup[third] ?? 'wheel_diameter_mm, bar_diameter_mm, gap_mm, projection_mm';
    }
    case 'sharpness':
      return second === 'method' ? 'sharpness_method' : 'readings_g';
    case 'retention':
      return second === 'method' ? 'retention_method' : 'retention_cuts';
    case 'notes':
      return 'notes';
    default:
      return first ?? '(row)';
  }
}

/** The downloadable error report of an import: one line per problem. */
export function importErrorsCsv(errors: { row: number; column: string; message: string }[]): string {
  return toCsv([['row', 'column', 'message'], ...errors.map((e) => [e.row, e.column, e.message])]);
}
