/**
 * A small line of measured diameter against date, drawn to scale in plain SVG, with the
 * original diameter as a dashed reference line. Colour is not the only carrier: each point is
 * labelled in the table beside it.
 */
import { formatDate } from '@/lib/format';
export function WearChart({ original, series }: { original: number; series: { measuredOn: string; diameterMm: number }[] }) {
  if (series.length < 2) return null;
  const w = 320;
  const h = 120;
  const pad = { l: 44, r: 8, t: 8, b: 22 };
  const times = series.map((s) => Date.parse(s.measuredOn));
  const t0 = Math.min(...times);
  const t1 = Math.max(...times);
  const lo = Math.min(...series.map((s) => s.diameterMm));
  const hi = Math.max(original, ...series.map((s) => s.diameterMm));
  const span = Math.max(hi - lo, 1);
  const x = (t: number) => pad.l + ((t - t0) / Math.max(t1 - t0, 1)) * (w - pad.l - pad.r);
  const y = (d: number) => pad.t + ((hi - d) / span) * (h - pad.t - pad.b);
  const points = series.map((s, i) => `${x(times[i]).toFixed(1)},${y(s.diameterMm).toFixed(1)}`).join(' ');
  return (
    <svg viewBox={`0 0 ${w} ${h}`} className="w-full max-w-sm" role="img" aria-label={`Diameter from ${series[0].diameterMm} mm to ${series[series.length - 1].diameterMm} mm`}>
      <line x1={pad.l} x2={w - pad.r} y1={y(original)} y2={y(original)} stroke="#5b6270" strokeDasharray="4 3" strokeWidth="1" />
      <text x={pad.l - 4} y={y(original) + 4} textAnchor="end" fontSize="10" fill="#5b6270">{original}</text>
      <text x={pad.l - 4} y={y(lo) + 4} textAnchor="end" fontSize="10" fill="#5b6270">{lo}</text>
      <polyline points={points} fill="none" stroke="#0f6e6a" strokeWidth="2" />
      {series.map((s, i) => (
        <circle key={s.measuredOn + i} cx={x(times[i])} cy={y(s.diameterMm)} r="3" fill="#0f6e6a" />
      ))}
      <text x={pad.l} y={h - 6} fontSize="10" fill="#5b6270">{formatDate(series[0].measuredOn)}</text>
      <text x={w - pad.r} y={h - 6} textAnchor="end" fontSize="10" fill="#5b6270">{formatDate(series[series.length - 1].measuredOn)}</text>
    </svg>
  );
}
