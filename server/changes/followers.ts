import { topicsOf, type Change, type Topic } from './kinds';

/** A committed transaction's changes, as the dispatcher hands them to followers. */
export interface Dispatched {
  /** The database they were written to (a follower tied to one database ignores the others). */
  db: object;
  /** Each change with its id in the `changes` table. */
  changes: { id: number; change: Change }[];
  topics: Set<Topic>;
}

/**
 * When a follower hears of a commit: `reads` first (kept reads dropped, the cell cache patched:
 * synchronous), then `index` (derived data rebuilt from the tables, awaited one after another:
 * the search index), then `answers` (kept answers dropped, once what they are made of is current).
 */
export const STAGES = ['reads', 'index', 'answers'] as const;
export type Stage = (typeof STAGES)[number];

type Listener = (batch: Dispatched) => void | Promise<void>;
interface Follower {
  topics: Set<Topic>;
  stage: Stage;
  listener: Listener;
}

const followers = new Set<Follower>();

/**
 * Calls `listener` after every commit that changed one of `topics`, at its `stage`. Returns a
 * function that stops following. A listener that throws or rejects is logged; the others still run.
 */
export function follow(topics: readonly Topic[], listener: Listener, stage: Stage = 'reads'): () => void {
  const follower = { topics: new Set(topics), stage, listener };
  followers.add(follower);
  return () => followers.delete(follower);
}

const failed = (err: unknown) => console.error('change feed: a follower failed', err);

/** Hands `batch` to every follower of its topics, stage by stage; resolves when all are done. */
export async function tellFollowers(db: object, changes: Dispatched['changes']): Promise<void> {
  const batch: Dispatched = { db, changes, topics: new Set(changes.flatMap((c) => topicsOf(c.change))) };
  for (const stage of STAGES) {
    for (const f of [...followers]) {
      if (f.stage !== stage || ![...f.topics].some((t) => batch.topics.has(t))) continue;
      try {
        const done = f.listener(batch);
        if (done) await done.catch(failed);
      } catch (err) {
        failed(err);
      }
    }
  }
}
