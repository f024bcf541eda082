import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ComputationError } from '@shared/computation-error';
import { angleFromSetup, gapForAngle, peripheralSpeedMps, projectionForAngle, ratedSpeedCheck, sideAngleFromSetup, sideGapForAngle, wearDrift, type WheelSetup } from '@shared/geometry';
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

/**
 * An independent numerical solution with a blade-plane offset: bisection on the contact point.
 * O at the origin, S at (0, d). C(θ) = R (sin θ, cos θ) runs round the rim from the point nearest S
 * (θ = 0) to the farthest (θ = π); |SC| grows with θ, so bisection finds the C with |SC|² = L² + e².
 * The blade is then the line through C tangent to the circle of radius |e| about S, on the side
 * that leaves S on the wheel's side for e > 0; α is its angle to the rim's tangent at C.
 */
function angleByBisection(R: number, d: number, L: number, e: number): number {
  const target = Math.hypot(L, e);
  const dist = (t: number) => Math.hypot(R * Math.sin(t), R * Math.cos(t) - d);
  let lo = 0;
  let hi = Math.PI;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (dist(mid) < target) lo = mid;
    else hi = mid;
  }
  const t = (lo + hi) / 2;
  const C = [R * Math.sin(t), R * Math.cos(t)];
  const v = [0 - C[0], d - C[1]]; // C → S
  const rho2 = v[0] * v[0] + v[1] * v[1];
  const toO = [-C[0] / R, -C[1] / R]; // unit C → O
  let best = { miss: Infinity, deg: Number.NaN };
  for (const sigma of [1, -1]) {
    // u·v = L and u × v = σ e: the blade's direction from C towards the jig
    const u = [(L * v[0] - sigma * e * v[1]) / rho2, (L * v[1] + sigma * e * v[0]) / rho2];
    // normal to u on the wheel's side, and S's signed distance from the blade's line along it
    let n = [-u[1], u[0]];
    if (n[0] * toO[0] + n[1] * toO[1] < 0) n = [u[1], -u[0]];
    const miss = Math.abs(v[0] * n[0] + v[1] * n[1] - e);
    // the angle between u and C→O is 90° + α
    if (miss < best.miss) best = { miss, deg: (Math.asin(Math.min(1, Math.max(-1, -(u[0] * toO[0] + u[1] * toO[1])))) * 180) / Math.PI };
  }
  return best.deg;
}

describe('blade-plane offset (DESIGN.md: derive it, test it against a numerical solution)', () => {
  it('the issue\'s example: 10 mm off, a 15° setup on a 250 mm wheel is really 10.7° or 18.9°', () => {
    // bar 12 mm, projection 140 mm (the projection that reproduces the figures); the gap set
    // for 15° without an offset, then read with the jig holding the blade 10 mm either side
    const base = { wheelDiameterMm: 250, barDiameterMm: 12, projectionMm: 140 };
    const { gapMm } = gapForAngle({ ...base, perSideDeg: 15 });
    const above = angleFromSetup({ ...base, gapMm, offsetMm: 10 }).perSideDeg;
    const below = angleFromSetup({ ...base, gapMm, offsetMm: -10 }).perSideDeg;
    expect(above).toBeCloseTo(18.9, 1);
    expect(below).toBeCloseTo(10.7, 1);
    const d = 125 + gapMm + 6;
    expect(above).toBeCloseTo(angleByBisection(125, d, 140, 10), 8);
    expect(below).toBeCloseTo(angleByBisection(125, d, 140, -10), 8);
  });

  it('e = 0 gives the formula without an offset, and the bisection agrees with the worked examples', () => {
    // published-values.md: R 100, d 250, L 200 → 18.2100°
    expect(angleByBisection(100, 250, 200, 0)).toBeCloseTo(18.21, 4);
    expect(angleFromSetup({ ...setupFrom(100, 250, 200), offsetMm: 0 }).perSideDeg).toBe(angleFromSetup(setupFrom(100, 250, 200)).perSideDeg);
  });

  it('property: agrees with the bisection for any reachable setup and offset', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 200, noNaN: true }),
        fc.double({ min: 5, max: 150, noNaN: true }),
        fc.double({ min: -25, max: 25, noNaN: true }),
        fc.double({ min: 0.1, max: 0.95, noNaN: true }),
        (R, gap, e, t) => {
          const d = R + gap + 6;
          // between the edge on the rim's nearest point and the blade lying along the rim (0°)
          const minL = Math.sqrt(Math.max(0, (d - R) ** 2 - e * e));
          const maxL = Math.sqrt(d * d - (R - e) * (R - e));
          fc.pre(maxL - minL > 1); // a range of projections a person could set
          const L = minL + t * (maxL - minL);
          let a: number;
          try {
            a = angleFromSetup({ wheelDiameterMm: 2 * R, barDiameterMm: 12, gapMm: gap, projectionMm: L, offsetMm: e }).perSideDeg;
          } catch (err) {
            // refused only where the blade would stand past square to the rim (e > 0, short projections)
            expect(err).toBeInstanceOf(ComputationError);
            expect(e).toBeGreaterThan(0);
            return;
          }
          // With e < 0 close to the rim's nearest point, a second blade position reaches the same
          // edge (α₂ = 2φ + 180° − α, the other root of ρ sin(α − φ) = K); the bisection may find
          // either, and the model keeps the one continuous with e = 0.
          const phiDeg = (Math.atan2(e, L) * 180) / Math.PI;
          const b = angleByBisection(R, d, L, e);
          // near 90° asin is ill-conditioned (both ways lose about √ε), hence 1e-4°
          expect(Math.min(Math.abs(b - a), Math.abs(b - (2 * phiDeg + 180 - a)))).toBeLessThan(1e-4);
          if (2 * phiDeg + 180 - a > 90.001) expect(a).toBeCloseTo(b, 4);
          // and the inverses return the setup (away from 0° and 90°, where they are ill-conditioned)
          if (a < 0.5 || a > 89.5) return;
          const back = gapForAngle({ wheelDiameterMm: 2 * R, barDiameterMm: 12, projectionMm: L, perSideDeg: a, offsetMm: e }).gapMm;
          expect(back).toBeCloseTo(gap, 6);
          const L2 = projectionForAngle({ wheelDiameterMm: 2 * R, barDiameterMm: 12, gapMm: gap, perSideDeg: a, offsetMm: e }).projectionMm;
          expect(L2).toBeCloseTo(L, 6);
        },
      ),
    );
  });

  it('refuses an offset that is not a number, naming offsetMm', () => {
    expect(computationError(() => angleFromSetup({ ...setupFrom(100, 250, 200), offsetMm: Number.NaN })).field).toBe('offsetMm');
  });
});

describe('flat bevels on a wheel\'s side (DESIGN.md: sin α = (gap + bar radius) / projection)', () => {
  it('12 mm bar, 24 mm gap, 120 mm projection: sin α = 30/120, α = 14.4775° (by hand: asin 0.25)', () => {
    const a = sideAngleFromSetup({ barDiameterMm: 12, gapMm: 24, projectionMm: 120 });
    expect(a.perSideDeg).toBeCloseTo((Math.asin(0.25) * 180) / Math.PI, 12);
    expect(a.perSideDeg).toBeCloseTo(14.4775, 4);
    expect(sideGapForAngle({ barDiameterMm: 12, projectionMm: 120, perSideDeg: a.perSideDeg }).gapMm).toBeCloseTo(24, 9);
  });

  it('a face is a rim of infinite radius: the rim model with a huge wheel gives the side angle, with and without an offset', () => {
    for (const offsetMm of [0, 8, -8]) {
      const side = sideAngleFromSetup({ barDiameterMm: 12, gapMm: 20, projectionMm: 110, offsetMm }).perSideDeg;
      const rim = angleFromSetup({ wheelDiameterMm: 2e8, barDiameterMm: 12, gapMm: 20, projectionMm: 110, offsetMm }).perSideDeg;
      expect(side).toBeCloseTo(rim, 4);
    }
  });

  it('refuses a projection that cannot reach the face, and an angle that would put the bar inside the wheel', () => {
    const short = computationError(() => sideAngleFromSetup({ barDiameterMm: 12, gapMm: 50, projectionMm: 40 }));
    expect(short.field).toBe('projectionMm');
    expect(short.message).toMatch(/not reach the wheel's face/);
    const inside = computationError(() => sideGapForAngle({ barDiameterMm: 12, projectionMm: 20, perSideDeg: 10 }));
    expect(inside.field).toBe('projectionMm');
    expect(inside.message).toMatch(/at least 34\.6 mm/); // 6 / sin 10° = 34.55 (by hand)
    expect(computationError(() => sideGapForAngle({ barDiameterMm: 12, projectionMm: 100, perSideDeg: 95 })).field).toBe('perSideDeg');
  });
});

describe('rated speed: v = π · D · n / 60 000 (DESIGN.md)', () => {
  it('a 250 mm wheel at 90 rpm runs at 1.178 m/s (by hand: π × 250 × 90 / 60 000)', () => {
    expect(peripheralSpeedMps(250, 90)).toBeCloseTo(1.1781, 4);
  });

  it('a 200 mm wheel at 3 000 rpm is 31.4 m/s: over a 30 m/s rating, under a 35 m/s one', () => {
    expect(ratedSpeedCheck({ diameterMm: 200, spindleRpm: 3000, ratedSpeedMps: 30 })).toMatchObject({ overspeed: true });
    const ok = ratedSpeedCheck({ diameterMm: 200, spindleRpm: 3000, ratedSpeedMps: 35 });
    expect(ok.overspeed).toBe(false);
    expect(ok.speedMps).toBeCloseTo(31.4159, 4);
    expect(ok.marginPct).toBeCloseTo((1 - 31.4159 / 35) * 100, 3);
  });

  it('refuses a rating of zero, naming ratedSpeedMps', () => {
    expect(computationError(() => ratedSpeedCheck({ diameterMm: 200, spindleRpm: 3000, ratedSpeedMps: 0 })).field).toBe('ratedSpeedMps');
  });
});
