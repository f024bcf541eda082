import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { insertRows } from '../db/insert-rows';
import { ChangeRow } from './change-row';
import { changeOf, mergeChanges, rowOf, type CellKey, type Change } from './kinds';
import { tellFollowers, type Dispatched } from './followers';

const recorded = new WeakMap<Transaction, Change[]>();

/**
 * Records what `transaction` changed: the one thing a write path does besides its own writes.
 * The feed writes the changes to the `changes` table before the commit (refreshing the comparison
 * cells of changed approved results first), and after the commit hands them to every follower.
 * Call it inside `ctx.db.write`, with the transaction the write runs in.
 */
export function record(transaction: Transaction, ...changes: Change[]): void {
  const list = recorded.get(transaction);
  if (list) list.push(...changes);
  else recorded.set(transaction, [...changes]);
}

/** How often a process reads the `changes` table for other processes' commits. */
export const POLL_MS = 200;
/**
 * How long an id missing below a newer one is looked for again: on PostgreSQL ids are taken in
 * insert order but become visible in commit order, so a change can appear after a newer one;
 * an id never seen by then was rolled back (a retried serialization failure, say).
 */
const GAP_MS = 30_000;
/** How long rows of `changes` are kept, and how often older ones are removed. */
export const KEEP_CHANGES_MS = 7 * 24 * 3_600_000;
const PRUNE_EVERY_MS = 3_600_000;

/**
 * The change feed of one database: writes each transaction's recorded changes in that
 * transaction, and hands them to the followers of this process (server/changes/followers.ts),
 * one batch after another: its own commits right after each commit, and every other process's
 * (or command-line tool's) as the poller (`follow`) finds them in the `changes` table, within
 * `POLL_MS` or so. The poller skips the ids this process wrote itself.
 */
export class ChangeFeed {
  /** The id of the newest change read or dispatched (at start, already reflected in what followers build from the tables). */
  lastDispatchedId = 0;
  private dispatching: Promise<void> = Promise.resolve();
  /** The poller's place: the newest id it has read (its own, not `lastDispatchedId`, which this process's commits move past changes of others not yet visible). */
  private cursor = 0;
  /** Ids this process wrote, not yet passed by the poller (known before the commit). */
  private readonly own = new Set<number>();
  /** Ids below `cursor` not yet seen, with when they were first missed. */
  private readonly gaps = new Map<number, number>();
  private following = false;

  /**
   * `refreshCells` rewrites the comparison cells of some keys inside a transaction
   * (server/aggregates/comparison-cells.ts), handed in by the database so that the feed, which
   * the models' hooks import, does not import the cells' module that imports the models.
   * `sequelize` and `write` are the database's own (`Database.write`): the poller and the pruning
   * read and write through them, not through the `ChangeRow` model, which is bound to the
   * database whose models were initialised last (tests run several in one process).
   */
  constructor(
    private readonly db: object,
    private readonly sequelize: Sequelize,
    private readonly refreshCells: (keys: CellKey[], transaction: Transaction) => Promise<void>,
    private readonly write: (work: (t: Transaction) => Promise<unknown>) => Promise<unknown>,
  ) {}

  /**
   * Called by `Database.write` as the transaction's last work: refreshes the comparison cells of
   * the recorded result changes, writes the changes, and arranges their dispatch after the
   * commit. Resolves with the promise of that dispatch (undefined when nothing was recorded).
   */
  async beforeCommit(transaction: Transaction): Promise<{ dispatched?: Promise<void> }> {
    const list = recorded.get(transaction);
    const outcome: { dispatched?: Promise<void> } = {};
    if (!list?.length) return outcome;
    recorded.delete(transaction);
    const changes = mergeChanges(list);
    const cells = changes.flatMap((c) => (c.kind === 'result' ? c.cells : []));
    if (cells.length) await this.refreshCells(cells, transaction);
    const rows = await insertRows(ChangeRow, changes.map(rowOf), transaction);
    const batch = rows.map((row, i) => ({ id: row.id, change: changes[i] }));
    // Before the commit: the poller may read the rows as soon as they are committed.
    for (const { id } of batch) this.own.add(id);
    transaction.afterCommit(() => {
      outcome.dispatched = this.dispatch(batch);
    });
    return outcome;
  }

  /** Hands `batch` on after every batch handed on before it. */
  private dispatch(batch: Dispatched['changes']): Promise<void> {
    const done = this.dispatching.then(async () => {
      await tellFollowers(this.db, batch);
      this.lastDispatchedId = Math.max(this.lastDispatchedId, ...batch.map((c) => c.id));
    });
    this.dispatching = done;
    return done;
  }

  /**
   * Followers build from the tables at start (the search index, the caches), so they start at
   * the newest change there is; what came before is already in what they read. Called before
   * they build: a change committed while they build is handed to them again, which they take
   * as any other (each follower reads the current rows), rather than lost.
   */
  async startAtNewest(): Promise<void> {
    const [{ newest }] = await this.sequelize.query<{ newest: number | null }>('SELECT MAX("id") AS "newest" FROM "changes"', { type: QueryTypes.SELECT });
    this.cursor = Math.max(this.cursor, Number(newest ?? 0));
    this.lastDispatchedId = Math.max(this.lastDispatchedId, this.cursor);
  }

  /** The changes after `lastId`, oldest first, at most `limit`. */
  async changesSince(lastId: number, limit = 1000): Promise<Dispatched['changes']> {
    return this.select('"id" > :lastId ORDER BY "id" LIMIT :limit', { lastId, limit });
  }

  private async select(where: string, replacements: Record<string, unknown>): Promise<Dispatched['changes']> {
    const rows = await this.sequelize.query<{ id: number; kind: string; keys: string }>(`SELECT "id", "kind", "keys" FROM "changes" WHERE ${where}`, { type: QueryTypes.SELECT, replacements });
    return rows.map((row) => ({ id: Number(row.id), change: changeOf(row) }));
  }

  /**
   * Reads the table once: the changes after the poller's last and the missing ids below it, and
   * hands those this process did not write to its followers, as one batch in id order.
   */
  async poll(): Promise<void> {
    const now = Date.now();
    for (const [id, since] of this.gaps) {
      if (now - since < GAP_MS) continue;
      this.gaps.delete(id);
      this.own.delete(id);
    }
    const from = this.cursor;
    const found = await this.changesSince(from);
    const late = this.gaps.size ? await this.select('"id" IN (:ids)', { ids: [...this.gaps.keys()] }) : [];
    for (const { id } of late) this.gaps.delete(id);
    const newest = found.length ? found[found.length - 1].id : from;
    const seen = new Set(found.map((c) => c.id));
    for (let id = from + 1; id < newest; id += 1) if (!seen.has(id)) this.gaps.set(id, now);
    const theirs = [...late, ...found].filter(({ id }) => !this.own.delete(id));
    this.cursor = newest;
    if (theirs.length) await this.dispatch(theirs.sort((x, y) => x.id - y.id));
  }

  /**
   * Follows the other processes' commits from here on: polls every `POLL_MS` (a poll that fails
   * is logged and tried again), and removes changes older than `KEEP_CHANGES_MS` once an hour.
   * Returns a function that stops following, once the poll under way has finished.
   */
  follow(): () => Promise<void> {
    if (this.following) throw new Error('the change feed is followed already');
    this.following = true;
    const state = { timer: undefined as NodeJS.Timeout | undefined, running: Promise.resolve(), prunedAt: 0, stopped: false };
    const tick = () => {
      state.running = this.pollAndPrune(state).finally(() => {
        if (!state.stopped) state.timer = setTimeout(tick, POLL_MS);
      });
    };
    tick();
    return async () => {
      state.stopped = true;
      clearTimeout(state.timer);
      await state.running;
      this.following = false;
    };
  }

  private async pollAndPrune(state: { prunedAt: number }): Promise<void> {
    try {
      await this.poll();
      if (Date.now() - state.prunedAt >= PRUNE_EVERY_MS) {
        state.prunedAt = Date.now();
        await this.prune(new Date(Date.now() - KEEP_CHANGES_MS));
      }
    } catch (err) {
      console.error('change feed: reading the changes of other processes failed', err);
    }
  }

  /** Removes the changes written before `before` (a process that was away longer builds again from the tables). */
  async prune(before: Date): Promise<number> {
    const removed = await this.write((transaction) =>
      this.sequelize.query('DELETE FROM "changes" WHERE "createdAt" < :before', { replacements: { before }, transaction, type: QueryTypes.BULKDELETE }),
    );
    return Number(removed);
  }
}
