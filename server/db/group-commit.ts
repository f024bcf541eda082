import type { Transaction } from 'sequelize';
import type { Database } from './database';

interface Waiting<I, O> {
  item: I;
  resolve: (value: O) => void;
  reject: (reason: unknown) => void;
}

/**
 * Group commit for one kind of write: items that arrive while the write queue is busy wait
 * together and go in as one transaction when their turn comes (`work` writes them all, in
 * order, and returns one outcome per item), so sixteen people posting at once cost one
 * transaction instead of sixteen. Each item's promise settles only after the commit. When a
 * batch fails, its items are tried again one transaction each, so a bad item fails alone and
 * every other one still goes in.
 */
export class GroupCommit<I, O> {
  private waiting: Waiting<I, O>[] = [];
  private queued = false;

  constructor(
    private readonly db: Database,
    private readonly work: (items: I[], transaction: Transaction) => Promise<O[]>,
    private readonly maxBatch = 200,
  ) {}

  /** Writes `item` with whatever else is waiting; resolves with its outcome after the commit. */
  add(item: I): Promise<O> {
    return new Promise<O>((resolve, reject) => {
      this.waiting.push({ item, resolve, reject });
      this.queue();
    });
  }

  private queue(): void {
    if (this.queued || !this.waiting.length) return;
    this.queued = true;
    let batch: Waiting<I, O>[] = [];
    let taken = false;
    this.db
      .write((transaction) => {
        // Taken at the turn, not before: everything that arrived while waiting goes in together.
        // (Once: on PostgreSQL a transaction that failed to serialize runs again, with the same batch.)
        if (!taken) {
          taken = true;
          batch = this.waiting.splice(0, this.maxBatch);
          this.queued = false;
          this.queue();
        }
        return this.work(
          batch.map((w) => w.item),
          transaction,
        );
      })
      .then(
        (outcomes) => batch.forEach((w, i) => w.resolve(outcomes[i])),
        (err) => {
          if (!batch.length) {
            // The transaction failed before it took anything: those waiting fail with it.
            this.queued = false;
            for (const w of this.waiting.splice(0)) w.reject(err);
          } else if (batch.length === 1) batch[0].reject(err);
          else for (const w of batch) this.db.write((t) => this.work([w.item], t)).then(([o]) => w.resolve(o), w.reject);
        },
      );
  }
}
