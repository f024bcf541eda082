import { useId, useMemo, useState } from 'react';
import { ComputationError } from '@shared/computation-error';
import {
  HARDNESS_SCALES,
  HARDNESS_SCALE_LABELS,
  brinellBeyondNormalRange,
  convertHardness,
  hardnessRange,
  hardnessTable,
  type HardnessScale,
} from '@shared/hardness';
import { PageTitle } from '@/components/ui/page-title';
import { Field, Input, Select, controlA11y } from '@/components/ui/field';
import { TableFrame, tdClass, thClass } from '@/components/ui/table';
import { formatNumber } from '@/lib/format';
import { SafetyCautions } from './safety-cautions';

/** Decimals worth showing per scale: Rockwell to a tenth, Vickers and Brinell whole. */
const DIGITS: Record<HardnessScale, number> = { HRC: 1, HV: 0, HBW: 0, HRA: 1 };

function conversion(text: string, scale: HardnessScale) {
  const t = text.trim().replace(',', '.');
  if (t === '') return {};
  const value = Number(t);
  if (!Number.isFinite(value)) return { error: 'Enter a number' };
  try {
    return { values: convertHardness(value, scale) };
  } catch (err) {
    if (err instanceof ComputationError) return { error: err.message };
    throw err;
  }
}

/** The hardness converter page: one value in, its equivalents on the other scales for steel. */
export default function HardnessConverter() {
  const id = useId();
  const [text, setText] = useState('60');
  const [scale, setScale] = useState<HardnessScale>('HRC');
  const result = useMemo(() => conversion(text, scale), [text, scale]);
  const rows = useMemo(() => hardnessTable().reverse(), []);
  const range = hardnessRange(scale);
  const hrc = result.values?.HRC ?? null;
  const hint = `The table covers ${scale} ${formatNumber(range.min)} to ${formatNumber(range.max)}.`;

  return (
    <div className="flex flex-col gap-8">
      <PageTitle
        title="Hardness converter"
        lead="Equivalent hardness numbers for non-austenitic steels, after the conversion table of ASTM E140 (Table 1). Conversions between scales are approximate: a measurement on the scale you need is always better than a converted one."
      >
        Hardness converter
      </PageTitle>

      <section aria-label="Your hardness" className="grid gap-4 rounded-md border border-rule bg-panel p-4 sm:grid-cols-2">
        <Field id={`${id}-value`} label="Hardness" hint={hint} error={result.error}>
          <Input
            {...controlA11y(`${id}-value`, { hint, error: result.error })}
            value={text}
            onChange={(e) => setText(e.target.value)}
            inputMode="decimal"
            autoComplete="off"
          />
        </Field>
        <Field id={`${id}-scale`} label="Scale">
          <Select id={`${id}-scale`} value={scale} onChange={(e) => setScale(e.target.value as HardnessScale)}>
            {HARDNESS_SCALES.map((s) => (
              <option key={s} value={s}>
                {HARDNESS_SCALE_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
      </section>

      <div aria-live="polite">
        {result.values ? (
          <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            {HARDNESS_SCALES.map((s) => {
              const v = result.values[s];
              const beyond = s === 'HBW' && v !== null && brinellBeyondNormalRange(v);
              return (
                <li key={s} className={`rounded-md border bg-panel p-4 ${s === scale ? 'border-accent' : 'border-rule'}`}>
                  <p className="text-sm font-semibold text-muted">{HARDNESS_SCALE_LABELS[s]}</p>
                  <p className="mt-1 font-serif text-3xl font-semibold tabular-nums">
                    {v === null ? '—' : beyond ? `(${formatNumber(v, DIGITS[s])})` : formatNumber(v, DIGITS[s])}
                  </p>
                  {v === null ? (
                    <p className="mt-1 text-sm text-muted">The table has no {s} value this hard.</p>
                  ) : beyond ? (
                    <p className="mt-1 text-sm text-caution">Beyond Brinell’s normal range: indicative only.</p>
                  ) : s === scale ? (
                    <p className="mt-1 text-sm text-muted">As entered.</p>
                  ) : null}
                </li>
              );
            })}
          </ul>
        ) : null}
      </div>

      <details className="rounded-md border border-rule bg-panel p-4">
        <summary className="cursor-pointer font-semibold">The conversion table (HRC 20 to 68)</summary>
        <p className="mt-2 max-w-3xl text-sm text-muted">
          Values between rows are interpolated in a straight line; values outside the table are refused rather than
          guessed. Brinell figures in parentheses lie beyond Brinell’s normal range. The row nearest your value is
          marked.
        </p>
        <div className="mt-3">
          <TableFrame label="Hardness conversion table">
            <table className="w-full border-collapse text-right tabular-nums">
              <thead>
                <tr>
                  {HARDNESS_SCALES.map((s) => (
                    <th key={s} scope="col" className={`${thClass} text-right`}>
                      {s}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rows.map((row) => {
                  const near = hrc !== null && Math.round(hrc) === row.HRC;
                  return (
                    <tr key={row.HRC} className={near ? 'bg-accent-soft' : undefined} aria-current={near ? 'true' : undefined}>
                      <th scope="row" className={`${tdClass} text-right font-semibold`}>
                        {row.HRC}
                      </th>
                      <td className={tdClass}>{row.HV}</td>
                      <td className={tdClass}>{row.HBW === null ? '—' : row.hbwBeyondNormalRange ? `(${row.HBW})` : row.HBW}</td>
                      <td className={tdClass}>{row.HRA.toFixed(1)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </TableFrame>
        </div>
      </details>

      <SafetyCautions />
    </div>
  );
}
