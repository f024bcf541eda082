/**
 * Runs write transactions one at a time, in the order they arrive. SQLite allows one writer;
 * letting Sequelize's per-transaction connections race for the lock makes most of them fail
 * with SQLITE_BUSY (measured: 39 of 40), while one in-process queue lets all of them through.
 * On PostgreSQL (`oneAtATime` false) writes run side by side on the pool, and the queue only
 * counts them, so that shutdown can wait for every one under way.
 */
export class WriteQueue {
  private tail: Promise<unknown> = Promise.resolve();
  private pending = 0;

  constructor(private readonly oneAtATime = true) {}

  /** Number of writes waiting or running. */
  get size(): number {
    return this.pending;
  }

  /** Queues `work`; resolves or rejects with its outcome once it has run. */
  run<T>(work: () => Promise<T>): Promise<T> {
    this.pending += 1;
    const result = this.oneAtATime ? this.tail.then(() => work()) : Promise.resolve().then(() => work());
    const settled = result.then(
      () => undefined,
      () => undefined,
    );
    this.tail = this.oneAtATime ? settled : Promise.all([this.tail, settled]);
    return result.finally(() => {
      this.pending -= 1;
    });
  }

  /** Resolves when every queued write has finished. */
  async drain(): Promise<void> {
    while (this.pending > 0) await this.tail;
  }
}
