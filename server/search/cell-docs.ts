import { formatBand, type CompareRow } from '@shared/compare-view';
import type { SearchDoc } from './search-index';
import { methodOwner, steelOwner } from './owners';

/**
 * A whole-φ comparison cell as a search document, so that "d2 cbn 62 µm" or "52100 diamond
 * fine" lands on it: the abrasive material, the band's edges, the sizes found in it and its
 * fineness word are its names; its steel (name, designations) and method lend it theirs; n and
 * the median are in the hit.
 */
export function cellDoc(row: CompareRow, steel: Parameters<typeof steelOwner>[0], method: Parameters<typeof methodOwner>[0]): SearchDoc {
  const um = (x: number) => `${Number(x.toPrecision(3))} µm`;
  const edge = (x: number) => (x >= 100 ? String(Math.round(x)) : String(Number(x.toPrecision(3))));
  const sizes = row.gritUmRange[0] === row.gritUmRange[1] ? um(row.gritUmRange[0]) : `${um(row.gritUmRange[0])} ${um(row.gritUmRange[1])}`;
  return {
    key: `cell:${row.method}:${row.cell}`,
    type: 'cell',
    slug: row.cell,
    title: `${row.steelName} · ${row.materialLabel} · ${formatBand(row.band)} (${row.band.words})`,
    names: [
      row.materialLabel,
      row.material,
      // Edges as separate words (the tokenizer keeps "31.3–62.5" whole), then the sizes found.
      `${edge(row.band.loUm)} ${edge(row.band.hiUm)} µm`,
      sizes,
      row.band.words,
      'comparison',
    ].join(' '),
    body: '',
    summary: `${row.n} result${row.n === 1 ? '' : 's'} from ${row.testers} tester${row.testers === 1 ? '' : 's'}; median ${Math.round(row.sharpnessG.median)} g (quartiles ${Math.round(row.sharpnessG.q1)}–${Math.round(row.sharpnessG.q3)} g); ${row.methodName}.`,
    group: row.material,
    owners: [steelOwner(steel), methodOwner(method)],
    cell: {
      method: row.method,
      ref: row.cell,
      n: row.n,
      testers: row.testers,
      medianG: Math.round(row.sharpnessG.median * 10) / 10,
      q1G: Math.round(row.sharpnessG.q1 * 10) / 10,
      q3G: Math.round(row.sharpnessG.q3 * 10) / 10,
    },
  };
}
