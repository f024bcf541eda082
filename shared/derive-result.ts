import type { ResultInput } from './schemas/result';
import { gritBand, parseGrit, type GritStandard } from './grit';
import { toHrc } from './hardness';
import { angleFromSetup } from './geometry';
import { median } from './stats';

/** The values derived from a result's input and stored beside it. */
export interface DerivedResult {
  gritStandard: GritStandard;
  gritGrade: string;
  gritUm: number;
  /** Whole-φ grit band, µm. */
  gritBand: { loUm: number; hiUm: number };
  /** φ at the band's coarse edge (the integer part of −log2(d / 1 mm)). */
  gritPhi: number;
  hrc: number;
  perSideDeg: number;
  inclusiveDeg: number;
  sharpnessMedianG: number;
}

/**
 * Derives the normalised values of one result. When the input names no grit, the final
 * abrasive's labelled grit is used. Throws ComputationError for impossible inputs.
 */
export function deriveResult(input: ResultInput, abrasiveGrit: { standard: GritStandard; grade: string }): DerivedResult {
  const grit = input.grit ?? abrasiveGrit;
  const parsed = parseGrit(grit.grade, grit.standard);
  const gritPhi = Math.floor(-Math.log2(parsed.micrometres / 1000));
  const angle = 'perSideDeg' in input.edgeAngle ? input.edgeAngle.perSideDeg : angleFromSetup(input.edgeAngle.setup).perSideDeg;
  return {
    gritStandard: parsed.standard,
    gritGrade: parsed.grade,
    gritUm: parsed.micrometres,
    gritBand: gritBand(parsed.micrometres),
    gritPhi,
    hrc: toHrc(input.hardness.value, input.hardness.scale),
    perSideDeg: angle,
    inclusiveDeg: 2 * angle,
    sharpnessMedianG: median(input.sharpness.readingsG),
  };
}

/** The µm edges of whole-φ band `phi` (φ = −log2(d / 1 mm)): finer edge first. */
export function bandOfPhi(phi: number): { loUm: number; hiUm: number } {
  return { loUm: 1000 * 2 ** -(phi + 1), hiUm: 1000 * 2 ** -phi };
}
