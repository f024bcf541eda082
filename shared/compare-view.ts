/**
 * The comparison's rows as the API gives them, and the pure helpers both sides need: band
 * edges and words, cell names, the marks for thin cells, and sorting. No I/O, no clock.
 */
import type { CompareSortKey } from './schemas/compare';

/** Cells with fewer results than this are marked "few results": a median of two says little. */
export const FEW_RESULTS = 3;

/** One grit band: its coarse-edge φ, its width in φ, and its edges in µm (bands are (loUm, hiUm]). */
export interface BandInfo {
  phi: number;
  step: 1 | 0.5;
  loUm: number;
  hiUm: number;
  /** A rough word for the band's fineness ("fine", "extra fine", …). */
  words: string;
}

/**
 * Rough fineness words by the band's geometric centre, µm (common practice: the trade's usual
 * talk of coarse, medium, fine and polishing grits; Edgeledger's own cut-offs).
 */
const FINENESS: { minUm: number; words: string }[] = [
  { minUm: 90, words: 'coarse' },
  { minUm: 25, words: 'medium' },
  { minUm: 8, words: 'fine' },
  { minUm: 2, words: 'extra fine' },
  { minUm: 0, words: 'polishing' },
];

/** The band whose coarse edge is at φ = `phi` and which is `step` φ wide. */
export function bandInfo(phi: number, step: 1 | 0.5): BandInfo {
  const hiUm = 1000 * 2 ** -phi;
  const loUm = 1000 * 2 ** -(phi + step);
  const centre = Math.sqrt(loUm * hiUm);
  return { phi, step, loUm, hiUm, words: FINENESS.find((f) => centre >= f.minUm)!.words };
}

/** A band's edges written for people: "7.81–15.6 µm" (three significant figures, whole µm from 100 µm). */
export function formatBand(band: { loUm: number; hiUm: number }): string {
  return `${formatEdgeUm(band.loUm)}–${formatEdgeUm(band.hiUm)} µm`;
}

/** A band edge in µm without the unit: three significant figures, whole µm from 100 µm. */
export function formatEdgeUm(um: number): string {
  return um >= 100 ? String(Math.round(um)) : String(Number(um.toPrecision(3)));
}

/** A cell's name in URLs: steel:material:phi (see cellRefSchema). */
export function cellId(steel: string, material: string, phi: number): string {
  return `${steel}:${material}:${phi}`;
}

/** One comparison cell as GET /api/compare gives it. Grams are grams-force of the method's tester. */
export interface CompareRow {
  /** steel:material:phi, for drill-down and the paired comparison. */
  cell: string;
  method: string;
  methodName: string;
  methodVersion: number;
  steel: string;
  steelName: string;
  steelCategory: string;
  material: string;
  materialLabel: string;
  band: BandInfo;
  /** The band's edges again, in the shape the first client used. */
  gritBand: { loUm: number; hiUm: number };
  n: number;
  testers: number;
  /** n below FEW_RESULTS. */
  fewResults: boolean;
  /** Every result from one tester: not replicated. */
  singleTester: boolean;
  sharpnessG: { median: number; q1: number; q3: number; mean: number; sd: number | null; ci95: [number, number] | null };
  /** Median pulled toward the method's overall median for the "ranked" order (see compare-shrinkage.ts). */
  rankedMedianG: number;
  retentionCuts: { median: number; n: number } | null;
  hrcRange: [number, number];
  angleRange: [number, number];
  /** Smallest and largest particle size among the cell's results, µm. */
  gritUmRange: [number, number];
}

type Getter = (r: CompareRow) => number | string | null;

const SORT_VALUE: Record<CompareSortKey, Getter> = {
  steel: (r) => r.steelName.toLowerCase(),
  material: (r) => r.materialLabel.toLowerCase(),
  // Coarse first when ascending: a smaller φ is a coarser band.
  band: (r) => r.band.phi,
  n: (r) => r.n,
  testers: (r) => r.testers,
  median: (r) => r.sharpnessG.median,
  q1: (r) => r.sharpnessG.q1,
  q3: (r) => r.sharpnessG.q3,
  mean: (r) => r.sharpnessG.mean,
  // The interval's width: how sure the mean is.
  ci: (r) => (r.sharpnessG.ci95 ? r.sharpnessG.ci95[1] - r.sharpnessG.ci95[0] : null),
  retention: (r) => r.retentionCuts?.median ?? null,
  hrc: (r) => r.hrcRange[0],
  angle: (r) => r.angleRange[0],
  ranked: (r) => r.rankedMedianG,
};

// One collator for every comparison: far cheaper than String.prototype.localeCompare per call.
const collator = new Intl.Collator('en', { sensitivity: 'base' });

function compareValues(a: number | string | null, b: number | string | null): number {
  // Missing values sort last in both directions.
  if (a === null || b === null) return a === b ? 0 : a === null ? 1 : -1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return collator.compare(String(a), String(b));
}

const BY_DEFAULT: Getter[] = [SORT_VALUE.steel, SORT_VALUE.material, SORT_VALUE.band];

/**
 * Sorts rows by `sort` ("median", "-n", …; default steel, material, band coarse to fine),
 * then by steel, material and band so the order is stable and the same on client and server.
 */
export function sortRows<T extends CompareRow>(rows: readonly T[], sort?: string): T[] {
  const desc = !!sort && sort.startsWith('-');
  const key = (sort ? sort.replace(/^-/, '') : undefined) as CompareSortKey | undefined;
  const primary = key ? SORT_VALUE[key] : undefined;
  // Each row's keys are read once, not once per comparison.
  const decorated = rows.map((row) => ({ row, p: primary ? primary(row) : null, d: BY_DEFAULT.map((g) => g(row)) }));
  decorated.sort((a, b) => {
    if (primary) {
      const c = compareValues(a.p, b.p);
      if (c) return a.p === null || b.p === null || !desc ? c : -c;
    }
    for (let i = 0; i < a.d.length; i++) {
      const c = compareValues(a.d[i], b.d[i]);
      if (c) return c;
    }
    return 0;
  });
  return decorated.map((x) => x.row);
}
