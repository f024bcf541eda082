/**
 * Geometry of a bevel ground on a wheel with the blade resting on a round support bar.
 *
 * Wheel axis O, radius R; the bar's axis S at distance d from O; the edge touches the rim at C,
 * at distance L (the projection) from S along the blade. The blade leaves the rim outward, and the
 * bevel angle per side α lies between the blade and the wheel's tangent at C. The law of cosines in
 * the triangle O S C gives
 *   sin α = (d² − R² − L²) / (2 R L),   valid for d − R ≤ L ≤ √(d² − R²)   (α from 90° down to 0°),
 * and inversely d = √(R² + L² + 2 R L sin α) and L = −R sin α + √(R² sin² α + d² − R²).
 * A person measures d as R + the shortest gap from bar to rim + the bar's radius.
 * All lengths in millimetres, angles in degrees.
 *
 * Pure arithmetic: no I/O, no clock, no framework imports.
 */
import { ComputationError } from './computation-error';

/** A wheel and support-bar setup, as measured at the machine (mm). */
export interface WheelSetup {
  /** Wheel diameter, mm. */
  wheelDiameterMm: number;
  /** Support bar diameter, mm. */
  barDiameterMm: number;
  /** Shortest gap between the bar's surface and the wheel's rim, mm. */
  gapMm: number;
  /** Distance from the bar's axis to the edge, along the blade, mm. */
  projectionMm: number;
}

/** An edge angle: per side (the bevel against the tangent) and inclusive (both sides), degrees. */
export interface EdgeAngle {
  perSideDeg: number;
  inclusiveDeg: number;
}

const DEG = Math.PI / 180;
// Relative slack for the validity limits, so a setup exactly at 0° or 90° is not refused for a
// rounding error in the last bit.
const SLACK = 1e-12;

function mm(n: number): string {
  return `${Number(n.toFixed(1))} mm`;
}

function requireNumber(value: unknown, field: string, what: string, allowZero = false): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
    throw new ComputationError(`${what} must be a ${allowZero ? 'non-negative' : 'positive'} number of millimetres (got ${String(value)})`, field);
  }
  return value;
}

function requireAngle(value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value >= 90) {
    throw new ComputationError(`the angle per side must be between 0° and 90° (got ${String(value)}°)`, 'perSideDeg');
  }
  return value;
}

/** Per-side angle in degrees from the wheel radius R, bar-axis distance d and projection L. */
function angleFromRdL(R: number, d: number, L: number, fields: { tooShort: string; tooLong: string }): number {
  const minL = d - R;
  const maxL = Math.sqrt(d * d - R * R);
  if (L < minL * (1 - SLACK)) {
    throw new ComputationError(
      `the blade would not reach the wheel: with the edge ${mm(L)} from the bar's axis it stops short of the rim, ` +
        `which is ${mm(minL)} from the bar's axis at its nearest; lengthen the projection or close the gap`,
      fields.tooShort,
    );
  }
  if (L > maxL * (1 + SLACK)) {
    throw new ComputationError(
      `the blade would cut into the wheel: with the edge ${mm(L)} from the bar's axis the blade would lie against the rim ` +
        `before its edge got there (at most ${mm(maxL)} for this gap, where the angle falls to 0°); shorten the projection or widen the gap`,
      fields.tooLong,
    );
  }
  const sin = Math.min(1, Math.max(0, (d * d - R * R - L * L) / (2 * R * L)));
  return Math.asin(sin) / DEG;
}

function validSetup(s: WheelSetup): { R: number; d: number; L: number; bar: number } {
  if (s === null || typeof s !== 'object') throw new ComputationError('give the wheel setup', 'setup');
  const D = requireNumber(s.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(s.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(s.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const L = requireNumber(s.projectionMm, 'projectionMm', 'the projection');
  const R = D / 2;
  return { R, d: R + gap + bar / 2, L, bar };
}

/**
 * The edge angle a setup grinds: per side and inclusive (degrees). Throws ComputationError when
 * the blade cannot rest on the bar and touch the rim with its edge: too short a projection
 * (field 'projectionMm': the blade would not reach the wheel) or too long a projection for the gap
 * (field 'projectionMm': the blade would cut into the wheel).
 */
export function angleFromSetup(s: WheelSetup): EdgeAngle {
  const { R, d, L } = validSetup(s);
  const perSideDeg = angleFromRdL(R, d, L, { tooShort: 'projectionMm', tooLong: 'projectionMm' });
  return { perSideDeg, inclusiveDeg: 2 * perSideDeg };
}

/** Gap (mm) for radius R, bar diameter, projection L and angle α; throws if the bar would overlap the wheel. */
function gapFor(R: number, bar: number, L: number, alphaDeg: number, field: string): number {
  const d = Math.sqrt(R * R + L * L + 2 * R * L * Math.sin(alphaDeg * DEG));
  const gapMm = d - R - bar / 2;
  if (gapMm < -SLACK * d) {
    const sin = Math.sin(alphaDeg * DEG);
    const d0 = R + bar / 2; // the bar touching the rim
    const shortest = -R * sin + Math.sqrt(R * R * sin * sin + d0 * d0 - R * R);
    throw new ComputationError(
      `for ${Number(alphaDeg.toFixed(2))}° per side with a projection of ${mm(L)} the bar would have to sit inside the wheel ` +
        `(${mm(-gapMm)} of overlap); lengthen the projection to at least ${mm(shortest)}`,
      field,
    );
  }
  return Math.max(0, gapMm);
}

/**
 * The gap from bar to rim (mm) that grinds `perSideDeg` with the given wheel, bar and projection:
 * d = √(R² + L² + 2RL sin α), gap = d − R − bar radius. Throws ComputationError when the bar would
 * have to overlap the wheel (field 'projectionMm', naming the shortest projection that works) or
 * the angle is not between 0° and 90° (field 'perSideDeg').
 */
export function gapForAngle(input: { wheelDiameterMm: number; barDiameterMm: number; projectionMm: number; perSideDeg: number }): {
  gapMm: number;
} {
  const D = requireNumber(input?.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  const alpha = requireAngle(input.perSideDeg);
  return { gapMm: gapFor(D / 2, bar, L, alpha, 'projectionMm') };
}

/**
 * The projection (mm, bar axis to edge) that grinds `perSideDeg` with the given wheel, bar and
 * gap: L = −R sin α + √(R² sin² α + d² − R²). Throws ComputationError for an angle not between
 * 0° and 90° (field 'perSideDeg') or bad lengths.
 */
export function projectionForAngle(input: { wheelDiameterMm: number; barDiameterMm: number; gapMm: number; perSideDeg: number }): {
  projectionMm: number;
} {
  const D = requireNumber(input?.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(input.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const alpha = requireAngle(input.perSideDeg);
  const R = D / 2;
  const d = R + gap + bar / 2;
  const sin = Math.sin(alpha * DEG);
  return { projectionMm: -R * sin + Math.sqrt(R * R * sin * sin + d * d - R * R) };
}

/**
 * How the angle of an unchanged setup drifts as a wheel wears. The bar is left where it was, so
 * the gap to the rim grows by the radius lost. Returns the per-side angle on the original and on
 * the current wheel (degrees), the gap to the rim now, and the gap that restores the original
 * angle on the current wheel (mm). Wheels that keep their diameter (CBN, diamond) show no drift.
 * `gapMm` is the gap as set on the original wheel. Throws ComputationError for a current diameter
 * larger than the original (field 'currentDiameterMm') or a setup the blade cannot reach.
 */
export function wearDrift(input: {
  originalDiameterMm: number;
  currentDiameterMm: number;
  barDiameterMm: number;
  gapMm: number;
  projectionMm: number;
}): { originalPerSideDeg: number; currentPerSideDeg: number; currentGapMm: number; restoringGapMm: number } {
  const D0 = requireNumber(input?.originalDiameterMm, 'originalDiameterMm', 'the original wheel diameter');
  const D1 = requireNumber(input.currentDiameterMm, 'currentDiameterMm', 'the current wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(input.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  if (D1 > D0) {
    throw new ComputationError(
      `the current diameter (${mm(D1)}) is larger than the original (${mm(D0)}); wear only makes a wheel smaller`,
      'currentDiameterMm',
    );
  }
  const R0 = D0 / 2;
  const R1 = D1 / 2;
  const d = R0 + gap + bar / 2; // the bar stays put: d is fixed
  const originalPerSideDeg = angleFromRdL(R0, d, L, { tooShort: 'projectionMm', tooLong: 'projectionMm' });
  let currentPerSideDeg: number;
  try {
    currentPerSideDeg = angleFromRdL(R1, d, L, { tooShort: 'currentDiameterMm', tooLong: 'currentDiameterMm' });
  } catch (err) {
    if (!(err instanceof ComputationError)) throw err;
    throw new ComputationError(
      `on the wheel worn to ${mm(D1)} the edge no longer reaches the rim with the bar where it was; move the bar closer or lengthen the projection`,
      'currentDiameterMm',
    );
  }
  const currentGapMm = gap + (R0 - R1);
  const restoringGapMm = gapFor(R1, bar, L, originalPerSideDeg, 'projectionMm');
  return { originalPerSideDeg, currentPerSideDeg, currentGapMm, restoringGapMm };
}
