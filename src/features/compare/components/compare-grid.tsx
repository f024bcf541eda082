import { useMemo } from 'react';
import type { CompareRow } from '@shared/compare-view';
import { formatGritBand } from '@/lib/format';
import { TableFrame, thClass } from '@/components/ui/table-frame';

/**
 * Edgeledger's own sequential ramp, from the paper tone to the accent's darkest teal (both from
 * tailwind.config.ts), in six steps: darker means a lower force, a keener edge. The last two
 * steps carry white text so every label stays legible.
 */
const RAMP = ['#f4efe3', '#dcebe5', '#b4d8d1', '#7fbab2', '#3f8f89', '#0a4f4c'] as const;
const DARK_FROM = 4;

/** Bin edges (g) splitting the medians into six groups of about equal size, ascending. */
export function binEdges(medians: number[], bins = RAMP.length): number[] {
  const s = [...medians].sort((a, b) => a - b);
  if (!s.length) return [];
  return Array.from({ length: bins - 1 }, (_, i) => s[Math.min(s.length - 1, Math.floor(((i + 1) * s.length) / bins))]);
}

/** The ramp index of a median: 0 for the highest forces (bluntest), 5 for the lowest. */
function shadeOf(g: number, edges: number[]): number {
  let bin = 0;
  while (bin < edges.length && g >= edges[bin]) bin++;
  return RAMP.length - 1 - bin;
}

/**
 * The grid view: steels down, abrasive material × grit band across, the median grams in each
 * cell as a number, shaded by value with a legend of numeric ranges (the number, not the
 * colour, carries the value). Thin cells say so in words. A cell opens its results.
 */
export function CompareGrid({ rows, onOpenCell, openCell }: { rows: CompareRow[]; onOpenCell: (cell: string) => void; openCell?: string }) {
  const { steels, columns, byKey, edges } = useMemo(() => {
    const steelMap = new Map<string, string>();
    const colMap = new Map<string, { material: string; label: string; band: CompareRow['band'] }>();
    const byKey = new Map<string, CompareRow>();
    for (const r of rows) {
      steelMap.set(r.steel, r.steelName);
      colMap.set(`${r.material}|${r.band.phi}`, { material: r.material, label: r.materialLabel, band: r.band });
      byKey.set(`${r.steel}|${r.material}|${r.band.phi}`, r);
    }
    const columns = [...colMap.entries()].sort((a, b) => a[1].label.localeCompare(b[1].label) || a[1].band.phi - b[1].band.phi);
    const steels = [...steelMap.entries()].sort((a, b) => a[1].localeCompare(b[1]));
    return { steels, columns, byKey, edges: binEdges(rows.map((r) => r.sharpnessG.median)) };
  }, [rows]);

  const materials = useMemo(() => {
    const out: { label: string; span: number }[] = [];
    for (const [, c] of columns) {
      const last = out[out.length - 1];
      if (last && last.label === c.label) last.span++;
      else out.push({ label: c.label, span: 1 });
    }
    return out;
  }, [columns]);

  const legend = RAMP.map((colour, i) => {
    // ramp index i ↔ bin (5 − i); bin b covers [edges[b − 1], edges[b])
    const bin = RAMP.length - 1 - i;
    const lo = bin === 0 ? null : edges[bin - 1];
    const hi = bin === RAMP.length - 1 ? null : edges[bin];
    const text = lo === null ? `below ${Math.round(hi!)} g` : hi === null ? `${Math.round(lo)} g and above` : `${Math.round(lo)}–${Math.round(hi)} g`;
    return { colour, text, dark: i >= DARK_FROM };
  });

  return (
    <div className="flex flex-col gap-3">
      <figure aria-label="Shading legend" className="flex flex-wrap items-center gap-2 text-sm">
        <figcaption className="mr-1 text-muted">Median force, each shade a sixth of the cells:</figcaption>
        {[...legend].reverse().map((l) => (
          <span key={l.text} className="inline-flex items-center gap-1.5 rounded border border-rule px-2 py-0.5" style={{ background: l.colour, color: l.dark ? '#fff' : '#1f2328' }}>
            {l.text}
          </span>
        ))}
        <span className="text-muted">(darker: lower force, a keener edge)</span>
      </figure>
      <TableFrame label="Grid of median grams: steels by abrasive material and grit band">
        <table className="border-collapse text-sm">
          <thead>
            <tr>
              <th scope="col" rowSpan={2} className={`${thClass} sticky left-0 z-10`}>
                Steel
              </th>
              {materials.map((m, i) => (
                <th key={`${m.label}-${i}`} scope="colgroup" colSpan={m.span} className={`${thClass} border-l text-center`}>
                  {m.label}
                </th>
              ))}
            </tr>
            <tr>
              {columns.map(([key, c]) => (
                <th key={key} scope="col" className={`${thClass} border-l text-center font-normal`}>
                  <span className="whitespace-nowrap">{formatGritBand(c.band)}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {steels.map(([slug, name]) => (
              <tr key={slug}>
                <th scope="row" className="sticky left-0 z-10 whitespace-nowrap border-b border-rule bg-panel px-3 py-1 text-left font-medium">
                  {name}
                </th>
                {columns.map(([key, c]) => {
                  const r = byKey.get(`${slug}|${c.material}|${c.band.phi}`);
                  if (!r)
                    return (
                      <td key={key} className="border-b border-l border-rule/70 px-2 py-1 text-center text-muted">
                        <span aria-label="no results">·</span>
                      </td>
                    );
                  const shade = shadeOf(r.sharpnessG.median, edges);
                  const thin = [r.fewResults ? 'few' : '', r.singleTester ? '1 tester' : ''].filter(Boolean).join(', ');
                  return (
                    <td key={key} className="border-b border-l border-rule/70 p-0 text-center">
                      <button
                        type="button"
                        onClick={() => onOpenCell(r.cell)}
                        aria-pressed={openCell === r.cell}
                        title={`${name}, ${r.materialLabel}, ${formatGritBand(r.band)}: median ${Math.round(r.sharpnessG.median)} g from ${r.n} results by ${r.testers} testers`}
                        className={`block w-full min-w-16 px-2 py-1 tabular-nums ${openCell === r.cell ? 'outline outline-2 outline-ink' : ''}`}
                        style={{ background: RAMP[shade], color: shade >= DARK_FROM ? '#fff' : '#1f2328' }}
                      >
                        <span className="block font-semibold">{Math.round(r.sharpnessG.median)}</span>
                        <span className="block text-[0.7rem] leading-tight">
                          n {r.n}
                          {thin ? ` · ${thin}` : ''}
                        </span>
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
      <p className="text-sm text-muted">
        Each number is the median of the cell’s results in grams; “few” marks fewer than 3 results and “1 tester” a cell nobody else has replicated. Choose a cell to list its results.
      </p>
    </div>
  );
}
