import { Op, type Transaction } from 'sequelize';
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

/**
 * The change feed of one database: writes each transaction's recorded changes in that
 * transaction, and dispatches them after its commit, one transaction after another in commit
 * order, to the followers of this process (server/changes/followers.ts). `lastDispatchedId` is
 * the newest change this process has handed on; `changesSince` reads the table from any id, for
 * a follower that was not in this process when the changes were made.
 */
export class ChangeFeed {
  /** The id of the newest change dispatched (or, at start, already reflected in what followers build from the tables). */
  lastDispatchedId = 0;
  private dispatching: Promise<void> = Promise.resolve();

  /**
   * `refreshCells` rewrites the comparison cells of some keys inside a transaction
   * (server/aggregates/comparison-cells.ts), handed in by the database so that the feed, which
   * the models' hooks import, does not import the cells' module that imports the models.
   */
  constructor(
    private readonly db: object,
    private readonly refreshCells: (keys: CellKey[], transaction: Transaction) => Promise<void>,
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
    transaction.afterCommit(() => {
      outcome.dispatched = this.dispatch(batch);
    });
    return outcome;
  }

  /** Hands `batch` on after every batch committed before it. */
  private dispatch(batch: Dispatched['changes']): Promise<void> {
    const done = this.dispatching.then(async () => {
      await tellFollowers(this.db, batch);
      this.lastDispatchedId = Math.max(this.lastDispatchedId, ...batch.map((c) => c.id));
    });
    this.dispatching = done;
    return done;
  }

  /**
   * Followers in this process build from the tables at start (the search index, the caches), so
   * they start at the newest change there is; what came before is already in what they read.
   * The seam for a follower in another process (issue #15): keep its own last id, read
   * `changesSince` it, then `tellFollowers` what it found.
   */
  async startAtNewest(): Promise<void> {
    this.lastDispatchedId = Math.max(this.lastDispatchedId, ((await ChangeRow.max('id')) as number | null) ?? 0);
  }

  /** The changes after `lastId`, oldest first, at most `limit`. */
  async changesSince(lastId: number, limit = 1000): Promise<Dispatched['changes']> {
    const rows = await ChangeRow.findAll({ where: { id: { [Op.gt]: lastId } }, order: [['id', 'ASC']], limit, raw: true });
    return rows.map((row) => ({ id: row.id, change: changeOf(row) }));
  }
}
