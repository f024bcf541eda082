import { useId, useMemo, useState } from 'react';
import { ComputationError } from '@shared/computation-error';
import {
  GRIT_STANDARDS,
  GRIT_STANDARD_LABELS,
  GRIT_STANDARD_SHORT_LABELS,
  formatGrade,
  formatMicrometres,
  gradesOf,
  gritBand,
  gritBandPhi,
  nearestGrade,
  parseGrit,
  type GritStandard,
  type ParsedGrit,
  type SizeBasis,
} from '@shared/grit';
import { PageTitle } from '@/components/ui/page-title';
import { Field, Input, Select, controlA11y } from '@/components/ui/field';
import { Facts } from '@/components/ui/facts';
import { Button } from '@/components/ui/button';
import { TableFrame, tdClass, thClass } from '@/components/ui/table';
import { SafetyCautions } from './safety-cautions';

const EXAMPLES = ['1000', 'F400', 'P1500', '#6000', '400 mesh', 'D46', '140/170', '15 µm'];

const BASIS_TEXT: Record<SizeBasis, string> = {
  'sieve-band': 'Sieve-graded grit: the geometric middle of the sieve band that holds about 80 % of the grains.',
  ds50: 'Median grain size (ds50), measured by sedimentation or by counting particles.',
  average: 'Average grain size as tabulated for the grade.',
  'sieve-opening': 'The opening of this test sieve: grains that pass it are at most this size.',
  'aperture-mean': 'The mean of the two sieve apertures that bound this diamond or CBN size range.',
  stated: 'The size as you typed it.',
};

/** Standards drawn as rows of the ladder chart (plain micrometres has no grades to draw). */
const LADDER_STANDARDS = GRIT_STANDARDS.filter((s) => s !== 'um');

type Reading = { grit: ParsedGrit; error?: undefined } | { grit?: undefined; error: string } | { grit?: undefined; error?: undefined };

function read(text: string, standard: GritStandard | ''): Reading {
  if (text.trim() === '') return {};
  try {
    return { grit: parseGrit(text, standard || undefined) };
  } catch (err) {
    if (err instanceof ComputationError) return { error: err.message };
    throw err;
  }
}

function bandText(band: { loUm: number; hiUm: number }): string {
  return `${formatMicrometres(band.loUm).replace(' µm', '')}–${formatMicrometres(band.hiUm)}`;
}

/** How much coarser or finer a grade is than the typed size, as a factor. */
function ratioText(gradeUm: number, um: number): string {
  const r = gradeUm / um;
  if (Math.abs(r - 1) < 0.005) return 'same size';
  return r > 1 ? `${r.toFixed(2)}× coarser` : `${(1 / r).toFixed(2)}× finer`;
}

/** The grit translator page: any grade in, its size, band and nearest grade in every standard out. */
export default function GritTranslator() {
  const id = useId();
  const [text, setText] = useState('1000');
  const [standard, setStandard] = useState<GritStandard | ''>('');
  const reading = useMemo(() => read(text, standard), [text, standard]);
  const grit = reading.grit;

  return (
    <div className="flex flex-col gap-8">
      <PageTitle
        title="Grit translator"
        lead="Type a grit as it is marked on the stone, wheel or paper. Each standard measures grain size its own way, so the sizes here are representative values, good for comparing, not for grading."
      >
        Grit translator
      </PageTitle>

      <section aria-labelledby={`${id}-input`} className="grid gap-4 rounded-md border border-rule bg-panel p-4 md:grid-cols-[2fr_1fr]">
        <h2 id={`${id}-input`} className="sr-only">
          Your grit
        </h2>
        <Field
          id={`${id}-grit`}
          label="Grit"
          hint="For example F400, P1500, #6000, JIS 1000, 400 mesh, D46, B126, 140/170 or 15 µm. A bare number is read as JIS."
          error={reading.error}
        >
          <Input
            {...controlA11y(`${id}-grit`, { hint: true, error: reading.error })}
            value={text}
            onChange={(e) => setText(e.target.value)}
            autoComplete="off"
            spellCheck={false}
            inputMode="text"
          />
        </Field>
        <Field id={`${id}-standard`} label="Standard" hint="Leave on “from what I type” unless the number alone is ambiguous.">
          <Select
            {...controlA11y(`${id}-standard`, { hint: true })}
            value={standard}
            onChange={(e) => setStandard(e.target.value as GritStandard | '')}
          >
            <option value="">From what I type</option>
            {GRIT_STANDARDS.map((s) => (
              <option key={s} value={s}>
                {GRIT_STANDARD_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        <div className="flex flex-wrap items-center gap-2 md:col-span-2">
          <span className="text-sm text-muted">Try:</span>
          {EXAMPLES.map((example) => (
            <Button
              key={example}
              variant="secondary"
              size="sm"
              onClick={() => {
                setText(example);
                setStandard('');
              }}
            >
              {example}
            </Button>
          ))}
        </div>
      </section>

      <div aria-live="polite">{grit ? <GritFacts grit={grit} /> : null}</div>

      {grit ? <NearestTable um={grit.micrometres} /> : null}

      <section aria-labelledby={`${id}-ladder`}>
        <h2 id={`${id}-ladder`} className="mb-2 text-2xl font-semibold">
          Grit ladders side by side
        </h2>
        <p className="mb-3 max-w-3xl text-sm text-muted">
          One row per standard, each tick a grade, on one scale of particle size (coarse on the left, fine on the right).
          {grit ? ' The line marks your grit and the shaded strip its grit band.' : ''}
        </p>
        <LadderChart um={grit?.micrometres ?? null} />
      </section>

      <SafetyCautions />
    </div>
  );
}

function GritFacts({ grit }: { grit: ParsedGrit }) {
  const whole = gritBand(grit.micrometres);
  const half = gritBand(grit.micrometres, 0.5);
  const phi = gritBandPhi(grit.micrometres);
  return (
    <section aria-label="Your grit">
      <Facts
        items={[
          {
            term: 'Read as',
            value: (
              <span>
                <strong className="font-semibold">{formatGrade(grit)}</strong>{' '}
                <span className="text-muted">— {GRIT_STANDARD_LABELS[grit.standard]}</span>
                {grit.inferred ? (
                  <span className="mt-1 block text-sm text-caution">
                    No standard given: read as JIS, the usual marking on sharpening stones. Choose the standard if it is
                    another.
                  </span>
                ) : null}
              </span>
            ),
          },
          {
            term: 'Particle size',
            value: (
              <span>
                <strong className="font-semibold">{formatMicrometres(grit.micrometres)}</strong>
                {grit.basis ? <span className="mt-1 block text-sm text-muted">{BASIS_TEXT[grit.basis]}</span> : null}
                {grit.lowConfidence ? (
                  <span className="mt-1 block text-sm text-caution">
                    Published copies of this table disagree by a few micrometres; take it as approximate.
                  </span>
                ) : null}
              </span>
            ),
          },
          {
            term: 'Grit band',
            value: (
              <span>
                {bandText(whole)} <span className="text-muted">(φ {phi} to {phi + 1})</span>
                <span className="mt-1 block text-sm text-muted">Half-φ band: {bandText(half)}</span>
              </span>
            ),
          },
        ]}
      />
    </section>
  );
}

function NearestTable({ um }: { um: number }) {
  const rows = LADDER_STANDARDS.map((s) => ({ standard: s, near: nearestGrade(um, s) }));
  return (
    <section aria-labelledby="nearest-heading">
      <h2 id="nearest-heading" className="mb-2 text-2xl font-semibold">
        Nearest grade in each standard
      </h2>
      <TableFrame label="Nearest grade in each standard">
        <table className="w-full border-collapse text-left">
          <thead>
            <tr>
              <th scope="col" className={thClass}>
                Standard
              </th>
              <th scope="col" className={thClass}>
                Nearest grade
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Its size
              </th>
              <th scope="col" className={thClass}>
                Against yours
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ standard, near }) => (
              <tr key={standard}>
                <th scope="row" className={`${tdClass} font-medium`}>
                  {GRIT_STANDARD_LABELS[standard]}
                </th>
                <td className={tdClass}>{near ? formatGrade({ standard, grade: near.grade }) : <span className="text-muted">outside its range</span>}</td>
                <td className={`${tdClass} text-right tabular-nums`}>{near ? formatMicrometres(near.micrometres) : '—'}</td>
                <td className={`${tdClass} text-sm text-muted`}>{near ? ratioText(near.micrometres, um) : ''}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
    </section>
  );
}

// Ladder chart geometry (SVG user units).
const CHART = { width: 820, labelWidth: 84, right: 16, top: 10, rowHeight: 40, axisHeight: 44, minUm: 0.5, maxUm: 8000 };

/** x position of a size on the chart: log scale, coarse on the left. */
function xOf(um: number): number {
  const plot = CHART.width - CHART.labelWidth - CHART.right;
  const t = (Math.log10(CHART.maxUm) - Math.log10(um)) / (Math.log10(CHART.maxUm) - Math.log10(CHART.minUm));
  return CHART.labelWidth + Math.min(1, Math.max(0, t)) * plot;
}

/**
 * The ladder chart: one horizontal log-µm axis, one row per standard with a tick for each grade,
 * the typed size as a vertical line over its grit band. Labels are drawn only where they fit;
 * every tick names its grade on hover.
 */
function LadderChart({ um }: { um: number | null }) {
  const titleId = useId();
  const height = CHART.top + LADDER_STANDARDS.length * CHART.rowHeight + CHART.axisHeight;
  const axisY = CHART.top + LADDER_STANDARDS.length * CHART.rowHeight;
  const band = um ? gritBand(um) : null;
  const decades = [1, 10, 100, 1000];
  const minors = [0.5, 2, 5, 20, 50, 200, 500, 2000, 5000];
  const summary = um
    ? `Grit ladders of ${LADDER_STANDARDS.length} standards on a log scale of particle size from ${CHART.maxUm} µm to ${CHART.minUm} µm, with your grit at ${formatMicrometres(um)}.`
    : `Grit ladders of ${LADDER_STANDARDS.length} standards on a log scale of particle size from ${CHART.maxUm} µm to ${CHART.minUm} µm.`;

  return (
    <div className="overflow-x-auto rounded-md border border-rule bg-panel p-2" tabIndex={0} role="region" aria-label="Grit ladder chart">
      <svg viewBox={`0 0 ${CHART.width} ${height}`} className="min-w-[640px] w-full" role="img" aria-labelledby={titleId}>
        <title id={titleId}>{summary}</title>
        {/* grid lines at decades and their halves, so the eye can read sizes off any row */}
        {[...decades, ...minors].map((d) => (
          <line
            key={`grid-${d}`}
            x1={xOf(d)}
            x2={xOf(d)}
            y1={CHART.top}
            y2={axisY}
            className={decades.includes(d) ? 'stroke-rule' : 'stroke-rule/50'}
            strokeWidth={1}
          />
        ))}
        {band ? (
          <rect
            x={xOf(band.hiUm)}
            y={CHART.top}
            width={xOf(band.loUm) - xOf(band.hiUm)}
            height={axisY - CHART.top}
            className="fill-accent-soft"
            opacity={0.7}
          />
        ) : null}
        {LADDER_STANDARDS.map((standard, row) => (
          <LadderRow key={standard} standard={standard} y={CHART.top + row * CHART.rowHeight} um={um} />
        ))}
        {/* axis */}
        <line x1={CHART.labelWidth} x2={CHART.width - CHART.right} y1={axisY} y2={axisY} className="stroke-ink" strokeWidth={1} />
        {decades.map((d) => (
          <g key={`axis-${d}`}>
            <line x1={xOf(d)} x2={xOf(d)} y1={axisY} y2={axisY + 6} className="stroke-ink" />
            <text x={xOf(d)} y={axisY + 18} textAnchor="middle" className="fill-ink text-[11px]">
              {d >= 1000 ? `${d / 1000} mm` : `${d} µm`}
            </text>
          </g>
        ))}
        <text x={CHART.labelWidth} y={axisY + 36} className="fill-muted text-[11px]">
          ← coarser
        </text>
        <text x={(CHART.labelWidth + CHART.width) / 2} y={axisY + 36} textAnchor="middle" className="fill-muted text-[11px]">
          particle size (log scale)
        </text>
        <text x={CHART.width - CHART.right} y={axisY + 36} textAnchor="end" className="fill-muted text-[11px]">
          finer →
        </text>
        {um ? (
          <line x1={xOf(um)} x2={xOf(um)} y1={CHART.top - 4} y2={axisY + 4} className="stroke-accent" strokeWidth={2} />
        ) : null}
      </svg>
    </div>
  );
}

function LadderRow({ standard, y, um }: { standard: GritStandard; y: number; um: number | null }) {
  const grades = gradesOf(standard);
  const near = um ? nearestGrade(um, standard) : null;
  const mid = y + CHART.rowHeight / 2;
  // Label a tick only if it is far enough from the last labelled one; the nearest grade always.
  let lastLabelX = -Infinity;
  const labelled = new Set<string>();
  for (const g of grades) {
    const x = xOf(g.micrometres);
    if (x - lastLabelX >= 34) {
      labelled.add(g.grade);
      lastLabelX = x;
    }
  }
  return (
    <g>
      <text x={CHART.labelWidth - 8} y={mid + 4} textAnchor="end" className="fill-ink text-[12px] font-semibold">
        {GRIT_STANDARD_SHORT_LABELS[standard]}
      </text>
      <line x1={xOf(grades[0].micrometres)} x2={xOf(grades[grades.length - 1].micrometres)} y1={mid} y2={mid} className="stroke-muted" strokeWidth={1} />
      {grades.map((g) => {
        const x = xOf(g.micrometres);
        const isNear = near?.grade === g.grade;
        const showLabel = labelled.has(g.grade) && !(near && !isNear && Math.abs(xOf(near.micrometres) - x) < 30);
        return (
          <g key={g.grade}>
            <title>{`${formatGrade({ standard, grade: g.grade })}: ${formatMicrometres(g.micrometres)}`}</title>
            <line
              x1={x}
              x2={x}
              y1={mid - (isNear ? 9 : 6)}
              y2={mid + (isNear ? 9 : 6)}
              className={isNear ? 'stroke-accent-strong' : 'stroke-ink'}
              strokeWidth={isNear ? 3 : 1.25}
            />
            {showLabel || isNear ? (
              <text
                x={x}
                y={mid - 11}
                textAnchor="middle"
                className={isNear ? 'fill-accent-strong text-[11px] font-semibold' : 'fill-muted text-[10px]'}
              >
                {g.grade.replace('No. ', '').replace('D/B', '')}
              </text>
            ) : null}
          </g>
        );
      })}
    </g>
  );
}
