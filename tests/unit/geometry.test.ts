import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ComputationError } from '@shared/computation-error';
import { angleFromSetup, gapForAngle, projectionForAngle, wearDrift, type WheelSetup } from '@shared/geometry';
import { computationError } from '../setup/computation-error';

/** A setup from the model's quantities: wheel radius R, bar-axis distance d, projection L, bar diameter. */
function setupFrom(R: number, d: number, L: number, bar = 12): WheelSetup {
  return { wheelDiameterMm: 2 * R, barDiameterMm: bar, gapMm: d - R - bar / 2, projectionMm: L };
}

/**
 * The per-side angle by coordinates, independent of the law-of-cosines formula: O at the origin,
 * S at (d, 0), C where the circle of radius R about O meets the circle of radius L about S; the
 * angle at C between C→S and C→O, less 90°.
 */
function angleByCoordinates(R: number, d: number, L: number): number {
  const x = (R * R - L * L + d * d) / (2 * d);
  const y = Math.sqrt(Math.max(0, R * R - x * x));
  const cs = [d - x, -y];
  const co = [-x, -y];
  const cos = (cs[0] * co[0] + cs[1] * co[1]) / (Math.hypot(cs[0], cs[1]) * Math.hypot(co[0], co[1]));
  return (Math.acos(Math.max(-1, Math.min(1, cos))) * 180) / Math.PI - 90;
}

describe('worked examples', () => {
  // published-values.md, geometry section: derived, computed by law of cosines and by coordinates
  it.each([
    [100, 250, 200, 18.21],
    [125, 300, 220, 28.1819],
  ])('R %i, d %i, L %i → %f° per side', (R, d, L, deg) => {
    const a = angleFromSetup(setupFrom(R, d, L));
    expect(a.perSideDeg).toBeCloseTo(deg, 4);
    expect(a.inclusiveDeg).toBe(2 * a.perSideDeg);
    expect(a.perSideDeg).toBeCloseTo(angleByCoordinates(R, d, L), 9);
  });

  it('R 100, d 250, 15° per side → L 204.704 (published-values.md, derived)', () => {
    const { projectionMm } = projectionForAngle({ wheelDiameterMm: 200, barDiameterMm: 12, gapMm: 144, perSideDeg: 15 });
    expect(projectionMm).toBeCloseTo(204.704, 3);
    const { gapMm } = gapForAngle({ wheelDiameterMm: 200, barDiameterMm: 12, projectionMm, perSideDeg: 15 });
    expect(gapMm).toBeCloseTo(144, 9);
  });

  it('d is measured as R + gap + bar radius (DESIGN.md): the bar’s size and the gap trade one for one', () => {
    const a = angleFromSetup({ wheelDiameterMm: 200, barDiameterMm: 12, gapMm: 144, projectionMm: 200 });
    const b = angleFromSetup({ wheelDiameterMm: 200, barDiameterMm: 20, gapMm: 140, projectionMm: 200 });
    expect(b.perSideDeg).toBeCloseTo(a.perSideDeg, 12);
  });

  it('limits: L = d − R gives 90°, L = √(d² − R²) gives 0° (published-values.md)', () => {
    expect(angleFromSetup(setupFrom(100, 250, 150)).perSideDeg).toBeCloseTo(90, 6);
    expect(angleFromSetup(setupFrom(100, 250, Math.sqrt(250 ** 2 - 100 ** 2))).perSideDeg).toBeCloseTo(0, 6);
  });
});

describe('impossible setups are refused in plain words', () => {
  it('a projection beyond √(d² − R²): the blade would cut into the wheel', () => {
    const err = computationError(() => angleFromSetup(setupFrom(100, 250, 230)));
    expect(err.field).toBe('projectionMm');
    expect(err.message).toMatch(/would cut into the wheel/);
    expect(err.message).toMatch(/229\.1 mm/); // √(250² − 100²) = 229.13
  });

  it('a projection shorter than d − R: the blade would not reach the wheel', () => {
    const err = computationError(() => angleFromSetup(setupFrom(100, 250, 140)));
    expect(err.field).toBe('projectionMm');
    expect(err.message).toMatch(/would not reach the wheel/);
    expect(err.message).toMatch(/150 mm/);
  });

  it.each<[Partial<WheelSetup>, string]>([
    [{ wheelDiameterMm: 0 }, 'wheelDiameterMm'],
    [{ wheelDiameterMm: -200 }, 'wheelDiameterMm'],
    [{ barDiameterMm: Number.NaN }, 'barDiameterMm'],
    [{ gapMm: -1 }, 'gapMm'],
    [{ projectionMm: Infinity }, 'projectionMm'],
  ])('bad input %j names %s', (patch, field) => {
    const setup = { ...setupFrom(100, 250, 200), ...patch };
    expect(computationError(() => angleFromSetup(setup)).field).toBe(field);
  });

  it('a gap of zero is a valid setup (the bar touching the rim)', () => {
    expect(angleFromSetup({ wheelDiameterMm: 200, barDiameterMm: 12, gapMm: 0, projectionMm: 30 }).perSideDeg).toBeGreaterThan(0);
  });

  it.each([0, 90, -5, 120, Number.NaN])('gapForAngle refuses %f° per side as out of range', (deg) => {
    const err = computationError(() => gapForAngle({ wheelDiameterMm: 200, barDiameterMm: 12, projectionMm: 200, perSideDeg: deg }));
    expect(err.field).toBe('perSideDeg');
    expect(err.message).toMatch(/between 0° and 90°/);
  });

  it('gapForAngle refuses an angle that would put the bar inside the wheel, naming the shortest projection', () => {
    // R 100, bar 12 touching the rim (d 106): for 20° the projection must be at least
    // −100 sin 20° + √(100² sin² 20° + 106² − 100²) = −34.202 + 49.049 = 14.85 mm (formula in
    // published-values.md, by hand); with L 10 mm, d = √(100² + 10² + 2·100·10·sin 20°) = 103.85 mm < 106
    const err = computationError(() => gapForAngle({ wheelDiameterMm: 200, barDiameterMm: 12, projectionMm: 10, perSideDeg: 20 }));
    expect(err.field).toBe('projectionMm');
    expect(err.message).toMatch(/inside the wheel/);
    expect(err.message).toMatch(/at least 14\.8 mm/);
  });
});

describe('wear drift', () => {
  it('a vitrified wheel worn from 200 mm to 180 mm raises the angle of an unchanged setup (common practice)', () => {
    // by hand: R 90, d 250, L 200: sin α = (250² − 90² − 200²)/(2·90·200) = 0.4 → 23.578°;
    // restoring: d' = √(90² + 200² + 2·90·200·0.3125) = 243.619, gap' = 243.619 − 90 − 6 = 147.619
    const drift = wearDrift({ originalDiameterMm: 200, currentDiameterMm: 180, barDiameterMm: 12, gapMm: 144, projectionMm: 200 });
    expect(drift.originalPerSideDeg).toBeCloseTo(18.21, 4);
    expect(drift.currentPerSideDeg).toBeCloseTo((Math.asin(0.4) * 180) / Math.PI, 9);
    expect(drift.currentPerSideDeg).toBeGreaterThan(drift.originalPerSideDeg);
    expect(drift.currentGapMm).toBe(154); // the gap grows by the 10 mm of radius lost
    expect(drift.restoringGapMm).toBeCloseTo(Math.sqrt(59350) - 96, 9);
    const restored = angleFromSetup({ wheelDiameterMm: 180, barDiameterMm: 12, gapMm: drift.restoringGapMm, projectionMm: 200 });
    expect(restored.perSideDeg).toBeCloseTo(drift.originalPerSideDeg, 9);
  });

  it('CBN and diamond wheels keep their diameter: no drift (common practice)', () => {
    const drift = wearDrift({ originalDiameterMm: 200, currentDiameterMm: 200, barDiameterMm: 12, gapMm: 144, projectionMm: 200 });
    expect(drift.currentPerSideDeg).toBe(drift.originalPerSideDeg);
    expect(drift.currentGapMm).toBe(144);
    expect(drift.restoringGapMm).toBeCloseTo(144, 9);
  });

  it('refuses a wheel that grew, and a worn wheel the edge no longer reaches', () => {
    const grew = computationError(() =>
      wearDrift({ originalDiameterMm: 200, currentDiameterMm: 210, barDiameterMm: 12, gapMm: 144, projectionMm: 200 }),
    );
    expect(grew.field).toBe('currentDiameterMm');
    expect(grew.message).toMatch(/wear only makes a wheel smaller/);
    // L 160 on R 100, d 250 is 65°; on R 80 the rim is 170 mm from the bar axis, out of reach
    const lost = computationError(() =>
      wearDrift({ originalDiameterMm: 200, currentDiameterMm: 160, barDiameterMm: 12, gapMm: 144, projectionMm: 160 }),
    );
    expect(lost.field).toBe('currentDiameterMm');
    expect(lost.message).toMatch(/no longer reaches the rim/);
  });
});

describe('properties', () => {
  /** Valid setups: R 50–150 mm, bar 8–25 mm, gap 1–200 mm, L anywhere in its valid range. */
  const validSetup = fc
    .record({
      R: fc.double({ min: 50, max: 150, noNaN: true }),
      bar: fc.double({ min: 8, max: 25, noNaN: true }),
      gap: fc.double({ min: 1, max: 200, noNaN: true }),
      t: fc.double({ min: 0.001, max: 0.999, noNaN: true }),
    })
    .map(({ R, bar, gap, t }) => {
      const d = R + gap + bar / 2;
      const L = d - R + t * (Math.sqrt(d * d - R * R) - (d - R));
      return { R, d, L, bar, gap };
    });

  it('agrees with an independent construction by coordinates', () => {
    fc.assert(
      fc.property(validSetup, ({ R, d, L, bar }) => {
        expect(angleFromSetup(setupFrom(R, d, L, bar)).perSideDeg).toBeCloseTo(angleByCoordinates(R, d, L), 6);
      }),
    );
  });

  it('the angle falls as the projection grows', () => {
    fc.assert(
      fc.property(validSetup, fc.double({ min: 0.01, max: 0.99, noNaN: true }), ({ R, d, L, bar }, shrink) => {
        const shorter = d - R + shrink * (L - (d - R));
        fc.pre(L - shorter > 1e-6);
        expect(angleFromSetup(setupFrom(R, d, shorter, bar)).perSideDeg).toBeGreaterThan(angleFromSetup(setupFrom(R, d, L, bar)).perSideDeg);
      }),
    );
  });

  it('the angle rises as the wheel shrinks with the bar unmoved', () => {
    fc.assert(
      fc.property(validSetup, fc.double({ min: 0.1, max: 10, noNaN: true }), ({ R, L, bar, gap }, lostMm) => {
        try {
          const drift = wearDrift({ originalDiameterMm: 2 * R, currentDiameterMm: 2 * R - 2 * lostMm, barDiameterMm: bar, gapMm: gap, projectionMm: L });
          expect(drift.currentPerSideDeg).toBeGreaterThan(drift.originalPerSideDeg);
          expect(drift.restoringGapMm).toBeLessThan(drift.currentGapMm); // the bar moves back toward the wheel
        } catch (err) {
          // only when the edge can no longer reach the smaller wheel
          expect((err as ComputationError).field).toBe('currentDiameterMm');
        }
      }),
    );
  });

  it('setup → angle → gap round-trips, and angle → projection → angle', () => {
    fc.assert(
      fc.property(validSetup, ({ R, d, L, bar, gap }) => {
        const { perSideDeg } = angleFromSetup(setupFrom(R, d, L, bar));
        fc.pre(perSideDeg > 1e-3 && perSideDeg < 90 - 1e-3);
        expect(gapForAngle({ wheelDiameterMm: 2 * R, barDiameterMm: bar, projectionMm: L, perSideDeg }).gapMm).toBeCloseTo(gap, 6);
        const { projectionMm } = projectionForAngle({ wheelDiameterMm: 2 * R, barDiameterMm: bar, gapMm: gap, perSideDeg });
        expect(projectionMm).toBeCloseTo(L, 6);
      }),
    );
  });
});
