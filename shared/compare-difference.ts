/**
 * The difference between two comparison cells (two choices of abrasive material × grit band on
 * one steel, under one method), read from their results as independent samples: each result's
 * median reading counts once. The shift B − A is the Hodges–Lehmann estimate with the exact
 * Mann–Whitney interval (./shift.ts); the same for retention counts where both cells report
 * them. Beside it, the method's within-edge spread: how much one edge's own readings scatter,
 * so a reader can tell a difference between edges from the scatter within one. Pure.
 */
import { shiftEstimate, type ShiftEstimate } from './shift';
import { median, sampleSd } from './stats';

/** One result as the difference reads it. */
export interface DifferenceMember {
  /** The result's median reading, g. */
  sharpnessMedianG: number;
  retentionCuts: number | null;
  /** The result's own readings, g (for the within-edge spread). */
  readingsG: readonly number[];
}

/** A shift with the words that say what it means. */
export type WordedShift = ShiftEstimate & { unit: 'g' | 'cuts'; words: string };

/** The within-edge spread of readings over the results of both cells. */
export interface WithinEdgeSpread {
  /** Median, over edges with two or more readings, of one edge's sample standard deviation, g. */
  medianSdG: number | null;
  /** How many edges it rests on. */
  edges: number;
  /** Median number of readings per edge. */
  readingsPerEdge: number | null;
}

/** The difference B − A between two cells. */
export interface CellDifference {
  sharpness: WordedShift | null;
  retention: WordedShift | null;
  withinEdge: WithinEdgeSpread;
  /** Plain sentences, in reading order. */
  words: string[];
}

/** A figure for a sentence: whole from 100, else one decimal; a true minus sign. */
const fmt = (x: number) => {
  const r = Math.abs(x) >= 100 ? Math.round(x) : Math.round(x * 10) / 10;
  return (Object.is(r, -0) ? 0 : r).toLocaleString('en-GB').replace('-', '−');
};
const pct = (p: number) => `${(Math.round(p * 1000) / 10).toLocaleString('en-GB')} %`;

const labelA = 'A';
const labelB = 'B';

function sharpnessWords(s: ShiftEstimate): string {
  // Fewer grams to sever the medium means the keener edge.
  const est = s.estimate;
  const head =
    est === 0
      ? `${labelB} and ${labelA} needed the same force to cut (shift B − A = 0 g).`
      : `${labelB}'s edges needed ${fmt(Math.abs(est))} g ${est < 0 ? 'less' : 'more'} force to cut than ${labelA}'s (shift B − A = ${fmt(est)} g): ${est < 0 ? labelB : labelA} gave the keener edge in these results.`;
  return `${head} ${intervalWords(s, 'g', `${labelB} keener`, `${labelA} keener`)}`;
}

function retentionWords(s: ShiftEstimate): string {
  const est = s.estimate;
  const head =
    est === 0
      ? `${labelB} and ${labelA} lasted alike (shift B − A = 0 cuts).`
      : `${labelB}'s edges lasted ${fmt(Math.abs(est))} cuts ${est > 0 ? 'longer' : 'shorter'} than ${labelA}'s (shift B − A = ${fmt(est)} cuts).`;
  return `${head} ${intervalWords(s, 'cuts', `${labelA} lasting longer`, `${labelB} lasting longer`)}`;
}

function intervalWords(s: ShiftEstimate, unit: string, negative: string, positive: string): string {
  if (!s.interval) {
    return `With ${s.nA} and ${s.nB} results no 95 % interval exists: even the whole range of differences would cover only ${pct(s.widestCoverage)}. More results are needed before this says anything firm.`;
  }
  const { lo, hi, coverage } = s.interval;
  const range = `95 % interval ${fmt(lo)} to ${fmt(hi)} ${unit} (actual coverage ${pct(coverage)}${s.distribution === 'normal' ? ', large-sample approximation' : ''})`;
  if (lo <= 0 && hi >= 0) return `${range}: it includes zero, so these results cannot tell the two apart.`;
  return `${range}: the data are consistent with ${hi < 0 ? negative : positive} by ${fmt(Math.min(Math.abs(lo), Math.abs(hi)))} to ${fmt(Math.max(Math.abs(lo), Math.abs(hi)))} ${unit}.`;
}

/** The within-edge spread over the given results (edges with one reading have none). */
export function withinEdgeSpread(members: readonly DifferenceMember[]): WithinEdgeSpread {
  const sds = members.filter((m) => m.readingsG.length >= 2).map((m) => sampleSd(m.readingsG)!);
  return {
    medianSdG: sds.length ? median(sds) : null,
    edges: sds.length,
    readingsPerEdge: members.length ? median(members.map((m) => m.readingsG.length)) : null,
  };
}

/**
 * The difference B − A between the results of two cells: sharpness always (null when a cell is
 * empty), retention where both cells have retention counts, the within-edge spread of both,
 * and sentences saying what they mean (the cells called A and B).
 */
export function cellDifference(a: readonly DifferenceMember[], b: readonly DifferenceMember[]): CellDifference {
  const words: string[] = [];
  let sharpness: WordedShift | null = null;
  if (a.length && b.length) {
    const s = shiftEstimate(
      a.map((m) => m.sharpnessMedianG),
      b.map((m) => m.sharpnessMedianG),
    );
    sharpness = { ...s, unit: 'g', words: sharpnessWords(s) };
    words.push(sharpness.words);
  } else {
    words.push(`${a.length ? labelB : labelA} has no results under these filters, so there is nothing to compare.`);
  }
  const cutsA = a.map((m) => m.retentionCuts).filter((c): c is number => c !== null);
  const cutsB = b.map((m) => m.retentionCuts).filter((c): c is number => c !== null);
  let retention: WordedShift | null = null;
  if (cutsA.length && cutsB.length) {
    const s = shiftEstimate(cutsA, cutsB);
    retention = { ...s, unit: 'cuts', words: retentionWords(s) };
    words.push(retention.words);
  } else if (a.length && b.length) {
    words.push('Retention cannot be compared: at least one side has no retention counts.');
  }
  const withinEdge = withinEdgeSpread([...a, ...b]);
  if (withinEdge.medianSdG !== null) {
    const spread = `One edge's own readings scatter with a median standard deviation of ${fmt(withinEdge.medianSdG)} g under this method (${withinEdge.edges} edges, typically ${withinEdge.readingsPerEdge} readings each)`;
    if (sharpness) {
      const larger = Math.abs(sharpness.estimate) > withinEdge.medianSdG;
      words.push(`${spread}; the shift is ${larger ? 'larger' : 'no larger'} than that scatter${larger ? '' : ', so it is within what one edge varies by itself'}.`);
    } else words.push(`${spread}.`);
  }
  const thin = Math.min(a.length, b.length);
  if (thin > 0 && thin < 5) words.push(`Thin evidence: the smaller side rests on ${thin} result${thin === 1 ? '' : 's'}.`);
  return { sharpness, retention, withinEdge, words };
}
