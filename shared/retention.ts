/**
 * Edge retention by the card-cutting test of ISO 8442-5:2004 (cutlery and table holloware, part 5:
 * specification for sharpness and edge retention test of cutlery). A blade is stroked forward and
 * back through a pack of test card under a set load and speed; each cycle cuts some depth of card.
 *   ICP, initial cutting performance: the card cut in the first 3 cycles.
 *   TCC, total card cut: the cumulative card cut over 60 cycles.
 * All depths in millimetres.
 *
 * Pure arithmetic: no I/O, no clock, no framework imports.
 */
import { ComputationError } from './computation-error';

/** Cycles counted for the initial cutting performance (ISO 8442-5:2004). */
export const ICP_CYCLES = 3;
/** Cycles counted for the total card cut (ISO 8442-5:2004). */
export const TCC_CYCLES = 60;
/** Minimum ICP for a blade to meet ISO 8442-5:2004, mm (from memory). */
export const ICP_MIN_MM = 50;
/** Minimum TCC for a blade to meet ISO 8442-5:2004, mm (from memory). */
export const TCC_MIN_MM = 150;
/** Most cycles accepted in one series: the test stops at 60; longer series run on to study wear. */
export const MAX_CYCLES = 200;

// At most 200 cuts of at most 10 000 mm: 2e6 mm in units of 1e-9 mm stays below 2^53, so sums of
// whole units are exact.
const MAX_PLACES = 9;

/** Decimal places of a number as written in its shortest form (1.25 → 2, 3e-7 → 7, 40 → 0). */
export function decimalPlaces(x: number): number {
  const [mantissa, exponent] = String(x).toLowerCase().split('e');
  const fraction = mantissa.split('.')[1]?.length ?? 0;
  return Math.max(0, fraction - Number(exponent ?? 0));
}

/** ICP and TCC of one card-cut series, with the standard's minimums and whether they are met. */
export interface CardCutRetention {
  /** Card cut in the first 3 cycles, mm (fewer if fewer were cut). */
  icpMm: number;
  /** Cumulative card cut over the first 60 cycles, mm (fewer if fewer were cut). */
  tccMm: number;
  /** Number of cycles given. */
  cycles: number;
  /** Cumulative cut after each cycle, mm, for a chart. */
  cumulativeMm: number[];
  limits: { icpMinMm: number; tccMinMm: number };
  /**
   * Whether ICP meets its minimum: true as soon as the minimum is reached (cuts never take card
   * away, so more cycles cannot undo it), false once all 3 cycles fall short, null while fewer
   * than 3 cycles are given and the minimum is not yet reached.
   */
  icpPass: boolean | null;
  /** As icpPass, for TCC over 60 cycles. */
  tccPass: boolean | null;
}

/**
 * ICP and TCC per ISO 8442-5:2004 from the card cut in each cycle (mm, in cycle order).
 * Throws ComputationError (field 'cutsMm', or 'cutsMm.<index>' for one cycle) unless given 1 to
 * 200 non-negative finite numbers.
 */
export function cardCutRetention(cutsMm: number[]): CardCutRetention {
  if (!Array.isArray(cutsMm)) throw new ComputationError('give the card cut of each cycle as a list of millimetres', 'cutsMm');
  if (cutsMm.length === 0) throw new ComputationError('give the card cut of at least one cycle', 'cutsMm');
  if (cutsMm.length > MAX_CYCLES) {
    throw new ComputationError(`at most ${MAX_CYCLES} cycles are accepted (got ${cutsMm.length}); the test itself runs ${TCC_CYCLES}`, 'cutsMm');
  }
  cutsMm.forEach((cut, i) => {
    if (typeof cut !== 'number' || !Number.isFinite(cut) || cut < 0) {
      throw new ComputationError(`the cut in cycle ${i + 1} must be a non-negative number of millimetres (got ${String(cut)})`, `cutsMm.${i}`);
    }
  });
  // Sum at the inputs' precision: in whole units of the finest decimal given, so a series that adds
  // up to exactly a minimum in decimal is judged on the minimum, not a hair under it (0.3 + 32.3 +
  // 17.4 is 49.99999999999999 in binary floating point). Numbers with more places than anyone
  // measures (computed series) are summed as they are.
  const places = Math.max(...cutsMm.map(decimalPlaces));
  const unit = places <= MAX_PLACES ? 10 ** places : 1;
  const exact = places <= MAX_PLACES;
  const cumulativeMm: number[] = [];
  let sum = 0;
  for (const cut of cutsMm) {
    sum += exact ? Math.round(cut * unit) : cut;
    cumulativeMm.push(exact ? sum / unit : sum);
  }
  const icpMm = cumulativeMm[Math.min(ICP_CYCLES, cutsMm.length) - 1];
  const tccMm = cumulativeMm[Math.min(TCC_CYCLES, cutsMm.length) - 1];
  const judge = (value: number, min: number, needed: number): boolean | null =>
    value >= min ? true : cutsMm.length >= needed ? false : null;
  return {
    icpMm,
    tccMm,
    cycles: cutsMm.length,
    cumulativeMm,
    limits: { icpMinMm: ICP_MIN_MM, tccMinMm: TCC_MIN_MM },
    icpPass: judge(icpMm, ICP_MIN_MM, ICP_CYCLES),
    tccPass: judge(tccMm, TCC_MIN_MM, TCC_CYCLES),
  };
}
