import { follow, KEPT, type Kept, type Stage } from '../changes';

/**
 * A map of values read from the database, kept until a commit changes what its row of `KEPT`
 * (server/changes/kept.ts) follows, then emptied. A value read while a change happened is
 * handed out but not kept, so a read that raced a commit never outlives it. Past `max` entries,
 * or past `budget` by `weigh` (bytes, say), the map starts again empty: the keys are few (pages,
 * accounts, page URLs), and memory stays bounded. `stage`: when it hears of a commit (see
 * server/changes/followers.ts); kept reads at once, kept answers once the search index is current.
 */
export function keptUntil<K, V>(kept: Kept, options: { max?: number; weigh?: (value: V) => number; budget?: number; stage?: Stage } = {}) {
  const { max = 5_000, weigh, budget = Infinity, stage = 'reads' } = options;
  const values = new Map<K, V>();
  let generation = 0;
  let weight = 0;
  const clear = () => {
    values.clear();
    weight = 0;
  };
  follow(
    KEPT[kept],
    () => {
      generation += 1;
      clear();
    },
    stage,
  );
  return {
    get: (key: K): V | undefined => values.get(key),
    /** A mark to give `keep` later: a change between the two makes `keep` do nothing. */
    mark: (): number => generation,
    keep(key: K, value: V, mark: number): void {
      if (mark !== generation) return;
      this.forget(key);
      const w = weigh ? weigh(value) : 0;
      if (values.size >= max || weight + w > budget) clear();
      weight += w;
      values.set(key, value);
    },
    /** Drops `key` (a read that failed, say). */
    forget(key: K): void {
      if (!values.has(key)) return;
      if (weigh) weight -= weigh(values.get(key)!);
      values.delete(key);
    },
    /**
     * For a map of promises: the kept promise of `key`, or `load()`'s, kept at once so that
     * readers at the same moment share one read (a change clears it like any value); a promise
     * that rejects is forgotten.
     */
    share(key: K, load: () => V & PromiseLike<unknown>): V {
      const kept = values.get(key);
      if (kept !== undefined) return kept;
      const started = load();
      this.keep(key, started, generation);
      Promise.resolve(started).catch(() => {
        if (values.get(key) === started) this.forget(key);
      });
      return started;
    },
    /** The kept value of `key`, or `load()`'s (kept when no change came in between). */
    async read(key: K, load: () => Promise<V>): Promise<V> {
      if (values.has(key)) return values.get(key)!;
      const mark = generation;
      const value = await load();
      this.keep(key, value, mark);
      return value;
    },
  };
}
