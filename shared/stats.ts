// Placeholder signatures; the full implementation replaces this file.
export interface Summary { n: number; median: number; q1: number; q3: number; mean: number; sd: number | null; ci95: [number, number] | null }
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b); const m = (s.length - 1) / 2;
  return (s[Math.floor(m)] + s[Math.ceil(m)]) / 2;
}
export function summarize(values: readonly number[]): Summary {
  const med = median(values); const mean = values.reduce((a, b) => a + b, 0) / values.length;
  return { n: values.length, median: med, q1: med, q3: med, mean, sd: null, ci95: null };
}
