/**
 * Geometry of a bevel ground on a wheel with the blade resting on a round support bar.
 *
 * Wheel axis O, radius R; the bar's axis S at distance d from O; the edge touches the rim at C.
 * A jig holds the blade's plane at a distance e from the bar's axis (the blade-plane offset),
 * positive when the bar's axis lies between the blade's line and the wheel's axis (the usual
 * case: the jig rests on the bar with the blade above it). The projection L is measured along the
 * blade, from the foot of the perpendicular dropped from S onto the blade's line to the edge C,
 * so |SC|² = L² + e². The blade leaves the rim outward, and the bevel angle per side α lies
 * between the blade and the wheel's tangent at C.
 *
 * Derivation (drawn in the section view of the tool page). Put C at the origin with the rim's
 * tangent along x and O at (0, −R). The blade runs from C along u = (cos α, sin α); its normal
 * towards the wheel's side is n = (sin α, −cos α). The bar's axis is S = L u + e n, so
 *   S − O = (L cos α + e sin α,  L sin α − e cos α + R)
 *   d²    = L² + e² + R² + 2R (L sin α − e cos α)
 * and, with ρ = √(L² + e²), φ = atan2(e, L) and K = (d² − R² − L² − e²) / (2R),
 *   L sin α − e cos α = K   ⇔   ρ sin(α − φ) = K   ⇔   α = φ + asin(K / ρ).
 * With e = 0 this is sin α = (d² − R² − L²) / (2RL), the law of cosines in the triangle O S C.
 * The angle runs from 90° at L = √(d² − e²) − R down to 0° at L = √(d² − (R − e)²); for a wanted
 * angle the bar sits at d = √(R² + L² + e² + 2R (L sin α − e cos α)), and the projection is
 *   L = −R sin α + √(R² sin² α + d² − R² − e² + 2Re cos α).
 * A person measures d as R + the shortest gap from bar to rim + the bar's radius.
 *
 * On a wheel's side (flat bevels) the bar lies parallel to the wheel's face at a gap from it; the
 * face is a rim of infinite radius, and the same construction gives, with h = gap + bar radius,
 *   L sin α − e cos α = h,  so  sin α = h / L  when e = 0.
 *
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
  /** Blade-plane offset e from the bar's axis, mm; positive with the bar's axis between blade and wheel. 0 when absent. */
  offsetMm?: number;
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

function requireNumber(value: unknown, field: string, what: string, allowZero = false, unit = 'millimetres'): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
    throw new ComputationError(`${what} must be a ${allowZero ? 'non-negative' : 'positive'} number of ${unit} (got ${String(value)})`, field);
  }
  return value;
}

function requireAngle(value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value >= 90) {
    throw new ComputationError(`the angle per side must be between 0° and 90° (got ${String(value)}°)`, 'perSideDeg');
  }
  return value;
}

/**
 * The shortest and longest projections that reach the rim for R, d and e: the longest gives 0°,
 * L = √(d² − (R − e)²); the shortest gives 90° for e ≥ 0, L = √(d² − e²) − R, and for e < 0 puts
 * the edge on the rim's point nearest the bar, L = √((d − R)² − e²), at 90° + φ.
 */
function projectionLimits(R: number, d: number, e: number): { minL: number; maxL: number } {
  const minL = e >= 0 ? Math.sqrt(Math.max(0, d * d - e * e)) - R : Math.sqrt(Math.max(0, (d - R) * (d - R) - e * e));
  return { minL, maxL: Math.sqrt(Math.max(0, d * d - (R - e) * (R - e))) };
}

/**
 * Per-side angle in degrees from the wheel radius R, bar-axis distance d, projection L and offset
 * e: α = φ + asin(K / ρ), the branch that is continuous with e = 0.
 */
function angleFromRdL(R: number, d: number, L: number, e: number, fields: { tooShort: string; tooLong: string }): number {
  const { minL, maxL } = projectionLimits(R, d, e);
  const rho = Math.hypot(L, e);
  const K = (d * d - R * R - L * L - e * e) / (2 * R);
  const ratio = K / rho;
  const alpha = ratio > 1 + SLACK ? Infinity : (Math.atan2(e, L) + Math.asin(Math.min(1, Math.max(-1, ratio)))) / DEG;
  if (alpha > 90 + SLACK * 90) {
    throw new ComputationError(
      `the blade would not reach the wheel: with the edge ${mm(L)} from the bar's axis it stops short of the rim, ` +
        `which it first reaches at ${mm(minL)} from the bar's axis; lengthen the projection or close the gap`,
      fields.tooShort,
    );
  }
  if (alpha < -SLACK * 90) {
    throw new ComputationError(
      `the blade would cut into the wheel: with the edge ${mm(L)} from the bar's axis the blade would lie against the rim ` +
        `before its edge got there (at most ${mm(maxL)} for this gap, where the angle falls to 0°); shorten the projection or widen the gap`,
      fields.tooLong,
    );
  }
  return Math.min(90, Math.max(0, alpha));
}

/** Bar-axis distance d for radius R, projection L, offset e and angle α (degrees). */
function barDistance(R: number, L: number, e: number, alphaDeg: number): number {
  const a = alphaDeg * DEG;
  return Math.sqrt(R * R + L * L + e * e + 2 * R * (L * Math.sin(a) - e * Math.cos(a)));
}

/** Projection for radius R, bar-axis distance d, offset e and angle α (degrees). */
function projectionFor(R: number, d: number, e: number, alphaDeg: number): number {
  const a = alphaDeg * DEG;
  const sin = Math.sin(a);
  return -R * sin + Math.sqrt(Math.max(0, R * R * sin * sin + d * d - R * R - e * e + 2 * R * e * Math.cos(a)));
}

function requireOffset(value: unknown): number {
  if (value === undefined) return 0;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ComputationError(`the blade-plane offset must be a number of millimetres (got ${String(value)})`, 'offsetMm');
  }
  return value;
}

function validSetup(s: WheelSetup): { R: number; d: number; L: number; e: number; bar: number } {
  if (s === null || typeof s !== 'object') throw new ComputationError('give the wheel setup', 'setup');
  const D = requireNumber(s.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(s.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(s.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const L = requireNumber(s.projectionMm, 'projectionMm', 'the projection');
  const e = requireOffset(s.offsetMm);
  const R = D / 2;
  return { R, d: R + gap + bar / 2, L, e, bar };
}

/**
 * The edge angle a setup grinds: per side and inclusive (degrees). Throws ComputationError when
 * the blade cannot rest on the bar and touch the rim with its edge: too short a projection
 * (field 'projectionMm': the blade would not reach the wheel) or too long a projection for the gap
 * (field 'projectionMm': the blade would cut into the wheel).
 */
export function angleFromSetup(s: WheelSetup): EdgeAngle {
  const { R, d, L, e } = validSetup(s);
  const perSideDeg = angleFromRdL(R, d, L, e, { tooShort: 'projectionMm', tooLong: 'projectionMm' });
  return { perSideDeg, inclusiveDeg: 2 * perSideDeg };
}

/** Gap (mm) for radius R, bar diameter, projection L, offset e and angle α; throws if the bar would overlap the wheel. */
function gapFor(R: number, bar: number, L: number, e: number, alphaDeg: number, field: string): number {
  const d = barDistance(R, L, e, alphaDeg);
  const gapMm = d - R - bar / 2;
  if (gapMm < -SLACK * d) {
    const shortest = projectionFor(R, R + bar / 2, e, alphaDeg); // the bar touching the rim
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
 * d = √(R² + L² + e² + 2R(L sin α − e cos α)), gap = d − R − bar radius (e = 0 without an offset). Throws ComputationError when the bar would
 * have to overlap the wheel (field 'projectionMm', naming the shortest projection that works) or
 * the angle is not between 0° and 90° (field 'perSideDeg').
 */
export function gapForAngle(input: { wheelDiameterMm: number; barDiameterMm: number; projectionMm: number; perSideDeg: number; offsetMm?: number }): {
  gapMm: number;
} {
  const D = requireNumber(input?.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  const alpha = requireAngle(input.perSideDeg);
  return { gapMm: gapFor(D / 2, bar, L, requireOffset(input.offsetMm), alpha, 'projectionMm') };
}

/**
 * The projection (mm, bar axis to edge) that grinds `perSideDeg` with the given wheel, bar and
 * gap: L = −R sin α + √(R² sin² α + d² − R² − e² + 2Re cos α). Throws ComputationError for an angle not between
 * 0° and 90° (field 'perSideDeg') or bad lengths.
 */
export function projectionForAngle(input: { wheelDiameterMm: number; barDiameterMm: number; gapMm: number; perSideDeg: number; offsetMm?: number }): {
  projectionMm: number;
} {
  const D = requireNumber(input?.wheelDiameterMm, 'wheelDiameterMm', 'the wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(input.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const alpha = requireAngle(input.perSideDeg);
  const R = D / 2;
  return { projectionMm: projectionFor(R, R + gap + bar / 2, requireOffset(input.offsetMm), alpha) };
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
  offsetMm?: number;
}): { originalPerSideDeg: number; currentPerSideDeg: number; currentGapMm: number; restoringGapMm: number } {
  const D0 = requireNumber(input?.originalDiameterMm, 'originalDiameterMm', 'the original wheel diameter');
  const D1 = requireNumber(input.currentDiameterMm, 'currentDiameterMm', 'the current wheel diameter');
  const bar = requireNumber(input.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(input.gapMm, 'gapMm', 'the gap from bar to wheel', true);
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  const e = requireOffset(input.offsetMm);
  if (D1 > D0) {
    throw new ComputationError(
      `the current diameter (${mm(D1)}) is larger than the original (${mm(D0)}); wear only makes a wheel smaller`,
      'currentDiameterMm',
    );
  }
  const R0 = D0 / 2;
  const R1 = D1 / 2;
  const d = R0 + gap + bar / 2; // the bar stays put: d is fixed
  const originalPerSideDeg = angleFromRdL(R0, d, L, e, { tooShort: 'projectionMm', tooLong: 'projectionMm' });
  let currentPerSideDeg: number;
  try {
    currentPerSideDeg = angleFromRdL(R1, d, L, e, { tooShort: 'currentDiameterMm', tooLong: 'currentDiameterMm' });
  } catch (err) {
    if (!(err instanceof ComputationError)) throw err;
    throw new ComputationError(
      `on the wheel worn to ${mm(D1)} the edge no longer reaches the rim with the bar where it was; move the bar closer or lengthen the projection`,
      'currentDiameterMm',
    );
  }
  const currentGapMm = gap + (R0 - R1);
  const restoringGapMm = gapFor(R1, bar, L, e, originalPerSideDeg, 'projectionMm');
  return { originalPerSideDeg, currentPerSideDeg, currentGapMm, restoringGapMm };
}

/** A flat bevel on a wheel's side: the bar parallel to the face at `gapMm` from it (mm). */
export interface SideSetup {
  barDiameterMm: number;
  gapMm: number;
  projectionMm: number;
  /** Blade-plane offset, as in WheelSetup; 0 when absent. */
  offsetMm?: number;
}

/**
 * The per-side angle of a flat bevel ground on a wheel's side: L sin α − e cos α = gap + bar
 * radius, so sin α = (gap + bar/2) / projection without an offset. Throws ComputationError
 * (field 'projectionMm') when the edge cannot reach the face (too short a projection for the gap).
 */
export function sideAngleFromSetup(input: SideSetup): EdgeAngle {
  const bar = requireNumber(input?.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const gap = requireNumber(input.gapMm, 'gapMm', 'the gap from bar to wheel face', true);
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  const e = requireOffset(input.offsetMm);
  const h = gap + bar / 2;
  const rho = Math.hypot(L, e);
  // α = φ + asin(h / ρ) must lie in 0°…90°: at 90° the blade stands square to the face (L = h).
  const perSideDeg = h / rho > 1 + SLACK ? NaN : (Math.atan2(e, L) + Math.asin(Math.min(1, h / rho))) / DEG;
  if (!(perSideDeg <= 90 + SLACK)) {
    throw new ComputationError(
      `the edge would not reach the wheel's face: the bar's axis is ${mm(h)} from the face, and an edge ${mm(L)} from the bar's axis ` +
        `stops short of it; lengthen the projection to more than ${mm(Math.sqrt(Math.max(0, h * h - e * e)))} or close the gap`,
      'projectionMm',
    );
  }
  const clamped = Math.min(90, Math.max(0, perSideDeg));
  return { perSideDeg: clamped, inclusiveDeg: 2 * clamped };
}

/**
 * The gap from bar to wheel face (mm) that grinds `perSideDeg` on the side: gap = L sin α − e cos α
 * − bar/2. Throws ComputationError when the bar would have to sit inside the wheel (field
 * 'projectionMm', naming the shortest projection that works) or the angle is not between 0° and 90°
 * (field 'perSideDeg').
 */
export function sideGapForAngle(input: { barDiameterMm: number; projectionMm: number; perSideDeg: number; offsetMm?: number }): { gapMm: number } {
  const bar = requireNumber(input?.barDiameterMm, 'barDiameterMm', 'the bar diameter');
  const L = requireNumber(input.projectionMm, 'projectionMm', 'the projection');
  const alpha = requireAngle(input.perSideDeg);
  const e = requireOffset(input.offsetMm);
  const a = alpha * DEG;
  const gapMm = L * Math.sin(a) - e * Math.cos(a) - bar / 2;
  if (gapMm < -SLACK * L) {
    const shortest = (bar / 2 + e * Math.cos(a)) / Math.sin(a);
    throw new ComputationError(
      `for ${Number(alpha.toFixed(2))}° per side with a projection of ${mm(L)} the bar would have to sit inside the wheel ` +
        `(${mm(-gapMm)} past its face); lengthen the projection to at least ${mm(shortest)}`,
      'projectionMm',
    );
  }
  return { gapMm: Math.max(0, gapMm) };
}

/** Peripheral speed of a wheel in m/s: v = π · D · n / 60 000 (D in mm, n in rpm). */
export function peripheralSpeedMps(diameterMm: number, spindleRpm: number): number {
  const D = requireNumber(diameterMm, 'diameterMm', 'the wheel diameter');
  const n = requireNumber(spindleRpm, 'spindleRpm', 'the spindle speed', true, 'revolutions a minute');
  return (Math.PI * D * n) / 60_000;
}

/**
 * A wheel's peripheral speed at a spindle speed against its rated maximum (m/s). The check is at
 * the diameter given (use the diameter when new: the largest, so the fastest rim). `overspeed` is
 * true when the rim would run faster than the rating; `marginPct` is how far below it (negative:
 * above).
 */
export function ratedSpeedCheck(input: { diameterMm: number; spindleRpm: number; ratedSpeedMps: number }): {
  speedMps: number;
  ratedSpeedMps: number;
  overspeed: boolean;
  marginPct: number;
} {
  const speedMps = peripheralSpeedMps(input?.diameterMm, input.spindleRpm);
  const rated = requireNumber(input.ratedSpeedMps, 'ratedSpeedMps', 'the rated speed', false, 'metres a second');
  return { speedMps, ratedSpeedMps: rated, overspeed: speedMps > rated, marginPct: (1 - speedMps / rated) * 100 };
}
