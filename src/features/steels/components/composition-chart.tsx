import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

export interface CompositionChartProps {
  composition: { element: string; min: number | null; max: number | null }[];
}

/**
 * The composition ranges as floating bars, one per element, from the standard's minimum (0 where
 * it gives a maximum only) to its maximum, wt %. Drawn beside the table that holds the same
 * figures; loaded on demand, since the charting library is large.
 */
export default function CompositionChart({ composition }: CompositionChartProps) {
  const data = composition
    .filter((c) => c.max !== null)
    .map((c) => ({ element: c.element, range: [c.min ?? 0, c.max as number] as [number, number], text: c.min === null ? `≤ ${c.max} %` : `${c.min}–${c.max} %` }));
  if (!data.length) return null;
  return (
    <figure className="flex flex-col gap-1">
      <div aria-hidden="true" style={{ height: 36 * data.length + 40 }}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} layout="vertical" margin={{ top: 4, right: 16, bottom: 4, left: 4 }}>
            <CartesianGrid horizontal={false} stroke="#d9d4c7" />
            <XAxis type="number" unit=" %" tick={{ fontSize: 12 }} domain={[0, 'auto']} />
            <YAxis type="category" dataKey="element" width={32} tick={{ fontSize: 13 }} />
            <Tooltip formatter={(_v, _n, item) => [(item.payload as { text: string }).text, 'range']} />
            <Bar dataKey="range" fill="#0f6e6a" radius={2} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-sm text-muted">Composition ranges, wt % (the same figures as the table).</figcaption>
    </figure>
  );
}
