/**
 * "Did you mean": the nearest of some known names to what was typed, within the typo tolerance
 * search uses (one edit in five characters, at least one; a swap of neighbours is one edit).
 * Edit distance: the optimal string alignment variant of the Damerau–Levenshtein distance.
 * Pure.
 */
export function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array<number>(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j++) d[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

/** The known name nearest to `typed` (case-insensitive) within the tolerance, or null. */
export function nearestName(typed: string, known: readonly string[]): string | null {
  const t = typed.trim().toLowerCase();
  const tolerance = Math.max(1, Math.round(t.length * 0.2));
  let best: { name: string; distance: number } | null = null;
  for (const name of known) {
    if (Math.abs(name.length - t.length) > tolerance) continue;
    const distance = editDistance(t, name.toLowerCase());
    if (distance <= tolerance && (!best || distance < best.distance)) best = { name, distance };
  }
  return best?.name ?? null;
}
