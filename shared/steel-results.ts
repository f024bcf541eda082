/**
 * A steel page's results, grouped so that like is read beside like: by method (readings of two
 * methods are not comparable), abrasive material and whole-φ grit band (decision 003; a 1 µm
 * strop is not pooled with a D46 wheel), and its most common progressions (the steps and the
 * final abrasive, by material and particle size) with their medians. Pure: rows in, groups out.
 */
import { bandInfo } from './compare-view';
import { progressionWords, type DerivedStep } from './progression';
import { median } from './stats';

/** What each approved result on the steel gives. */
export interface SteelResultRow {
  sharpnessMethodId: number;
  material: string;
  gritPhi: number;
  gritUm: number;
  sharpnessMedianG: number;
  authorId: number;
  progression: readonly Pick<DerivedStep, 'material' | 'gritUm'>[];
}

/** Results of one method on one material within one whole-φ band. */
export interface MethodBandGroup {
  methodId: number;
  material: string;
  band: { loUm: number; hiUm: number; words: string };
  n: number;
  testers: number;
  /** Lowest (keenest) median reading of one result, grams. */
  bestG: number;
  /** Median of the results' median readings, grams (0.1 g). */
  medianG: number;
}

/** One progression (steps, then the final abrasive) under one method. */
export interface ProgressionGroup {
  methodId: number;
  /** The whole progression in words, final abrasive included: "Aluminium oxide 125 µm → CBN 46 µm → Diamond 1 µm". */
  words: string;
  steps: number;
  n: number;
  testers: number;
  medianG: number;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

function groupBy<K>(rows: readonly SteelResultRow[], keyOf: (r: SteelResultRow) => K): Map<K, SteelResultRow[]> {
  const out = new Map<K, SteelResultRow[]>();
  for (const r of rows) {
    const k = keyOf(r);
    const list = out.get(k);
    if (list) list.push(r);
    else out.set(k, [r]);
  }
  return out;
}

/** Groups by method, material and whole-φ band: most results first, then keenest median. */
export function groupByMethodAndBand(rows: readonly SteelResultRow[]): MethodBandGroup[] {
  const groups = [...groupBy(rows, (r) => `${r.sharpnessMethodId}|${r.material}|${r.gritPhi}`).values()].map((list) => {
    const { sharpnessMethodId, material, gritPhi } = list[0];
    const { loUm, hiUm, words } = bandInfo(gritPhi, 1);
    const readings = list.map((r) => r.sharpnessMedianG);
    return { methodId: sharpnessMethodId, material, band: { loUm, hiUm, words }, n: list.length, testers: new Set(list.map((r) => r.authorId)).size, bestG: Math.min(...readings), medianG: round1(median(readings)) };
  });
  return groups.sort((a, b) => a.methodId - b.methodId || b.n - a.n || a.medianG - b.medianG);
}

/**
 * The most common progressions among results that recorded one (at least one step before the
 * final abrasive), at most `limit`: most results first, then keenest median.
 */
export function commonProgressions(rows: readonly SteelResultRow[], limit = 5): ProgressionGroup[] {
  const withSteps = rows.filter((r) => r.progression.length > 0);
  const wordsOf = (r: SteelResultRow) => progressionWords([...r.progression, { material: r.material, gritUm: r.gritUm }]);
  const groups = [...groupBy(withSteps, (r) => `${r.sharpnessMethodId}|${wordsOf(r)}`).values()].map((list) => ({
    methodId: list[0].sharpnessMethodId,
    words: wordsOf(list[0]),
    steps: list[0].progression.length,
    n: list.length,
    testers: new Set(list.map((r) => r.authorId)).size,
    medianG: round1(median(list.map((r) => r.sharpnessMedianG))),
  }));
  return groups.sort((a, b) => b.n - a.n || a.medianG - b.medianG || a.words.localeCompare(b.words)).slice(0, limit);
}
