import { ComputationError } from './computation-error';

/**
 * Element filters for steel lists, typed the way people write them: "C ≥ 1 %, V ≥ 2 %",
 * "Cr>=12; Mo<=1", "c 1.4-1.6", "W = 0.5 %". Values are wt %.
 *
 * A steel page holds each element as the standard's range (min–max, or a maximum only). A
 * filter compares one number per element with its bound, and which number is a choice:
 * - basis 'nominal' (default): the middle of the range; a maximum-only limit counts as 0 to
 *   its maximum; an element the page does not list counts as 0.
 * - basis 'range': whether the standard's range reaches the bound at all (C ≥ 1 matches a
 *   0.93–1.05 % range; C ≤ 0.5 matches a maximum-only limit whatever its maximum, from 0).
 */

/** One filter: an element, a comparison and a value (or range) in wt %. */
export type ElementFilter =
  | { element: string; op: '>=' | '<=' | '>' | '<' | '='; value: number }
  | { element: string; op: 'between'; from: number; to: number };

/** A composition limit as a steel page stores it, wt %. */
export interface CompositionLimit {
  element: string;
  min: number | null;
  max: number;
}

export type CompositionBasis = 'nominal' | 'range';

/** The elements a filter may name: those that appear in steel standards' composition tables. */
export const FILTER_ELEMENTS = ['C', 'Si', 'Mn', 'P', 'S', 'Cr', 'Ni', 'Mo', 'V', 'W', 'Co', 'Cu', 'N', 'Nb', 'Ti', 'Al', 'B'] as const;

const OPS: Record<string, '>=' | '<=' | '>' | '<' | '='> = { '≥': '>=', '>=': '>=', '=>': '>=', '≤': '<=', '<=': '<=', '=<': '<=', '>': '>', '<': '<', '=': '=' };
const NUMBER = '(\\d+(?:[.,]\\d+)?|[.,]\\d+)';
const COMPARISON = new RegExp(`^([A-Za-z]{1,2})\\s*(≥|>=|=>|≤|<=|=<|>|<|=)\\s*${NUMBER}\\s*%?$`);
const RANGE = new RegExp(`^([A-Za-z]{1,2})\\s*:?\\s*${NUMBER}\\s*%?\\s*(?:–|—|-|to|\\.\\.)\\s*${NUMBER}\\s*%?$`);

const toNumber = (s: string) => Number(s.replace(',', '.'));

function element(symbol: string, clause: string): string {
  const normal = symbol.charAt(0).toUpperCase() + symbol.slice(1).toLowerCase();
  if (!(FILTER_ELEMENTS as readonly string[]).includes(normal)) {
    throw new ComputationError(`"${clause}": ${symbol} is not an element we filter on (use ${FILTER_ELEMENTS.join(', ')})`, 'composition');
  }
  return normal;
}

/**
 * Parses a filter text into element filters. Clauses are separated by commas, semicolons or
 * "and"; a comma between digits is a decimal comma ("C ≥ 1,5 %"). An empty text gives no
 * filters. Throws ComputationError (field 'composition') naming the clause it cannot read.
 */
export function parseCompositionFilter(text: string): ElementFilter[] {
  const clauses = text
    .split(/[;]|,(?!\d)|\band\b/i)
    .map((c) => c.trim())
    .filter(Boolean);
  return clauses.map((clause): ElementFilter => {
    const cmp = COMPARISON.exec(clause);
    if (cmp) {
      const value = toNumber(cmp[3]);
      if (value > 100) throw new ComputationError(`"${clause}": a content above 100 % cannot be`, 'composition');
      return { element: element(cmp[1], clause), op: OPS[cmp[2]], value };
    }
    const range = RANGE.exec(clause);
    if (range) {
      const from = toNumber(range[2]);
      const to = toNumber(range[3]);
      if (from > to) throw new ComputationError(`"${clause}": the range runs from the lower to the higher value`, 'composition');
      if (to > 100) throw new ComputationError(`"${clause}": a content above 100 % cannot be`, 'composition');
      return { element: element(range[1], clause), op: 'between', from, to };
    }
    throw new ComputationError(`"${clause}" is not an element filter; write e.g. "C ≥ 1 %", "Cr <= 13" or "V 2–4 %"`, 'composition');
  });
}

/** The filters written back in the product's notation, e.g. "C ≥ 1 %, V ≥ 2 %". */
export function formatCompositionFilter(filters: ElementFilter[]): string {
  const sign = { '>=': '≥', '<=': '≤', '>': '>', '<': '<', '=': '=' } as const;
  return filters.map((f) => (f.op === 'between' ? `${f.element} ${f.from}–${f.to} %` : `${f.element} ${sign[f.op]} ${f.value} %`)).join(', ');
}

/** The range a steel page gives for `element`, as [low, high] wt %; [0, 0] when it does not list it. */
function rangeOf(composition: CompositionLimit[], symbol: string): [number, number] {
  const limit = composition.find((l) => l.element === symbol);
  if (!limit) return [0, 0];
  return [limit.min ?? 0, limit.max];
}

/** Whether one filter holds for a composition on the given basis. */
export function matchesFilter(composition: CompositionLimit[], f: ElementFilter, basis: CompositionBasis = 'nominal'): boolean {
  const [lo, hi] = rangeOf(composition, f.element);
  if (basis === 'nominal') {
    const x = (lo + hi) / 2;
    switch (f.op) {
      case '>=': return x >= f.value;
      case '<=': return x <= f.value;
      case '>': return x > f.value;
      case '<': return x < f.value;
      case '=': return Math.abs(x - f.value) < 1e-9;
      case 'between': return x >= f.from && x <= f.to;
    }
  }
  switch (f.op) {
    case '>=': return hi >= f.value;
    case '<=': return lo <= f.value;
    case '>': return hi > f.value;
    case '<': return lo < f.value;
    case '=': return lo <= f.value && f.value <= hi;
    case 'between': return lo <= f.to && hi >= f.from;
  }
}

/** Whether every filter holds (an empty list holds for every steel). */
export function matchesComposition(composition: CompositionLimit[], filters: ElementFilter[], basis: CompositionBasis = 'nominal'): boolean {
  return filters.every((f) => matchesFilter(composition, f, basis));
}
