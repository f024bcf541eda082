import { useId, useMemo, useState } from 'react';
import { angleFromSetup, gapForAngle, projectionForAngle, wearDrift, type WheelSetup } from '@shared/geometry';
import { PageTitle } from '@/components/ui/page-title';
import { Facts } from '@/components/ui/facts';
import { formatDegrees } from '@/lib/format';
import { formatLength, type LengthUnit } from '@/lib/lengths';
import { LengthUnitPicker } from '@/components/ui/length-unit-picker';
import { SafetyCautions } from './safety-cautions';
import { DrawingFigure, NumberField, SetupSection, WantedAngleSection, attempt, lengthFact, toNumber, useLengthBoxes } from './tool-inputs';

/** A change of angle for people: "+2.35°", or "no change" below what the display shows. */
function changeText(deltaDeg: number): string {
  if (Math.abs(deltaDeg) < 0.005) return 'no change';
  return `${deltaDeg > 0 ? '+' : '−'}${formatDegrees(Math.abs(deltaDeg), 2)}`;
}

/** Which way to move the bar to restore the angle, from the gap now less the gap wanted (mm). */
function moveText(excessMm: number, unit: LengthUnit): string {
  if (Math.abs(excessMm) < 0.05) return 'the bar is where it should be';
  return `move the bar ${formatLength(Math.abs(excessMm), unit)} ${excessMm > 0 ? 'closer to' : 'away from'} the wheel`;
}

type SetupField = keyof WheelSetup;

const SETUP_LABELS: Record<SetupField, { label: string; hint: string }> = {
  wheelDiameterMm: { label: 'Wheel diameter', hint: 'Measure it now: a vitrified wheel shrinks as it wears and is dressed.' },
  barDiameterMm: { label: 'Support bar diameter', hint: 'The round bar the jig slides on.' },
  gapMm: { label: 'Gap, bar to wheel', hint: 'The shortest distance from the bar’s surface to the rim.' },
  projectionMm: { label: 'Projection', hint: 'From the bar’s axis to the edge, along the blade.' },
  offsetMm: {
    label: 'Blade-plane offset',
    hint: 'How far the jig holds the blade’s plane from the bar’s axis: positive with the bar between blade and wheel, negative the other side, 0 through the axis.',
  },
};

/** The angle geometry page: setup → angle, angle → gap, and the drift as a wheel wears. */
export default function AngleGeometry() {
  const id = useId();
  // A 250 mm wheel with a 12 mm bar: about 15° per side (worked with the formulas on this page).
  const boxes = useLengthBoxes<SetupField>({ wheelDiameterMm: 250, barDiameterMm: 12, gapMm: 80, projectionMm: 140, offsetMm: 0 });
  const { unit } = boxes;
  const len = (mm: number) => formatLength(mm, unit);
  const [wantedText, setWantedText] = useState('15');
  const now = useLengthBoxes({ currentDiameterMm: 225 });

  const setup = useMemo(() => ({ values: boxes.mm as WheelSetup, missing: boxes.missing }), [boxes.mm, boxes.missing]);
  const setupReady = setup.missing.length === 0;
  const angle = useMemo(() => (setupReady ? attempt(() => angleFromSetup(setup.values), unit) : null), [setupReady, setup.values, unit]);

  const wanted = toNumber(wantedText);
  const inverse = useMemo(() => {
    if (!setupReady || !Number.isFinite(wanted)) return null;
    const { wheelDiameterMm, barDiameterMm, gapMm, projectionMm, offsetMm } = setup.values;
    return {
      gap: attempt(() => gapForAngle({ wheelDiameterMm, barDiameterMm, projectionMm, perSideDeg: wanted, offsetMm }), unit),
      projection: attempt(() => projectionForAngle({ wheelDiameterMm, barDiameterMm, gapMm, perSideDeg: wanted, offsetMm }), unit),
    };
  }, [setupReady, setup.values, wanted, unit]);

  const current = now.mm.currentDiameterMm;
  const drift = useMemo(() => {
    if (!setupReady || !Number.isFinite(current)) return null;
    const { wheelDiameterMm, barDiameterMm, gapMm, projectionMm, offsetMm } = setup.values;
    return attempt(() => wearDrift({ originalDiameterMm: wheelDiameterMm, currentDiameterMm: current, barDiameterMm, gapMm, projectionMm, offsetMm }), unit);
  }, [setupReady, setup.values, current, unit]);

  const setupError = (field: SetupField): string | undefined => {
    if (setup.missing.includes(field)) return 'Enter a number';
    if (angle?.error && (angle.field === field || (!angle.field && field === 'projectionMm'))) return angle.error;
    return undefined;
  };

  return (
    <div className="flex flex-col gap-10">
      <PageTitle
        title="Angle geometry"
        lead="The edge angle a wheel and support-bar setup grinds, from four measurements. The model: the blade rests on the bar and touches the rim with its edge; the angle per side lies between the blade and the wheel’s tangent where they meet."
      >
        Angle geometry
      </PageTitle>

      <LengthUnitPicker />

      <SetupSection
        id={id}
        unit={unit}
        labels={SETUP_LABELS}
        text={boxes.text}
        onChange={boxes.set}
        errorFor={setupError}
        angle={angle?.value}
        drawing={
          <DrawingFigure waiting="The drawing appears when the setup is one the blade can reach." caption="Drawn to scale from your numbers. The wheel’s axis is O, the bar’s axis S.">
            {angle?.value ? <SetupDrawing setup={setup.values} perSideDeg={angle.value.perSideDeg} lengthUnit={unit} /> : null}
          </DrawingFigure>
        }
      />

      <WantedAngleSection
        id={id}
        title="Setting up for the angle you want"
        wantedText={wantedText}
        onChange={setWantedText}
        error={!Number.isFinite(wanted) ? 'Enter a number' : inverse?.gap.field === 'perSideDeg' ? inverse.gap.error : undefined}
      >
        {inverse ? (
          <Facts
            items={[
              lengthFact('Gap for this angle', inverse.gap.value?.gapMm, inverse.gap.error, `keeping the projection of ${len(setup.values.projectionMm)}`, unit),
              lengthFact('Or the projection for it', inverse.projection.value?.projectionMm, inverse.projection.error, `keeping the gap of ${len(setup.values.gapMm)}`, unit),
            ]}
          />
        ) : null}
      </WantedAngleSection>

      <section aria-labelledby={`${id}-wear`} className="flex flex-col gap-4">
        <h2 id={`${id}-wear`} className="text-2xl font-semibold">
          When the wheel wears
        </h2>
        <p className="max-w-3xl text-muted">
          A vitrified wheel gets smaller as it wears and each time it is dressed. If the bar stays where it was, the gap to
          the rim grows by the radius lost and the same projection grinds a steeper angle. Here the setup above is the one
          you set on the wheel when it was new (or last measured), and the wheel has since worn to the diameter below.
        </p>
        <div className="grid gap-4 md:grid-cols-[16rem_1fr] md:items-start">
          <NumberField
            id={`${id}-current`}
            label="Wheel diameter now"
            unit={unit}
            hint="Smaller than the diameter above."
            value={now.text.currentDiameterMm}
            onChange={(v) => now.set('currentDiameterMm', v)}
            error={!Number.isFinite(current) ? 'Enter a number' : drift?.field === 'currentDiameterMm' ? drift.error : undefined}
          />
          <div aria-live="polite">
            {drift?.value ? (
              <Facts
                items={[
                  { term: 'Angle when set', value: formatDegrees(drift.value.originalPerSideDeg) + ' per side' },
                  {
                    term: 'Angle now',
                    value: (
                      <span>
                        <strong className="font-semibold">{formatDegrees(drift.value.currentPerSideDeg)} per side</strong>{' '}
                        <span className="text-muted">({changeText(drift.value.currentPerSideDeg - drift.value.originalPerSideDeg)})</span>
                      </span>
                    ),
                  },
                  { term: 'Gap to the rim now', value: len(drift.value.currentGapMm) },
                  {
                    term: 'Gap that restores the angle',
                    value: (
                      <span>
                        <strong className="font-semibold">{len(drift.value.restoringGapMm)}</strong>{' '}
                        <span className="text-muted">({moveText(drift.value.currentGapMm - drift.value.restoringGapMm, unit)})</span>
                      </span>
                    ),
                  },
                ]}
              />
            ) : drift?.error && drift.field !== 'currentDiameterMm' && !angle?.error ? (
              <p className="text-danger">{drift.error}</p>
            ) : null}
          </div>
        </div>
        <p className="max-w-3xl rounded-md border border-rule bg-panel px-4 py-3 text-sm">
          CBN and diamond wheels keep their diameter, so a setup measured once keeps its angle on them. On a vitrified
          wheel, measure the diameter again after dressing and reset the gap.
        </p>
      </section>

      <SafetyCautions />
    </div>
  );
}

/**
 * The setup drawn to scale: wheel, bar, blade from behind the bar to the rim, the tangent at the
 * contact point and the angle between them. Coordinates in mm with y up, turned into SVG's y down.
 */
function SetupDrawing({ setup, perSideDeg, lengthUnit }: { setup: WheelSetup; perSideDeg: number; lengthUnit: LengthUnit }) {
  const titleId = useId();
  const R = setup.wheelDiameterMm / 2;
  const r = setup.barDiameterMm / 2;
  const d = R + setup.gapMm + r;
  const L = setup.projectionMm;
  const e = setup.offsetMm ?? 0;
  const rho = Math.hypot(L, e); // |SC|: the edge is L along the blade from the foot of the perpendicular from S
  // S sits up and to the right of O, as on a machine with the bar above the wheel.
  const beta = (55 * Math.PI) / 180;
  const u = [Math.cos(beta), Math.sin(beta)]; // unit vector O → S
  const v = [Math.sin(beta), -Math.cos(beta)]; // perpendicular, clockwise
  const along = (R * R - rho * rho + d * d) / (2 * d);
  const across = Math.sqrt(Math.max(0, R * R - along * along));
  const S = [d * u[0], d * u[1]];
  const C = [along * u[0] + across * v[0], along * u[1] + across * v[1]];
  const cs = [(S[0] - C[0]) / rho, (S[1] - C[1]) / rho];
  // The blade's direction: C→S turned by φ = atan(e / L), to the side that leaves S on the wheel's
  // side of the blade for e > 0 (shared/geometry.ts).
  const phi = Math.atan2(Math.abs(e), L);
  const turn = (sign: number) => [cs[0] * Math.cos(sign * phi) - cs[1] * Math.sin(sign * phi), cs[0] * Math.sin(sign * phi) + cs[1] * Math.cos(sign * phi)];
  const sideOfS = (dir: number[]) => {
    let n = [-dir[1], dir[0]];
    if (n[0] * -C[0] + n[1] * -C[1] < 0) n = [dir[1], -dir[0]];
    return (S[0] - C[0]) * n[0] + (S[1] - C[1]) * n[1];
  };
  const toS = Math.abs(sideOfS(turn(1)) - e) < Math.abs(sideOfS(turn(-1)) - e) ? turn(1) : turn(-1);
  const foot = [C[0] + toS[0] * L, C[1] + toS[1] * L]; // foot of the perpendicular from S on the blade
  const tail = [C[0] + toS[0] * 1.45 * L, C[1] + toS[1] * 1.45 * L]; // the blade runs on past the bar to the handle
  // Tangent at C, on the side where the blade lies.
  const radial = [C[0] / R, C[1] / R];
  let t = [-radial[1], radial[0]];
  if (t[0] * toS[0] + t[1] * toS[1] < 0) t = [-t[0], -t[1]];
  const tanLen = 0.6 * R;
  const arcR = Math.min(0.4 * R, 0.5 * L);
  const a0 = Math.atan2(t[1], t[0]);
  const a1 = Math.atan2(toS[1], toS[0]);
  const arcEnd = [C[0] + arcR * Math.cos(a1), C[1] + arcR * Math.sin(a1)];
  const arcStart = [C[0] + arcR * Math.cos(a0), C[1] + arcR * Math.sin(a0)];
  // Gap dimension along O → S, from the rim to the bar's surface.
  const rim = [R * u[0], R * u[1]];
  const barEdge = [(d - r) * u[0], (d - r) * u[1]];

  const xs = [-R, R, S[0] + r, S[0] - r, tail[0], C[0], foot[0]];
  const ys = [-R, R, S[1] + r, S[1] - r, tail[1], C[1], foot[1]];
  const pad = 0.08 * Math.max(...xs.map(Math.abs), ...ys.map(Math.abs));
  const minX = Math.min(...xs) - pad;
  const maxX = Math.max(...xs) + pad;
  const minY = Math.min(...ys) - pad;
  const maxY = Math.max(...ys) + pad;
  const X = (p: number[]) => p[0];
  const Y = (p: number[]) => -p[1];
  const unit = (maxX - minX) / 300; // stroke widths and text in proportion to the drawing
  // Which way the arc sweeps from the tangent to the blade, in SVG's flipped y.
  const cross = t[0] * toS[1] - t[1] * toS[0];
  const sweep = cross > 0 ? 0 : 1;

  return (
    <svg
      viewBox={`${minX} ${-maxY} ${maxX - minX} ${maxY - minY}`}
      className="mx-auto h-auto max-h-[26rem] w-full"
      role="img"
      aria-labelledby={titleId}
    >
      <title id={titleId}>
        {`Wheel of ${formatLength(setup.wheelDiameterMm, lengthUnit)}, bar of ${formatLength(setup.barDiameterMm, lengthUnit)} at a gap of ${formatLength(setup.gapMm, lengthUnit)}, blade projecting ${formatLength(L, lengthUnit)}${e ? ` with its plane ${formatLength(e, lengthUnit)} off the bar’s axis` : ''}: ${formatDegrees(perSideDeg)} per side.`}
      </title>
      <circle cx={0} cy={0} r={R} className="fill-paper stroke-ink" strokeWidth={unit * 1.2} />
      <circle cx={0} cy={0} r={unit * 2} className="fill-ink" />
      <text x={unit * 4} y={unit * 10} className="fill-muted" fontSize={unit * 10}>
        O
      </text>
      <line x1={X(rim)} y1={Y(rim)} x2={X(barEdge)} y2={Y(barEdge)} className="stroke-muted" strokeWidth={unit} strokeDasharray={`${unit * 3} ${unit * 3}`} />
      <circle cx={X(S)} cy={Y(S)} r={r} className="fill-rule stroke-ink" strokeWidth={unit} />
      <text x={X(S) + r + unit * 4} y={Y(S) - r} className="fill-muted" fontSize={unit * 10}>
        S
      </text>
      <line
        x1={X(C)}
        y1={Y(C)}
        x2={X(C) + t[0] * tanLen}
        y2={Y(C) - t[1] * tanLen}
        className="stroke-ink/70"
        strokeWidth={unit * 1.2}
        strokeDasharray={`${unit * 5} ${unit * 3}`}
      />
      <line
        x1={X(C)}
        y1={Y(C)}
        x2={X(C) - t[0] * tanLen * 0.3}
        y2={Y(C) + t[1] * tanLen * 0.3}
        className="stroke-ink/70"
        strokeWidth={unit * 1.2}
        strokeDasharray={`${unit * 5} ${unit * 3}`}
      />
      <line x1={X(tail)} y1={Y(tail)} x2={X(C)} y2={Y(C)} className="stroke-accent-strong" strokeWidth={unit * 4} strokeLinecap="round" />
      {Math.abs(e) > 0.05 ? (
        <g>
          <line x1={X(S)} y1={Y(S)} x2={X(foot)} y2={Y(foot)} className="stroke-muted" strokeWidth={unit} />
          <text x={(X(S) + X(foot)) / 2 + unit * 4} y={(Y(S) + Y(foot)) / 2} className="fill-muted" fontSize={unit * 10}>
            e
          </text>
        </g>
      ) : null}
      <path
        d={`M ${X(arcStart)} ${Y(arcStart)} A ${arcR} ${arcR} 0 0 ${sweep} ${X(arcEnd)} ${Y(arcEnd)}`}
        className="fill-none stroke-caution"
        strokeWidth={unit * 1.5}
      />
      <text
        x={X(C) + (t[0] + toS[0]) * arcR * 0.6 + unit * 6}
        y={Y(C) - (t[1] + toS[1]) * arcR * 0.6}
        className="fill-caution font-semibold"
        fontSize={unit * 11}
      >
        {formatDegrees(perSideDeg)}
      </text>
      <circle cx={X(C)} cy={Y(C)} r={unit * 2.5} className="fill-caution" />
    </svg>
  );
}
