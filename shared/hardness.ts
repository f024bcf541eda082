/**
 * Hardness conversion for steel per ASTM E140 Table 1 (approximate equivalent hardness numbers
 * for non-austenitic steels; ISO 18265:2013 is the international counterpart). Conversions are
 * empirical: the table is the definition, values between rows are interpolated linearly, and
 * values outside the table are refused rather than extrapolated.
 *
 * Pure data and arithmetic: no I/O, no clock, no framework imports.
 */
import { ComputationError } from './computation-error';

export const HARDNESS_SCALES = ['HRC', 'HV', 'HBW', 'HRA'] as const;
/** Hardness scale: Rockwell C, Vickers, Brinell (tungsten-carbide ball, 3000 kgf), Rockwell A. */
export type HardnessScale = (typeof HARDNESS_SCALES)[number];

/** Scale names as shown to people. */
export const HARDNESS_SCALE_LABELS: Record<HardnessScale, string> = {
  HRC: 'Rockwell C (HRC)',
  HV: 'Vickers (HV)',
  HBW: 'Brinell, carbide ball (HBW)',
  HRA: 'Rockwell A (HRA)',
};

/** One row of the conversion table. */
export interface HardnessRow {
  HRC: number;
  HV: number;
  /** Null where the table gives no Brinell value. */
  HBW: number | null;
  /** True where the table prints the Brinell value in parentheses: beyond Brinell's normal range. */
  hbwBeyondNormalRange: boolean;
  HRA: number;
}

type RawRow = [hrc: number, hv: number, hbw: number | null, hbwParenthesised: boolean, hra: number];

/**
 * ASTM E140 Table 1, non-austenitic steels, one row per HRC unit from HRC 68 to HRC 20.
 * R: rows seen in a retrieved copy (editions E140-05 and E140-12b were cited); every other row
 * (from memory). Copies disagree at HRC 62 (745 or 746 HV; 746 kept) and HRC 50 (HBW 481 or 482;
 * 481 kept). Brinell values in parentheses lie beyond Brinell's normal range (above about 650 HBW).
 */
const TABLE: RawRow[] = [
  [68, 940, null, false, 85.6], // R
  [67, 900, null, false, 85.0], // (from memory)
  [66, 865, null, false, 84.5], // R
  [65, 832, 739, true, 83.9], // (from memory)
  [64, 800, 722, true, 83.4], // R
  [63, 772, 705, true, 82.8], // (from memory)
  [62, 746, 688, true, 82.3], // R
  [61, 720, 670, true, 81.8], // (from memory)
  [60, 697, 654, true, 81.2], // R
  [59, 674, 634, false, 80.7], // (from memory)
  [58, 653, 615, false, 80.1], // R
  [57, 633, 595, false, 79.6], // (from memory)
  [56, 613, 577, false, 79.0], // (from memory)
  [55, 595, 560, false, 78.5], // R
  [54, 577, 543, false, 78.0], // (from memory)
  [53, 560, 525, false, 77.4], // (from memory)
  [52, 544, 512, false, 76.8], // (from memory)
  [51, 528, 496, false, 76.3], // (from memory)
  [50, 513, 481, false, 75.9], // R
  [49, 498, 469, false, 75.2], // (from memory)
  [48, 484, 455, false, 74.7], // (from memory)
  [47, 471, 443, false, 74.1], // (from memory)
  [46, 458, 432, false, 73.6], // (from memory)
  [45, 446, 421, false, 73.1], // R
  [44, 434, 409, false, 72.5], // (from memory)
  [43, 423, 400, false, 72.0], // (from memory)
  [42, 412, 390, false, 71.5], // (from memory)
  [41, 402, 381, false, 70.9], // (from memory)
  [40, 392, 371, false, 70.4], // R
  [39, 382, 362, false, 69.9], // (from memory)
  [38, 372, 353, false, 69.4], // (from memory)
  [37, 363, 344, false, 68.9], // (from memory)
  [36, 354, 336, false, 68.4], // (from memory)
  [35, 345, 327, false, 67.9], // (from memory)
  [34, 336, 319, false, 67.4], // (from memory)
  [33, 327, 311, false, 66.8], // (from memory)
  [32, 318, 301, false, 66.3], // (from memory)
  [31, 310, 294, false, 65.8], // (from memory)
  [30, 302, 286, false, 65.3], // R
  [29, 294, 279, false, 64.7], // (from memory)
  [28, 286, 271, false, 64.3], // (from memory)
  [27, 279, 264, false, 63.8], // (from memory)
  [26, 272, 258, false, 63.3], // (from memory)
  [25, 266, 253, false, 62.8], // (from memory)
  [24, 260, 247, false, 62.4], // (from memory)
  [23, 254, 243, false, 62.0], // (from memory)
  [22, 248, 237, false, 61.5], // (from memory)
  [21, 243, 231, false, 61.0], // (from memory)
  [20, 238, 226, false, 60.5], // R
];

/** The conversion table, ascending by HRC (a copy: callers cannot change the table). */
export function hardnessTable(): HardnessRow[] {
  return ROWS.map((r) => ({ ...r }));
}

// Ascending by HRC, so every column ascends too (the table is monotonic in every column).
const ROWS: HardnessRow[] = [...TABLE]
  .sort((a, b) => a[0] - b[0])
  .map(([HRC, HV, HBW, hbwBeyondNormalRange, HRA]) => ({ HRC, HV, HBW, hbwBeyondNormalRange, HRA }));

/** Rows that have a value in a column, ascending. */
function columnRows(scale: HardnessScale): { hrc: number; value: number }[] {
  return ROWS.filter((r) => r[scale] !== null).map((r) => ({ hrc: r.HRC, value: r[scale] as number }));
}

const COLUMNS: Record<HardnessScale, { hrc: number; value: number }[]> = {
  HRC: columnRows('HRC'),
  HV: columnRows('HV'),
  HBW: columnRows('HBW'),
  HRA: columnRows('HRA'),
};

/** The range of values a scale's column covers in the table, e.g. HV 238 to 940. */
export function hardnessRange(scale: HardnessScale): { min: number; max: number } {
  assertScale(scale);
  const col = COLUMNS[scale];
  return { min: col[0].value, max: col[col.length - 1].value };
}

function assertScale(scale: string): asserts scale is HardnessScale {
  if (!(HARDNESS_SCALES as readonly string[]).includes(scale)) {
    throw new ComputationError(`"${scale}" is not a hardness scale we convert; choose one of ${HARDNESS_SCALES.join(', ')}`, 'scale');
  }
}

/** Linear interpolation in a monotonic column: x values → y values, x inside the column's range. */
function interpolate(points: { x: number; y: number }[], x: number): number {
  // Binary search for the segment holding x (points ascend in x).
  let lo = 0;
  let hi = points.length - 1;
  if (x <= points[0].x) return points[0].y;
  if (x >= points[hi].x) return points[hi].y;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid].x <= x) lo = mid;
    else hi = mid;
  }
  const a = points[lo];
  const b = points[hi];
  return a.y + ((x - a.x) / (b.x - a.x)) * (b.y - a.y);
}

/**
 * Convert a hardness on any carried scale to Rockwell C (HRC), interpolating linearly between
 * the rows of ASTM E140 Table 1. Throws ComputationError (field 'value') for a value outside the
 * table's range for its scale, naming that range.
 */
export function toHrc(value: number, scale: HardnessScale): number {
  assertScale(scale);
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ComputationError(`a hardness must be a number (got ${String(value)})`, 'value');
  }
  const { min, max } = hardnessRange(scale);
  if (value < min || value > max) {
    // The value as given and the limits as tabulated, never rounded: 68.01 HRC is outside a table
    // that ends at 68, and a message saying "68 is outside … 68" would contradict itself.
    const col = COLUMNS[scale];
    throw new ComputationError(
      `${String(value)} ${scale} is outside the conversion table: ASTM E140 Table 1 (non-austenitic steels) ` +
        `covers ${scale} ${String(min)} to ${String(max)}` +
        (scale === 'HRC' ? '' : ` (HRC ${col[0].hrc} to ${col[col.length - 1].hrc}, where the ${scale} column has values)`),
      'value',
    );
  }
  if (scale === 'HRC') return value;
  return interpolate(COLUMNS[scale].map((p) => ({ x: p.value, y: p.hrc })), value);
}

/** HRC → a scale's value, or null where that column has no value at this HRC. */
function fromHrc(hrc: number, scale: HardnessScale): number | null {
  if (scale === 'HRC') return hrc;
  const col = COLUMNS[scale];
  if (hrc < col[0].hrc || hrc > col[col.length - 1].hrc) return null;
  return interpolate(col.map((p) => ({ x: p.hrc, y: p.value })), hrc);
}

/**
 * Convert a hardness to every carried scale (HRC, HV, HBW, HRA), by linear interpolation between
 * rows of ASTM E140 Table 1. A scale whose column does not reach the value is null (Brinell has
 * no values above HRC 65). Throws ComputationError (field 'value') for an input outside the
 * table's range for its own scale.
 */
export function convertHardness(value: number, scale: HardnessScale): Record<HardnessScale, number | null> {
  const hrc = toHrc(value, scale);
  const out = Object.fromEntries(HARDNESS_SCALES.map((s) => [s, fromHrc(hrc, s)])) as Record<HardnessScale, number | null>;
  out[scale] = value; // the given value exactly, not a round trip through HRC
  return out;
}

/**
 * Upper end of Brinell's normal range with a tungsten-carbide ball, HBW: ASTM E10 and ISO 6506-1
 * limit the test to 650 HBW (from memory). It agrees with the table, which prints 634 (HRC 59)
 * plainly and 654 (HRC 60) in parentheses.
 */
export const BRINELL_NORMAL_MAX_HBW = 650;

/**
 * True when a Brinell value lies beyond Brinell's normal range (where the table prints it in
 * parentheses), so a reader should treat it as indicative only.
 */
export function brinellBeyondNormalRange(hbw: number): boolean {
  return hbw > BRINELL_NORMAL_MAX_HBW;
}
