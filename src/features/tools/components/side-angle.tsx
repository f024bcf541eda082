import { useId, useMemo, useState } from 'react';
import { sideAngleFromSetup, sideGapForAngle, type SideSetup } from '@shared/geometry';
import { PageTitle } from '@/components/ui/page-title';
import { Caution } from '@/components/ui/caution';
import { Facts } from '@/components/ui/facts';
import { formatDegrees } from '@/lib/format';
import { formatLength, type LengthUnit } from '@/lib/lengths';
import { LengthUnitPicker } from '@/components/ui/length-unit-picker';
import { SafetyCautions } from './safety-cautions';
import { DrawingFigure, SetupSection, WantedAngleSection, attempt, lengthFact, toNumber, useLengthBoxes } from './tool-inputs';

type Field = keyof SideSetup;

const LABELS: Record<Field, { label: string; hint: string }> = {
  barDiameterMm: { label: 'Support bar diameter', hint: 'The bar mounted parallel to the wheel’s face.' },
  gapMm: { label: 'Gap, bar to face', hint: 'The shortest distance from the bar’s surface to the wheel’s side.' },
  projectionMm: { label: 'Projection', hint: 'From the bar’s axis to the edge, along the blade.' },
  offsetMm: { label: 'Blade-plane offset', hint: 'From the bar’s axis to the blade’s plane; 0 when the blade’s line passes through the axis.' },
};

/**
 * Flat bevels on a wheel's side: the bar parallel to the face at a gap from it, so the angle per
 * side is asin((gap + bar/2) / projection) (with the offset, L sin α − e cos α = gap + bar/2).
 */
export default function SideAngle() {
  const id = useId();
  // A 12 mm bar 24 mm from the face with a 120 mm projection: asin(30 / 120) = 14.48° per side.
  const boxes = useLengthBoxes<Field>({ barDiameterMm: 12, gapMm: 24, projectionMm: 120, offsetMm: 0 });
  const { unit } = boxes;
  const len = (mm: number) => formatLength(mm, unit);
  const [wantedText, setWantedText] = useState('15');

  const setup = useMemo(() => ({ values: boxes.mm as SideSetup, missing: boxes.missing }), [boxes.mm, boxes.missing]);
  const ready = setup.missing.length === 0;
  const angle = useMemo(() => (ready ? attempt(() => sideAngleFromSetup(setup.values), unit) : null), [ready, setup.values, unit]);
  const wanted = toNumber(wantedText);
  const gap = useMemo(() => {
    if (!ready || !Number.isFinite(wanted)) return null;
    const { barDiameterMm, projectionMm, offsetMm } = setup.values;
    return attempt(() => sideGapForAngle({ barDiameterMm, projectionMm, offsetMm, perSideDeg: wanted }), unit);
  }, [ready, setup.values, wanted, unit]);

  const errorFor = (field: Field) => (setup.missing.includes(field) ? 'Enter a number' : angle?.field === field ? angle.error : undefined);

  return (
    <div className="flex flex-col gap-10">
      <PageTitle
        title="Flat bevels on a wheel’s side"
        lead="Some CBN and diamond wheels may be used on their side, which grinds a flat bevel instead of a hollow one. With the support bar parallel to the wheel’s face, the angle per side is asin((gap + bar radius) / projection)."
      >
        Flat bevels on a wheel’s side
      </PageTitle>

      <Caution title="Only on a wheel made for it">
        Grind on a wheel’s side only where its maker says the side may be used: many wheels, vitrified ones above all, must
        never be loaded sideways. Follow the machine’s and the wheel’s instructions and your local regulations.
      </Caution>

      <LengthUnitPicker />

      <SetupSection
        id={id}
        unit={unit}
        labels={LABELS}
        text={boxes.text}
        onChange={boxes.set}
        errorFor={errorFor}
        angle={angle?.value}
        drawing={
          <DrawingFigure waiting="The drawing appears when the edge can reach the wheel’s face." caption="Seen from above, to scale: the wheel’s face on the left, the bar’s axis S.">
            {angle?.value ? <SideDrawing setup={setup.values} perSideDeg={angle.value.perSideDeg} lengthUnit={unit} /> : null}
          </DrawingFigure>
        }
      />

      <WantedAngleSection
        id={id}
        title="The gap for the angle you want"
        wantedText={wantedText}
        onChange={setWantedText}
        error={!Number.isFinite(wanted) ? 'Enter a number' : gap?.field === 'perSideDeg' ? gap.error : undefined}
      >
        {gap ? (
          <Facts items={[lengthFact('Gap, bar to face', gap.value?.gapMm, gap.error, `with the projection of ${len(setup.values.projectionMm)}`, unit)]} />
        ) : null}
      </WantedAngleSection>

      <SafetyCautions />
    </div>
  );
}

/**
 * The side setup from above, to scale: the face as a vertical line at x = 0, the bar's axis at
 * x = gap + bar radius, the blade from the edge on the face out past the bar. Coordinates in mm.
 */
function SideDrawing({ setup, perSideDeg, lengthUnit }: { setup: SideSetup; perSideDeg: number; lengthUnit: LengthUnit }) {
  const titleId = useId();
  const r = setup.barDiameterMm / 2;
  const L = setup.projectionMm;
  const e = setup.offsetMm ?? 0;
  const a = (perSideDeg * Math.PI) / 180;
  // Edge C on the face at the origin; the blade leaves the face at α, S = L u + e n (n towards the face).
  const u = [Math.sin(a), Math.cos(a)];
  const n = [-Math.cos(a), Math.sin(a)];
  const S = [L * u[0] + e * n[0], L * u[1] + e * n[1]];
  const tail = [1.4 * L * u[0], 1.4 * L * u[1]];
  const pad = 0.1 * L;
  const minX = -0.4 * L;
  const maxX = Math.max(tail[0], S[0] + r, 0.6 * L) + pad;
  const minY = -0.15 * L;
  const maxY = Math.max(tail[1], S[1] + r) + pad;
  const unit = Math.max(maxX - minX, maxY - minY) / 300; // strokes and text in proportion to the drawing
  const arcR = 0.3 * L;
  const labelAt = a + (18 * Math.PI) / 180; // from the face, past the blade
  return (
    <svg viewBox={`${minX} ${-maxY} ${maxX - minX} ${maxY - minY}`} className="mx-auto h-auto max-h-[26rem] w-full" role="img" aria-labelledby={titleId}>
      <title id={titleId}>
        {`Bar of ${formatLength(setup.barDiameterMm, lengthUnit)} at ${formatLength(setup.gapMm, lengthUnit)} from the wheel’s face, blade projecting ${formatLength(L, lengthUnit)}: ${formatDegrees(perSideDeg)} per side.`}
      </title>
      <rect x={minX} y={-maxY} width={-minX} height={maxY - minY} className="fill-rule" />
      <line x1={0} y1={-maxY} x2={0} y2={-minY} className="stroke-ink" strokeWidth={unit * 1.5} />
      <line x1={0} y1={-S[1]} x2={S[0] - r} y2={-S[1]} className="stroke-muted" strokeWidth={unit} strokeDasharray={`${unit * 3} ${unit * 3}`} />
      <circle cx={S[0]} cy={-S[1]} r={r} className="fill-rule stroke-ink" strokeWidth={unit} />
      <text x={S[0] + r + unit * 4} y={-S[1] - r} className="fill-muted" fontSize={unit * 10}>
        S
      </text>
      <line x1={0} y1={0} x2={tail[0]} y2={-tail[1]} className="stroke-accent-strong" strokeWidth={unit * 4} strokeLinecap="round" />
      <path
        d={`M 0 ${-arcR} A ${arcR} ${arcR} 0 0 1 ${arcR * Math.sin(a)} ${-arcR * Math.cos(a)}`}
        className="fill-none stroke-caution"
        strokeWidth={unit * 1.5}
      />
      {/* The label sits just past the arc's end, on the open side of the blade (away from the face), so
          neither the blade nor the arc crosses it whatever the angle; a halo keeps it readable. */}
      <text
        x={arcR * Math.sin(labelAt)}
        y={-arcR * Math.cos(labelAt)}
        dominantBaseline="middle"
        className="fill-caution stroke-panel font-semibold"
        strokeWidth={unit * 3}
        paintOrder="stroke"
        fontSize={unit * 11}
      >
        {formatDegrees(perSideDeg)}
      </text>
      <circle cx={0} cy={0} r={unit * 2.5} className="fill-caution" />
    </svg>
  );
}
