import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { CompareRow } from '@shared/compare-view';
import type { WordedShift, WithinEdgeSpread } from '@shared/compare-difference';
import { GRIT_STANDARD_SHORT_LABELS } from '@shared/grit';
import type { Coolant } from '@shared/vocabulary';
import { optionCoolants, progressionCoolant, type OptionCoolants } from '@shared/workshop';
import { NOTATIONS, bandGrade, notationOf } from '../lib/grit-notation';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, PageOptions } from '@/components/ui/field';
import { ErrorState, Loading } from '@/components/ui/states';
import { formatGritBand, formatNumber } from '@/lib/format';
import { useCompare } from '../api/get-compare';
import { useCompareDifference } from '../api/get-compare-difference';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { CoolantCaution, coolantWord } from '@/features/workshop/components/coolant-caution';
import type { AbrasiveSummary } from '@/types/api';

/** How much a cell's evidence is worth, in words. */
function evidenceWords(row: CompareRow): string | null {
  if (row.n === 1) return 'one result: an anecdote, not a measurement of the option';
  if (row.n < 3) return `only ${row.n} results`;
  if (row.testers === 1) return 'every result from one tester';
  return null;
}

/** An option's coolants from its abrasive pages (shared/workshop.ts `optionCoolants`). */
function coolantsOf(row: CompareRow, pages: AbrasiveSummary[]): OptionCoolants {
  return optionCoolants(
    pages.map((p) => ({ name: p.name, material: p.material, gritUm: p.gritUm, coolant: p.coolant as Coolant })),
    row,
  );
}

/** An option's coolants in words: one, or each with the pages that run on it. */
function coolantText(c: OptionCoolants): string {
  if (c.basis === 'none') return 'no abrasive page of this material yet';
  const words = c.coolants.map((k) => (c.coolants.length === 1 ? coolantWord(k.coolant) : `${coolantWord(k.coolant)} (${k.pages.join(', ')})`)).join(', or ');
  return c.basis === 'material' ? `${words}, as this material’s pages say (none of them in this band)` : words;
}

/**
 * One steel's decision view: each abrasive material × grit band measured on it (under one
 * method, optionally within a hardness range) as an option with its median, interval,
 * retention, n and testers; any two chosen give their difference, written and drawn.
 */
export function DecisionView({ steel, steelName, methods }: { steel: string; steelName: string; methods: { slug: string; name: string }[] }) {
  const [params, setParams] = useSearchParams();
  const get = (k: string) => params.get(k) ?? undefined;
  const notation = notationOf(get('notation'));
  const filters = { steel, method: get('method'), hrcMin: get('hrcMin'), hrcMax: get('hrcMax') };
  const view = useCompare({ ...filters, sort: 'median', pageSize: '500' });
  const a = get('a');
  const b = get('b');
  const set = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(changes)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    setParams(next, { replace: true });
  };
  const rows = view.data?.rows ?? [];
  const abrasives = useAbrasives().data?.items;
  const method = view.data?.method;
  const choose = (cell: string) => {
    if (a === cell) set({ a: b, b: undefined });
    else if (b === cell) set({ b: undefined });
    else if (!a) set({ a: cell });
    else set({ b: cell });
  };

  return (
    <div className="flex flex-col gap-6">
      <form className="flex flex-wrap items-end gap-4 rounded-md border border-rule bg-panel p-4" onSubmit={(e) => e.preventDefault()} aria-label="What to decide about">
        <Field id="decide-method" label="Method" className="min-w-0 w-full sm:w-96">
          <Select id="decide-method" value={method?.slug ?? get('method') ?? ''} onChange={(e) => set({ method: e.target.value, a: undefined, b: undefined })}>
            <PageOptions pages={methods} />
          </Select>
        </Field>
        <Field id="decide-hrc-min" label="Hardness from, HRC" className="w-36">
          <Input id="decide-hrc-min" type="number" inputMode="decimal" min={20} max={72} step={0.5} defaultValue={get('hrcMin')} onBlur={(e) => set({ hrcMin: e.target.value || undefined })} />
        </Field>
        <Field id="decide-hrc-max" label="to, HRC" className="w-36">
          <Input id="decide-hrc-max" type="number" inputMode="decimal" min={20} max={72} step={0.5} defaultValue={get('hrcMax')} onBlur={(e) => set({ hrcMax: e.target.value || undefined })} />
        </Field>
        <Field id="decide-notation" label="Grit written as" className="w-44">
          <Select id="decide-notation" value={notation} onChange={(e) => set({ notation: e.target.value })}>
            {NOTATIONS.map((n) => (
              <option key={n} value={n}>
                {GRIT_STANDARD_SHORT_LABELS[n]}
              </option>
            ))}
          </Select>
        </Field>
      </form>

      {view.isPending ? (
        <Loading label="Gathering the options…" />
      ) : view.isError ? (
        <ErrorState error={view.error} onRetry={() => view.refetch()} />
      ) : (
        <>
          <section aria-labelledby="options-title" className="flex flex-col gap-3">
            <h2 id="options-title" className="font-serif text-xl">
              {rows.length} option{rows.length === 1 ? '' : 's'} measured on {steelName}
            </h2>
            <p className="max-w-3xl text-muted">
              Each option is an abrasive material at a grit band, measured by {method?.name}. Figures are the results’ median force to sever the test medium (lower is keener), with the 95 % interval of the mean where there are two results or more. Choose two to see their difference.
            </p>
            {rows.length === 0 ? <p role="status">No approved results on {steelName} under these choices yet.</p> : null}
            <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3" aria-label="Options">
              {rows.map((row) => {
                const role = row.cell === a ? 'A' : row.cell === b ? 'B' : null;
                const thin = evidenceWords(row);
                return (
                  <li key={row.cell} className={`flex min-w-0 flex-col gap-2 rounded-md border bg-panel p-3 ${role ? 'border-accent ring-2 ring-accent-soft' : 'border-rule'}`}>
                    <div className="flex items-start justify-between gap-2">
                      <h3 className="min-w-0 font-semibold">
                        {row.materialLabel}
                        <span className="block text-sm font-normal text-muted">
                          {formatGritBand(row.band)} · {bandGrade(row.band, notation)}
                        </span>
                      </h3>
                      <Button size="sm" variant={role ? 'primary' : 'secondary'} aria-pressed={!!role} onClick={() => choose(row.cell)} aria-label={`${role ? `Chosen as ${role}; press to un-choose` : 'Choose'} ${row.materialLabel} ${formatGritBand(row.band)}`}>
                        {role ? `${role} ✓` : a && !b ? 'Choose as B' : 'Choose'}
                      </Button>
                    </div>
                    <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
                      <dt className="text-muted">Median</dt>
                      <dd>
                        <strong>{formatNumber(row.sharpnessG.median, 0)} g</strong>
                        {row.sharpnessG.ci95 ? ` (mean’s 95 % interval ${formatNumber(row.sharpnessG.ci95[0], 0)}–${formatNumber(row.sharpnessG.ci95[1], 0)} g)` : ''}
                      </dd>
                      <dt className="text-muted">Retention</dt>
                      <dd>{row.retentionCuts ? `median ${formatNumber(row.retentionCuts.median, 0)} cuts (${row.retentionCuts.n} result${row.retentionCuts.n === 1 ? '' : 's'})` : 'not reported'}</dd>
                      <dt className="text-muted">Coolant</dt>
                      <dd>{abrasives ? coolantText(coolantsOf(row, abrasives)) : '…'}</dd>
                      <dt className="text-muted">Evidence</dt>
                      <dd>
                        {row.n} result{row.n === 1 ? '' : 's'} from {row.testers} tester{row.testers === 1 ? '' : 's'}
                        {thin ? <span className="block text-caution">Thin: {thin}.</span> : null}
                      </dd>
                    </dl>
                  </li>
                );
              })}
            </ul>
          </section>
          {a && b ? <DifferencePanel filters={{ ...filters, method: method?.slug }} a={a} b={b} abrasives={abrasives} onClear={() => set({ a: undefined, b: undefined })} /> : a ? <p role="status">A is chosen; choose a second option as B.</p> : null}
          <p className="text-sm">
            <Link to={paths.compare.getHref({ steel, method: method?.slug })}>See {steelName} in the full comparison</Link>
          </p>
        </>
      )}
    </div>
  );
}

/** A shift drawn on a line: zero, the interval, the estimate, and one edge's own scatter around zero. */
function ShiftDrawing({ shift, within, title }: { shift: WordedShift; within: WithinEdgeSpread | null; title: string }) {
  const lo = shift.interval?.lo ?? shift.estimate;
  const hi = shift.interval?.hi ?? shift.estimate;
  const scatter = within?.medianSdG ?? 0;
  const extent = Math.max(Math.abs(lo), Math.abs(hi), scatter, 1) * 1.15;
  // Drawn 400 units wide and shown at most 36 rem wide, so labels stay readable on a phone and a desktop.
  const W = 400;
  const x = (v: number) => 20 + ((v + extent) / (2 * extent)) * (W - 40);
  const ticks = [-extent, -extent / 2, 0, extent / 2, extent].map((t) => Math.round(t));
  return (
    <figure className="m-0">
      <svg viewBox={`0 0 ${W} 92`} className="h-auto w-full max-w-xl" role="img" aria-label={`${title}: estimate ${formatNumber(shift.estimate, 0)} ${shift.unit}${shift.interval ? `, interval ${formatNumber(lo, 0)} to ${formatNumber(hi, 0)}` : ', no interval'}`}>
        {scatter ? <rect x={x(-scatter)} y={18} width={x(scatter) - x(-scatter)} height={34} className="fill-accent-soft" /> : null}
        <line x1={x(0)} x2={x(0)} y1={10} y2={60} className="stroke-ink" strokeDasharray="3 3" />
        {shift.interval ? <line x1={x(lo)} x2={x(hi)} y1={35} y2={35} className="stroke-accent-strong" strokeWidth={6} strokeLinecap="round" /> : null}
        <circle cx={x(shift.estimate)} cy={35} r={7} className="fill-panel stroke-accent-strong" strokeWidth={3} />
        {ticks.map((t, i) => (
          <text key={i} x={x(t)} y={80} textAnchor="middle" className="fill-muted text-[13px]">
            {String(t).replace('-', '−')}
          </text>
        ))}
      </svg>
      <figcaption className="text-sm text-muted">
        {title}, B − A in {shift.unit}: dot the estimate, bar its 95 % interval{scatter ? ', shaded band ± one edge’s own scatter (median SD of its readings)' : ''}; the dashed line is no difference.
      </figcaption>
    </figure>
  );
}

/**
 * The trough between the two options chosen, coarse to fine (the coarser band first; as chosen
 * within one band): where it must change, by `progressionCoolant`, when each option runs on one
 * coolant; otherwise which of their pages run on what.
 */
function TroughBetween({ a, b, pages }: { a: CompareRow; b: CompareRow; pages: AbrasiveSummary[] }) {
  const [first, second] = b.band.hiUm > a.band.hiUm ? [b, a] : [a, b];
  const name = (r: CompareRow) => `${r.materialLabel}, ${formatGritBand(r.band)}`;
  const [c1, c2] = [coolantsOf(first, pages), coolantsOf(second, pages)];
  let text: string;
  if (c1.coolants.length === 1 && c2.coolants.length === 1) {
    const step = (r: CompareRow, c: OptionCoolants) => ({ label: name(r), coolant: c.coolants[0].coolant, micrometres: null });
    const { changes } = progressionCoolant([step(first, c1)], step(second, c2));
    text = changes.length
      ? `Going from ${name(first)} to ${name(second)}, the trough must change between them: from ${coolantWord(changes[0].from)} to ${coolantWord(changes[0].to)}.`
      : `Both run on ${coolantWord(c1.coolants[0].coolant)}: no change of the trough between ${name(first)} and ${name(second)}.`;
  } else {
    text = `It depends on which wheels or stones you use: ${name(first)} runs on ${coolantText(c1)}; ${name(second)} on ${coolantText(c2)}. The trough must change wherever the two you use differ.`;
  }
  return (
    <div className="rounded-md border border-rule p-3" aria-label="Coolant between the two">
      <p className="font-medium">Coolant in the trough</p>
      <p>{text}</p>
      {c1.basis === 'material' || c2.basis === 'material' ? (
        <p className="mt-1 text-sm text-muted">Where no page of a material lies in the band, its coolant is taken from the material’s other pages.</p>
      ) : null}
      <CoolantCaution />
    </div>
  );
}

function DifferencePanel({ filters, a, b, abrasives, onClear }: { filters: Record<string, string | undefined>; a: string; b: string; abrasives: AbrasiveSummary[] | undefined; onClear: () => void }) {
  const query = useCompareDifference({ ...filters, a, b }, true);
  const names = useMemo(() => {
    const d = query.data;
    const name = (r: CompareRow | null, fallback: string) => (r ? `${r.materialLabel}, ${formatGritBand(r.band)}` : fallback);
    return d ? { a: name(d.a, a), b: name(d.b, b) } : null;
  }, [query.data, a, b]);
  return (
    <section aria-labelledby="difference-title" className="flex flex-col gap-3 rounded-md border border-rule bg-panel p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="difference-title" className="font-serif text-xl">
          The difference between the two
        </h2>
        <Button variant="quiet" size="sm" onClick={onClear}>
          Clear both
        </Button>
      </div>
      {query.isPending ? (
        <Loading label="Working out the difference…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => query.refetch()} />
      ) : (
        <>
          <dl className="grid gap-1 sm:grid-cols-[3rem_1fr]">
            <dt className="font-semibold">A</dt>
            <dd>{names!.a}</dd>
            <dt className="font-semibold">B</dt>
            <dd>{names!.b}</dd>
          </dl>
          <div role="status" className="flex flex-col gap-2">
            {query.data.words.map((w, i) => (
              <p key={i} className={i === 0 ? 'text-lg' : ''}>
                {w}
              </p>
            ))}
          </div>
          {query.data.sharpness ? <ShiftDrawing shift={query.data.sharpness} within={query.data.withinEdge} title="Force to cut" /> : null}
          {query.data.retention ? <ShiftDrawing shift={query.data.retention} within={null} title="Retention" /> : null}
          <p className="text-sm text-muted">
            The shift is the Hodges–Lehmann estimate (the median of every difference between a result of B and a result of A); its interval comes from the exact distribution of the Mann–Whitney statistic and assumes only that results are independent (Hollander, Wolfe &amp; Chicken, Nonparametric Statistical Methods, 3rd ed., §4.3).
          </p>
          {query.data.a && query.data.b && abrasives ? <TroughBetween a={query.data.a} b={query.data.b} pages={abrasives} /> : null}
        </>
      )}
    </section>
  );
}
