import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CartesianGrid, Legend, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZAxis } from 'recharts';
import { ABRASIVE_MATERIALS } from '@shared/vocabulary';
import { median } from '@shared/stats';
import { paths } from '@/config/paths';
import { Field, Select } from '@/components/ui/field';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatNumber } from '@/lib/format';
import type { CompareFilters } from '@/config/paths';
import { useComparePoints, type ComparePoint, type ComparePointsResponse } from '../api/get-compare-points';

/**
 * One colour and one marker shape per abrasive material, so a series can be told apart
 * without colour. The colours are Edgeledger's own (accent teal, caution rust, muted slate from
 * tailwind.config.ts, with three tones chosen to sit beside them).
 */
export const MATERIAL_STYLE: Record<string, { colour: string; shape: 'circle' | 'triangle' | 'square' | 'diamond' | 'star' | 'cross' }> = {
  'aluminium-oxide': { colour: '#8a4b08', shape: 'circle' },
  'ceramic-alumina': { colour: '#b7791f', shape: 'triangle' },
  'silicon-carbide': { colour: '#5b6270', shape: 'square' },
  cbn: { colour: '#0f6e6a', shape: 'diamond' },
  diamond: { colour: '#35507e', shape: 'star' },
  'natural-stone': { colour: '#7a5c3e', shape: 'cross' },
};
const labelOf = (m: string) => ABRASIVE_MATERIALS[m as keyof typeof ABRASIVE_MATERIALS] ?? m;
/** Height of one abrasive's row in the spread chart: the chart grows with its rows, so names never crowd. */
const ROW_PX = 30;
const LOG_TICKS = [0.25, 0.5, 1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 1024];

/** Whether the screen is narrower than the md breakpoint (a phone), following its changes. */
function useNarrow(): boolean {
  const query = '(max-width: 767px)';
  const [narrow, setNarrow] = useState(() => window.matchMedia(query).matches);
  useEffect(() => {
    const list = window.matchMedia(query);
    const on = () => setNarrow(list.matches);
    list.addEventListener('change', on);
    return () => list.removeEventListener('change', on);
  }, []);
  return narrow;
}

/** Room for a tick label of `px` pixels at about 9 px a character (13 px text, wide glyphs and the ellipsis included). */
const charsIn = (px: number) => Math.max(6, Math.floor(px / 9));
const shorten = (text: string, chars: number) => (text.length <= chars ? text : `${text.slice(0, chars - 1).trimEnd()}…`);

/**
 * A category tick on the spread chart's axis: the abrasive's name shortened to the room there
 * is, the whole name on hover (its title) and on focus (it is focusable and named by it).
 */
function NameTick({ x, y, payload, names, width }: { x?: number; y?: number; payload?: { value: number }; names: string[]; width: number }) {
  const name = names[payload?.value ?? -1] ?? '';
  return (
    <g transform={`translate(${x ?? 0},${y ?? 0})`} tabIndex={0} aria-label={name} className="outline-none focus:[&>text]:fill-accent-strong focus:[&>text]:underline">
      <title>{name}</title>
      <text x={-6} y={0} dy="0.32em" textAnchor="end" fontSize={13} fill="#4a4f57">
        {shorten(name, charsIn(width - 10))}
      </text>
    </g>
  );
}

/** Axis titles sit in their own band beside the tick labels, never on them. */
const X_AXIS_HEIGHT = 48;
/** The legend keeps clear of the top tick label. */
const LEGEND_STYLE = { paddingBottom: 10 };
const Y_AXIS_WIDTH = 64;

function ChartFrame({ title, caption, children, fallback, height = 320, controls }: { title: string; caption: ReactNode; children: ReactNode; fallback: ReactNode; height?: number; controls?: ReactNode }) {
  return (
    <section className="flex min-w-0 flex-col gap-2 rounded-md border border-rule bg-panel p-4">
      <h2 className="font-serif text-xl">{title}</h2>
      <p className="text-sm text-muted">{caption}</p>
      {controls}
      <div className="w-full" style={{ height }} role="img" aria-label={`${title}: chart; the same data is in the table below it`}>
        {children}
      </div>
      <details>
        <summary className="cursor-pointer text-sm font-medium text-accent-strong">The same data as a table</summary>
        <div className="mt-2">{fallback}</div>
      </details>
    </section>
  );
}

function PointTip({ data, point }: { data: ComparePointsResponse; point?: ComparePoint & { name?: string } }) {
  if (!point) return null;
  // The strip plot's median marks carry no result.
  if (point.id < 0) return <div className="rounded border border-rule bg-panel px-3 py-2 text-sm shadow">Median of {point.name}: {formatNumber(point.medianG, 0)} g</div>;
  return (
    <div className="rounded border border-rule bg-panel px-3 py-2 text-sm shadow">
      <p className="font-semibold">
        {data.steels[point.steel] ?? point.steel} on {data.abrasives[point.abrasive]?.name ?? point.abrasive}
      </p>
      <p>
        {formatNumber(point.medianG, 0)} g median · {formatNumber(point.gritUm)} µm · {formatNumber(point.hrc)} HRC · {formatNumber(point.perSideDeg)}° per side
        {point.retentionCuts !== null ? ` · ${point.retentionCuts} cuts` : ''}
      </p>
      <p className="text-muted">
        Result #{point.id}
        {point.author ? ` by ${point.author}` : ''}
      </p>
    </div>
  );
}

function byMaterial(points: ComparePoint[]) {
  const out = new Map<string, ComparePoint[]>();
  for (const p of points) out.set(p.material, [...(out.get(p.material) ?? []), p]);
  return [...out.entries()].sort((a, b) => labelOf(a[0]).localeCompare(labelOf(b[0])));
}

function PointsTable({ data, points, columns }: { data: ComparePointsResponse; points: ComparePoint[]; columns: ('um' | 'g' | 'hrc' | 'cuts')[] }) {
  const shown = points.slice(0, 300);
  return (
    <TableFrame label="Chart data">
      <table className="w-full border-collapse text-sm">
        <caption className="px-3 py-2 text-left text-muted">
          {shown.length < points.length ? `The first ${shown.length} of ${points.length} points.` : `${points.length} points.`}
        </caption>
        <thead>
          <tr>
            <th scope="col" className={thClass}>Result</th>
            <th scope="col" className={thClass}>Steel</th>
            <th scope="col" className={thClass}>Abrasive</th>
            {columns.includes('um') ? <th scope="col" className={`${thClass} text-right`}>µm</th> : null}
            {columns.includes('hrc') ? <th scope="col" className={`${thClass} text-right`}>HRC</th> : null}
            {columns.includes('g') ? <th scope="col" className={`${thClass} text-right`}>Median g</th> : null}
            {columns.includes('cuts') ? <th scope="col" className={`${thClass} text-right`}>Cuts</th> : null}
          </tr>
        </thead>
        <tbody>
          {shown.map((p) => (
            <tr key={p.id}>
              <td className={tdClass}>
                <Link to={paths.result.getHref(p.id)}>#{p.id}</Link>
              </td>
              <td className={tdClass}>{data.steels[p.steel] ?? p.steel}</td>
              <td className={tdClass}>{data.abrasives[p.abrasive]?.name ?? p.abrasive}</td>
              {columns.includes('um') ? <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.gritUm)}</td> : null}
              {columns.includes('hrc') ? <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.hrc)}</td> : null}
              {columns.includes('g') ? <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(p.medianG, 0)}</td> : null}
              {columns.includes('cuts') ? <td className={`${tdClass} text-right tabular-nums`}>{p.retentionCuts ?? '—'}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}

/**
 * The comparison's charts (loaded on demand, in their own chunk): sharpness against particle
 * size on a log axis, one series per abrasive material; the spread of sharpness per abrasive
 * for one steel (a strip plot with each abrasive's median); and retention against hardness.
 * Every chart has its data as a table beneath it.
 */
export default function CompareCharts({ filters, chartSteel, onChartSteel }: { filters: CompareFilters; chartSteel?: string; onChartSteel: (slug: string | undefined) => void }) {
  const points = useComparePoints(filters);
  const narrow = useNarrow();
  // The abrasive names' band: a third of a phone's width, 220 px beside a wide chart.
  const nameWidth = narrow ? 120 : 220;
  const data = points.data;
  const steelsInView = useMemo(() => (data ? Object.entries(data.steels).sort((a, b) => a[1].localeCompare(b[1])) : []), [data]);
  const steel = chartSteel && data?.steels[chartSteel] ? chartSteel : steelsInView[0]?.[0];

  const strip = useMemo(() => {
    if (!data || !steel) return null;
    const mine = data.points.filter((p) => p.steel === steel);
    const groups = new Map<string, ComparePoint[]>();
    for (const p of mine) groups.set(p.abrasive, [...(groups.get(p.abrasive) ?? []), p]);
    const abrasives = [...groups.entries()]
      .map(([slug, list]) => ({ slug, name: data.abrasives[slug]?.name ?? slug, material: data.abrasives[slug]?.material ?? '', median: median(list.map((p) => p.medianG)), list }))
      .sort((a, b) => a.median - b.median);
    // A fixed jitter from the result id keeps each point in place between renders.
    const dots = abrasives.flatMap((a, i) => a.list.map((p) => ({ ...p, row: i + (((p.id * 2654435761) % 1000) / 1000 - 0.5) * 0.5 })));
    const medians = abrasives.map((a, i) => ({ medianG: a.median, row: i, id: -1, name: a.name }));
    return { abrasives, dots, medians, count: mine.length };
  }, [data, steel]);

  if (points.isPending) return <Loading label="Loading the chart points…" />;
  if (points.isError) return <ErrorState error={points.error} onRetry={() => points.refetch()} />;
  if (!data || data.points.length === 0) return <Empty title="No published results to chart for these filters" />;

  const sample = data.sampledEvery > 1 ? ` Showing every ${data.sampledEvery}th of ${data.total} results (evenly spaced, so the shape holds).` : '';
  const sizes = data.points.map((p) => p.gritUm);
  const domain: [number, number] = [Math.min(...sizes) / 1.3, Math.max(...sizes) * 1.3];
  const withCuts = data.points.filter((p) => p.retentionCuts !== null);

  return (
    <div className="flex flex-col gap-6">
      <ChartFrame
        title="Sharpness and particle size"
        caption={`Each point is one result: its median reading against the particle size of the last abrasive, on a logarithmic size axis; one series (colour and shape) per abrasive material.${sample}`}
        fallback={<PointsTable data={data} points={data.points} columns={['um', 'g']} />}
      >
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 10, right: 16, bottom: 6, left: 0 }}>
            <CartesianGrid stroke="#d9d4c7" strokeDasharray="3 3" />
            <XAxis type="number" dataKey="gritUm" name="Particle size" scale="log" domain={domain} ticks={LOG_TICKS.filter((t) => t >= domain[0] && t <= domain[1])} allowDataOverflow height={X_AXIS_HEIGHT} label={{ value: narrow ? 'Particle size, µm (log)' : 'Particle size, µm (log scale)', position: 'insideBottom', offset: 0 }} />
            <YAxis type="number" dataKey="medianG" name="Median" width={Y_AXIS_WIDTH} label={{ value: 'Median force, g', angle: -90, position: 'insideLeft', offset: 12, style: { textAnchor: 'middle' } }} />
            <ZAxis range={[28, 28]} />
            <Tooltip content={({ payload }) => <PointTip data={data} point={payload?.[0]?.payload as ComparePoint | undefined} />} />
            <Legend verticalAlign="top" wrapperStyle={LEGEND_STYLE} />
            {byMaterial(data.points).map(([m, list]) => (
              <Scatter key={m} name={labelOf(m)} data={list} fill={MATERIAL_STYLE[m]?.colour ?? '#1f2328'} shape={MATERIAL_STYLE[m]?.shape ?? 'circle'} isAnimationActive={false} fillOpacity={0.75} />
            ))}
          </ScatterChart>
        </ResponsiveContainer>
      </ChartFrame>

      <ChartFrame
        title="Spread per abrasive, for one steel"
        caption={`Each dot is one result on ${steel ? data.steels[steel] : 'the chosen steel'}; the cross marks each abrasive’s median. Abrasives are ordered keenest first; a name too long for its row is shortened, the whole name shows on hover and focus and in the table below.`}
        height={strip ? Math.max(200, strip.abrasives.length * ROW_PX + 110) : 200}
        controls={
          <Field id="chart-steel" label="Steel for this chart" className="max-w-xs">
            <Select id="chart-steel" value={steel ?? ''} onChange={(e) => onChartSteel(e.target.value || undefined)}>
              {steelsInView.map(([slug, name]) => (
                <option key={slug} value={slug}>
                  {name}
                </option>
              ))}
            </Select>
          </Field>
        }
        fallback={
          strip ? (
            <TableFrame label="Medians per abrasive">
              <table className="w-full border-collapse text-sm">
                <thead>
                  <tr>
                    <th scope="col" className={thClass}>Abrasive</th>
                    <th scope="col" className={`${thClass} text-right`}>Results</th>
                    <th scope="col" className={`${thClass} text-right`}>Median g</th>
                    <th scope="col" className={`${thClass} text-right`}>Range g</th>
                  </tr>
                </thead>
                <tbody>
                  {strip.abrasives.map((a) => (
                    <tr key={a.slug}>
                      <td className={tdClass}>
                        <Link to={paths.abrasive.getHref(a.slug)}>{a.name}</Link>
                      </td>
                      <td className={`${tdClass} text-right tabular-nums`}>{a.list.length}</td>
                      <td className={`${tdClass} text-right tabular-nums`}>{formatNumber(a.median, 0)}</td>
                      <td className={`${tdClass} text-right tabular-nums`}>
                        {formatNumber(Math.min(...a.list.map((p) => p.medianG)), 0)}–{formatNumber(Math.max(...a.list.map((p) => p.medianG)), 0)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableFrame>
          ) : null
        }
      >
        {strip ? (
          <ResponsiveContainer width="100%" height="100%">
            <ScatterChart margin={{ top: 10, right: 16, bottom: 6, left: 0 }}>
              <CartesianGrid stroke="#d9d4c7" strokeDasharray="3 3" />
              <XAxis type="number" dataKey="medianG" name="Median" height={X_AXIS_HEIGHT} label={{ value: 'Median force, g', position: 'insideBottom', offset: 0 }} />
              <YAxis
                type="number"
                dataKey="row"
                name="Abrasive"
                width={nameWidth}
                tick={<NameTick names={strip.abrasives.map((a) => a.name)} width={nameWidth} />}
                domain={[-0.6, strip.abrasives.length - 0.4]}
                ticks={strip.abrasives.map((_, i) => i)}
                reversed
                interval={0}
              />
              <ZAxis range={[24, 24]} />
              <Tooltip content={({ payload }) => <PointTip data={data} point={(payload?.[0]?.payload as ComparePoint & { id: number }) ?? undefined} />} />
              {byMaterial(strip.dots).map(([m, list]) => (
                <Scatter key={m} name={labelOf(m)} data={list} fill={MATERIAL_STYLE[m]?.colour ?? '#1f2328'} shape={MATERIAL_STYLE[m]?.shape ?? 'circle'} fillOpacity={0.6} isAnimationActive={false} />
              ))}
              <Scatter name="Median" data={strip.medians} fill="#1f2328" shape="cross" isAnimationActive={false} />
              <Legend verticalAlign="top" wrapperStyle={LEGEND_STYLE} />
            </ScatterChart>
          </ResponsiveContainer>
        ) : null}
      </ChartFrame>

      <ChartFrame
        title="Retention and hardness"
        caption={`Each point is one result that ran the retention test: the cuts it lasted against the steel’s hardness; one series per abrasive material. ${withCuts.length} of ${data.points.length} results have a retention count.`}
        fallback={<PointsTable data={data} points={withCuts} columns={['hrc', 'cuts']} />}
      >
        {withCuts.length ? (
          <ResponsiveContainer width="100%" height="100%">
            <ScatterChart margin={{ top: 10, right: 16, bottom: 6, left: 0 }}>
              <CartesianGrid stroke="#d9d4c7" strokeDasharray="3 3" />
              <XAxis type="number" dataKey="hrc" name="Hardness" domain={['dataMin - 0.5', 'dataMax + 0.5']} height={X_AXIS_HEIGHT} label={{ value: 'Hardness, HRC', position: 'insideBottom', offset: 0 }} />
              <YAxis type="number" dataKey="retentionCuts" name="Cuts" width={Y_AXIS_WIDTH} label={{ value: 'Cuts', angle: -90, position: 'insideLeft', offset: 12, style: { textAnchor: 'middle' } }} />
              <ZAxis range={[28, 28]} />
              <Tooltip content={({ payload }) => <PointTip data={data} point={payload?.[0]?.payload as ComparePoint | undefined} />} />
              <Legend verticalAlign="top" wrapperStyle={LEGEND_STYLE} />
              {byMaterial(withCuts).map(([m, list]) => (
                <Scatter key={m} name={labelOf(m)} data={list} fill={MATERIAL_STYLE[m]?.colour ?? '#1f2328'} shape={MATERIAL_STYLE[m]?.shape ?? 'circle'} fillOpacity={0.75} isAnimationActive={false} />
              ))}
            </ScatterChart>
          </ResponsiveContainer>
        ) : (
          <Empty title="No result in this view ran the retention test" />
        )}
      </ChartFrame>
    </div>
  );
}
